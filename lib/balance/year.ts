// Annual roll-up of several plant-month files of one site: each month is calculated as the
// month CLI would, then lib/emissions' rollUpYear adds them with the annual uncertainty model
// (factor part correlated across months, meter part independent).
import { YEAR_CORRELATION, rollUpYear, type YearMonthEntry, type YearResult } from "../emissions/year";
import { embeddedEmissions, CBAM_GOOD, type CbamFigures } from "../emissions/cbam";
import { annualReportContent, etsBenchmark, monitoringCheck, type AnnualReportContent, type EtsBenchmark, type MonitoringCheck } from "../emissions/eu-ets";
import { EU_MRR } from "../emissions/factor-sets/eu-mrr";
import type { CalculationResult } from "./calculate";
import { ZERO, dec, num } from "./decimal";
import { uncertaintyJson } from "./result-emissions";
import type { PlantMonth } from "./schema";
import type { Flag } from "./types";

export interface LoadedMonth {
  file: string;
  doc: PlantMonth;
  result: CalculationResult;
}

export const YEAR_RESULT_FORMAT = "synledger.year-result/1";

export interface YearRollUp {
  site: string;
  files: LoadedMonth[];
  year: YearResult;
  /** Month warnings and errors carried up, prefixed with their month so none is lost in the total. */
  flags: Flag[];
  /** EU emissions trading monitoring check and CBAM embedded emissions of the months given (issue 14). */
  eu: EuFigures;
}

export interface EuFigures {
  euEts: MonitoringCheck;
  etsBenchmark: EtsBenchmark | null;
  annualReport: AnnualReportContent;
  cbam: CbamFigures;
}

/** The EU trading-system check, the ammonia benchmark, the annual report content and CBAM of a year's months: one composition for the CLI, the pages and the statements. */
export function euFiguresOf(entries: YearMonthEntry[], year: string): EuFigures {
  const euEts = monitoringCheck(entries);
  const co2e = entries.reduce((a, e) => a.plus(e.result.emissions.co2e_t), ZERO);
  const nh3 = entries.reduce((a, e) => a.plus(dec(e.input.ammonia_t)), ZERO);
  return { euEts, etsBenchmark: etsBenchmark(year, EU_MRR.benchmarks, co2e, nh3), annualReport: annualReportContent(entries, euEts, year), cbam: embeddedEmissions(entries) };
}

/** The year document's `eu_ets` and `cbam` objects (decimal strings). */
export function euFiguresJson(eu: EuFigures) {
  return { eu_ets: { ...euEtsJson(eu.euEts, eu.etsBenchmark), annual_report: annualReportJson(eu.annualReport) }, cbam: cbamJson(eu.cbam) };
}

/** Why a set of files cannot make one year: the offending file and the JSON path, or null when they can. */
export function yearInputProblem(months: LoadedMonth[]): { file: string; path: string; reason: string } | null {
  const first = months[0];
  const year = first.doc.month.slice(0, 4);
  const seen = new Map<string, string>();
  for (const m of months) {
    if (m.doc.site !== first.doc.site)
      return { file: m.file, path: "site", reason: `site "${m.doc.site}" differs from "${first.doc.site}" in ${first.file}; a year rolls up one site` };
    if (m.doc.month.slice(0, 4) !== year)
      return { file: m.file, path: "month", reason: `${m.doc.month} is not in ${year}, the year of ${first.file}` };
    const other = seen.get(m.doc.month);
    if (other !== undefined) return { file: m.file, path: "month", reason: `${m.doc.month} is given twice (also ${other})` };
    seen.set(m.doc.month, m.file);
  }
  return null;
}

export function rollUp(months: LoadedMonth[]): YearRollUp {
  const sorted = [...months].sort((a, b) => a.doc.month.localeCompare(b.doc.month));
  const entries: YearMonthEntry[] = sorted.map((m) => ({ month: m.doc.month, input: m.result.emissions.input, result: m.result.emissions.detail }));
  const year = rollUpYear(entries);
  const eu = euFiguresOf(entries, year.year);
  const monthFlags = sorted.flatMap((m) =>
    m.result.flags.filter((f) => f.severity !== "info").map((f) => ({ code: f.code, severity: f.severity, message: `${m.doc.month}: ${f.message}` })),
  );
  return {
    site: sorted[0].doc.site, files: sorted, year, flags: [...year.flags, ...eu.euEts.flags, ...monthFlags], eu,
  };
}

export function toYearDocument(y: YearRollUp) {
  const r = y.year;
  const e = r.emissions;
  const method = y.files[0].result.emissions.detail;
  return {
    format: YEAR_RESULT_FORMAT,
    site: y.site,
    year: r.year,
    months_included: r.months_included,
    months_missing: r.months_missing,
    months: y.files.map((m) => {
      const d = m.result.emissions.detail;
      return {
        month: m.doc.month, file: m.file, ammonia_t: num(d.intensity.ammonia_t), co2_t: num(d.emissions.co2_t),
        co2e_t: num(d.emissions.co2e_t), net_co2e_t: num(d.emissions.net_co2e_t), co2e_t_per_t_nh3: num(d.intensity.co2e_t_per_t_nh3),
        gj_lhv_per_t_nh3: num(d.intensity.gj_lhv_per_t_nh3), carbon_closure_pct: num(m.result.balances.carbon.closure_pct),
        u95_co2_t: num(d.uncertainty.co2.u95_t),
      };
    }),
    method: { emissions: method.method, factor_set: method.factor_set, gwp: method.gwp.id },
    ammonia_t: num(r.ammonia_t),
    emissions: {
      co2_t: num(e.co2_t), ch4_t: num(e.ch4_t), n2o_t: num(e.n2o_t), co2e_t: num(e.co2e_t),
      transferred_co2_t: num(e.transferred_co2_t), net_co2e_t: num(e.net_co2e_t),
      gross_co2_t: num(r.co2.gross_t), deductible_co2_t: num(r.co2.deductible_t), net_co2_t: num(r.co2.net_t),
    },
    transfers_by_destination: Object.fromEntries(Object.entries(r.transfers_by_destination).map(([k, v]) => [k, num(v)])),
    intensity: {
      co2e_t_per_t_nh3: num(r.intensity.co2e_t_per_t_nh3),
      net_co2e_t_per_t_nh3: num(r.intensity.net_co2e_t_per_t_nh3),
      gj_lhv_per_t_nh3: num(r.intensity.gj_lhv_per_t_nh3),
      indirect_co2e_t: num(r.intensity.indirect_co2e_t),
      indirect_complete: r.intensity.indirect_complete,
      co2e_incl_indirect_t_per_t_nh3: num(r.intensity.co2e_incl_indirect_t_per_t_nh3),
    },
    uncertainty: {
      model: `${YEAR_CORRELATION}; 95 %, k = 1.96`,
      co2: uncertaintyJson(r.uncertainty.co2),
      net_co2: uncertaintyJson(r.uncertainty.net_co2),
      co2e: uncertaintyJson(r.uncertainty.co2e),
      net_co2e: uncertaintyJson(r.uncertainty.net_co2e),
    },
    ...euFiguresJson(y.eu),
    flags: y.flags,
  };
}

export function euEtsJson(c: MonitoringCheck, b: EtsBenchmark | null) {
  return {
    installation_category: c.installation_category,
    emissions_t: num(c.emissions_t),
    materiality_threshold_pct: num(c.materiality_threshold_pct),
    materiality_threshold_t: num(c.materiality_threshold_t),
    source_streams: c.source_streams.map((s) => ({
      id: s.id, kind: s.kind, class: s.class, emissions_t: num(s.emissions_t), share_pct: num(s.share_pct),
      tier_required: s.tier_required, tier_achieved: s.tier_achieved, tier_with_approval: s.tier_with_approval,
      uncertainty_pct: num(s.uncertainty_pct), uncertainty_needed_pct: num(s.uncertainty_needed_pct),
      factor_origin: s.factor_origin, factor_tier_achieved: s.factor_tier_achieved, factor_tier_required: s.factor_tier_required, rule: s.rule,
    })),
    benchmark: b
      ? { id: b.id, label: b.label, value: num(b.value), value_note: b.value === null ? `not shown: the value was not confirmed in ${b.source}` : null, unit: b.unit, source: b.source, status: b.status,
          intensity_t_per_t: num(b.intensity_t_per_t), difference_pct: num(b.difference_pct) }
      : null,
    benchmark_note: b ? null : "no EU ammonia benchmark is shown for this year: the act setting the 2026–2030 value was not found, so none is given",
    notes: c.notes,
    rules: c.rules,
  };
}

export function cbamJson(c: CbamFigures) {
  return {
    good: CBAM_GOOD,
    period: c.period,
    production_t: num(c.production_t),
    direct_t: num(c.direct_t),
    direct_deducted_t: num(c.direct_deducted_t),
    urea_co2_t: num(c.urea_co2_t),
    electricity_mwh: num(c.electricity_mwh),
    electricity_mwh_with_factor: num(c.electricity_mwh_with_factor),
    electricity_factor_t_per_mwh: num(c.electricity_factor_t_per_mwh),
    indirect_t: num(c.indirect_t),
    indirect_complete: c.indirect_complete,
    see_direct_t_per_t: num(c.see_direct_t_per_t),
    see_indirect_t_per_t: num(c.see_indirect_t_per_t),
    see_total_t_per_t: num(c.see_total_t_per_t),
    precursors: c.precursors,
  };
}

export function annualReportJson(r: AnnualReportContent) {
  return {
    streams: r.streams.map((s) => ({
      id: s.id, kind: s.kind, activity: s.activity.map((a) => ({ unit: a.unit, quantity: num(a.quantity) })), mass_t: num(s.mass_t),
      ncv_gj_per_t: num(s.ncv_gj_per_t), carbon_t_per_t: num(s.carbon_t_per_t), emission_factor_t_co2_per_tj: num(s.emission_factor_t_per_tj),
      oxidation_factor: s.oxidation_factor, tier_activity: s.tier_activity, tier_factors: s.tier_factors, co2_t: num(s.co2_t), co2e_t: num(s.co2e_t),
    })),
    totals: { co2e_before_deductions_t: num(r.totals.co2e_before_deductions_t), deducted_t: num(r.totals.deducted_t), net_co2e_t: num(r.totals.net_co2e_t) },
    transfers: r.transfers.map((t) => ({ id: t.id, destination: t.destination, co2_t: num(t.co2_t), deducted_under_eu_rules: t.deducted_under_eu_rules, receiver: t.receiver })),
    data_gaps: r.data_gaps,
  };
}
