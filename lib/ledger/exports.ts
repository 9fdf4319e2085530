/**
 * Exports of a site's year or month: CSV (one row per month, or per stream of one month, or the
 * annual tables) and the plant-month JSON. Every figure is the decimal string the engine's result
 * carries (lib/balance num()), written as is: no float conversion, no rounding, so a CSV and the
 * series, the screen and the signed statement all come from the same text.
 */
import { HttpError, quoted } from "@/lib/auth/errors";
import { csvDocument, type CsvValue } from "@/lib/csv";
import { FIRST_YEAR, LAST_YEAR, isYearKey } from "@/lib/period";
import { num } from "@/lib/balance/decimal";
import { toResultDocument } from "@/lib/balance/result";
import type { YearSeries } from "./series";
import type { annualReportJson } from "@/lib/balance/year";
import type { MonthRun, RuleSetYear } from "./year";

export const YEAR_DOCUMENT_FORMAT = "synledger.plant-month-year/1";

/** The `{year}` path segment: four digits within the years the ledger accepts. */
export function yearParam(year: string): string {
  if (!isYearKey(year))
    throw new HttpError(400, "invalid_input", `${quoted(year)} is not a year; write it as YYYY (e.g. 2026).`, [{ path: "year", message: `must be four digits, ${FIRST_YEAR}..${LAST_YEAR}` }]);
  return year;
}

type Cell = CsvValue;

function methodLine(series: YearSeries): string {
  const methods = new Set(series.months.filter((m) => m.method).map((m) => `${m.method!.emissions} / ${m.method!.factor_set} / ${m.method!.gwp}`));
  return methods.size ? `method / factor set / GWP: ${[...methods].join("; ")} (each month's own in its columns)` : "method: no month recorded";
}

const MONTH_HEADER = [
  "month", "state", "revision", "method", "factor set", "GWP set",
  "ammonia (t NH3)", "CO2 (t)", "CO2e (t)", "net CO2e (t)",
  "CO2 intensity (t CO2/t NH3)", "CO2e intensity (t CO2e/t NH3)", "energy (GJ LHV/t NH3)", "theoretical minimum (GJ LHV/t NH3)",
  "carbon closure (%)", "nitrogen closure (%)", "hydrogen closure (%)", "H2:N2 ratio (mol/mol)", "suspect meters",
];

/** The year, one row per month (months nobody started are left out) and a total row. */
export function yearCsv(series: YearSeries): string {
  const rows: Cell[][] = series.months
    .filter((m) => m.state !== null)
    .map((m) => [
      m.month, m.state, m.revision, m.method?.emissions, m.method?.factor_set, m.method?.gwp,
      m.ammonia_t, m.co2_t, m.co2e_t, m.net_co2e_t, m.co2_t_per_t_nh3, m.co2e_t_per_t_nh3, m.gj_lhv_per_t_nh3, m.theoretical_min_gj_lhv_per_t_nh3,
      m.closure_pct.carbon, m.closure_pct.nitrogen, m.closure_pct.hydrogen, m.h2_n2_ratio, m.suspect_meters.join(" "),
    ]);
  const t = series.totals;
  if (t.months_included.length)
    rows.push([
      `${series.year} total`, "", "", "", "", "",
      t.ammonia_t, t.co2_t, t.co2e_t, t.net_co2e_t, t.co2_t_per_t_nh3, t.co2e_t_per_t_nh3, t.gj_lhv_per_t_nh3, t.theoretical_min_gj_lhv_per_t_nh3,
      "", "", "", "", "",
    ]);
  return csvDocument(
    [
      `Synledger year export: ${series.site.name} (${series.site.code}), ${series.year}`,
      methodLine(series),
      `closure tolerance ${series.tolerance_pct} %; closure = (out - in) / in x 100; totals are sums over the months that compute; intensities are total over total`,
      `annual CO2 uncertainty (95 %): ${t.u95_co2_t ?? "n/a"} t CO2 (${t.u95_co2_pct ?? "n/a"} %)`,
      "figures are exact decimal strings from the engine, not rounded",
    ],
    MONTH_HEADER,
    rows,
  );
}

/** One month, one row per stream: the quantity as entered and what the engine made of it. */
export function monthStreamsCsv(site: { name: string; code: string }, run: MonthRun): string {
  const method = run.document.method as { emissions: string; factor_set: string; gwp: string };
  const comments = [
    `Synledger month export: ${site.name} (${site.code}), ${run.period}, state ${run.state}, revision ${run.revision}, version ${run.version}`,
    `method: ${method.emissions}; factor set: ${method.factor_set}; GWP set: ${method.gwp}`,
  ];
  const header = [
    "stream", "kind", "quantity", "unit", "uncertainty (%)", "amount (kmol)", "mass (t)", "carbon (t C)", "energy (GJ LHV)", "energy (GJ HHV)", "electricity (MWh)",
    "CO2 (t)", "CH4 (t)", "N2O (t)", "CO2e (t)",
  ];
  if (!run.result) return csvDocument([...comments, `the stored figures do not compute: ${run.issues.map((i) => `${i.path}: ${i.reason}`).join("; ")}`], header, []);
  const doc = toResultDocument(run.result);
  const emitted = new Map(doc.emissions_by_stream.map((e) => [e.id, e]));
  const uncertainty = new Map(run.result.streams.map((s) => [s.id, num(s.uncertainty_pct)]));
  const rows: Cell[][] = doc.streams.map((s) => {
    const e = emitted.get(s.id);
    return [s.id, s.kind, s.quantity, s.unit, uncertainty.get(s.id), s.kmol, s.t, s.carbon_t, s.gj_lhv, s.gj_hhv, s.mwh, e?.co2_t, e?.ch4_t, e?.n2o_t, e?.co2e_t];
  });
  // Rows the emissions part adds that are not metered streams (e.g. the ammonia process itself).
  for (const e of doc.emissions_by_stream.filter((x) => !doc.streams.some((s) => s.id === x.id)))
    rows.push([e.id, e.kind, "", "", "", "", "", "", "", "", "", e.co2_t, e.ch4_t, e.n2o_t, e.co2e_t]);
  return csvDocument(comments, header, rows);
}

/** The year's emissions by source (sum of the months), as the annual page shows it. */
export function sourcesCsv(series: YearSeries, rows: { id: string; kind: string; co2_t: string; ch4_t: string; n2o_t: string; co2e_t: string }[]): string {
  return csvDocument(
    [`Synledger emissions by source: ${series.site.name} (${series.site.code}), ${series.year}`, methodLine(series)],
    ["source", "kind", "CO2 (t)", "CH4 (t)", "N2O (t)", "CO2e (t)"],
    rows.map((r) => [r.id, r.kind, r.co2_t, r.ch4_t, r.n2o_t, r.co2e_t]),
  );
}

/**
 * The annual emissions report content (EU monitoring rules): one row per source stream with its
 * activity data, calorific value, carbon content, emission factor, oxidation factor, tiers and
 * emissions; then the transfers with their destination; comment lines carry totals and data gaps.
 */
export function annualReportCsv(series: YearSeries, r: ReturnType<typeof annualReportJson>): string {
  return csvDocument(
    [
      `Synledger annual emissions report content: ${series.site.name} (${series.site.code}), ${series.year}`,
      `totals: CO2e before deductions ${r.totals.co2e_before_deductions_t} t; deducted under Reg. (EU) 2018/2066 Art 49 ${r.totals.deducted_t} t; net ${r.totals.net_co2e_t} t`,
      ...r.data_gaps.map((g) => `data gap: ${g}`),
    ],
    ["row", "id", "kind or destination", "activity data", "mass (t)", "NCV (GJ/t)", "carbon (t C/t)", "emission factor (t CO2/TJ)", "oxidation factor", "activity tier", "factor tier", "CO2 (t)", "CO2e (t)", "deducted"],
    [
      ...r.streams.map((s): CsvValue[] => ["source stream", s.id, s.kind, s.activity.map((a) => `${a.quantity} ${a.unit}`).join("; "), s.mass_t, s.ncv_gj_per_t, s.carbon_t_per_t, s.emission_factor_t_co2_per_tj, s.oxidation_factor, s.tier_activity, s.tier_factors, s.co2_t, s.co2e_t, ""]),
      ...r.transfers.map((t): CsvValue[] => ["transfer", t.id, t.destination, "", t.co2_t, "", "", "", "", "", "", t.co2_t, "", t.deducted_under_eu_rules ? "yes" : "no"]),
    ],
  );
}

/** Gross, deducted and net CO2 of the year under each built-in factor set. */
export function ruleSetsCsv(series: YearSeries, sets: RuleSetYear[]): string {
  return csvDocument(
    [`Synledger year under each built-in factor set: ${series.site.name} (${series.site.code}), ${series.year}`, "recorded = the set the months are stored under; the others are recomputed, never stored"],
    ["factor set", "name", "recorded", "gross CO2 (t)", "deducted CO2 (t)", "net CO2 (t)", "CO2e (t)", "net CO2e (t)", "CO2e intensity (t CO2e/t NH3)", "months not computed"],
    sets.map((s) => [
      s.factorSet, s.name, s.recorded ? "yes" : "no",
      num(s.year?.co2.gross_t), num(s.year?.co2.deductible_t), num(s.year?.co2.net_t), num(s.year?.emissions.co2e_t), num(s.year?.emissions.net_co2e_t),
      num(s.year?.intensity.co2e_t_per_t_nh3), s.failed.join(" "),
    ]),
  );
}

/** The year as one JSON document holding each stored month's plant-month file. */
export function yearDocument(site: { name: string; code: string }, year: string, runs: readonly MonthRun[]) {
  return {
    format: YEAR_DOCUMENT_FORMAT,
    site: site.name,
    site_code: site.code,
    year,
    months: runs.map((r) => r.document),
  };
}

/** Download name: synledger-<site code>-<period>[-<table>].<ext>, safe in any header or file system. */
export function exportName(siteCode: string, period: string, ext: "csv" | "json", table?: string): string {
  const code = siteCode.replace(/[^A-Za-z0-9_-]+/g, "-").replace(/^-+|-+$/g, "") || "site";
  return `synledger-${code}-${period}${table ? `-${table}` : ""}.${ext}`;
}
