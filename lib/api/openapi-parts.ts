/**
 * Building blocks of the OpenAPI description: shared parameters, schemas and responses, so
 * each path in openapi.ts reads as one line per operation.
 */
type Json = Record<string, unknown>;

export const ref = (name: string) => ({ $ref: `#/components/schemas/${name}` });
const decimal = { type: "string", pattern: "^\\d+(\\.\\d+)?$", description: "exact decimal written as text" };
const pathParam = (name: string, description: string, extra: Json = {}) => ({ name, in: "path", required: true, description, schema: { type: "string", ...extra } });

export const params = {
  siteId: pathParam("siteId", "site id (uuid); another organisation's site answers 404", { format: "uuid" }),
  month: pathParam("month", "calendar month YYYY-MM", { pattern: "^\\d{4}-(0[1-9]|1[0-2])$" }),
  stream: pathParam("stream", "stream key, as in the plant-month file (streams[].id)"),
  key: pathParam("key", "analysis name"),
};

const errorCodes: Record<string, string> = {
  "400": "invalid input; issues name each path",
  "401": "not signed in, or the bearer token is unknown or revoked",
  "403": "the role (or the token's scope) does not allow this",
  "404": "not found, or another organisation's record",
  "409": "stale version (issues say who changed what) or the month is read-only",
  "413": "body larger than 1 MiB",
  "422": "the stored month cannot be computed yet",
};

/** The responses of one operation: its success plus the error bodies that can happen. */
export function responses(ok: Json, errors: string[], status = "200") {
  const out: Json = { [status]: ok };
  for (const code of errors) out[code] = { description: errorCodes[code], content: { "application/json": { schema: ref("Error") } } };
  return out;
}

export const json = (schema: Json, description = "OK") => ({ description, content: { "application/json": { schema } } });
export const body = (schema: Json, description?: string) => ({ required: true, ...(description ? { description } : {}), content: { "application/json": { schema } } });

export const schemas: Json = {
  Error: {
    type: "object",
    required: ["error"],
    properties: {
      error: {
        type: "object",
        required: ["code", "message"],
        properties: {
          code: { type: "string", examples: ["invalid_input", "unauthorized", "forbidden", "token_scope", "not_found", "version_conflict"] },
          message: { type: "string" },
          issues: { type: "array", items: { type: "object", required: ["path", "message"], properties: { path: { type: "string", examples: ["readings[0].quantity", "streams[2].id"] }, message: { type: "string" } } } },
        },
      },
    },
  },
  Site: {
    type: "object",
    properties: {
      id: { type: "string", format: "uuid" }, name: { type: "string" }, code: { type: "string" },
      meteringReference: { enum: ["15C", "0C", "60F"] }, closureTolerancePct: decimal,
      emissionsMethod: { type: "string" }, factorSet: { type: "string" }, gwp: { type: "string" }, archivedAt: { type: ["string", "null"], format: "date-time" },
    },
  },
  Stream: {
    type: "object",
    properties: {
      key: { type: "string" }, name: { type: "string" }, kind: { type: "string" }, unit: { type: "string" }, analysisKey: { type: ["string", "null"] },
      destination: { type: ["string", "null"] }, fate: { type: ["string", "null"] }, uncertaintyPct: { type: ["string", "null"] }, metered: { type: "boolean" }, systematicPct: { type: ["string", "null"] }, indirectFactor: { type: ["string", "null"] },
      meterTag: { type: ["string", "null"] }, calibratedOn: { type: ["string", "null"], format: "date" }, archivedAt: { type: ["string", "null"], format: "date-time" },
    },
  },
  MonthState: { enum: ["open", "balanced", "in_review", "signed", "submitted"] },
  ReadingInput: {
    type: "object",
    required: ["quantity", "unit"],
    properties: { quantity: decimal, unit: { type: "string", examples: ["Sm3", "t", "MWh"] }, source: { enum: ["meter", "estimate", "invoice"], default: "meter" }, note: { type: "string", maxLength: 1000 } },
  },
  AnalysisInput: {
    type: "object",
    required: ["components"],
    properties: {
      components: { type: "object", additionalProperties: decimal, description: "component → mol % (dry); must sum to 100 within 0.5", examples: [{ CH4: "93.10", C2H6: "3.20", N2: "1.80", CO2: "1.90" }] },
      sampledOn: { type: "string", format: "date" }, laboratory: { type: "string" }, note: { type: "string" },
      carbonUncertaintyPct: { ...decimal, description: "expanded (95 %) relative uncertainty of the carbon content, %; absent: the factor set's default" },
      cvUncertaintyPct: { ...decimal, description: "expanded (95 %) relative uncertainty of the calorific value, %; absent: the factor set's default" },
    },
  },
  MonthFigures: {
    type: "object",
    required: ["expectedVersion"],
    properties: {
      expectedVersion: { type: "integer", minimum: 0, description: "the version you started from (0 for a month nobody started)" },
      readings: { type: "array", maxItems: 500, items: { allOf: [{ type: "object", required: ["stream"], properties: { stream: { type: "string" } } }, ref("ReadingInput")] } },
      removeReadings: { type: "array", items: { type: "string" }, description: "stream keys whose reading is removed" },
      analyses: { type: "array", maxItems: 50, items: { allOf: [{ type: "object", required: ["key"], properties: { key: { type: "string" } } }, ref("AnalysisInput")] } },
      balanceNote: { type: "string", maxLength: 4000 },
    },
  },
  Month: {
    type: "object",
    properties: {
      site: { type: "object" }, month: { type: "string" }, state: ref("MonthState"), revision: { type: "integer" }, version: { type: "integer" },
      readings: { type: "array", items: { type: "object", properties: { stream: { type: "string" }, quantity: decimal, unit: { type: "string" }, source: { type: "string" }, note: { type: ["string", "null"] } } } },
      analyses: { type: "array", items: { type: "object", properties: { key: { type: "string" }, components: { type: "object", additionalProperties: decimal } } } },
    },
  },
  Saved: { type: "object", properties: { month: { type: "string" }, version: { type: "integer", description: "send this as expectedVersion next time" }, changed: { type: "integer" } } },
  PlantMonth: { type: "object", description: "plant-month file, format synledger.plant-month/1 (see the product's format description)", required: ["format", "site", "month", "streams", "method"] },
  Result: { type: "object", description: "result document, format synledger.result/1; numbers are decimal strings" },
};

/** A file answered as a download (Content-Disposition names it). */
export const download = (mediaType: string, description: string) => ({
  description,
  headers: { "Content-Disposition": { schema: { type: "string" } } },
  content: { [mediaType]: { schema: { type: "string", format: "binary" } } },
});
