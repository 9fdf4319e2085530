/**
 * A site's year at a glance, derived from the same series the trends and exports use: months by
 * state, data completeness, the latest closures, intensities year to date against the factor
 * set's benchmarks, and, when the site is above a benchmark, the months that pulled it up.
 * Values stay decimal strings; the card formats them.
 */
import type { SeriesMonth, YearSeries } from "@/lib/ledger/series";
import type { YearBenchmark } from "@/lib/ledger/year";
import { absWithin, compare, fixed, signed } from "@/reports/format";

export type StateKey = NonNullable<SeriesMonth["state"]> | "not_started";
export const STATE_ORDER: StateKey[] = ["submitted", "signed", "in_review", "balanced", "open", "not_started"];

export interface SiteSummary {
  year: string;
  byState: Record<StateKey, string[]>;
  completeness: { present: number; expected: number; months: number };
  latest: { month: string; closures: SeriesMonth["closure_pct"]; ratio: string | null } | null;
  ytd: YearSeries["totals"];
  benchmarks: (YearBenchmark & { above: boolean })[];
  /** Months above the benchmark that is exceeded, highest first, with what the engine flagged in them. */
  drivers: { month: string; value: string; notes: string[] }[];
}

/** The intensity a benchmark is defined on, for one month. */
function monthValue(m: SeriesMonth, b: YearBenchmark): string | null {
  return b.compared_with === "co2_t_per_t_nh3" ? m.co2_t_per_t_nh3 : m.co2e_t_per_t_nh3;
}

/** Short reasons from the month's own figures: closures beyond tolerance, the meter the reconciliation names, the ratio. */
function notesOf(m: SeriesMonth, series: YearSeries): string[] {
  const notes: string[] = [];
  for (const el of ["carbon", "nitrogen", "hydrogen"] as const) {
    const c = m.closure_pct[el];
    if (c !== null && !absWithin(c, series.tolerance_pct)) notes.push(`${el} closure ${signed(c, 2)} %`);
  }
  const names = new Map(series.suspect_meters.map((s) => [s.stream, s.meter ? `${s.name} (${s.meter})` : s.name]));
  if (m.suspect_meters.length) notes.push(`reconciliation names ${m.suspect_meters.map((k) => names.get(k) ?? k).join(", ")}`);
  if (m.flags.some((f) => f.code === "h2-n2-ratio-out-of-range")) notes.push(`H2:N2 ${fixed(m.h2_n2_ratio, 3)}`);
  return notes;
}

export function siteSummary(series: YearSeries): SiteSummary {
  const byState = Object.fromEntries(STATE_ORDER.map((k) => [k, [] as string[]])) as Record<StateKey, string[]>;
  let present = 0;
  let expected = 0;
  for (const m of series.months) {
    byState[m.state ?? "not_started"].push(m.month);
    if (m.readings) {
      present += m.readings.present;
      expected += m.readings.expected;
    }
  }
  // The running month is provisional: the latest closures and the drivers come from ended months.
  const computed = series.months.filter((m) => m.computes && m.timing === "ended");
  const last = computed[computed.length - 1];
  const benchmarks = series.benchmarks.map((b) => ({ ...b, above: b.site_value !== null && compare(b.site_value, b.value) > 0 }));
  // The tightest benchmark exceeded explains "off benchmark"; looser ones the site meets add nothing.
  const exceeded = benchmarks.filter((b) => b.above).sort((a, b) => compare(a.value, b.value))[0];
  const drivers = exceeded
    ? computed
        .flatMap((m) => {
          const v = monthValue(m, exceeded);
          return v !== null && compare(v, exceeded.value) > 0 ? [{ month: m.month, value: v, notes: notesOf(m, series) }] : [];
        })
        .sort((a, b) => compare(b.value, a.value))
        .slice(0, 3)
    : [];
  return {
    year: series.year,
    byState,
    completeness: { present, expected, months: series.months.filter((m) => m.state !== null).length },
    latest: last ? { month: last.month, closures: last.closure_pct, ratio: last.h2_n2_ratio } : null,
    ytd: series.totals,
    benchmarks,
    drivers,
  };
}
