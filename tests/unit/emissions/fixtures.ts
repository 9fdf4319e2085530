import Decimal from "decimal.js";
import type { AnalysisFigures, EmissionsInput, StreamFigures } from "../../../lib/emissions/types";

/**
 * Hand-built plant-months (no lib/balance): round numbers so every expected value can be worked
 * out on paper. The gas is a synthetic natural gas: 0.75 kg C/kg, NCV 50 MJ/kg, GCV 55.5 MJ/kg.
 */
/** Tests work at 50 digits (more than the engine's 34, so the test side adds no rounding of its own); equality of derived values is checked to 12 places. */
const D50 = Decimal.clone({ precision: 50 });
export const d = (x: Decimal.Value): Decimal => new D50(x);
export function same(a: Decimal | null | undefined, b: Decimal.Value, places = 12): boolean {
  return a !== null && a !== undefined && a.toDecimalPlaces(places).eq(new D50(b).toDecimalPlaces(places));
}

export const NG: AnalysisFigures = {
  molar_mass: d("16"), carbon_mass_fraction: d("0.75"), carbon_atoms_per_mol: d("1"),
  ncv_mj_per_kg: d("50"), gcv_mj_per_kg: d("55.5"),
};

type Partial_ = Partial<StreamFigures> & Pick<StreamFigures, "id" | "kind">;

export function stream(s: Partial_): StreamFigures {
  return {
    unit: "t", quantity: d(0), uncertainty_pct: null, kmol: null, t: null, carbon_kmol: null, carbon_t: null,
    gj_lhv: null, gj_hhv: null, mwh: null, ...s,
  };
}

/** A gas stream of `t` tonnes of the synthetic gas: carbon 0.75 t/t, 50 GJ/t LHV, 55.5 GJ/t HHV. */
export function gas(id: string, kind: "feed-gas" | "fuel-gas", t: string, uncertaintyPct: string | null,
  opts: { withCarbon?: boolean } = {}): StreamFigures {
  const tt = d(t);
  const carbon = opts.withCarbon === false ? null : tt.times("0.75");
  return stream({
    id, kind, analysis: "ng", unit: "t", quantity: tt, t: tt, kmol: tt.times(1000).div(16),
    carbon_t: carbon, carbon_kmol: carbon === null ? null : carbon.times(1000).div("12.011"),
    gj_lhv: tt.times(50), gj_hhv: tt.times("55.5"), uncertainty_pct: uncertaintyPct === null ? null : d(uncertaintyPct),
  });
}

export function co2Stream(id: string, kind: "co2-export" | "co2-vent" | "stack-co2", t: string, uncertaintyPct: string | null,
  destination?: StreamFigures["destination"]): StreamFigures {
  return stream({
    id, kind, unit: "t", quantity: d(t), t: d(t), kmol: d(t).times(1000).div("44.009"),
    carbon_kmol: d(t).times(1000).div("44.009"), carbon_t: d(t).times(1000).div("44.009").times("12.011").div(1000),
    uncertainty_pct: uncertaintyPct === null ? null : d(uncertaintyPct), ...(destination ? { destination } : {}),
  });
}

export function ammonia(t: string, uncertaintyPct: string | null = null): StreamFigures {
  return stream({ id: "nh3", kind: "ammonia", unit: "t", quantity: d(t), t: d(t), kmol: d(t).times(1000).div("17.031"),
    uncertainty_pct: uncertaintyPct === null ? null : d(uncertaintyPct) });
}

/**
 * The reference plant: feed 20 000 t (15 000 t C, 1 000 000 GJ), fuel 8 000 t (6 000 t C,
 * 400 000 GJ), 46 500 t NH3, 40 000 t CO2 to urea. Carbon in = 21 000 t C.
 */
export function plant(over: Partial<EmissionsInput> = {}, extra: StreamFigures[] = []): EmissionsInput {
  return {
    month: "2024-03",
    method: { emissions: "carbon-mass-balance", factor_set: "ipcc-2006", gwp: "AR5" },
    ammonia_t: d("46500"),
    analyses: { ng: NG },
    streams: [
      gas("feed", "feed-gas", "20000", "1.5"),
      gas("fuel", "fuel-gas", "8000", "2.0"),
      ammonia("46500", "0.5"),
      co2Stream("urea", "co2-export", "40000", "2.0", "urea"),
      ...extra,
    ],
    ...over,
  };
}

export function withMethod(input: EmissionsInput, m: Partial<EmissionsInput["method"]>): EmissionsInput {
  return { ...input, method: { ...input.method, ...m } };
}

/** Relative closeness, for checks against a source's printed rounding. */
export function relDiff(a: Decimal.Value, b: Decimal.Value): number {
  return new Decimal(a).minus(b).abs().div(new Decimal(b).abs()).toNumber();
}
