/**
 * A site's calendar year from its stored months: each month through the same engine run as the
 * month pages (calculateMonth), then lib/emissions' rollUpYear for the totals and their combined
 * uncertainty. Pure (no database, no framework), so the server pages, the series endpoint, the
 * exports and the browser's what-if all add the months up the same way.
 */
import { calculate, type CalculationResult } from "@/lib/balance/calculate";
import { Dec, ZERO, num } from "@/lib/balance/decimal";
import { parsePlantMonth, type InputIssue } from "@/lib/balance/schema";
import { BUILT_IN_FACTOR_SETS } from "@/lib/emissions/registry";
import { rollUpYear, type YearResult } from "@/lib/emissions/year";
import { hasEnded } from "@/lib/period";
import { euFiguresJson, euFiguresOf } from "@/lib/balance/year";
import type { MonthState } from "@/lib/month-states";


/** One stored month after its engine run; `result` is null when the stored figures do not compute. */
export interface MonthRun {
  id: string;
  period: string;
  state: MonthState;
  revision: number;
  version: number;
  /** The plant-month document the engine read (numbers as strings). */
  document: Record<string, unknown>;
  result: CalculationResult | null;
  issues: InputIssue[];
  /** Active streams with a reading this month, against active streams of the site. */
  readings: { present: number; expected: number };
  /** True when the figures come from the revision's snapshot (In review, Signed, Submitted). */
  frozen: boolean;
  /** The last day the figures cover, when stated (daily imports). */
  coveredThrough: string | null;
}

/** The twelve month keys of a year, January first. */
export function monthsOfYear(year: string): string[] {
  return Array.from({ length: 12 }, (_, i) => `${year}-${String(i + 1).padStart(2, "0")}`);
}

/**
 * The months a year-to-date figure may count: those whose last day has passed. The running
 * month is left out of every total (and the pages say so), never counted as complete.
 */
export function endedRuns<R extends Pick<MonthRun, "period">>(runs: readonly R[], now = new Date()): R[] {
  return runs.filter((r) => hasEnded(r.period, now));
}

/** Totals of the ended months that compute, or null when none does (a year with nothing to add). */
export function rollUpRuns(runs: readonly MonthRun[], now = new Date()): YearResult | null {
  const ok = endedRuns(runs, now).filter((r): r is MonthRun & { result: CalculationResult } => r.result !== null);
  if (ok.length === 0) return null;
  return rollUpYear(ok.map((r) => ({ month: r.period, input: r.result.emissions.input, result: r.result.emissions.detail })));
}

/** A benchmark of the factor set against the year-to-date intensity it is defined on. */
export interface YearBenchmark {
  id: string;
  label: string;
  kind: string;
  unit: string;
  /** Which intensity the benchmark is compared with: direct CO2 or CO2e per tonne NH3. */
  compared_with: "co2_t_per_t_nh3" | "co2e_t_per_t_nh3";
  value: string;
  site_value: string | null;
  difference: string | null;
  ratio_pct: string | null;
  source: string;
  status: "confirmed" | "unconfirmed";
}

/**
 * The year's position against each benchmark the months name. The year-to-date value is total
 * over total (not the mean of monthly ratios), so a small month weighs as little as it produced.
 */
export function yearBenchmarks(runs: readonly MonthRun[], year: YearResult | null): YearBenchmark[] {
  const seen = new Map<string, YearBenchmark>();
  for (const r of runs) {
    for (const b of r.result?.emissions.detail.benchmarks ?? []) {
      if (seen.has(b.id)) continue;
      const nh3 = year?.ammonia_t ?? ZERO;
      const total = b.compared_with === "co2_t_per_t_nh3" ? year?.emissions.co2_t : year?.emissions.co2e_t;
      const site = total && nh3.gt(0) ? total.div(nh3) : null;
      seen.set(b.id, {
        id: b.id,
        label: b.label,
        kind: b.kind,
        unit: b.unit,
        compared_with: b.compared_with,
        value: b.value.toFixed(),
        site_value: num(site),
        difference: site ? num(site.minus(b.value)) : null,
        ratio_pct: site && !b.value.isZero() ? num(site.div(b.value).times(100)) : null,
        source: b.source,
        status: b.status,
      });
    }
  }
  return [...seen.values()];
}

/** Theoretical minimum energy per tonne over the year, weighted by each month's production. */
export function yearTheoreticalMinimum(runs: readonly MonthRun[]): string | null {
  let weighted = ZERO;
  let nh3 = ZERO;
  for (const r of runs) {
    const min = r.result?.feed.theoretical_min_gj_lhv_per_t_nh3;
    if (!r.result || !min) continue;
    weighted = weighted.plus(min.times(r.result.feed.ammonia_t));
    nh3 = nh3.plus(r.result.feed.ammonia_t);
  }
  return nh3.gt(0) ? num(weighted.div(nh3)) : null;
}

/** A what-if or rule-set run of plant-month documents: parse, calculate, roll up. */
export function calculateDocuments(documents: readonly Record<string, unknown>[], tolerancePct: string, reconcile = true) {
  return documents.map((d) => {
    const parsed = parsePlantMonth(d);
    if (!parsed.ok) return { month: String(d.month ?? ""), result: null, issues: parsed.issues };
    try {
      return { month: parsed.doc.month, result: calculate(parsed.doc, { closureTolerancePct: new Dec(tolerancePct), reconcile }), issues: [] as InputIssue[] };
    } catch (err) {
      const reason = err instanceof Error ? err.message : String(err);
      return { month: parsed.doc.month, result: null, issues: [{ path: "document", reason }] };
    }
  });
}

/** The same documents with another factor set named (and nothing else changed). */
export function withFactorSet(documents: readonly Record<string, unknown>[], factorSet: string): Record<string, unknown>[] {
  return documents.map((d) => ({ ...d, method: { ...(d.method as Record<string, unknown>), factor_set: factorSet } }));
}

export interface RuleSetYear {
  factorSet: string;
  name: string;
  /** True for the set the months are actually recorded under. */
  recorded: boolean;
  year: YearResult | null;
  failed: string[];
}

/**
 * The year under each built-in factor set: gross CO2, what the set's rules let be deducted
 * (urea, storage, sale) and the net. Reconciliation is skipped because it does not depend on
 * the factor set, and the set changes nothing else.
 */
export function yearUnderEachFactorSet(documents: readonly Record<string, unknown>[], tolerancePct: string, recordedSets: readonly string[]): RuleSetYear[] {
  return BUILT_IN_FACTOR_SETS.map((set) => {
    const runs = calculateDocuments(withFactorSet(documents, set.id), tolerancePct, false);
    const ok = runs.filter((r) => r.result !== null) as { month: string; result: CalculationResult }[];
    return {
      factorSet: set.id,
      name: set.name,
      recorded: recordedSets.includes(set.id),
      year: ok.length ? rollUpYear(ok.map((r) => ({ month: r.month, input: r.result.emissions.input, result: r.result.emissions.detail }))) : null,
      failed: runs.filter((r) => r.result === null).map((r) => r.month),
    };
  });
}

/** Emissions by source over the year: each stream's monthly rows added up, in the month's order of appearance. */
export function yearBySource(runs: readonly MonthRun[]) {
  const rows = new Map<string, { id: string; kind: string; co2_t: Dec; ch4_t: Dec; n2o_t: Dec; co2e_t: Dec }>();
  for (const r of runs) {
    for (const s of r.result?.emissions.detail.by_stream ?? []) {
      const row = rows.get(s.id) ?? { id: s.id, kind: s.kind, co2_t: ZERO, ch4_t: ZERO, n2o_t: ZERO, co2e_t: ZERO };
      rows.set(s.id, { ...row, co2_t: row.co2_t.plus(s.co2_t), ch4_t: row.ch4_t.plus(s.ch4_t), n2o_t: row.n2o_t.plus(s.n2o_t), co2e_t: row.co2e_t.plus(s.co2e_t) });
    }
  }
  return [...rows.values()].map((r) => ({ id: r.id, kind: r.kind, co2_t: num(r.co2_t)!, ch4_t: num(r.ch4_t)!, n2o_t: num(r.n2o_t)!, co2e_t: num(r.co2e_t)! }));
}

/**
 * Whether the annual statement may be signed: all twelve months of the year exist and are
 * Signed or Submitted. `waiting` names the others (a month nobody started included).
 */
export function annualReadiness(year: string, runs: readonly Pick<MonthRun, "period" | "state">[]): { ready: boolean; waiting: string[] } {
  const stateOf = new Map(runs.map((r) => [r.period, r.state]));
  const waiting = monthsOfYear(year).filter((m) => stateOf.get(m) !== "signed" && stateOf.get(m) !== "submitted");
  return { ready: waiting.length === 0, waiting };
}

/**
 * The EU trading-system monitoring check and the CBAM figures of the year's ended months that
 * compute, in the year document's JSON form (decimal strings); null when no month computes.
 */
export function yearEuEtsAndCbam(year: string, runs: readonly MonthRun[], now = new Date()) {
  const ok = endedRuns(runs, now).filter((r): r is MonthRun & { result: CalculationResult } => r.result !== null);
  if (ok.length === 0) return null;
  const eu = euFiguresOf(ok.map((r) => ({ month: r.period, input: r.result.emissions.input, result: r.result.emissions.detail })), year);
  const json = euFiguresJson(eu);
  const { annual_report: annualReport, ...euEts } = json.eu_ets;
  return { euEts, annualReport, cbam: json.cbam, flags: eu.euEts.flags };
}
