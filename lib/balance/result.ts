// The result document `synledger.result/1` (stable keys, numbers as strings), the
// EmissionsInput handed to lib/emissions, and the single place where the emissions part
// joins the result.
import { EmissionsInputError, computeEmissions } from "../emissions/compute";
import { type FactorSetRegistry, defaultRegistry } from "../emissions/registry";
import type { EmissionsResult } from "../emissions/result";
import type { CalculationResult, EmissionsPart } from "./calculation-result";
import { Dec, dec, num } from "./decimal";
import { CUBIC_FOOT_M3, PSI_PA, R, REFERENCES, compressibility, type GasProperties } from "./gas-properties";
import { CalculationInputError } from "./errors";
import { emissionsDocumentPart } from "./result-emissions";
import type { PlantMonth } from "./schema";
import type { AnalysisFigures, EmissionsInput } from "./types";
import { ENGINE_VERSION } from "./version";

export const RESULT_FORMAT = "synledger.result/1";

export type { EmissionsPart } from "./calculation-result";

/**
 * THE integration point with lib/emissions. The factor set is checked here rather than in the
 * schema because an organisation may register its own sets: only the registry in use knows
 * which names are valid. Any refusal becomes an input error on `method.*`, so the CLI and the
 * API answer it like any other bad field.
 */
export function emissionsPart(input: EmissionsInput, registry: FactorSetRegistry = defaultRegistry): EmissionsPart {
  if (!registry.get(input.method.factor_set))
    throw new CalculationInputError("method.factor_set", `unknown factor set "${input.method.factor_set}" (known: ${registry.ids().join(", ")})`);
  let detail: EmissionsResult;
  try {
    detail = computeEmissions(input, registry);
  } catch (e) {
    if (e instanceof EmissionsInputError) throw new CalculationInputError("method", e.message);
    throw e;
  }
  const e = detail.emissions;
  return {
    emissions: { co2_t: e.co2_t, ch4_t: e.ch4_t, n2o_t: e.n2o_t, co2e_t: e.co2e_t, transferred_co2_t: e.transferred_co2_t, net_co2e_t: e.net_co2e_t },
    intensity: { co2e_t_per_t_nh3: detail.intensity.co2e_t_per_t_nh3 },
    flags: detail.flags.map((f) => ({ code: f.code, severity: f.severity, message: f.message })),
    detail,
    input,
  };
}

/**
 * Builds the EmissionsInput (docs/engine-contract.md) from the document and the stream
 * figures: measured quantities as written (reconciled values are reported, not substituted —
 * the statement rests on the meters; the engineer decides on corrections).
 */
/**
 * A gas amount as standard cubic feet at 68 °F and 14.7 psia (40 CFR 98's standard conditions):
 * kmol × Z(68 °F) × R·T / p, real gas. Z is ISO 6976's at 68 °F and 101.325 kPa (14.696 psia);
 * the 0.004 psi to 14.7 changes Z by less than 1e-6 and is not applied. This is the file's volume
 * restated exactly, whatever reference it was metered at.
 */
export function standardScf68F(kmol: Dec, gas: GasProperties): Dec {
  return kmol.times(compressibility(gas, "68F")).times(idealScfPerKmol68F());
}

let idealScf68F: Dec | undefined;
/** R·T/p at 68 °F and 14.7 psia in scf per kmol (ideal gas), worked out once rather than for every stream of every month. */
function idealScfPerKmol68F(): Dec {
  return (idealScf68F ??= R.times(REFERENCES["68F"].T).div(dec("14.7").times(PSI_PA)).times(1000).div(CUBIC_FOOT_M3));
}

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
      ...(doc.analyses[id]?.carbon_uncertainty_pct !== undefined ? { carbon_uncertainty_pct: doc.analyses[id].carbon_uncertainty_pct } : {}),
      ...(doc.analyses[id]?.cv_uncertainty_pct !== undefined ? { cv_uncertainty_pct: doc.analyses[id].cv_uncertainty_pct } : {}),
    };
  const min = result.feed.theoretical_min_gj_lhv_per_t_nh3;
  return {
    month: doc.month,
    method: { ...doc.method },
    ammonia_t: result.feed.ammonia_t,
    streams: result.streams.map((s) => {
      const gas = s.analysis ? result.analyses[s.analysis]?.gas : undefined;
      return gas && s.kmol !== null ? { ...s, standard_scf_68f: standardScf68F(s.kmol, gas) } : s;
    }),
    analyses,
    ...(min ? { theoretical_min_gj_lhv_per_t_nh3: min } : {}),
  };
}

export { num } from "./decimal";

export function toResultDocument(r: CalculationResult) {
  const b = r.balances;
  const bal = (x: typeof b.carbon) => ({ in_kmol: num(x.in_kmol), out_kmol: num(x.out_kmol), closure_pct: num(x.closure_pct) });
  const rec = r.reconciliation;
  return {
    format: RESULT_FORMAT,
    /** Which engine computed it (lib/balance/version.ts). */
    engine: ENGINE_VERSION,
    site: r.site,
    month: r.month,
    closure_tolerance_pct: num(r.tolerancePct),
    streams: r.streams.map((s) => ({
      id: s.id, kind: s.kind, unit: s.unit, quantity: num(s.quantity), ...(s.metered === false ? { metered: false } : {}),
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
    ...emissionsDocumentPart(r.emissions.detail, r.feed.gj_lhv_per_t_nh3, r.feed.gj_hhv_per_t_nh3),
    reconciliation: rec && {
      constraints: rec.constraints,
      streams: rec.streams.map((s) => ({
        id: s.id, measured: num(s.measured), reconciled: num(s.reconciled), adjustment: num(s.adjustment),
        adjustment_pct: num(s.adjustment_pct), sigma: num(s.sigma), test_statistic: num(s.test_statistic),
        suspect: s.suspect, redundancy: s.redundancy,
      })),
      unmeasured: rec.unmeasured.map((u) => ({
        id: u.id, balance: u.balance, kmol: num(u.kmol),
        ...(u.stream ? { stream: u.stream, quantity: num(u.quantity) } : {}), observable: u.observable,
      })),
      chi2: num(rec.chi2), dof: rec.dof, chi2_critical: num(rec.chi2_critical), z_critical: num(rec.z_critical),
      measurement_tests: { meters_tested: rec.tested, per_test_confidence: num(rec.per_test_confidence), correction: "Šidák", read_only_when_global_test_fails: true },
      passed: rec.passed,
      closures_after_pct: Object.fromEntries(Object.entries(rec.closures_after).map(([k, v]) => [k, num(v)])),
    },
    flags: r.flags.map((f) => ({ code: f.code, severity: f.severity, message: f.message, ...(f.stream ? { stream: f.stream } : {}) })),
  };
}

export type ResultDocument = ReturnType<typeof toResultDocument>;
