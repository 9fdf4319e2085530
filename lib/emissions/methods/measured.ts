import { K95, ZERO, dec, sqrtOf, sum, type Decimal } from "../decimal";
import { carbonInputs, co2MassOf, relStd, stoichiometricFactor, streamsOf } from "../activity";
import type { FactorSet } from "../factor-set-schema";
import { pushOnce, type BalanceCheck, type MethodOutcome, type StreamEmission, type UncertaintyTerm } from "../model";
import type { EmissionsInput, Flag } from "../types";
import { ventedPurgeCarbon } from "./carbon-common";

/** Variance of a sum of terms whose meters are independent (null uncertainty counts as zero). */
function meterVariance(terms: UncertaintyTerm[], flags: Flag[]): Decimal {
  let v = ZERO;
  for (const t of terms) {
    if (t.meter_rel_std === null || t.meter_rel_std === undefined) {
      pushOnce(flags, { code: "uncertainty-missing", severity: "warning",
        message: `Meter ${t.stream_id} states no uncertainty_pct; the check treats it as exact.` });
      continue;
    }
    v = v.plus(t.value_t.times(t.meter_rel_std).pow(2));
  }
  return v;
}

/**
 * Measured: CO2 from continuous stack monitors plus the CO2 vent of the removal unit. Exported CO2
 * never passes those monitors, yet it is part of the direct total before deductions, so it is
 * added (and deducted later only where the rules allow). The carbon balance gives an independent
 * figure for CO2 to air; a difference larger than the combined expanded uncertainty of both
 * (95 %, meters independent) is flagged.
 */
export function measured(input: EmissionsInput, set: FactorSet): MethodOutcome {
  const flags: Flag[] = [];
  const rows: StreamEmission[] = [];
  const measuredTerms: UncertaintyTerm[] = [];
  for (const s of streamsOf(input, "stack-co2", "co2-vent")) {
    const t = co2MassOf(s);
    rows.push({ id: s.id, kind: s.kind, co2_t: t, ch4_t: ZERO, n2o_t: ZERO, co2e_t: ZERO,
      basis: s.kind === "stack-co2" ? "continuous stack monitor" : "CO2 vent of the removal unit, measured" });
    measuredTerms.push({ value_t: t, stream_id: s.id, meter_rel_std: relStd(s.uncertainty_pct, K95) });
  }
  if (measuredTerms.length === 0) {
    flags.push({ code: "no-measured-co2", severity: "error", message: "Method measured needs stack-co2 or co2-vent streams; none given." });
  }
  const exportTerms: UncertaintyTerm[] = [];
  for (const s of streamsOf(input, "co2-export")) {
    const t = co2MassOf(s);
    rows.push({ id: s.id, kind: s.kind, co2_t: t, ch4_t: ZERO, n2o_t: ZERO, co2e_t: ZERO,
      basis: "exported CO2: part of the direct total, deducted only where the rules allow" });
    exportTerms.push({ value_t: t, stream_id: s.id, meter_rel_std: relStd(s.uncertainty_pct, K95) });
  }
  const measuredT = sum(measuredTerms.map((t) => t.value_t));
  const gross = measuredT.plus(sum(exportTerms.map((t) => t.value_t)));
  return {
    by_stream: rows, gross_co2_t: gross, terms: [...measuredTerms, ...exportTerms], flags,
    balance_check: checkAgainstBalance(input, set, measuredT, measuredTerms, exportTerms, flags),
    screening_estimate: false,
  };
}

function checkAgainstBalance(input: EmissionsInput, set: FactorSet, measuredT: Decimal,
  measuredTerms: UncertaintyTerm[], exportTerms: UncertaintyTerm[], flags: Flag[]): BalanceCheck | null {
  const inputs = carbonInputs(input);
  if (inputs.length === 0 || inputs.some((s) => s.carbon_t === null) || measuredTerms.length === 0) {
    flags.push({ code: "balance-check-not-possible", severity: "info",
      message: "The measured CO2 could not be checked against the carbon balance (feed/fuel carbon missing)." });
    return null;
  }
  const f = stoichiometricFactor(set);
  const balanceTerms: UncertaintyTerm[] = inputs.map((s) => ({
    value_t: dec(s.carbon_t!).times(f), stream_id: s.id, meter_rel_std: relStd(s.uncertainty_pct, K95),
  }));
  balanceTerms.push(...ventedPurgeCarbon(input, set, f, []).terms);
  // CO2 to air by balance = carbon in × factor − vented purge carbon − every export.
  balanceTerms.push(...exportTerms.map((t) => ({ ...t, value_t: t.value_t.neg() })));
  const balanceT = sum(balanceTerms.map((t) => t.value_t));
  const variance = meterVariance(measuredTerms, flags).plus(meterVariance(balanceTerms, flags));
  const u95 = K95.times(sqrtOf(variance));
  const difference = measuredT.minus(balanceT);
  const within = difference.abs().lte(u95);
  if (!within) {
    flags.push({ code: "measured-disagrees-with-balance", severity: "warning",
      message: `Measured CO2 ${measuredT.toFixed(1)} t differs from the carbon balance ${balanceT.toFixed(1)} t by ${difference.toFixed(1)} t, more than the combined uncertainty ±${u95.toFixed(1)} t (95 %).` });
  }
  return { measured_co2_t: measuredT, balance_co2_t: balanceT, difference_t: difference, u95_t: u95, within_uncertainty: within };
}
