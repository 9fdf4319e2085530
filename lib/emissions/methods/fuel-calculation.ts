import { K95, ZERO, dec } from "../decimal";
import { activityLabel, activityOf, analysisStd, carbonCo2, meteredAsEnergy, carbonInputs, fuelFor, relStd, siteFactorFromAnalysis, stoichiometricFactor } from "../activity";
import type { FactorSet } from "../factor-set-schema";
import { pushOnce, type MethodOutcome, type StreamEmission, type UncertaintyTerm } from "../model";
import type { EmissionsInput, Flag } from "../types";
import { notePurgeInternal, ventedPurgeCarbon } from "./carbon-common";

/**
 * Fuel-by-fuel calculation: activity × emission factor × oxidation factor for each feed and fuel
 * stream (IPCC Tier 2/3 sum over fuels; 40 CFR 98 Eq C-1 / G-1). Where the set prefers it and the
 * month's analysis gives the carbon, the factor is site-specific: carbon content × stoichiometric
 * factor (the analysis is a higher tier than a default). Feed carbon later exported is part of
 * the total; the deduction is decided by the set's rules, as for the mass balance.
 */
export function fuelCalculation(input: EmissionsInput, set: FactorSet): MethodOutcome {
  const flags: Flag[] = [];
  const stoich = stoichiometricFactor(set);
  const rows: StreamEmission[] = [];
  const terms: UncertaintyTerm[] = [];
  let gross = ZERO;
  for (const s of carbonInputs(input)) {
    const { key, fuel } = fuelFor(set, s);
    const of = dec(fuel.oxidation_factor.value);
    const meter = relStd(s.uncertainty_pct, K95);
    if (fuel.co2_from_analysis && s.carbon_t !== null) {
      // Feedstock under a set that writes it by volume (Eq G-1, which has no oxidation term); otherwise carbon × factor × oxidation.
      const byVolume = carbonCo2(input, set, s, stoich);
      const co2 = byVolume.equation ? byVolume.co2 : dec(s.carbon_t).times(stoich).times(of);
      const site = siteFactorFromAnalysis(input, s, fuel, stoich);
      gross = gross.plus(co2);
      rows.push({ id: s.id, kind: s.kind, co2_t: co2, ch4_t: ZERO, n2o_t: ZERO, co2e_t: ZERO,
        basis: byVolume.equation ? byVolume.basis : `carbon from analysis ${s.analysis ?? "?"} × stoichiometric factor × oxidation ${of.toString()}`,
        ...(site ? { co2_factor: { value: site.times(of), unit: `kg CO2/${activityLabel(fuel.activity)}`,
          origin: "analysis" as const, source: `analysis ${s.analysis}` } } : {}) });
      terms.push({ value_t: co2, stream_id: s.id, meter_rel_std: meter, ...analysisStd(input, set, s, "carbon", flags) });
      continue;
    }
    if (!fuel.co2) {
      flags.push({ code: "co2-factor-missing", severity: "error",
        message: `Stream ${s.id}: fuel "${key}" takes its factor from the analysis, and none was given.` });
      continue;
    }
    const activity = activityOf(s, fuel, flags);
    if (activity === null) {
      flags.push({ code: "activity-missing", severity: "error",
        message: `Stream ${s.id}: no ${activityLabel(fuel.activity)} figure to apply the factor of ${set.id} to.` });
      continue;
    }
    const factor = dec(fuel.co2.value);
    const co2 = activity.times(factor).times(of).div(1000);
    gross = gross.plus(co2);
    rows.push({ id: s.id, kind: s.kind, co2_t: co2, ch4_t: ZERO, n2o_t: ZERO, co2e_t: ZERO,
      basis: `${activity.toSignificantDigits(10).toString()} ${activityLabel(fuel.activity)} × ${fuel.co2.value} ${fuel.co2.unit} × oxidation ${of.toString()}`,
      co2_factor: { value: factor.times(of), unit: fuel.co2.unit, origin: "factor-set", source: fuel.co2.source } });
    const factorStd = relStd(fuel.co2.uncertainty_pct, K95);
    if (factorStd === null) {
      pushOnce(flags, { code: "factor-uncertainty-unknown", severity: "info",
        message: `${fuel.co2.source} states no uncertainty for the ${key} CO2 factor; it is taken as exact.` });
    }
    // A metered volume or mass becomes energy through the analysis's calorific value, which carries its own uncertainty.
    const viaCv = fuel.activity.kind === "energy" && !meteredAsEnergy(s);
    terms.push({ value_t: co2, stream_id: s.id, meter_rel_std: meter,
      ...(viaCv ? analysisStd(input, set, s, "cv", flags) : {}),
      ...(factorStd ? { factor_key: `${set.id}:${key}:co2`, factor_rel_std: factorStd } : {}) });
  }
  const vent = ventedPurgeCarbon(input, set, stoich, flags);
  notePurgeInternal(input, flags);
  return {
    by_stream: [...rows, ...vent.rows], gross_co2_t: gross.plus(vent.co2_t), terms: [...terms, ...vent.terms],
    flags, balance_check: null, screening_estimate: false,
  };
}
