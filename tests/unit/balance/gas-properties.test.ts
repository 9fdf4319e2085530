import { describe, expect, it } from "vitest";
import { ATOMIC_WEIGHT, COMPONENTS, DRY_AIR_PCT, h2EquivalentsOf, molarMassOf } from "../../../lib/balance/components";
import { Dec, dec } from "../../../lib/balance/decimal";
import {
  CompositionError, REFERENCES, calorificValues, componentGross, componentNet, compositionOf, compressibility,
  gasProperties, idealMolarVolume, realMolarVolume, summationFactor,
} from "../../../lib/balance/gas-properties";
import { CUBIC_FOOT_M3 } from "../../../lib/balance/gas-properties";

const near = (x: Dec, expected: string, tol: string) => expect(x.minus(expected).abs().lte(tol), `${x} vs ${expected}`).toBe(true);
const methane = gasProperties(compositionOf({ CH4: "100" }));

describe("molar masses from CIAAW 2021 conventional atomic weights", () => {
  it("NH3 17.031, CH4 16.043, CO2 44.009 g/mol (REFERENCE-VALUES, Calc)", () => {
    expect(molarMassOf("NH3").toFixed()).toBe("17.031");
    expect(molarMassOf("CH4").toFixed()).toBe("16.043");
    expect(molarMassOf("CO2").toFixed()).toBe("44.009");
    expect(ATOMIC_WEIGHT.Ar.toFixed()).toBe("39.95");
  });
  it("every component has a positive molar mass", () => {
    for (const c of COMPONENTS) expect(molarMassOf(c).gt(0)).toBe(true);
  });
  it("H2-equivalents 2c + h/2 − o: CH4 4, C2H6 7, H2 1, CO 1, CO2 0, O2 −2 (plant-month format)", () => {
    expect(["CH4", "C2H6", "H2", "CO", "CO2", "O2", "N2"].map((c) => h2EquivalentsOf(c as never).toFixed())).toEqual(["4", "7", "1", "1", "0", "-2", "0"]);
  });
});

describe("ISO 6976:2016 methane at 15 °C (REFERENCE-VALUES, C*)", () => {
  const cv = calorificValues(methane, "15C");
  // Net = gross − 2 × L0(15 °C) = 891.51 − 2 × 44.431 = 802.648 (ISO 6976:2016 Eq. (3) with its
  // L0; tests/unit/balance/iso6976-table.test.ts). REFERENCE-VALUES' "802.69" is the 1995
  // edition's pair (891.56 − 2 × 44.433), not the 2016 table's.
  it("ideal molar gross 891.51 and net 802.648 kJ/mol", () => {
    expect(cv.grossMolar.toFixed()).toBe("891.51");
    near(cv.netMolar, "802.648", "1e-9");
  });
  it("Z = 1 − 0.04452² = 0.99802 (ISO 6976:2016, C*)", () => near(cv.z, "0.99802", "5e-6"));
  it("real gas 37.78 MJ/m3 gross (REFERENCE-VALUES, Calc); net 802.648 / (0.99802 × 23.64483) = 34.0134 MJ/m3 and 802.648 / 16.043 = 50.0310 MJ/kg (hand calc)", () => {
    near(cv.grossVolumeReal, "37.78", "0.005");
    near(cv.netVolumeReal, "34.013441", "0.000001");
    near(cv.grossMass, "55.57", "0.005");
    near(cv.netMass, "50.031042", "0.000001");
  });
  it("0 °C and 60 °F values are the table's: 892.92 and 891.46 kJ/mol gross; net at 0 °C 892.92 − 2 × 45.064 = 802.792", () => {
    expect(componentGross("CH4", "0C").toString()).toBe("892.92");
    expect(componentGross("CH4", "60F").toString()).toBe("891.46");
    expect(componentNet("CH4", "0C").toString()).toBe("802.792");
  });
});

describe("multi-component gas against the ISO 6976 method, hand calc from the table", () => {
  // CH4 90, C2H6 5, C3H8 2, N2 2, CO2 1 mol %. Gross: 0.9·891.51 + 0.05·1562.14 + 0.02·2221.10
  // = 924.888 kJ/mol (ISO 6976:2016 Table A.4). Net: minus (h/2)·L0 = 2.03 × 44.431 → 834.69307.
  // Σxs = 0.048443 (summation factors from REFERENCE-VALUES) → Z = 0.997653275751.
  // Real gross per m3 = 924.888 / (Z · 23.6448300358) = 39.2078759348 MJ/m3 (hand calc).
  const gas = gasProperties(compositionOf({ CH4: "90", C2H6: "5", C3H8: "2", N2: "2", CO2: "1" }));
  const cv = calorificValues(gas, "15C");
  it("molar gross, net, Z, volumetric and mass values", () => {
    near(cv.grossMolar, "924.888", "1e-9");
    near(cv.netMolar, "834.69307", "1e-9");
    near(cv.z, "0.997653275751", "1e-12");
    near(cv.grossVolumeReal, "39.2078759348", "1e-9");
    near(cv.netVolumeReal, "35.3843301375", "1e-9");
    near(gas.molarMass, "17.82451", "1e-12");
    near(cv.grossMass, "51.8885512140", "1e-9");
  });
  it("atoms per mole and carbon mass fraction (hand calc)", () => {
    // C = 0.9 + 0.1 + 0.06 + 0.01 = 1.07; H = 3.6 + 0.3 + 0.16 = 4.06; N = 0.04; O = 0.02
    expect([gas.atoms.C, gas.atoms.H, gas.atoms.N, gas.atoms.O].map((x) => x.toFixed())).toEqual(["1.07", "4.06", "0.04", "0.02"]);
    near(gas.carbonMassFraction, dec("1.07").times("12.011").div("17.82451").toFixed(), "1e-40");
  });
});

describe("molar volumes and references", () => {
  it("ideal 23.645 m3/kmol at 15 °C and 22.414 at 0 °C (REFERENCE-VALUES, R = 8.314462618)", () => {
    near(idealMolarVolume("15C"), "23.645", "0.0005");
    near(idealMolarVolume("0C"), "22.414", "0.0005");
  });
  it("40 CFR 98.73: 849.5 scf/kg-mol at 68 °F and 836.6 at 60 °F (14.696 psia)", () => {
    near(idealMolarVolume("68F").div(CUBIC_FOOT_M3), "849.5", "0.05");
    near(idealMolarVolume("60F").div(CUBIC_FOOT_M3), "836.6", "0.05");
  });
  it("40 CFR 98.73 Eq G-1 worked with MVC 849.5: 1e6 scf of methane → 51.8427 t CO2 (hand calc)", () => {
    // CO2 = 44/12 × Fdstk × CC × MW / MVC × 0.001 with CC, MW from our analysis figures
    const co2 = dec(44).div(12).times(1e6).times(methane.carbonMassFraction).times(methane.molarMass).div("849.5").times("0.001");
    near(co2, "51.842652540710", "1e-9");
  });
  it("references: 60 °F = 288.7056 K and 14.696 psia = 101.32535 kPa (exact psi)", () => {
    near(REFERENCES["60F"].T, "288.705556", "1e-6");
    near(REFERENCES["60F"].p, "101325.353", "0.001");
  });
  it("real molar volume = Z · RT/p; 60 °F takes the table's 15.55 °C summation factor 0.04437", () => {
    expect(realMolarVolume(methane, "15C").eq(idealMolarVolume("15C").times(compressibility(methane, "15C")))).toBe(true);
    near(summationFactor("CH4", "60F"), "0.04437", "0.00002");
  });
});

describe("normalisation and dry air", () => {
  it("within 0.5 of 100: rescaled and marked normalised", () => {
    const g = gasProperties(compositionOf({ CH4: "99.8" }));
    expect(g.normalised).toBe(true);
    expect(g.fractions.CH4!.toFixed()).toBe("1");
  });
  it("beyond 0.5: rejected", () => expect(() => gasProperties(compositionOf({ CH4: "99.4" }))).toThrow(CompositionError));
  it("dry air N2 78.084 O2 20.948 Ar 0.934 CO2 0.034 sums to 100 (US Std Atmosphere 1976; CO2 per brief); M = 28.96549 (hand calc)", () => {
    const air = gasProperties(compositionOf(DRY_AIR_PCT));
    expect(air.sumPct.toFixed()).toBe("100");
    near(air.molarMass, "28.96548886", "1e-12");
  });
});
