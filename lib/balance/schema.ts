// The plant-month format `synledger.plant-month/1` as one zod schema, shared by the CLI,
// the API and CSV import. Numbers may be JSON strings or JSON numbers; read through
// readJson they arrive as JsonNumber with their literal digits, never as binary doubles.
import { z } from "zod";
import { COMPONENTS } from "./components";
import { Dec, HUNDRED, sum } from "./decimal";
import { SUM_TOLERANCE_PCT } from "./gas-properties";
import { JsonNumber, JsonSyntaxError, readJson } from "./json-reader";
import { LIMITS, tooLargeReason, utf8Length } from "./limits";
import { DESTINATIONS, EMISSION_METHODS, FATES, GWP_SETS, STREAM_KINDS, type StreamKind } from "./types";
import { UNITS, UNIT_DEFS, type Unit } from "./units";

export const PLANT_MONTH_FORMAT = "synledger.plant-month/1";
const DECIMAL_TEXT = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const MAX_DECIMAL_CHARS = LIMITS.numberChars;
const MAX_DECIMAL_EXPONENT = 30;

/** A decimal field: JSON string, JsonNumber (literal digits) or, from already-parsed JSON, a JS number. */
const decimal = (what: "quantity" | "value") =>
  z.unknown().transform((v, ctx) => {
    let text: string | null = null;
    if (typeof v === "string") text = v.trim();
    else if (v instanceof JsonNumber) text = v.text;
    // A JS number only reaches us when the caller parsed JSON itself; String() gives its shortest round-trip digits.
    else if (typeof v === "number" && Number.isFinite(v)) text = String(v);
    if (v === undefined) {
      ctx.addIssue({ code: "custom", message: "is required" });
      return z.NEVER;
    }
    if (text === null || !DECIMAL_TEXT.test(text)) {
      ctx.addIssue({ code: "custom", message: `is not a number (${JSON.stringify(v instanceof JsonNumber ? v.text : v)})` });
      return z.NEVER;
    }
    // Bounds far outside any plant figure: "1e999999999999" is valid decimal text, but writing it
    // out (toFixed) would take a terabyte and end the process, so it is refused here.
    if (text.length > MAX_DECIMAL_CHARS) {
      ctx.addIssue({ code: "custom", message: `is longer than ${MAX_DECIMAL_CHARS} characters` });
      return z.NEVER;
    }
    const d = new Dec(text);
    if (!d.isZero() && (d.e > MAX_DECIMAL_EXPONENT || d.e < -MAX_DECIMAL_EXPONENT)) {
      ctx.addIssue({ code: "custom", message: `is out of range (${text}); plant figures lie between 1e-${MAX_DECIMAL_EXPONENT} and 1e${MAX_DECIMAL_EXPONENT}` });
      return z.NEVER;
    }
    if (d.isNegative() && !d.isZero()) {
      ctx.addIssue({ code: "custom", message: `${what === "quantity" ? "quantity" : "value"} must not be negative (${text})` });
      return z.NEVER;
    }
    return d;
  });

const enumOf = <T extends readonly [string, ...string[]]>(values: T, what: string) =>
  z.enum(values, { error: (iss) => `unknown ${what} ${JSON.stringify(iss.input)} (one of: ${values.join(", ")})` });

const componentsSchema = z.strictObject(
  Object.fromEntries(COMPONENTS.map((c) => [c, decimal("value").optional()])) as Record<
    (typeof COMPONENTS)[number],
    z.ZodOptional<ReturnType<typeof decimal>>
  >,
  { error: (iss) => (iss.code === "unrecognized_keys" ? `unknown component ${iss.keys.join(", ")}` : "must be an object") },
);

const note = () => z.string().max(LIMITS.noteChars, `is longer than ${LIMITS.noteChars} characters`).optional();
const name = (min = "must not be empty") => z.string().min(1, min).max(LIMITS.nameChars, `is longer than ${LIMITS.nameChars} characters`);

const pctAtMost100 = () => decimal("value").refine((d) => d.lte(HUNDRED), "must be at most 100 (%)").optional();
const analysisSchema = z.strictObject({
  components: componentsSchema,
  /** Expanded (95 %) relative uncertainty of the carbon content the composition gives, %; absent: the set's default. */
  carbon_uncertainty_pct: pctAtMost100(),
  /** Expanded (95 %) relative uncertainty of its calorific value, %; absent: the set's default. */
  cv_uncertainty_pct: pctAtMost100(),
  note: note(),
});

const streamSchema = z.strictObject({
  id: name(),
  kind: enumOf(STREAM_KINDS, "stream kind"),
  analysis: name().optional(),
  fate: enumOf(FATES, "fate").optional(),
  destination: enumOf(DESTINATIONS, "destination").optional(),
  // Optional only on a stream declared not metered (checked below): its quantity is then unknown.
  quantity: decimal("quantity").optional(),
  unit: enumOf(UNITS, "unit"),
  /**
   * false: no meter measures this flow. Its quantity, when given, is the team's estimate; the
   * reconciliation solves for the flow from the balances instead of moving metered flows to
   * absorb it, and where the balances determine it that value is the stream's quantity.
   */
  metered: z.boolean({ error: "must be true or false" }).optional(),
  // Beyond 100 % a meter says nothing, and a huge σ beside small ones makes reconciliation's matrix singular.
  uncertainty_pct: decimal("value").refine((d) => d.lte(HUNDRED), "uncertainty must be at most 100 (%)").optional(),
  /**
   * Share of the meter's uncertainty that repeats month after month until the meter is
   * recalibrated (calibration error), %; the rest is random. Absent: 100 (all systematic).
   */
  systematic_pct: pctAtMost100(),
  /** Date of the meter's last calibration before or in the month: months with different dates are independent periods. */
  calibrated_on: z.string().regex(/^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/, "must be a date YYYY-MM-DD").optional(),
  factor_t_per_MWh: decimal("value").optional(),
  factor_t_per_GJ: decimal("value").optional(),
  meter: name().optional(),
  note: note(),
});

/** Which units each stream kind may be written in (an energy unit on air or a MWh gas stream is an error). */
const VOLUME_UNITS = UNITS.filter((u) => UNIT_DEFS[u].kind === "volume");
const GAS_UNITS: readonly Unit[] = [...VOLUME_UNITS, "t", "kg", "GJ-LHV", "GJ-HHV", "MMBtu-HHV"];
export const UNITS_BY_KIND: Record<StreamKind, readonly Unit[]> = {
  "feed-gas": GAS_UNITS,
  "fuel-gas": GAS_UNITS,
  "purge-gas": GAS_UNITS,
  "process-air": [...VOLUME_UNITS, "t", "kg"],
  ammonia: ["t", "kg"],
  "co2-export": ["t", "kg", ...VOLUME_UNITS],
  "co2-vent": ["t", "kg", ...VOLUME_UNITS],
  "stack-co2": ["t", "kg", ...VOLUME_UNITS],
  "electricity-import": ["MWh"],
  "steam-import": ["GJ", "MWh"],
  "steam-export": ["GJ", "MWh"],
};

export const plantMonthSchema = z
  .strictObject({
    format: z.literal(PLANT_MONTH_FORMAT, { error: `must be "${PLANT_MONTH_FORMAT}"` }),
    site: name(),
    month: z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, "must be a month YYYY-MM (01..12)"),
    analyses: z
      .record(name(), analysisSchema)
      .refine((a) => Object.keys(a).length <= LIMITS.analyses, `holds more than ${LIMITS.analyses} analyses`)
      .default({}),
    streams: z.array(streamSchema).max(LIMITS.streams, `holds more than ${LIMITS.streams} streams`),
    method: z.strictObject({
      emissions: enumOf(EMISSION_METHODS, "emissions method"),
      factor_set: name(),
      gwp: enumOf(GWP_SETS, "GWP set"),
    }),
    note: note(),
  })
  .superRefine((doc, ctx) => {
    for (const [id, a] of Object.entries(doc.analyses)) {
      const total = sum(Object.values(a.components).filter((v): v is Dec => v !== undefined));
      if (total.minus(HUNDRED).abs().gt(SUM_TOLERANCE_PCT))
        ctx.addIssue({ code: "custom", path: ["analyses", id, "components"], message: `composition sums to ${total.toFixed()} %, more than 0.5 from 100` });
    }
    const seen = new Map<string, number>();
    doc.streams.forEach((s, i) => {
      const at = (field: string, message: string) => ctx.addIssue({ code: "custom", path: ["streams", i, field], message });
      if (seen.has(s.id)) at("id", `duplicate stream id "${s.id}" (also streams[${seen.get(s.id)}])`);
      else seen.set(s.id, i);
      if (s.analysis !== undefined && !(s.analysis in doc.analyses)) at("analysis", `analysis "${s.analysis}" is not defined in analyses`);
      const needsAnalysis = s.kind === "feed-gas" || s.kind === "fuel-gas" || s.kind === "purge-gas";
      if (needsAnalysis && s.analysis === undefined) at("analysis", `a ${s.kind} stream needs an analysis`);
      if (s.kind === "purge-gas" && s.fate === undefined) at("fate", "a purge-gas stream needs a fate (fuel, flare or vent)");
      if (s.kind === "co2-export" && s.destination === undefined) at("destination", "a co2-export stream needs a destination (urea, storage, pcc, sale or other)");
      if (s.fate !== undefined && s.kind !== "purge-gas") at("fate", "only purge-gas streams have a fate");
      if (s.destination !== undefined && s.kind !== "co2-export") at("destination", "only co2-export streams have a destination");
      if (s.quantity === undefined && s.metered !== false) at("quantity", "is required (only a stream declared \"metered\": false may leave it out)");
      if (s.metered === false && s.uncertainty_pct !== undefined) at("uncertainty_pct", "a stream that is not metered has no meter uncertainty; the reconciliation solves for it");
      if (s.metered === false && s.systematic_pct !== undefined) at("systematic_pct", "a stream that is not metered has no meter uncertainty to split");
      if (!UNITS_BY_KIND[s.kind].includes(s.unit)) at("unit", `unit ${s.unit} is not valid for a ${s.kind} stream (use ${UNITS_BY_KIND[s.kind].join(", ")})`);
    });
  });

type ParsedPlantMonth = z.output<typeof plantMonthSchema>;
type ParsedStream = ParsedPlantMonth["streams"][number];
/** A stream as the engine reads it: the quantity always present (0 where a stream that is not metered gave none). */
export type PlantMonthStream = Omit<ParsedStream, "quantity"> & { quantity: Dec; /** true where the file gave no quantity (a stream not metered, no estimate). */ quantity_missing?: true };
export type PlantMonth = Omit<ParsedPlantMonth, "streams"> & { streams: PlantMonthStream[] };

/** The unknown quantity of a stream that is not metered reads as 0 until the reconciliation solves for it. */
function withQuantities(doc: ParsedPlantMonth): PlantMonth {
  return { ...doc, streams: doc.streams.map((s) => (s.quantity === undefined ? { ...s, quantity: new Dec(0), quantity_missing: true as const } : { ...s, quantity: s.quantity })) };
}

/** A stream whose quantity is not a meter's: declared "metered": false. */
export const isUnmetered = (s: Pick<PlantMonthStream, "metered">): boolean => s.metered === false;

export interface InputIssue {
  path: string; // e.g. streams[2].quantity; "" for the document itself
  reason: string;
}
export type ParseResult = { ok: true; doc: PlantMonth } | { ok: false; issues: InputIssue[] };

/** JSON path text: streams[2].quantity, analyses.pipeline-gas.components. */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = "";
  for (const part of path) {
    if (typeof part === "number") out += `[${part}]`;
    else if (/^[A-Za-z0-9_-]+$/.test(String(part))) out += (out ? "." : "") + String(part);
    else out += `[${JSON.stringify(String(part))}]`;
  }
  return out;
}

export function parsePlantMonth(value: unknown): ParseResult {
  const r = plantMonthSchema.safeParse(value);
  if (r.success) return { ok: true, doc: withQuantities(r.data) };
  return { ok: false, issues: r.error.issues.map((i) => ({ path: formatPath(i.path), reason: i.message })) };
}

/** Reads the document from JSON text, keeping number literals exact. */
export function parsePlantMonthText(text: string): ParseResult {
  // Measured before parsing: the parser and the engine are what a huge document would cost.
  const bytes = utf8Length(text);
  if (bytes > LIMITS.fileBytes) return { ok: false, issues: [{ path: "", reason: tooLargeReason(bytes) }] };
  try {
    return parsePlantMonth(readJson(text));
  } catch (e) {
    if (e instanceof JsonSyntaxError) return { ok: false, issues: [{ path: "", reason: e.message }] };
    throw e;
  }
}

export function describeIssues(issues: InputIssue[]): string {
  return issues.map((i) => `${i.path || "(document)"}: ${i.reason}`).join("\n");
}
