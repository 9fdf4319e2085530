/**
 * The series as chart rows. Numbers become JS numbers here and only here, because the SVG needs
 * coordinates; every label, tooltip and table cell formats the decimal string kept beside it.
 */
import type { YearSeries } from "@/lib/ledger/series";

const SHORT = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

const draw = (v: string | null): number | null => (v === null ? null : Number(v));

export interface ChartRow {
  label: string;
  month: string;
  state: string | null;
  nh3: number | null;
  co2e: number | null;
  co2: number | null;
  gj: number | null;
  gjMin: number | null;
  carbon: number | null;
  nitrogen: number | null;
  hydrogen: number | null;
  ratio: number | null;
  /** The exact decimal strings, for tooltips. */
  text: Record<"nh3" | "co2e" | "co2" | "gj" | "gjMin" | "carbon" | "nitrogen" | "hydrogen" | "ratio", string | null>;
}

export function chartRows(s: YearSeries): ChartRow[] {
  return s.months.map((m, i) => {
    const text = {
      nh3: m.ammonia_t,
      co2e: m.co2e_t_per_t_nh3,
      co2: m.co2_t_per_t_nh3,
      gj: m.gj_lhv_per_t_nh3,
      gjMin: m.theoretical_min_gj_lhv_per_t_nh3,
      carbon: m.closure_pct.carbon,
      nitrogen: m.closure_pct.nitrogen,
      hydrogen: m.closure_pct.hydrogen,
      ratio: m.h2_n2_ratio,
    };
    return {
      label: SHORT[i],
      month: m.month,
      state: m.state,
      ...(Object.fromEntries(Object.entries(text).map(([k, v]) => [k, draw(v)])) as Omit<ChartRow, "label" | "month" | "state" | "text">),
      text,
    };
  });
}

export const hasData = (s: YearSeries) => s.months.some((m) => m.computes);
