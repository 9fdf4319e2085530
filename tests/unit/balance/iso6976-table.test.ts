// ISO 6976:2016 values the engine's gas properties rest on, each against the 2016 tables as an
// open clean-room implementation checked against the standard's Annex D examples reproduces them:
// RuedigerForster/ISO_6976, src/iso6976.cpp (Table A.3 summation factors at 0, 15, 15.55 and
// 20 °C; Table A.4 gross calorific values and the water row L0). The standard's own text was
// not read: the code marks them unconfirmed.
import { describe, expect, it } from "vitest";
import { type COMPONENT_DATA, WATER_L0 } from "../../../lib/balance/components";
import { componentGross, componentNet, summationFactor } from "../../../lib/balance/gas-properties";

describe("summation factors s at 15 °C and 0 °C (ISO 6976:2016 Table A.3 as reproduced)", () => {
  const table: [keyof typeof COMPONENT_DATA, string, string][] = [
    ["CH4", "0.04452", "0.04886"],
    ["C2H6", "0.0919", "0.0997"],
    ["C3H8", "0.1344", "0.1465"],
    ["nC4H10", "0.1840", "0.2022"],
    ["iC4H10", "0.1722", "0.1885"],
    ["nC5H12", "0.2361", "0.2586"],
    ["iC5H12", "0.2251", "0.2458"],
    ["nC6H14", "0.3001", "0.3319"],
    ["N2", "0.0170", "0.0214"],
    ["CO2", "0.0752", "0.0821"],
    ["H2", "-0.0100", "-0.0100"],
    ["He", "-0.0100", "-0.0100"],
    ["CO", "0.0217", "0.0258"],
    ["NH3", "0.1100", "0.1230"],
  ];
  for (const [c, s15, s0] of table) {
    it(`${c}: ${s15} at 15 °C, ${s0} at 0 °C`, () => {
      expect(summationFactor(c, "15C").eq(s15)).toBe(true);
      expect(summationFactor(c, "0C").eq(s0)).toBe(true);
    });
  }
  it("60 °F takes the 15.55 °C column and 68 °F the 20 °C one (methane 0.04437, 0.04317; water 0.2546, 0.2419)", () => {
    expect(summationFactor("CH4", "60F").toString()).toBe("0.04437");
    expect(summationFactor("CH4", "68F").toString()).toBe("0.04317");
    expect(summationFactor("H2O", "60F").toString()).toBe("0.2546");
    expect(summationFactor("H2O", "68F").toString()).toBe("0.2419");
  });
});

describe("enthalpy of vaporisation of water L0 (ISO 6976:2016, as reproduced)", () => {
  it("45.064, 44.431, 44.408 and 44.222 kJ/mol at 0 °C, 15 °C, 60 °F (15.55 °C) and 68 °F (20 °C)", () => {
    expect([WATER_L0["0C"], WATER_L0["15C"], WATER_L0["60F"], WATER_L0["68F"]].map(String)).toEqual(["45.064", "44.431", "44.408", "44.222"]);
  });
  it("methane's inferior CV at 15 °C is its superior CV 891.51 less 2 × 44.431 = 802.648 kJ/mol (ISO 6976 definition)", () => {
    expect(componentGross("CH4", "15C").toString()).toBe("891.51");
    expect(componentNet("CH4", "15C").toString()).toBe("802.648");
  });
  it("gross values at the other references are the table's own (methane 892.92 at 0 °C, 891.46 at 60 °F, 891.05 at 68 °F)", () => {
    expect([componentGross("CH4", "0C"), componentGross("CH4", "60F"), componentGross("CH4", "68F")].map(String)).toEqual(["892.92", "891.46", "891.05"]);
  });
  it("hydrogen: 286.15 superior, less 44.431 (one H2O per H2) = 241.719 kJ/mol at 15 °C", () => {
    expect(componentNet("H2", "15C").toString()).toBe("241.719");
  });
});
