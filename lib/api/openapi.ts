import { otherPaths } from "./openapi-others";
import { body, download, json, params, ref, responses, schemas } from "./openapi-parts";

const site = [params.siteId];
const month = [params.siteId, params.month];
const asPerson = [{ session: [] }];
const personOrToken = [{ session: [] }, { siteToken: [] }];
const plantFile = { required: true, content: { "application/json": { schema: ref("PlantMonth") } } };

/**
 * GET /api/v1/openapi.json. Hand-written and short: it documents what each route accepts and
 * answers; a test checks that every route file under app/api/v1 has a path here.
 */
export const openApiDocument = {
  openapi: "3.1.0",
  info: {
    title: "Synledger API",
    version: "1",
    description:
      "Monthly figures of ammonia plants: sites, streams, readings, gas analyses, engine results, plant-month files and the audit trail. " +
      "Every error is { error: { code, message, issues?: [{ path, message }] } }. Engineering numbers are decimal strings. " +
      "A person's session cookie may call every operation their role allows; a POST, PUT or DELETE made with the cookie must come from the app's own pages (an Origin header of another site is refused with 403 cross_site_request). A site API token (Authorization: Bearer syl_…) may only write readings of its own site and read that site's streams.",
  },
  servers: [{ url: "/" }],
  security: asPerson,
  components: {
    securitySchemes: {
      session: { type: "apiKey", in: "cookie", name: "authjs.session-token", description: "set by signing in to the web app" },
      siteToken: { type: "http", scheme: "bearer", description: "per-site API token made by an administrator (Settings → API tokens)" },
    },
    schemas,
  },
  paths: {
    ...otherPaths,
    "/api/v1/sites": {
      get: {
        summary: "Active sites of your organisation, by name, a page at a time",
        parameters: [
          { name: "limit", in: "query", required: false, description: "sites per page, 1 to 500; default 100", schema: { type: "integer", minimum: 1, maximum: 500, default: 100 } },
          { name: "after", in: "query", required: false, description: "the `next` of the previous page", schema: { type: "string", maxLength: 400 } },
        ],
        responses: responses(
          json({
            type: "object",
            properties: {
              sites: { type: "array", items: ref("Site") },
              next: { type: ["string", "null"], description: "pass as `after` for the following page; null on the last page" },
            },
          }),
          ["400", "401", "403"],
        ),
      },
    },
    "/api/v1/sites/{siteId}": {
      get: { summary: "One site and its settings", parameters: site, responses: responses(json({ type: "object", properties: { site: ref("Site") } }), ["401", "403", "404"]) },
    },
    "/api/v1/sites/{siteId}/streams": {
      get: { summary: "Metered streams of the site (site tokens may read their own)", security: personOrToken, parameters: site, responses: responses(json({ type: "object", properties: { streams: { type: "array", items: ref("Stream") } } }), ["401", "403", "404"]) },
    },
    "/api/v1/sites/{siteId}/months": {
      get: {
        summary: "Months on record in one year, with state, revision and version",
        parameters: [...site, { name: "year", in: "query", required: false, description: "four-digit year; default the current one", schema: { type: "string", pattern: "^\\d{4}$" } }],
        responses: responses(json({ type: "object", properties: { months: { type: "array", items: { type: "object", properties: { month: { type: "string" }, state: ref("MonthState"), revision: { type: "integer" }, version: { type: "integer" } } } } } }), ["400", "401", "403", "404"]),
      },
    },
    "/api/v1/sites/{siteId}/months/{month}": {
      get: { summary: "Readings, analyses, state and version of a month", parameters: month, responses: responses(json(ref("Month")), ["400", "401", "403", "404"]) },
      put: {
        summary: "Save the month's figures (process engineer; a site token may send readings only)",
        security: personOrToken,
        parameters: month,
        requestBody: body(ref("MonthFigures")),
        responses: responses(json(ref("Saved")), ["400", "401", "403", "404", "409", "413"]),
      },
    },
    "/api/v1/sites/{siteId}/months/{month}/readings/{stream}": {
      put: {
        summary: "Save one monthly total (plant systems); without expectedVersion it is saved against the current version",
        security: personOrToken,
        parameters: [...month, params.stream],
        requestBody: body({ allOf: [ref("ReadingInput"), { type: "object", properties: { expectedVersion: { type: "integer", minimum: 0 } } }] }),
        responses: responses(json(ref("Saved")), ["400", "401", "403", "404", "409", "413"]),
      },
    },
    "/api/v1/sites/{siteId}/months/{month}/analyses": {
      get: { summary: "Gas analyses of the month", parameters: month, responses: responses(json({ type: "object", properties: { version: { type: "integer" }, analyses: { type: "array", items: ref("AnalysisInput") } } }), ["400", "401", "403", "404"]) },
    },
    "/api/v1/sites/{siteId}/months/{month}/analyses/{key}": {
      put: {
        summary: "Add or replace one gas analysis (process engineer)",
        parameters: [...month, params.key],
        requestBody: body({ allOf: [ref("AnalysisInput"), { type: "object", properties: { expectedVersion: { type: "integer", minimum: 0 } } }] }),
        responses: responses(json(ref("Saved")), ["400", "401", "403", "404", "409", "413"]),
      },
    },
    "/api/v1/sites/{siteId}/months/{month}/statement-preview": {
      get: {
        summary: "The unsigned statement PDF of a month In review exactly as it would be signed now (any member, signed in as a person)",
        parameters: month,
        responses: responses(download("application/pdf", "the unsigned statement"), ["401", "403", "404", "409"]),
      },
    },
    "/api/v1/sites/{siteId}/months/{month}/result": {
      get: {
        summary: "Engine result: the frozen one of a month In review, Signed or Submitted (with its digests), else computed from the stored figures",
        parameters: month,
        responses: responses(
          json({
            type: "object",
            properties: {
              state: ref("MonthState"),
              revision: { type: "integer" },
              version: { type: "integer" },
              frozen: {
                type: ["object", "null"],
                properties: { snapshot_id: { type: "string", format: "uuid" }, frozen_at: { type: "string", format: "date-time" }, engine_version: { type: "string" }, document_sha256: { type: "string" }, result_sha256: { type: "string" } },
              },
              result: ref("Result"),
            },
          }),
          ["400", "401", "403", "404", "422"],
        ),
      },
    },
    "/api/v1/sites/{siteId}/months/{month}/transitions": {
      post: {
        summary: "One life-cycle step of the month (balance, send-for-review, return, sign, record-submission, reopen), with the role, state, version and preconditions the review page applies",
        parameters: month,
        requestBody: body({
          type: "object",
          required: ["transition", "expectedVersion"],
          additionalProperties: false,
          properties: {
            transition: { type: "string", enum: ["balance", "send-for-review", "return", "sign", "record-submission", "reopen"] },
            expectedVersion: { type: "integer", minimum: 0 },
            reason: { type: "string", maxLength: 4000 },
            reference: { type: "string", maxLength: 120 },
            submittedOn: { type: "string", description: "YYYY-MM-DD" },
            declaration: { type: "boolean" },
            acknowledged: { type: "array", items: { type: "string" } },
          },
        }),
        responses: responses(json({ type: "object", properties: { state: { type: "string" }, version: { type: "integer" }, revision: { type: "integer" }, notified: { type: "integer" } } }), ["400", "401", "403", "404", "409", "422"]),
      },
    },
    "/api/v1/sites/{siteId}/months/{month}/method": {
      put: {
        summary: "Choose the month's emissions method, factor set and GWP set (environmental officer or administrator; while Open or Balanced)",
        parameters: month,
        requestBody: body({
          type: "object",
          required: ["emissions", "factor_set", "gwp", "expectedVersion"],
          additionalProperties: false,
          properties: {
            emissions: { type: "string", enum: ["carbon-mass-balance", "fuel-calculation", "measured", "default-factor"] },
            factor_set: { type: "string", enum: ["ipcc-2006", "us-40cfr98", "eu-mrr"] },
            gwp: { type: "string", enum: ["AR4", "AR5", "AR6"] },
            expectedVersion: { type: "integer", minimum: 0 },
          },
        }),
        responses: responses(
          json({ type: "object", properties: { month: { type: "string" }, version: { type: "integer" }, changed: { type: "boolean" }, method: { type: "object" } } }),
          ["400", "401", "403", "404", "409", "413"],
        ),
      },
    },
    "/api/v1/sites/{siteId}/months/{month}/export": {
      get: {
        summary: "The month as a plant-month file (download named synledger-<site code>-<YYYY-MM>.plant-month.json); a frozen month gives its frozen document in canonical JSON, its SHA-256 in X-Synledger-Document-Sha256",
        parameters: month,
        responses: responses({ description: "the file", headers: { "Content-Disposition": { schema: { type: "string" } } }, content: { "application/json": { schema: ref("PlantMonth") } } }, ["400", "401", "403", "404"]),
      },
    },
    "/api/v1/sites/{siteId}/months/{month}/import": {
      post: {
        summary: "Import a plant-month file: its readings and analyses are saved in one transaction (process engineer)",
        parameters: [...month, { name: "expectedVersion", in: "query", required: false, schema: { type: "integer", minimum: 0 } }],
        requestBody: plantFile,
        responses: responses(json(ref("Saved")), ["400", "401", "403", "404", "409", "413"]),
      },
    },
    "/api/v1/calculate": {
      post: { summary: "Calculate a plant-month file without storing anything (any member)", requestBody: plantFile, responses: responses(json(ref("Result")), ["400", "401", "403", "413"]) },
    },
    "/api/v1/audit/export": {
      get: {
        summary: "The filtered audit trail as CSV (any member)",
        parameters: ["site", "entity", "channel", "actor", "from", "to"].map((name) => ({ name, in: "query", required: false, schema: { type: "string" }, description: name === "from" || name === "to" ? "date YYYY-MM-DD (UTC, inclusive)" : undefined })),
        responses: responses({ description: "CSV with a header row", content: { "text/csv": { schema: { type: "string" } } } }, ["400", "401", "403"]),
      },
    },
    "/api/v1/health": {
      get: { summary: "Liveness for load balancers: {ok:true}, no session, no database", security: [], responses: { "200": json({ type: "object", properties: { ok: { const: true } } }) } },
    },
    "/api/v1/openapi.json": {
      get: { summary: "This description", security: [], responses: { "200": json({ type: "object" }) } },
    },
  },
};
