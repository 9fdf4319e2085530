/**
 * The monthly series of a site's year as GET /api/v1/sites/{siteId}/years/{year}/series answers
 * it, and as the trend charts, the overview and the CSV export read it. Every figure is a decimal
 * string (or null where the month has no value); charts convert to numbers only to draw.
 */
import { num } from "@/lib/balance/decimal";
import { namedSuspects } from "@/lib/balance/suspects";
import type { YearResult } from "@/lib/emissions/year";
import { hasEnded, monthTiming } from "@/lib/period";
import { endedRuns, monthsOfYear, yearBenchmarks, yearTheoreticalMinimum, type MonthRun, type YearBenchmark } from "./year";
import type { MonthState } from "@/lib/month-states";

export const SERIES_FORMAT = "synledger.year-series/1";

export interface StreamLabel {
  key: string;
  name: string;
  meterTag: string | null;
}

export interface SeriesMonth {
  month: string;
  /** null: nobody has started the month. */
  state: MonthState | null;
  /** ended: its last day has passed; in-progress: the running month (left out of totals); future: not begun. */
  timing: "ended" | "in-progress" | "future";
  /** True when the figures come from the revision's frozen snapshot. */
  frozen: boolean;
  /** The last day the figures cover, when stated. */
  covered_through: string | null;
  revision: number | null;
  computes: boolean;
  method: { emissions: string; factor_set: string; gwp: string } | null;
  readings: { present: number; expected: number } | null;
  ammonia_t: string | null;
  co2_t: string | null;
  co2e_t: string | null;
  net_co2e_t: string | null;
  co2_t_per_t_nh3: string | null;
  co2e_t_per_t_nh3: string | null;
  gj_lhv_per_t_nh3: string | null;
  theoretical_min_gj_lhv_per_t_nh3: string | null;
  closure_pct: { carbon: string | null; nitrogen: string | null; hydrogen: string | null };
  h2_n2_ratio: string | null;
  /** Streams the reconciliation names as suspect this month (stream keys). */
  suspect_meters: string[];
  /** Warnings and errors of the month, for tooltips and the attention list. */
  flags: { code: string; severity: string; message: string; stream?: string }[];
}

export interface YearSeries {
  format: typeof SERIES_FORMAT;
  site: { id: string; name: string; code: string };
  year: string;
  tolerance_pct: string;
  h2_n2_target: string;
  benchmarks: YearBenchmark[];
  months: SeriesMonth[];
  /** Which meters the reconciliation names, most often first. */
  suspect_meters: { stream: string; name: string; meter: string | null; months: string[] }[];
  totals: {
    months_included: string[];
    /** Months with figures left out of the totals because they have not ended (the running month). */
    months_left_out_in_progress: string[];
    ammonia_t: string | null;
    co2_t: string | null;
    co2e_t: string | null;
    net_co2e_t: string | null;
    co2e_t_per_t_nh3: string | null;
    co2_t_per_t_nh3: string | null;
    gj_lhv_per_t_nh3: string | null;
    theoretical_min_gj_lhv_per_t_nh3: string | null;
    u95_co2_t: string | null;
    u95_co2_pct: string | null;
  };
}

const EMPTY_CLOSURES = { carbon: null, nitrogen: null, hydrogen: null };

/** The meters the reconciliation names (lib/balance/suspects.ts). */
const namedMeters = (r: MonthRun["result"]): string[] => namedSuspects(r?.reconciliation?.streams);

function seriesMonth(period: string, run: MonthRun | undefined, now: Date): SeriesMonth {
  const r = run?.result ?? null;
  const d = r?.emissions.detail;
  const method = run ? ((run.document.method as SeriesMonth["method"]) ?? null) : null;
  return {
    month: period,
    state: run?.state ?? null,
    timing: monthTiming(period, now).kind,
    frozen: run?.frozen ?? false,
    covered_through: run?.coveredThrough ?? null,
    revision: run?.revision ?? null,
    computes: r !== null,
    method,
    readings: run?.readings ?? null,
    ammonia_t: num(r?.feed.ammonia_t),
    co2_t: num(d?.emissions.co2_t),
    co2e_t: num(d?.emissions.co2e_t),
    net_co2e_t: num(d?.emissions.net_co2e_t),
    co2_t_per_t_nh3: num(d?.intensity.co2_t_per_t_nh3),
    co2e_t_per_t_nh3: num(d?.intensity.co2e_t_per_t_nh3),
    gj_lhv_per_t_nh3: num(r?.feed.gj_lhv_per_t_nh3),
    theoretical_min_gj_lhv_per_t_nh3: num(r?.feed.theoretical_min_gj_lhv_per_t_nh3),
    closure_pct: r
      ? { carbon: num(r.balances.carbon.closure_pct), nitrogen: num(r.balances.nitrogen.closure_pct), hydrogen: num(r.balances.hydrogen.closure_pct) }
      : EMPTY_CLOSURES,
    h2_n2_ratio: num(r?.balances.h2n2Ratio),
    suspect_meters: namedMeters(r),
    flags: (r?.flags ?? [])
      .filter((f) => f.severity !== "info")
      .map((f) => ({ code: f.code, severity: f.severity, message: f.message, ...(f.stream ? { stream: f.stream } : {}) })),
  };
}

export interface SeriesInput {
  site: { id: string; name: string; code: string; closureTolerancePct: string };
  year: string;
  runs: readonly MonthRun[];
  streams: readonly StreamLabel[];
  /** Totals of the ended months only (rollUpRuns). */
  rollUp: YearResult | null;
  now?: Date;
}

export function buildSeries(input: SeriesInput): YearSeries {
  const now = input.now ?? new Date();
  const byPeriod = new Map(input.runs.map((r) => [r.period, r]));
  const months = monthsOfYear(input.year).map((p) => seriesMonth(p, byPeriod.get(p), now));
  const ended = endedRuns(input.runs, now);
  const suspects = new Map<string, string[]>();
  for (const m of months) for (const s of m.suspect_meters) suspects.set(s, [...(suspects.get(s) ?? []), m.month]);
  const label = new Map(input.streams.map((s) => [s.key, s]));
  const y = input.rollUp;
  const nh3 = y?.ammonia_t;
  return {
    format: SERIES_FORMAT,
    site: { id: input.site.id, name: input.site.name, code: input.site.code },
    year: input.year,
    tolerance_pct: input.site.closureTolerancePct,
    // Make-up gas for ammonia synthesis is held near 3 H2 : 1 N2 (stoichiometry; common practice).
    h2_n2_target: "3",
    benchmarks: yearBenchmarks(ended, y),
    months,
    suspect_meters: [...suspects]
      .map(([stream, ms]) => ({ stream, name: label.get(stream)?.name ?? stream, meter: label.get(stream)?.meterTag ?? null, months: ms }))
      .sort((a, b) => b.months.length - a.months.length || a.stream.localeCompare(b.stream)),
    totals: {
      months_included: y?.months_included ?? [],
      months_left_out_in_progress: input.runs.filter((r) => !hasEnded(r.period, now)).map((r) => r.period),
      ammonia_t: num(nh3),
      co2_t: num(y?.emissions.co2_t),
      co2e_t: num(y?.emissions.co2e_t),
      net_co2e_t: num(y?.emissions.net_co2e_t),
      co2e_t_per_t_nh3: num(y?.intensity.co2e_t_per_t_nh3),
      co2_t_per_t_nh3: y && nh3?.gt(0) ? num(y.emissions.co2_t.div(nh3)) : null,
      gj_lhv_per_t_nh3: num(y?.intensity.gj_lhv_per_t_nh3),
      theoretical_min_gj_lhv_per_t_nh3: yearTheoreticalMinimum(ended),
      u95_co2_t: num(y?.uncertainty.co2.u95_t),
      u95_co2_pct: num(y?.uncertainty.co2.u95_pct),
    },
  };
}
