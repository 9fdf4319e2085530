/**
 * Paths of the v1 routes built beside the core API (CSV import, attachments, statements,
 * verification), kept apart so openapi.ts stays readable. Their behaviour is described from the
 * route handlers; the coverage test fails when a new route file appears without a path here.
 */
import { download, json, params, ref, responses } from "./openapi-parts";

const site = [params.siteId];
const month = [params.siteId, params.month];
const idParam = (name: string, description: string) => ({ name, in: "path", required: true, description, schema: { type: "string", format: "uuid" } });
const upload = (fields: Record<string, unknown>, required: string[]) => ({
  required: true,
  content: { "multipart/form-data": { schema: { type: "object", required, properties: { file: { type: "string", format: "binary" }, ...fields } } } },
});
const csvUpload = upload({ mapping: { type: "string", description: "column mapping as JSON text" }, confirmReplace: { enum: ["true"] } }, ["file", "mapping"]);

const year = [params.siteId, { name: "year", in: "path", required: true, description: "calendar year YYYY", schema: { type: "string", pattern: "^\\d{4}$" } }];

export const otherPaths = {
  "/api/v1/sites/{siteId}/embedded-emissions": {
    get: {
      summary: "Embedded emissions of the site's ammonia for a period, as the communication to importers (synledger.cbam-communication/1); by default this year's ended months",
      description: "Schema: /api/v1/schemas/cbam-communication.json. A month not yet ended is refused (400 naming `to`).",
      parameters: [
        ...site,
        { name: "from", in: "query", description: "first month YYYY-MM", schema: { type: "string", pattern: "^\\d{4}-\\d{2}$" } },
        { name: "to", in: "query", description: "last month YYYY-MM (ended)", schema: { type: "string", pattern: "^\\d{4}-\\d{2}$" } },
        { name: "shipped_t", in: "query", description: "a shipped quantity, t NH3, to state its embedded emissions", schema: { type: "string" } },
      ],
      responses: responses(json({ $ref: "/api/v1/schemas/cbam-communication.json" }), ["400", "401", "403", "404"]),
    },
  },
  "/api/v1/statements/{id}/document": {
    get: {
      summary: "The machine-readable communication of embedded emissions a signed communication carries inside its PDF, as signed",
      parameters: [idParam("id", "statement id (the reference printed in the PDF)")],
      responses: responses(json({ $ref: "/api/v1/schemas/cbam-communication.json" }), ["401", "403", "404"]),
    },
  },
  "/api/v1/schemas/cbam-communication.json": {
    get: { summary: "JSON Schema of synledger.cbam-communication/1 (public; generated from the schema the API answers with)", security: [], responses: { "200": json({ type: "object" }) } },
  },
  "/api/v1/sites/{siteId}/years/{year}/series": {
    get: {
      summary: "Twelve months of the year as computed by the engine: production, intensities, energy, closures, H2:N2, suspect meters (nulls for months not started)",
      parameters: year,
      responses: responses(json({ type: "object", properties: { months: { type: "array", items: { type: "object" } } } }), ["400", "401", "403", "404"]),
    },
  },
  "/api/v1/sites/{siteId}/years/{year}/export": {
    get: {
      summary: "The year (or one month with month=YYYY-MM) as CSV with units in the headers, or format=json: the twelve plant-month files",
      parameters: [
        ...year,
        { name: "format", in: "query", schema: { enum: ["csv", "json"] } },
        { name: "month", in: "query", schema: { type: "string" } },
        { name: "table", in: "query", schema: { enum: ["sources", "rule-sets", "annual-report"] } },
      ],
      responses: responses(download("text/csv", "CSV or JSON file"), ["400", "401", "403", "404"]),
    },
  },
  "/api/v1/sites/{siteId}/imports": {
    get: { summary: "Recent CSV import batches and saved column mappings of the site", parameters: site, responses: responses(json({ type: "object", properties: { batches: { type: "array", items: { type: "object" } }, mappings: { type: "array", items: { type: "object" } } } }), ["401", "403", "404"]) },
  },
  "/api/v1/sites/{siteId}/imports/preview": {
    post: {
      summary: "Check a CSV file against the site without writing: bad rows and cells, monthly totals beside the current ones (process engineer)",
      description: "Send Accept: application/x-ndjson for progress lines.",
      parameters: site,
      requestBody: csvUpload,
      responses: responses(json({ type: "object" }), ["400", "401", "403", "404", "413"]),
    },
  },
  "/api/v1/sites/{siteId}/imports/commit": {
    post: {
      summary: "Validate the CSV file again and write it in one transaction, or refuse it whole (process engineer)",
      description: "409 already_imported for a file imported before (send confirmReplace=true to replace), 409 month_read_only naming the months.",
      parameters: site,
      requestBody: csvUpload,
      responses: responses(json(ref("Saved")), ["400", "401", "403", "404", "409", "413"]),
    },
  },
  "/api/v1/sites/{siteId}/months/{month}/attachments": {
    get: { summary: "Attachments of the month (metadata, download link, whether you may delete each)", parameters: month, responses: responses(json({ type: "object", properties: { attachments: { type: "array", items: { type: "object" } } } }), ["400", "401", "404"]) },
    post: {
      summary: "Attach a certificate or invoice to the month, or to one of its streams",
      parameters: month,
      requestBody: upload({ category: { enum: ["lab-certificate", "calibration-certificate", "invoice", "other"] }, stream: { type: "string", description: "stream key (optional)" } }, ["file", "category"]),
      responses: responses(json({ type: "object", properties: { attachment: { type: "object" } } }, "attached"), ["400", "401", "404", "409", "413"], "201"),
    },
  },
  "/api/v1/attachments/{attachmentId}": {
    get: { summary: "Download an attachment (always as a file, type detected at upload)", parameters: [idParam("attachmentId", "attachment id")], responses: responses(download("application/octet-stream", "the file"), ["401", "404"]) },
    delete: { summary: "Delete an attachment (uploader or administrator, while the month is not signed)", parameters: [idParam("attachmentId", "attachment id")], responses: responses({ description: "deleted" }, ["401", "403", "404", "409"], "204") },
  },
  "/api/v1/statements/{id}/pdf": {
    get: { summary: "The signed statement PDF exactly as signed (any member)", parameters: [idParam("id", "statement id")], responses: responses(download("application/pdf", "the signed PDF (X-Content-SHA256 header)"), ["401", "404"]) },
  },
  "/api/v1/verify": {
    post: {
      summary:
        "Public, no account: check a PDF against every stored statement (issued, superseded with the revision that replaced it, altered or unknown) and see its public facts only. 30 requests a minute per address; nothing stored",
      security: [],
      requestBody: { required: true, content: { "multipart/form-data": { schema: { type: "object", required: ["file"], properties: { file: { type: "string", format: "binary" } } } }, "application/pdf": { schema: { type: "string", format: "binary" } } } },
      responses: responses(
        json({
          type: "object",
          required: ["verdict", "sha256", "headline", "explanation", "statement", "supersededBy"],
          properties: {
            verdict: { type: "string", enum: ["issued", "superseded", "altered", "unknown"] },
            sha256: { type: "string" },
            headline: { type: "string" },
            explanation: { type: "array", items: { type: "string" } },
            statement: { type: ["object", "null"], description: "public facts: reference, installation, operator, identifiers, kind, period, revision, signer, signedAt, sha256, certificateFingerprint, figures, verifyUrl" },
            supersededBy: { type: ["object", "null"], description: "public facts of the later revision (verdict superseded)" },
          },
        }),
        ["400", "413", "429"],
      ),
    },
  },
};
