import { K95, ZERO, dec, sqrtOf, type Decimal } from "./decimal";
import type { FactorSet } from "./factor-set-schema";
import type { UncertaintyTerm } from "./model";
import type { EmissionsInput, StreamKind } from "./types";

export interface UncertaintyComponent { key: string; u_std_t: Decimal }

/**
 * One meter's part, split into what repeats every month until the meter is recalibrated
 * (systematic: calibration error) and what is new each month (random). `period` names the
 * calibration the systematic part belongs to (the meter's calibration date), null when unknown.
 */
export interface MeterComponent extends UncertaintyComponent {
  systematic_u_std_t: Decimal;
  random_u_std_t: Decimal;
  period: string | null;
}

/** How a meter's uncertainty is split, per stream id (absent: all systematic, period unknown). */
export interface MeterSplit {
  systematic_share: Decimal;
  period: string | null;
  /** A stream no meter measures: it has no meter uncertainty to miss. */
  unmetered?: boolean;
}

export interface UncertaintyFigures {
  value_t: Decimal;
  u_std_t: Decimal;                       // combined standard uncertainty
  u95_t: Decimal;                         // expanded, coverage factor 1.96 (95 %, normal)
  u95_pct: Decimal | null;                // relative to |value|; null when value is zero
  meter_u_std_t: Decimal;                 // part from meters
  meter_systematic_u_std_t: Decimal;      // of it, the part repeating until recalibration
  meter_random_u_std_t: Decimal;          // of it, the part new each month
  analysis_u_std_t: Decimal;              // part from the gas analyses (carbon content, calorific value)
  factor_u_std_t: Decimal;                // part from factors
  meter_components: MeterComponent[];     // one per meter
  analysis_components: UncertaintyComponent[]; // one per analysis and property ("ng:carbon")
  factor_components: UncertaintyComponent[]; // one per factor key
  coverage_factor: Decimal;
  meters_without_uncertainty: string[];
  /** How the parts were combined, in words (the year states its correlation model here). */
  correlation: string;
}

export const MONTH_CORRELATION =
  "meters independent of each other; a meter, an analysis property or a factor used in several terms is fully correlated with itself; the three parts independent of each other";

const ONE = dec(1);

/**
 * GUM first-order propagation for a figure that is a sum of products meter × analysis × factor.
 * The sensitivity of the sum to a relative error of an input is the term value itself, so
 *   u_meter² = Σ_meters (Σ_terms of that meter value × u_rel,meter)²
 *   u_analysis² = Σ_analysis properties (Σ_terms using it value × u_rel)²
 *   u_factor² = Σ_factor keys (Σ_terms using that factor value × u_rel,factor)²
 * A meter appearing in several terms, an analysis giving the carbon of feed and fuel, or a factor
 * multiplying several streams is fully correlated with itself: its contributions add linearly
 * before squaring. Different meters, analyses and factors are independent. Inputs are expanded
 * (95 %) uncertainties; they are divided by 1.96 to standard and the result multiplied back.
 * Each meter's part is split by `splits` into systematic and random: the share is of the stated
 * uncertainty, u_sys = share·u, and the random part takes the rest of the variance,
 * u_rand = u·√(1 − share²), so that u_sys² + u_rand² = u²; within one month the split changes
 * nothing, across months it does.
 */
export function propagate(terms: UncertaintyTerm[], k: Decimal = K95, splits: ReadonlyMap<string, MeterSplit> = new Map()): UncertaintyFigures {
  const meters = new Map<string, Decimal>();
  const analyses = new Map<string, Decimal>();
  const factors = new Map<string, Decimal>();
  const missing = new Set<string>();
  let value = ZERO;
  for (const t of terms) {
    value = value.plus(t.value_t);
    const id = t.stream_id ?? "(unnamed)";
    if (t.meter_rel_std === null || t.meter_rel_std === undefined) {
      if (t.stream_id && !splits.get(t.stream_id)?.unmetered) missing.add(t.stream_id);
    } else {
      meters.set(id, (meters.get(id) ?? ZERO).plus(t.value_t.times(t.meter_rel_std)));
    }
    if (t.analysis_key && t.analysis_rel_std) {
      analyses.set(t.analysis_key, (analyses.get(t.analysis_key) ?? ZERO).plus(t.value_t.times(t.analysis_rel_std)));
    }
    if (t.factor_key && t.factor_rel_std) {
      factors.set(t.factor_key, (factors.get(t.factor_key) ?? ZERO).plus(t.value_t.times(t.factor_rel_std)));
    }
  }
  const meterComponents: MeterComponent[] = [...meters].map(([key, signed]) => {
    const u = signed.abs();
    const split = splits.get(key);
    const share = split?.systematic_share ?? ONE;
    return meterComponent(key, u, share, split?.period ?? null);
  });
  const analysisComponents = [...analyses].map(([key, u]) => ({ key, u_std_t: u.abs() }));
  const factorComponents = [...factors].map(([key, u]) => ({ key, u_std_t: u.abs() }));
  return summarise(value, meterComponents, analysisComponents, factorComponents, [...missing], k, MONTH_CORRELATION);
}

/** A meter part of standard uncertainty u whose systematic part is `share` (0–1) of u. */
export function meterComponent(key: string, u: Decimal, share: Decimal, period: string | null): MeterComponent {
  const sys = share.eq(1) ? u : u.times(share);
  const rand = share.eq(1) ? ZERO : share.isZero() ? u : u.times(sqrtOf(ONE.minus(share.times(share))));
  return { key, u_std_t: u, systematic_u_std_t: sys, random_u_std_t: rand, period };
}

export function rss(values: Decimal[]): Decimal {
  return sqrtOf(values.reduce((a, v) => a.plus(v.times(v)), ZERO));
}

export function summarise(value: Decimal, meterComponents: MeterComponent[], analysisComponents: UncertaintyComponent[],
  factorComponents: UncertaintyComponent[], missing: string[], k: Decimal = K95, correlation: string = MONTH_CORRELATION,
  meterTotals?: { systematic: Decimal; random: Decimal }): UncertaintyFigures {
  const sys = meterTotals?.systematic ?? rss(meterComponents.map((c) => c.systematic_u_std_t));
  const rand = meterTotals?.random ?? rss(meterComponents.map((c) => c.random_u_std_t));
  const meterU = sqrtOf(sys.times(sys).plus(rand.times(rand)));
  const analysisU = rss(analysisComponents.map((c) => c.u_std_t));
  const factorU = rss(factorComponents.map((c) => c.u_std_t));
  const u = sqrtOf(meterU.times(meterU).plus(analysisU.times(analysisU)).plus(factorU.times(factorU)));
  const u95 = u.times(k);
  return {
    value_t: value, u_std_t: u, u95_t: u95, u95_pct: value.isZero() ? null : u95.div(value.abs()).times(100),
    meter_u_std_t: meterU, meter_systematic_u_std_t: sys, meter_random_u_std_t: rand, analysis_u_std_t: analysisU,
    factor_u_std_t: factorU, meter_components: meterComponents, analysis_components: analysisComponents,
    factor_components: factorComponents, coverage_factor: k, meters_without_uncertainty: missing, correlation,
  };
}

// ---- Activity-data tiers ----

export interface MeterTier {
  stream_id: string;
  kind: StreamKind;
  uncertainty_pct: Decimal | null;
  /** 1–4 as reached; 0 when beyond the loosest threshold; null when no uncertainty is stated. */
  tier: number | null;
}

const TIERED_KINDS: StreamKind[] = ["feed-gas", "fuel-gas", "purge-gas", "co2-export", "co2-vent", "stack-co2", "ammonia"];

/**
 * The highest tier whose maximum permissible uncertainty the meter's stated uncertainty meets.
 * Thresholds are the chosen set's, else the EU MRR set's (Reg. 601/2012 Annex II). They are
 * defined for a reporting period; a monthly figure shows where a meter stands, not compliance.
 */
export function assessTiers(input: EmissionsInput, set: FactorSet, fallback: FactorSet | undefined): MeterTier[] {
  const tiers = (set.activity_tiers ?? fallback?.activity_tiers ?? [])
    .map((t) => ({ tier: t.tier, max: dec(t.max_uncertainty_pct) }))
    .sort((a, b) => b.tier - a.tier);
  return input.streams.filter((s) => TIERED_KINDS.includes(s.kind)).map((s) => {
    if (s.uncertainty_pct === null) return { stream_id: s.id, kind: s.kind, uncertainty_pct: null, tier: null };
    const u = dec(s.uncertainty_pct);
    const reached = tiers.find((t) => u.lte(t.max));
    return { stream_id: s.id, kind: s.kind, uncertainty_pct: u, tier: reached ? reached.tier : 0 };
  });
}
