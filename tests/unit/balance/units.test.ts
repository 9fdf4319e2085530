import { describe, expect, it } from "vitest";
import { Dec, dec } from "../../../lib/balance/decimal";
import { CUBIC_FOOT_M3, R, compositionOf, compressibility, gasProperties } from "../../../lib/balance/gas-properties";
import { PURE_CO2, PURE_NH3 } from "../../../lib/balance/streams";
import { MMBTU_GJ, UnitError, fromKmol, materialAmounts, toGj, toKmol } from "../../../lib/balance/units";

const near = (x: Dec, expected: Dec | string, rel = "1e-30") =>
  expect(x.minus(expected).abs().lte(new Dec(expected).abs().times(rel)), `${x} vs ${expected}`).toBe(true);
const methane = gasProperties(compositionOf({ CH4: "100" }));

describe("volume units through the real-gas molar volume at their reference", () => {
  it("1 Sm3 of methane = 101325 / (Z·R·288.15) mol (hand formula, ISO 6976 Z)", () => {
    const z = dec(1).minus(dec("0.04452").pow(2));
    near(toKmol(dec(1), "Sm3", methane), dec(101325).div(z.times(R).times("288.15")).div(1000));
  });
  it("1 Nm3 uses 0 °C and the 0 °C summation factor", () => {
    const z = compressibility(methane, "0C");
    near(toKmol(dec(1), "Nm3", methane), dec(101325).div(z.times(R).times("273.15")).div(1000));
  });
  it("multiples: 1 MMscf = 1e6 scf = 1e6 × 0.3048³ m3 at 60 °F; 1 kSm3 = 1000 Sm3; MNm3 = 1e6 Nm3", () => {
    near(toKmol(dec(1), "MMscf", methane), toKmol(dec(1e6), "scf", methane));
    near(toKmol(dec(1), "Mscf", methane), toKmol(dec(1000), "scf", methane));
    near(toKmol(dec(1), "kSm3", methane), toKmol(dec(1000), "Sm3", methane));
    near(toKmol(dec(1), "MSm3", methane), toKmol(dec(1e6), "Sm3", methane));
    near(toKmol(dec(1), "kNm3", methane), toKmol(dec(1000), "Nm3", methane));
    near(toKmol(dec(1), "MNm3", methane), toKmol(dec(1e6), "Nm3", methane));
    expect(CUBIC_FOOT_M3.toFixed()).toBe("0.028316846592");
  });
});

describe("mass and energy units", () => {
  it("CO2 in t → kmol by M(CO2) 44.009; NH3 in kg by 17.031 (CIAAW 2021)", () => {
    expect(toKmol(dec("44.009"), "t", PURE_CO2).toFixed()).toBe("1000");
    expect(toKmol(dec("17031"), "kg", PURE_NH3).toFixed()).toBe("1000");
  });
  it("GJ-LHV of methane: 802.648 GJ = 1000 kmol (ISO 6976:2016 net, 15 °C: 891.51 − 2 × 44.431)", () => near(toKmol(dec("802.648"), "GJ-LHV", methane), "1000", "1e-12"));
  it("GJ-HHV of methane: 891.51 GJ = 1000 kmol", () => near(toKmol(dec("891.51"), "GJ-HHV", methane), "1000"));
  it("MMBtu-HHV = 1.05505585262 GJ on the 60 °F gross value (International Table Btu)", () => {
    expect(MMBTU_GJ.toFixed()).toBe("1.05505585262");
    near(toKmol(dec(1000), "MMBtu-HHV", methane), dec("1055.05585262").div("891.458").times(1000), "1e-4");
  });
  it("an energy unit on a non-combustible gas and electricity as material are errors", () => {
    expect(() => toKmol(dec(1), "GJ-LHV", PURE_CO2)).toThrow(UnitError);
    expect(() => toKmol(dec(1), "MWh", methane)).toThrow(UnitError);
    expect(() => toKmol(dec(1), "Sm3", null)).toThrow(/needs a gas composition/);
  });
  it("materialAmounts: 1000 kmol methane = 16.043 t, 802.648 GJ LHV, 891.51 GJ HHV", () => {
    const a = materialAmounts(dec("16.043"), "t", methane);
    near(a.kmol, "1000");
    near(a.t, "16.043");
    near(a.gjLhv, "802.648", "1e-12");
    near(a.gjHhv, "891.51");
  });
  it("fromKmol inverts toKmol; steam GJ and MWh × 3.6", () => {
    near(toKmol(fromKmol(dec(123), "scf", methane), "scf", methane), "123");
    expect(toGj(dec(10), "MWh").toFixed()).toBe("36");
    expect(toGj(dec(10), "GJ").toFixed()).toBe("10");
    expect(() => toGj(dec(1), "t")).toThrow(UnitError);
  });
});
