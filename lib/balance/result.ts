// The result document `synledger.result/1` (stable keys, numbers as strings), the
// EmissionsInput handed to lib/emissions, and the single place where the emissions part
// joins the result.
import type { CalculationResult } from "./calculate";
import { Dec } from "./decimal";
import type { PlantMonth } from "./schema";
import type { AnalysisFigures, EmissionsInput, Flag } from "./types";

export const RESULT_FORMAT = "synledger.result/1";

export interface EmissionsPart {
  emissions: { co2_t: Dec | null; ch4_t: Dec | null; n2o_t: Dec | null; co2e_t: Dec | null; transferred_co2_t: Dec | null };
  intensity: { co2e_t_per_t_nh3: Dec | null };
  flags: Flag[];
}

/**
 * THE integration point with lib/emissions: today it returns nulls and an info flag. When
 * lib/emissions lands, this body becomes a call to computeEmissions(input) mapped onto
 * EmissionsPart — nothing else in lib/balance needs to change.
 */
export function emissionsPart(input: EmissionsInput): EmissionsPart {
  void input;
  return {
    emissions: { co2_t: null, ch4_t: null, n2o_t: null, co2e_t: null, transferred_co2_t: null },
    intensity: { co2e_t_per_t_nh3: null },
    flags: [{ code: "emissions-not-computed", severity: "info", message: "emissions are computed by lib/emissions, not yet connected" }],
  };
}

/**
 * Builds the EmissionsInput (docs/engine-contract.md) from the document and the stream
 * figures: measured quantities as written (reconciled values are reported, not substituted —
 * the statement rests on the meters; the engineer decides on corrections).
 */
export function buildEmissionsInput(
  doc: PlantMonth,
  result: Pick<CalculationResult, "streams" | "analyses" | "feed">,
): EmissionsInput {
  const analyses: Record<string, AnalysisFigures> = {};
  for (const [id, a] of Object.entries(result.analyses))
    analyses[id] = {
      molar_mass: a.molar_mass,
      carbon_mass_fraction: a.carbon_mass_fraction,
      carbon_atoms_per_mol: a.carbon_atoms_per_mol,
      ncv_mj_per_kg: a.ncv_mj_per_kg,
      gcv_mj_per_kg: a.gcv_mj_per_kg,
    };
  const min = result.feed.theoretical_min_gj_lhv_per_t_nh3;
  return {
    month: doc.month,
    method: { ...doc.method },
    ammonia_t: result.feed.ammonia_t,
    streams: result.streams,
    analyses,
    ...(min ? { theoretical_min_gj_lhv_per_t_nh3: min } : {}),
  };
}

/** Decimal → JSON string: 15 significant digits, no exponent; rounding dust below 1e-25 prints as 0. */
export function num(x: Dec | null | undefined): string | null {
  if (x === null || x === undefined) return null;
  if (x.abs().lt("1e-25")) return "0";
  return x.toSignificantDigits(15).toFixed();
}

export function toResultDocument(r: CalculationResult) {
  const b = r.balances;
  const bal = (x: typeof b.carbon) => ({ in_kmol: num(x.in_kmol), out_kmol: num(x.out_kmol), closure_pct: num(x.closure_pct) });
  const rec = r.reconciliation;
  return {
    format: RESULT_FORMAT,
    site: r.site,
    month: r.month,
    streams: r.streams.map((s) => ({
      id: s.id, kind: s.kind, unit: s.unit, quantity: num(s.quantity),
      kmol: num(s.kmol), t: num(s.t), carbon_kmol: num(s.carbon_kmol), carbon_t: num(s.carbon_t),
      gj_lhv: num(s.gj_lhv), gj_hhv: num(s.gj_hhv), mwh: num(s.mwh),
    })),
    analyses: Object.fromEntries(Object.values(r.analyses).map((a) => [a.id, {
      molar_mass: num(a.molar_mass), carbon_mass_fraction: num(a.carbon_mass_fraction),
      carbon_atoms_per_mol: num(a.carbon_atoms_per_mol), ncv_mj_per_kg: num(a.ncv_mj_per_kg),
      gcv_mj_per_kg: num(a.gcv_mj_per_kg), z_15c: num(a.z_15c),
      gcv_mj_per_m3_15c: num(a.gcv_mj_per_m3_15c), ncv_mj_per_m3_15c: num(a.ncv_mj_per_m3_15c),
      normalised: a.gas.normalised,
    }])),
    balances: {
      carbon: bal(b.carbon),
      nitrogen: bal(b.nitrogen),
      hydrogen: { available_kmol: num(b.hydrogen.in_kmol), used_kmol: num(b.hydrogen.out_kmol), closure_pct: num(b.hydrogen.closure_pct) },
    },
    synthesis: { h2_n2_ratio: num(b.h2n2Ratio) },
    feed: {
      ammonia_t: num(r.feed.ammonia_t), feed_gj_lhv: num(r.feed.feed_gj_lhv), fuel_gj_lhv: num(r.feed.fuel_gj_lhv),
      feed_gj_lhv_per_t_nh3: num(r.feed.feed_gj_lhv_per_t_nh3),
      theoretical_min_gj_lhv_per_t_nh3: num(r.feed.theoretical_min_gj_lhv_per_t_nh3),
      feed_efficiency_pct: num(r.feed.feed_efficiency_pct),
    },
    emissions: Object.fromEntries(Object.entries(r.emissions.emissions).map(([k, v]) => [k, num(v)])),
    intensity: { co2e_t_per_t_nh3: num(r.emissions.intensity.co2e_t_per_t_nh3), gj_lhv_per_t_nh3: num(r.feed.gj_lhv_per_t_nh3) },
    reconciliation: rec && {
      constraints: rec.constraints,
      streams: rec.streams.map((s) => ({
        id: s.id, measured: num(s.measured), reconciled: num(s.reconciled), adjustment: num(s.adjustment),
        adjustment_pct: num(s.adjustment_pct), sigma: num(s.sigma), test_statistic: num(s.test_statistic),
        suspect: s.suspect, redundancy: s.redundancy,
      })),
      unmeasured: rec.unmeasured.map((u) => ({ id: u.id, balance: u.balance, kmol: num(u.kmol) })),
      chi2: num(rec.chi2), dof: rec.dof, chi2_critical: num(rec.chi2_critical), z_critical: num(rec.z_critical),
      passed: rec.passed,
      closures_after_pct: Object.fromEntries(Object.entries(rec.closures_after).map(([k, v]) => [k, num(v)])),
    },
    flags: r.flags.map((f) => ({ code: f.code, severity: f.severity, message: f.message, ...(f.stream ? { stream: f.stream } : {}) })),
  };
}

export type ResultDocument = ReturnType<typeof toResultDocument>;
