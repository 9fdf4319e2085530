/**
 * The communication of embedded emissions to importers, `synledger.cbam-communication/1`: one site,
 * one period, the good (anhydrous ammonia), the figures with units and how each was obtained,
 * their data quality and verification status. A layout of our own; the zod schema is the one the
 * API answers with, and its JSON Schema (zod 4's toJSONSchema) is served at
 * /api/v1/schemas/cbam-communication.json. Pure: no database, no framework.
 */
import { z } from "zod";
import { num } from "@/lib/balance/decimal";
import { CBAM_GOOD, CBAM_RULES, embeddedEmissions } from "@/lib/emissions/cbam";
import type { YearMonthEntry } from "@/lib/emissions/year";
import { D } from "@/lib/emissions/decimal";
import type { InstallationIdentity } from "@/lib/validations/installation";
import { quoted } from "@/lib/auth/errors";
import { currentMonthKey, isMonthKey, monthsBetween, previousMonth } from "@/lib/period";
import type { MonthRun } from "./year";

export const CBAM_COMMUNICATION_FORMAT = "synledger.cbam-communication/1";

const decimalText = z.string().regex(/^-?\d+(\.\d+)?$/, "a decimal number written as text");
const figure = (unit: string) =>
  z.strictObject({ value: decimalText.nullable(), unit: z.literal(unit), how: z.string().min(1) });
const monthKey = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/);

export const cbamCommunicationSchema = z.strictObject({
  format: z.literal(CBAM_COMMUNICATION_FORMAT),
  prepared_at: z.iso.datetime(),
  installation: z.strictObject({
    organisation: z.string(),
    site: z.strictObject({ id: z.string(), code: z.string(), name: z.string() }),
    operator_name: z.string(),
    identifiers: z.array(z.strictObject({ scheme: z.string(), identifier: z.string() })),
    address: z.string(),
    contact: z.strictObject({ name: z.string(), email: z.string() }),
  }),
  period: z.strictObject({ from: monthKey, to: monthKey, months: z.array(monthKey) }),
  good: z.strictObject({ cn_code: z.string(), description: z.string(), cn_status: z.enum(["confirmed", "unconfirmed"]), cn_source: z.string(), route: z.string() }),
  methodology: z.strictObject({
    emissions_methods: z.array(z.string()),
    factor_sets: z.array(z.string()),
    gwp: z.array(z.string()),
    rules: z.array(z.strictObject({ text: z.string(), status: z.enum(["confirmed", "unconfirmed"]), checked: z.string() })),
  }),
  figures: z.strictObject({
    production: figure("t NH3"),
    direct_emissions: figure("t CO2e"),
    co2_to_urea_counted: figure("t CO2"),
    deducted: figure("t CO2"),
    electricity: figure("MWh"),
    electricity_factor: figure("t CO2/MWh"),
    indirect_emissions: figure("t CO2e"),
    see_direct: figure("t CO2e/t NH3"),
    see_indirect: figure("t CO2e/t NH3"),
    see_total: figure("t CO2e/t NH3"),
  }),
  shipment: z
    .strictObject({ quantity_t: decimalText, direct_t: decimalText.nullable(), indirect_t: decimalText.nullable(), total_t: decimalText.nullable() })
    .nullable(),
  precursors: z.array(z.never()),
  data_quality: z.strictObject({
    months_in_period: z.number().int(),
    months_signed: z.number().int(),
    months_not_signed: z.array(monthKey),
    months_missing: z.array(monthKey),
    indirect_complete: z.boolean(),
  }),
  verification: z.strictObject({ status: z.enum(["not-verified", "signed-by-operator"]), note: z.string() }),
  cautions: z.array(z.string()),
});

export type CbamCommunication = z.infer<typeof cbamCommunicationSchema>;

/** The figures in the order a reader takes them, with their labels and displayed decimals (the page and the PDF). */
export const COMMUNICATION_FIGURE_ROWS: readonly [keyof CbamCommunication["figures"], string, number][] = [
  ["production", "Ammonia produced", 1],
  ["direct_emissions", "Direct emissions attributed", 1],
  ["co2_to_urea_counted", "of which CO2 sent to urea (counted as emitted)", 1],
  ["deducted", "Deducted (storage, precipitated calcium carbonate)", 1],
  ["electricity", "Electricity consumed", 1],
  ["electricity_factor", "Emission factor of the electricity", 4],
  ["indirect_emissions", "Indirect emissions", 1],
  ["see_direct", "Specific direct embedded emissions", 4],
  ["see_indirect", "Specific indirect embedded emissions", 4],
  ["see_total", "Specific embedded emissions, total", 4],
];

/** JSON Schema of the document (draft 2020-12), generated from the zod schema the API answers with. */
export function cbamCommunicationJsonSchema() {
  return { $id: "/api/v1/schemas/cbam-communication.json", title: "Synledger communication of embedded emissions", ...z.toJSONSchema(cbamCommunicationSchema) };
}

export interface CommunicationInput {
  organisation: string;
  site: { id: string; code: string; name: string; installation: InstallationIdentity | null };
  from: string;
  to: string;
  /** Runs of the months in the period (any state); months not yet ended are left out by the caller. */
  runs: readonly MonthRun[];
  shippedT?: string | null;
  preparedAt: Date;
}

export function buildCommunication(i: CommunicationInput): CbamCommunication {
  const wanted = monthsBetween(i.from, i.to);
  const computed = i.runs.filter((r) => wanted.includes(r.period) && r.result !== null);
  const entries: YearMonthEntry[] = computed.map((r) => ({ month: r.period, input: r.result!.emissions.input, result: r.result!.emissions.detail }));
  const c = embeddedEmissions(entries);
  const signed = computed.filter((r) => r.state === "signed" || r.state === "submitted").map((r) => r.period);
  const inst = i.site.installation;
  const shipped = i.shippedT ? new D(i.shippedT) : null;
  const times = (x: InstanceType<typeof D> | null) => (shipped && x ? num(shipped.times(x)) : null);
  const details = entries.map((e) => e.result);
  return {
    format: CBAM_COMMUNICATION_FORMAT,
    prepared_at: i.preparedAt.toISOString(),
    installation: {
      organisation: i.organisation,
      site: { id: i.site.id, code: i.site.code, name: i.site.name },
      operator_name: inst?.operatorName ?? "",
      identifiers: inst?.identifiers ?? [],
      address: inst?.address ?? "",
      contact: { name: inst?.contactName ?? "", email: inst?.contactEmail ?? "" },
    },
    period: { from: i.from, to: i.to, months: c.period.months },
    good: { ...CBAM_GOOD },
    methodology: {
      emissions_methods: [...new Set(details.map((d) => d.method))],
      factor_sets: [...new Set(details.map((d) => d.factor_set.id))],
      gwp: [...new Set(details.map((d) => d.gwp.id))],
      rules: CBAM_RULES,
    },
    figures: {
      production: { value: num(c.production_t), unit: "t NH3", how: "sum of the ammonia streams of the months, as metered" },
      direct_emissions: { value: num(c.direct_t), unit: "t CO2e", how: "the months' CO2e before deductions (CO2, CH4 and N2O at the months' GWP), less CO2 to geological storage and to precipitated calcium carbonate" },
      co2_to_urea_counted: { value: num(c.urea_co2_t), unit: "t CO2", how: "CO2 exported to urea production: counted as emitted, not deducted" },
      deducted: { value: num(c.direct_deducted_t), unit: "t CO2", how: "CO2 to storage and to precipitated calcium carbonate (Reg. (EU) 2018/2066 Art 49)" },
      electricity: { value: num(c.electricity_mwh), unit: "MWh", how: "imported electricity of the months, as metered" },
      electricity_factor: { value: num(c.electricity_factor_t_per_mwh), unit: "t CO2/MWh",
        how: c.electricity_factor_t_per_mwh ? "the factor entered with the electricity stream (supplier or grid operator; its evidence is the site's)" : "not one figure: the months carry different factors or none" },
      indirect_emissions: { value: c.indirect_complete ? num(c.indirect_t) : null, unit: "t CO2e",
        how: c.indirect_complete ? "electricity × its emission factor, month by month" : "not computed: a month's electricity has no emission factor" },
      see_direct: { value: num(c.see_direct_t_per_t), unit: "t CO2e/t NH3", how: "direct emissions ÷ production" },
      see_indirect: { value: num(c.see_indirect_t_per_t), unit: "t CO2e/t NH3", how: "indirect emissions ÷ production" },
      see_total: { value: num(c.see_total_t_per_t), unit: "t CO2e/t NH3", how: "direct + indirect, per tonne" },
    },
    shipment: shipped
      ? { quantity_t: num(shipped)!, direct_t: times(c.see_direct_t_per_t), indirect_t: times(c.see_indirect_t_per_t), total_t: times(c.see_total_t_per_t) }
      : null,
    precursors: [],
    data_quality: {
      months_in_period: wanted.length,
      months_signed: signed.length,
      months_not_signed: computed.filter((r) => !signed.includes(r.period)).map((r) => r.period),
      months_missing: wanted.filter((m) => !computed.some((r) => r.period === m)),
      indirect_complete: c.indirect_complete,
    },
    verification: {
      status: signed.length === wanted.length && wanted.length > 0 ? "signed-by-operator" : "not-verified",
      note: "Synledger records the operator's own sign-off of each month; verification by an accredited verifier is outside it and is not claimed here.",
    },
    cautions: [
      "The CN code, the counting of fertilisers' indirect emissions and the definitive period's implementing rules were not confirmed in the published text; check them with the importer and the competent authority before relying on these figures.",
      "No precursor is counted: the plant-month format has no stream for bought-in hydrogen.",
    ],
  };
}

const MAX_MONTHS = 36;

export type PeriodCheck = { ok: true; from: string; to: string; shippedT: string | null } | { ok: false; path: "from" | "to" | "shipped_t"; message: string };

/**
 * The period and shipped quantity of a communication, as the API and the signing form take them:
 * by default this calendar year's ended months; never a month that has not ended; at most 36 months.
 */
export function communicationPeriod(fromRaw: string | null, toRaw: string | null, shipped: string | null, now = new Date()): PeriodCheck {
  const lastEnded = previousMonth(currentMonthKey(now));
  const from = fromRaw || `${lastEnded.slice(0, 4)}-01`;
  const to = toRaw || lastEnded;
  const bad = (path: "from" | "to" | "shipped_t", message: string): PeriodCheck => ({ ok: false, path, message });
  if (!isMonthKey(from)) return bad("from", `${quoted(from)} is not a month; write it as YYYY-MM`);
  if (!isMonthKey(to)) return bad("to", `${quoted(to)} is not a month; write it as YYYY-MM`);
  if (from > to) return bad("to", `${to} is before from (${from})`);
  if (to > lastEnded) return bad("to", `${to} has not ended; the last ended month is ${lastEnded}`);
  if (monthsBetween(from, to).length > MAX_MONTHS) return bad("to", `at most ${MAX_MONTHS} months at a time`);
  if (shipped !== null && !/^\d{1,12}(\.\d{1,6})?$/.test(shipped)) return bad("shipped_t", "a quantity in tonnes, e.g. 25000 or 25000.5");
  return { ok: true, from, to, shippedT: shipped };
}
