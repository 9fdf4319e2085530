import { K95, ZERO, dec, sqrtOf, type Decimal } from "./decimal";
import type { FactorSet } from "./factor-set-schema";
import type { UncertaintyTerm } from "./model";
import type { EmissionsInput, StreamKind } from "./types";

export interface UncertaintyComponent { key: string; u_std_t: Decimal }

export interface UncertaintyFigures {
  value_t: Decimal;
  u_std_t: Decimal;                       // combined standard uncertainty
  u95_t: Decimal;                         // expanded, coverage factor 1.96 (95 %, normal)
  u95_pct: Decimal | null;                // relative to |value|; null when value is zero
  meter_u_std_t: Decimal;                 // independent part (meters)
  factor_u_std_t: Decimal;                // part from factors
  meter_components: UncertaintyComponent[];  // one per meter
  factor_components: UncertaintyComponent[]; // one per factor key
  coverage_factor: Decimal;
  meters_without_uncertainty: string[];
}

/**
 * GUM first-order propagation for a figure that is a sum of products meter × factor. The
 * sensitivity of the sum to a relative error of an input is the term value itself, so
 *   u_meter² = Σ_meters (Σ_terms of that meter value × u_rel,meter)²
 *   u_factor² = Σ_factor keys (Σ_terms using that factor value × u_rel,factor)²
 * A meter appearing in several terms, or a factor multiplying several streams (natural gas for
 * feed and fuel), is fully correlated with itself: its contributions add linearly before
 * squaring. Different meters and different factors are independent. Inputs are expanded (95 %)
 * uncertainties; they are divided by 1.96 to standard and the result multiplied back.
 */
export function propagate(terms: UncertaintyTerm[], k: Decimal = K95): UncertaintyFigures {
  const meters = new Map<string, Decimal>();
  const factors = new Map<string, Decimal>();
  const missing = new Set<string>();
  let value = ZERO;
  for (const t of terms) {
    value = value.plus(t.value_t);
    const id = t.stream_id ?? "(unnamed)";
    if (t.meter_rel_std === null || t.meter_rel_std === undefined) {
      if (t.stream_id) missing.add(t.stream_id);
    } else {
      meters.set(id, (meters.get(id) ?? ZERO).plus(t.value_t.times(t.meter_rel_std)));
    }
    if (t.factor_key && t.factor_rel_std) {
      factors.set(t.factor_key, (factors.get(t.factor_key) ?? ZERO).plus(t.value_t.times(t.factor_rel_std)));
    }
  }
  const meterComponents = [...meters].map(([key, u]) => ({ key, u_std_t: u.abs() }));
  const factorComponents = [...factors].map(([key, u]) => ({ key, u_std_t: u.abs() }));
  const meterU = rss(meterComponents.map((c) => c.u_std_t));
  const factorU = rss(factorComponents.map((c) => c.u_std_t));
  return summarise(value, meterU, factorU, meterComponents, factorComponents, [...missing], k);
}

export function rss(values: Decimal[]): Decimal {
  return sqrtOf(values.reduce((a, v) => a.plus(v.times(v)), ZERO));
}

export function summarise(value: Decimal, meterU: Decimal, factorU: Decimal, meterComponents: UncertaintyComponent[],
  factorComponents: UncertaintyComponent[], missing: string[], k: Decimal = K95): UncertaintyFigures {
  const u = sqrtOf(meterU.times(meterU).plus(factorU.times(factorU)));
  const u95 = u.times(k);
  return {
    value_t: value, u_std_t: u, u95_t: u95, u95_pct: value.isZero() ? null : u95.div(value.abs()).times(100),
    meter_u_std_t: meterU, factor_u_std_t: factorU, meter_components: meterComponents,
    factor_components: factorComponents, coverage_factor: k, meters_without_uncertainty: missing,
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
