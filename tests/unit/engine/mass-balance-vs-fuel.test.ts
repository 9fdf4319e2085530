// The carbon mass balance and the fuel calculation on one plant where both apply: the same gas
// analysis for feed and fuel, every stream metered, and CO2 outlets that close the carbon
// balance exactly. Expected values are worked out here from cited constants, not read back
// from the engine.
import DecimalBase from "decimal.js";
import { describe, expect, it } from "vitest";
import { calculate } from "../../../lib/balance/calculate";
import { parsePlantMonth } from "../../../lib/balance/schema";
import { FactorSetRegistry, IPCC_2006 } from "../../../lib/emissions/index";

const D = DecimalBase.clone({ precision: 40 });
type Dx = DecimalBase;

// CIAAW 2021 conventional atomic weights (REFERENCE-VALUES, "C intervals, M conventional").
const W = { C: new D("12.011"), H: new D("1.008"), N: new D("14.007"), O: new D("15.999") };
const M_CO2 = W.C.plus(W.O.times(2)); // 44.009
const GAS = { CH4: "91.45", C2H6: "4.35", C3H8: "1.10", N2: "1.60", CO2: "1.50" }; // invented, sums to 100
const ATOMS: Record<keyof typeof GAS, [number, number, number, number]> = {
  CH4: [1, 4, 0, 0], C2H6: [2, 6, 0, 0], C3H8: [3, 8, 0, 0], N2: [0, 0, 2, 0], CO2: [1, 0, 0, 2],
};
const x = (k: keyof typeof GAS) => new D(GAS[k]).div(100);
const keys = Object.keys(GAS) as (keyof typeof GAS)[];
const molarMass = keys.reduce((a, k) => {
  const [c, h, n, o] = ATOMS[k];
  return a.plus(x(k).times(W.C.times(c).plus(W.H.times(h)).plus(W.N.times(n)).plus(W.O.times(o))));
}, new D(0));
const carbonPerMol = keys.reduce((a, k) => a.plus(x(k).times(ATOMS[k][0])), new D(0));

const FEED_T = new D("17240.5");
const FUEL_T = new D("6118.2");
const kmolC = (t: Dx) => t.times(1000).div(molarMass).times(carbonPerMol);
// Closed carbon: every feed carbon leaves as CO2 to urea and the vent, every fuel carbon up the stack.
const feedCo2T = kmolC(FEED_T).times(M_CO2).div(1000);
const fuelCo2T = kmolC(FUEL_T).times(M_CO2).div(1000);
const UREA_T = feedCo2T.times("0.8");

function plant(method: string, factorSet: string) {
  const r = parsePlantMonth({
    format: "synledger.plant-month/1",
    site: "Two-methods test plant",
    month: "2027-05",
    analyses: { gas: { components: GAS } },
    streams: [
      { id: "feed", kind: "feed-gas", analysis: "gas", quantity: FEED_T.toFixed(), unit: "t", uncertainty_pct: "1.0" },
      { id: "fuel", kind: "fuel-gas", analysis: "gas", quantity: FUEL_T.toFixed(), unit: "t", uncertainty_pct: "1.5" },
      { id: "air", kind: "process-air", quantity: "32000", unit: "t" },
      { id: "nh3", kind: "ammonia", quantity: "30550", unit: "t", uncertainty_pct: "0.5" },
      { id: "urea", kind: "co2-export", destination: "urea", quantity: UREA_T.toFixed(30), unit: "t", uncertainty_pct: "1.0" },
      { id: "vent", kind: "co2-vent", quantity: feedCo2T.minus(UREA_T).toFixed(30), unit: "t", uncertainty_pct: "3.0" },
      { id: "stack", kind: "stack-co2", quantity: fuelCo2T.toFixed(30), unit: "t", uncertainty_pct: "2.5" },
    ],
    method: { emissions: method, factor_set: factorSet, gwp: "AR5" },
  });
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return r.doc;
}

const rel = (a: Dx, b: Dx) => a.minus(b).abs().div(b.abs()).toNumber();

describe("carbon mass balance and fuel calculation agree where both apply", () => {
  const mb = calculate(plant("carbon-mass-balance", "ipcc-2006"));
  const fc = calculate(plant("fuel-calculation", "ipcc-2006"));
  const carbonT = kmolC(FEED_T.plus(FUEL_T)).times(W.C).div(1000);

  it("the plant closes its carbon balance (outlets built from the analysis, hand calc)", () => {
    expect(mb.balances.carbon.closure_pct!.abs().lt("1e-20")).toBe(true);
  });
  it("mass balance: carbon in × 44/12 (IPCC 2006 Vol 3 Eq 3.1, unconfirmed)", () => {
    expect(rel(mb.emissions.emissions.co2_t, carbonT.times(44).div(12))).toBeLessThan(1e-15);
  });
  it("fuel calculation with the site factor from the same analysis gives the same CO2, stream by stream", () => {
    expect(rel(fc.emissions.emissions.co2_t, mb.emissions.emissions.co2_t)).toBeLessThan(1e-15);
    for (const id of ["feed", "fuel"]) {
      const a = mb.emissions.detail.by_stream.find((s) => s.id === id)!.co2_t;
      const b = fc.emissions.detail.by_stream.find((s) => s.id === id)!.co2_t;
      expect(rel(a, b)).toBeLessThan(1e-15);
    }
  });
  it("both differ from the CO2 metered at the outlets by 12.011 × 44/12 / 44.009 − 1 = +0.071 % (REFERENCE-VALUES trap: 44/12 vs molar masses)", () => {
    const measured = calculate(plant("measured", "ipcc-2006")).emissions.emissions.co2_t;
    expect(rel(measured, feedCo2T.plus(fuelCo2T))).toBeLessThan(1e-15);
    const expectedRatio = W.C.times(44).div(12).div(M_CO2); // 1.000712…
    expect(rel(mb.emissions.emissions.co2_t.div(measured), expectedRatio)).toBeLessThan(1e-15);
    expect(expectedRatio.minus(1).times(100).toFixed(3)).toBe("0.071");
  });
  it("with the EU factor 3.664 (MRR Art 25) the mass balance meets the metered CO2 within 0.002 %", () => {
    const eu = calculate(plant("carbon-mass-balance", "eu-mrr")).emissions.emissions.co2_t;
    expect(rel(eu, carbonT.times("3.664"))).toBeLessThan(1e-15);
    expect(rel(eu, feedCo2T.plus(fuelCo2T))).toBeLessThan(2e-5);
  });
  it("the fuel calculation with a default factor per TJ NCV equals the mass balance when the factor fits the gas", () => {
    // A site set whose natural-gas factor is a number, not the analysis: pure methane,
    // 12.011 kg C per kmol × 44/12 ÷ 802.648 MJ/kmol (ISO 6976:2016 net CV at 15 °C: 891.51 − 2 × 44.431) = 54 869.… kg CO2/TJ.
    const factor = W.C.times(44).div(12).div("802.648").times(1e6);
    const registry = new FactorSetRegistry([{
      ...IPCC_2006, id: "site-methane", name: "test set: fixed methane factor",
      fuels: { ...IPCC_2006.fuels, "natural-gas": { ...IPCC_2006.fuels["natural-gas"], co2_from_analysis: false,
        co2: { value: factor.toFixed(25), unit: "kg CO2/TJ NCV", source: "calculated here from CIAAW 12.011 and ISO 6976:2016 methane 802.648 kJ/mol", status: "confirmed", checked: "computed in this test" } } },
    }]);
    const doc = plant("fuel-calculation", "site-methane");
    doc.analyses.gas = { components: { CH4: new D(100) } } as typeof doc.analyses.gas;
    const withFactor = calculate(doc, { factorSets: registry }).emissions.emissions.co2_t;
    const byBalance = calculate({ ...doc, method: { ...doc.method, emissions: "carbon-mass-balance" } }, { factorSets: registry }).emissions.emissions.co2_t;
    const methaneC = FEED_T.plus(FUEL_T).times(1000).div(W.C.plus(W.H.times(4))).times(W.C).div(1000);
    expect(rel(byBalance, methaneC.times(44).div(12))).toBeLessThan(1e-15);
    expect(rel(withFactor, byBalance)).toBeLessThan(1e-20);
  });
});
