import { K95, ZERO, dec, type Decimal } from "./decimal";
import { M_CH4, activityLabel, activityOf, analysisStd, fuelFor, meteredAsEnergy, relStd, streamsOf } from "./activity";
import type { CitedValue, FactorSet } from "./factor-set-schema";
import { pushOnce, type UncertaintyTerm } from "./model";
import type { EmissionsInput, Flag, StreamFigures } from "./types";

/** An uncertainty term in tonnes of the gas itself; compute.ts turns it into CO2e with the GWP. */
export type GasTerm = UncertaintyTerm & { gas: "ch4" | "n2o" };
export interface NonCo2Row { id: string; ch4_t: Decimal; n2o_t: Decimal; basis: string; terms: GasTerm[] }

function gasTerm(input: EmissionsInput, set: FactorSet, s: StreamFigures, gas: "ch4" | "n2o", t: Decimal, factor: CitedValue,
  fuelKey: string, viaEnergy: boolean, flags: Flag[]): GasTerm {
  const factorStd = relStd(factor.uncertainty_pct, K95);
  return {
    gas, value_t: t, stream_id: s.id, meter_rel_std: relStd(s.uncertainty_pct, K95),
    ...(viaEnergy && !meteredAsEnergy(s) ? analysisStd(input, set, s, "cv", flags) : {}),
    ...(factorStd ? { factor_key: `${set.id}:${fuelKey}:${gas}`, factor_rel_std: factorStd } : {}),
  };
}

/**
 * CH4 and N2O from combustion: fuel gas and purge burnt as fuel, activity × the set's factors
 * (kg per activity unit). Feed gas is not burnt, so it has none. A null factor means the gas is
 * outside the set's scope (e.g. the EU ETS covers only CO2 for ammonia) and is reported as such.
 * Vented purge releases its carbon as methane (taken to be CH4, the only carbon species of
 * consequence after methanation), counted only where the set covers CH4.
 */
export function nonCo2(input: EmissionsInput, set: FactorSet, flags: Flag[]): NonCo2Row[] {
  const rows: NonCo2Row[] = [];
  for (const s of streamsOf(input, "fuel-gas", "purge-gas")) {
    if (s.kind === "purge-gas" && s.fate !== "fuel") continue;
    const { key, fuel } = fuelFor(set, s);
    if (!fuel.ch4 && !fuel.n2o) {
      pushOnce(flags, { code: "non-co2-outside-scope", severity: "info",
        message: `CH4 and N2O from combustion are outside the scope of ${set.id}; not counted.` });
      continue;
    }
    const act = activityOf(s, fuel, flags);
    if (act === null) {
      flags.push({ code: "activity-missing", severity: "warning",
        message: `Stream ${s.id}: no ${activityLabel(fuel.activity)} figure; its CH4 and N2O are not counted.` });
      continue;
    }
    const ch4 = fuel.ch4 ? act.times(dec(fuel.ch4.value)).div(1000) : ZERO;
    const n2o = fuel.n2o ? act.times(dec(fuel.n2o.value)).div(1000) : ZERO;
    const viaEnergy = fuel.activity.kind === "energy";
    const terms: GasTerm[] = [];
    if (fuel.ch4) terms.push(gasTerm(input, set, s, "ch4", ch4, fuel.ch4, key, viaEnergy, flags));
    if (fuel.n2o) terms.push(gasTerm(input, set, s, "n2o", n2o, fuel.n2o, key, viaEnergy, flags));
    rows.push({ id: s.id, ch4_t: ch4, n2o_t: n2o, terms,
      basis: `combustion of ${key}: ${fuel.ch4?.value ?? "–"} kg CH4 and ${fuel.n2o?.value ?? "–"} kg N2O per ${activityLabel(fuel.activity)}` });
  }
  for (const s of streamsOf(input, "purge-gas")) {
    if (s.fate !== "vent") continue;
    const { fuel } = fuelFor(set, s);
    if (!fuel.ch4) {
      pushOnce(flags, { code: "vented-ch4-outside-scope", severity: "info",
        message: `Methane in vented purge is outside the scope of ${set.id}; not counted.` });
      continue;
    }
    if (s.carbon_kmol === null) continue;
    const ch4 = dec(s.carbon_kmol).times(M_CH4).div(1000);
    rows.push({ id: s.id, ch4_t: ch4, n2o_t: ZERO,
      terms: [{ gas: "ch4", value_t: ch4, stream_id: s.id, meter_rel_std: relStd(s.uncertainty_pct, K95), ...analysisStd(input, set, s, "carbon", flags) }],
      basis: "vented purge: carbon leaves as CH4 (kmol C × 16.043 kg/kmol)" });
  }
  return rows;
}
