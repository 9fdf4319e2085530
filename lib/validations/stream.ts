import { z } from "zod";
import { Dec } from "@/lib/balance/decimal";
import { UNITS_BY_KIND } from "@/lib/balance/schema";
import { DESTINATIONS, FATES, STREAM_KINDS, type StreamKind } from "@/lib/balance/types";
import type { Unit } from "@/lib/balance/units";

export const STREAM_KIND_LABELS: Record<StreamKind, string> = {
  "feed-gas": "Feed gas",
  "fuel-gas": "Fuel gas",
  "purge-gas": "Purge gas",
  "process-air": "Process air",
  ammonia: "Ammonia product",
  "co2-export": "CO2 export",
  "co2-vent": "CO2 vent (removal unit)",
  "stack-co2": "CO2 in flue gas (monitor)",
  "electricity-import": "Electricity import",
  "steam-import": "Steam import",
  "steam-export": "Steam export",
};

/** Kinds whose composition comes from a gas analysis (process air may name one; dry air otherwise). */
export const NEEDS_ANALYSIS: readonly StreamKind[] = ["feed-gas", "fuel-gas", "purge-gas"];
export const MAY_HAVE_ANALYSIS: readonly StreamKind[] = [...NEEDS_ANALYSIS, "process-air"];
/** Kinds that carry an indirect CO2 factor, and its unit (plant-month format, streams[].factor_*). */
export const INDIRECT_FACTOR_UNIT: Partial<Record<StreamKind, string>> = {
  "electricity-import": "t CO2/MWh",
  "steam-import": "t CO2/GJ",
  "steam-export": "t CO2/GJ",
};

const DECIMAL = /^\d+(\.\d+)?$/;
/** Optional text: an empty box means "none" and is stored as NULL. */
const optionalText = (max: number, label: string) =>
  z.string().trim().max(max, `${label} is longer than ${max} characters.`).transform((v) => (v === "" ? null : v));
const optionalDecimal = (label: string, max?: string) =>
  z
    .string()
    .trim()
    .refine((v) => v === "" || DECIMAL.test(v), `${label} must be a non-negative number with a dot for decimals.`)
    .refine((v) => v === "" || !DECIMAL.test(v) || max === undefined || new Dec(v).lte(max), `${label} must be at most ${max}.`)
    .transform((v) => (v === "" ? null : v));

/**
 * One stream (a metered flow across the site boundary) as the form, the server actions and the
 * tests see it. The per-kind rules are those of the plant-month format, checked here so a stream
 * that could never be calculated cannot be set up.
 */
export const streamSchema = z
  .strictObject({
    key: z
      .string()
      .trim()
      .min(1, "Enter a key.")
      .max(40, "Keep the key under 40 characters.")
      .regex(/^[a-z0-9][a-z0-9-]*$/, "Use lower-case letters, digits and dashes (the key names the stream in files and the API)."),
    name: z.string().trim().min(1, "Enter a name.").max(120, "Keep the name under 120 characters."),
    kind: z.enum(STREAM_KINDS, { error: "Choose the kind of stream." }),
    unit: z.string().min(1, "Choose a unit."),
    analysisKey: optionalText(80, "Analysis key"),
    destination: z.union([z.enum(DESTINATIONS), z.literal("")]).transform((v) => (v === "" ? null : v)),
    fate: z.union([z.enum(FATES), z.literal("")]).transform((v) => (v === "" ? null : v)),
    uncertaintyPct: optionalDecimal("Uncertainty", "100"),
    /** False: no meter measures the flow and the balances solve for it. */
    metered: z.boolean().default(true),
    /** Share of the uncertainty that repeats every month until recalibration, %; empty: 100. */
    systematicPct: optionalDecimal("Repeating share", "100").optional().transform((v) => v ?? null),
    indirectFactor: optionalDecimal("Indirect factor"),
    meterTag: optionalText(60, "Meter tag"),
    calibratedOn: z
      .string()
      .trim()
      .refine((v) => v === "" || /^\d{4}-\d{2}-\d{2}$/.test(v), "Enter the date as YYYY-MM-DD.")
      .transform((v) => (v === "" ? null : v)),
    calibrationIntervalMonths: z
      .string()
      .trim()
      .refine((v) => v === "" || /^\d{1,3}$/.test(v), "Enter the interval as whole months, e.g. 12.")
      .refine((v) => v === "" || (Number(v) >= 1 && Number(v) <= 120), "The interval is 1 to 120 months.")
      .transform((v) => (v === "" ? null : Number(v))),
    sortOrder: z
      .string()
      .trim()
      .regex(/^\d{1,4}$/, "Order is a whole number from 0 to 9999.")
      .transform((v) => Number.parseInt(v, 10)),
  })
  .superRefine((s, ctx) => {
    const at = (path: string, message: string) => ctx.addIssue({ code: "custom", path: [path], message });
    if (!UNITS_BY_KIND[s.kind].includes(s.unit as Unit)) at("unit", `${s.unit || "This unit"} is not a unit for ${STREAM_KIND_LABELS[s.kind].toLowerCase()} (use ${UNITS_BY_KIND[s.kind].join(", ")}).`);
    if (NEEDS_ANALYSIS.includes(s.kind) && !s.analysisKey) at("analysisKey", "A gas stream needs the key of the analysis that gives its composition.");
    if (s.analysisKey && !MAY_HAVE_ANALYSIS.includes(s.kind)) at("analysisKey", "Only gas streams and process air have an analysis.");
    if (s.kind === "purge-gas" && !s.fate) at("fate", "Say where the purge goes: fuel, flare or vent.");
    if (s.fate && s.kind !== "purge-gas") at("fate", "Only purge gas has a fate.");
    if (s.kind === "co2-export" && !s.destination) at("destination", "Say where the CO2 goes: urea, storage, precipitated calcium carbonate, sale or other.");
    if (s.destination && s.kind !== "co2-export") at("destination", "Only CO2 export has a destination.");
    if (!s.metered && s.uncertaintyPct) at("uncertaintyPct", "A stream no meter measures has no meter uncertainty: leave it empty, the balances give its figure.");
    if (!s.metered && s.systematicPct) at("systematicPct", "A stream no meter measures has no meter uncertainty to split.");
    if (!s.metered && s.meterTag) at("meterTag", "A stream no meter measures has no meter tag.");
    if (s.indirectFactor && !INDIRECT_FACTOR_UNIT[s.kind]) at("indirectFactor", "Only electricity and steam streams carry an indirect factor.");
  });
export type StreamInput = z.input<typeof streamSchema>;
export type StreamValues = z.output<typeof streamSchema>;

export const STREAM_DEFAULTS: StreamInput = {
  key: "",
  name: "",
  kind: "feed-gas",
  unit: "Sm3",
  analysisKey: "",
  destination: "",
  fate: "",
  uncertaintyPct: "",
  metered: true,
  systematicPct: "",
  indirectFactor: "",
  meterTag: "",
  calibratedOn: "",
  calibrationIntervalMonths: "",
  sortOrder: "0",
};
