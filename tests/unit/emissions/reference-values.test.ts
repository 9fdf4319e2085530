import Decimal from "decimal.js";
import { describe, expect, it } from "vitest";
import { EU_MRR, IPCC_2006, US_40CFR98, computeEmissions, eqG1FeedstockCo2T } from "../../../lib/emissions/index";
import { GJ_PER_MMBTU } from "../../../lib/emissions/activity";
import { d, gas, plant, relDiff, stream, withMethod } from "./fixtures";

const row = (id: string) => IPCC_2006.default_per_tonne.find((r) => r.id === id)!;

describe("IPCC 2006 Vol 3 Table 3.1 defaults follow from Eq 3.1 (unconfirmed)", () => {
  it("modern conventional reforming: 30.2 GJ/t × 15.3 kg C/GJ × 44/12 = 1.694 t CO2/t (Table 3.1, unconfirmed)", () => {
    const byHand = d("30.2").times("15.3").times(44).div(12).div(1000); // 1.69422
    expect(byHand.toDecimalPlaces(3).toString()).toBe("1.694");
    expect(row("modern-conventional-reforming").co2_t_per_t.value).toBe("1.694");
  });
  it("average natural-gas plant: 37.5 GJ/t × 15.3 × 44/12 = 2.104 t CO2/t (Table 3.1, unconfirmed)", () => {
    const byHand = d("37.5").times("15.3").times(44).div(12).div(1000); // 2.10375
    expect(byHand.toDecimalPlaces(3).toString()).toBe("2.104");
    expect(row("average-natural-gas").co2_t_per_t.value).toBe("2.104");
  });
  it("partial oxidation 3.273 is stored as printed, not recomputed from 15.3 (REFERENCE-VALUES note, unconfirmed)", () => {
    expect(row("average-partial-oxidation").co2_t_per_t.value).toBe("3.273");
    expect(d("48.0").times("15.3").times(44).div(12).div(1000).toDecimalPlaces(3).eq("3.273")).toBe(false);
  });
  it("IPCC Vol 2 Table 1.4 56 100 kg/TJ = Table 1.3 15.3 kg C/GJ × 44/12 × 1000, to the table's rounding (unconfirmed)", () => {
    const ng = IPCC_2006.fuels["natural-gas"];
    const fromCarbon = d(ng.carbon_content!.value).times(44).div(12).times(1000);
    expect(Math.abs(fromCarbon.minus(ng.co2!.value).toNumber())).toBeLessThanOrEqual(50); // table prints to 100 kg/TJ
    expect(ng.co2!.status).toBe("unconfirmed");
  });
  it("default-factor method: 46 500 t NH3 × 2.104 = 97 836 t CO2, labelled a screening estimate (Table 3.1, unconfirmed)", () => {
    const r = computeEmissions(withMethod(plant(), { emissions: "default-factor" }));
    expect(r.emissions.co2_t.toString()).toBe("97836");
    expect(r.screening_estimate).toBe(true);
    expect(r.flags.map((f) => f.code)).toContain("screening-estimate");
  });
});

describe("40 CFR 98 Subpart C factors on a fuel quantity in MMBtu", () => {
  // 1 000 000 MMBtu HHV of natural gas, no analysis carbon: Tier 1 style with Table C-1 and C-2.
  const mmbtu = d("1000000");
  const fuel = stream({ id: "fuel", kind: "fuel-gas", unit: "MMBtu-HHV", quantity: mmbtu, gj_hhv: mmbtu.times(GJ_PER_MMBTU), uncertainty_pct: d("2") });
  const input = plant({ method: { emissions: "fuel-calculation", factor_set: "us-40cfr98", gwp: "AR5" }, streams: [fuel] });
  const r = computeEmissions(input);
  it("CO2 = 1 000 000 MMBtu × 53.06 kg/MMBtu = 53 060 t (Table C-1, published)", () => {
    expect(r.emissions.co2_t.toDecimalPlaces(6).toString()).toBe("53060");
  });
  it("CH4 = 1 000 000 × 1.0E-03 kg = 1 t; N2O = 1 000 000 × 1.0E-04 kg = 0.1 t (Table C-2, published)", () => {
    expect(r.emissions.ch4_t.toDecimalPlaces(9).toString()).toBe("1");
    expect(r.emissions.n2o_t.toDecimalPlaces(9).toString()).toBe("0.1");
    // AR5 (40 CFR 98 Table A-1 from 2025): 53 060 + 1 × 28 + 0.1 × 265 = 53 114.5
    expect(r.emissions.co2e_t.toDecimalPlaces(6).toString()).toBe("53114.5");
  });
  it("volume without analysis: 1 MMscf-thousand (1e9 scf) × 1.026E-03 MMBtu/scf × 53.06 = 54 439.56 t (Table C-1, published)", () => {
    const scf = stream({ id: "fuel", kind: "fuel-gas", unit: "MMscf", quantity: d("1000") });
    const r2 = computeEmissions(plant({ method: input.method, streams: [scf] }));
    expect(r2.emissions.co2_t.toDecimalPlaces(6).toString()).toBe("54439.56");
    expect(r2.flags.map((f) => f.code)).toContain("default-energy-content");
  });
  it("Eq G-1: 44/12 × 1e8 scf × 0.75 × 16 / 849.5 × 0.001 by hand (40 CFR 98.73, published)", () => {
    const byHand = new Decimal(44).div(12).times("1e8").times("0.75").times(16).div("849.5").times("0.001");
    expect(eqG1FeedstockCo2T("1e8", "0.75", "16").toDecimalPlaces(9).eq(byHand.toDecimalPlaces(9))).toBe(true);
    expect(byHand.toDecimalPlaces(1).toString()).toBe("5179.5");
    // The 68 °F vs 60 °F trap: 849.5 against 836.6 scf/kmol is 1.5 % (40 CFR 98.73; 836.6 Calc).
    const at60 = eqG1FeedstockCo2T("1e8", "0.75", "16", "836.6");
    expect(relDiff(at60, byHand)).toBeCloseTo(849.5 / 836.6 - 1, 10);
  });
});

describe("EU MRR stoichiometric factor 3.664 versus 44/12", () => {
  it("the same carbon gives results 0.07 % apart (MRR 601/2012 Art 36(3), confirmed; IPCC Eq 3.1, unconfirmed)", () => {
    const ipcc = computeEmissions(plant());
    const eu = computeEmissions(withMethod(plant(), { factor_set: "eu-mrr" }));
    expect(ipcc.emissions.co2_t.toString()).toBe("77000");              // 21 000 t C × 44/12
    expect(eu.emissions.co2_t.toString()).toBe("76944");                // 21 000 t C × 3.664
    const apart = ipcc.emissions.co2_t.minus(eu.emissions.co2_t).div(eu.emissions.co2_t).times(100);
    expect(apart.toDecimalPlaces(2).toString()).toBe("0.07");
    expect(EU_MRR.stoichiometric_factor.numerator).toBe("3.664");
    expect(US_40CFR98.stoichiometric_factor).toMatchObject({ numerator: "44", denominator: "12" });
  });
  it("fuel-calculation with a set factor: 1 000 TJ NCV × 56 100 kg/TJ = 56 100 t (IPCC Vol 2 Table 1.4, unconfirmed)", () => {
    const feed = gas("feed", "feed-gas", "20000", "1.5", { withCarbon: false }); // 1 000 000 GJ LHV, no carbon figure
    const r = computeEmissions(plant({ method: { emissions: "fuel-calculation", factor_set: "ipcc-2006", gwp: "AR5" }, streams: [feed] }));
    expect(r.emissions.co2_t.toString()).toBe("56100");
    expect(r.by_stream[0].co2_factor?.origin).toBe("factor-set");
  });
});
