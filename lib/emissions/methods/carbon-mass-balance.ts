import { K95, ZERO } from "../decimal";
import { analysisStd, carbonCo2, carbonInputs, relStd, stoichiometricFactor } from "../activity";
import type { FactorSet } from "../factor-set-schema";
import type { MethodOutcome, StreamEmission, UncertaintyTerm } from "../model";
import type { EmissionsInput, Flag } from "../types";
import { notePurgeInternal, ventedPurgeCarbon } from "./carbon-common";

/**
 * Carbon mass balance: carbon entering in feed and fuel gas × the set's stoichiometric factor,
 * less carbon leaving other than as CO2 (vented purge, as CH4). The result is the direct total
 * before deductions: CO2 exported is part of it and is deducted afterwards only where the set's
 * rule allows (see transfers.ts). Ammonia carries no carbon, so no product term appears.
 */
export function carbonMassBalance(input: EmissionsInput, set: FactorSet): MethodOutcome {
  const flags: Flag[] = [];
  const f = stoichiometricFactor(set);
  const rows: StreamEmission[] = [];
  const terms: UncertaintyTerm[] = [];
  let gross = ZERO;
  const inputs = carbonInputs(input);
  if (inputs.length === 0) {
    flags.push({ code: "no-carbon-inputs", severity: "error", message: "No feed-gas or fuel-gas stream: the carbon balance has no inputs." });
  }
  for (const s of inputs) {
    if (s.carbon_t === null) {
      flags.push({ code: "carbon-content-missing", severity: "error",
        message: `Stream ${s.id} has no carbon figure (analysis missing?); it is left out of the carbon balance.` });
      continue;
    }
    const { co2, basis, equation } = carbonCo2(input, set, s, f);
    gross = gross.plus(co2);
    rows.push({ id: s.id, kind: s.kind, co2_t: co2, ch4_t: ZERO, n2o_t: ZERO, co2e_t: ZERO, basis,
      ...(equation ? {} : { co2_factor: { value: f, unit: "t CO2/t C", origin: "factor-set" as const, source: set.stoichiometric_factor.source } }) });
    terms.push({ value_t: co2, stream_id: s.id, meter_rel_std: relStd(s.uncertainty_pct, K95), ...analysisStd(input, set, s, "carbon", flags) });
  }
  const vent = ventedPurgeCarbon(input, set, f, flags);
  notePurgeInternal(input, flags);
  return {
    by_stream: [...rows, ...vent.rows], gross_co2_t: gross.plus(vent.co2_t), terms: [...terms, ...vent.terms],
    flags, balance_check: null, screening_estimate: false,
  };
}
