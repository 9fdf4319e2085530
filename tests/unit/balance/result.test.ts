import { describe, expect, it } from "vitest";
import { analysisFigures, calculate } from "../../../lib/balance/calculate";
import { dec } from "../../../lib/balance/decimal";
import { compositionOf, gasProperties } from "../../../lib/balance/gas-properties";
import { formatReport, table } from "../../../lib/balance/report";
import { buildEmissionsInput, emissionsPart, num, toResultDocument } from "../../../lib/balance/result";
import { parsePlantMonth } from "../../../lib/balance/schema";
import { sigmaOf, reconciliationFlags } from "../../../lib/balance/reconcile-plant";
import { STOICH_PLANT } from "./fixtures";

const parsed = parsePlantMonth(STOICH_PLANT);
if (!parsed.ok) throw new Error("fixture");
const doc = parsed.doc;
const result = calculate(doc);

describe("StreamFigures (docs/engine-contract.md) for the paper plant", () => {
  it("feed: 69 037 kmol, carbon 69 037 kmol = 829.203407 t C (× 12.011 / 1000, hand calc)", () => {
    const feed = result.streams[0];
    expect(feed.kmol!.toFixed()).toBe("69037");
    expect(feed.carbon_t!.toFixed()).toBe("829.203407");
    expect(feed.uncertainty_pct!.toFixed()).toBe("1");
  });
  it("ammonia has no carbon and no energy figures", () => {
    const nh3 = result.streams.find((s) => s.kind === "ammonia")!;
    expect([nh3.carbon_kmol, nh3.gj_lhv, nh3.mwh]).toEqual([null, null, null]);
  });
  it("analysisFigures: methane carbon mass fraction 12.011/16.043 (hand calc)", () => {
    const a = analysisFigures("m", gasProperties(compositionOf({ CH4: "100" })));
    expect(a.carbon_mass_fraction.eq(dec("12.011").div("16.043"))).toBe(true);
  });
});

describe("EmissionsInput and the emissions part", () => {
  const input = buildEmissionsInput(doc, result);
  it("carries month, method, ammonia tonnes and every stream as measured", () => {
    expect(input.month).toBe("2026-01");
    expect(input.method).toEqual({ emissions: "carbon-mass-balance", factor_set: "ipcc-2006", gwp: "AR5" });
    expect(input.ammonia_t.toFixed()).toBe("2659.697208");
    expect(input.streams.map((s) => s.id)).toEqual(["feed", "fuel", "air", "nh3", "urea", "stack"]);
    expect(input.analyses.methane.molar_mass.toFixed()).toBe("16.043");
    expect(input.theoretical_min_gj_lhv_per_t_nh3).toBeDefined();
  });
  it("emissionsPart joins lib/emissions: CO2 = (69 037 + 10 000) kmol C × 12.011 / 1000 × 44/12 (IPCC 2006 Eq 3.1, from memory; hand calc)", () => {
    const part = emissionsPart(input);
    // 949.313407 t C × 11/3 = 3 480.815825667 t
    expect(part.emissions.co2_t.toDecimalPlaces(9).toFixed()).toBe("3480.815825667");
    // fuel 10 000 kmol × 802.648 MJ/kmol (ISO 6976:2016 methane net, 15 °C) = 8.02648 TJ × 1 kg CH4 and 0.1 kg N2O per TJ (IPCC Vol 2 Tables 2.2/2.3, unconfirmed)
    expect(part.emissions.ch4_t.toFixed()).toBe("0.00802648");
    expect(part.emissions.n2o_t.toFixed()).toBe("0.000802648");
    // urea CO2 is deducted under IPCC 2006 (R in Eq 3.1, unconfirmed): 3 481.253268827 − 3 038.249333
    expect(part.emissions.net_co2e_t.toDecimalPlaces(9).toFixed()).toBe("443.003935827");
    expect(part.flags.some((f) => f.code === "emissions-not-computed")).toBe(false);
  });
  it("an unknown factor set is an input error on method.factor_set", () => {
    expect(() => emissionsPart({ ...input, method: { ...input.method, factor_set: "nope" } })).toThrow(/^method\.factor_set: unknown factor set "nope"/);
  });
});

describe("result document synledger.result/1", () => {
  const out = toResultDocument(result);
  it("numbers are strings, keys as the format lists", () => {
    expect(out.balances.hydrogen.available_kmol).toBe("234252");
    expect(out.streams[0].kmol).toBe("69037");
    expect(out.intensity.gj_lhv_per_t_nh3).toBe("23.851921859821");
    // 3 480.815825667 + 0.00802648 × 28 + 0.000802648 × 265 (AR5 GWP, hand calc)
    expect(out.emissions.co2e_t).toBe("3481.25326882667");
    expect(out.reconciliation!.passed).toBe(true);
  });
  it("num: 15 significant digits, no exponent, dust as 0", () => {
    expect(num(dec("1e-30"))).toBe("0");
    expect(num(dec("12345678901234567890"))).toBe("12345678901234600000");
    expect(num(null)).toBeNull();
  });
});

describe("report and reconciliation helpers", () => {
  it("table right-aligns numbers under an underlined header", () => {
    expect(table(["a", "bb"], [["x", "1"], ["yy", "22"]])).toBe("a   bb\n--  --\nx    1\nyy  22");
  });
  it("formatReport names the site and month", () => expect(formatReport(result)).toMatch(/^Synledger balance — Paper plant, 2026-01/));
  it("sigma = U / 1.96 × value (95 % expanded → standard)", () => {
    expect(sigmaOf(result.flows[0]).eq(dec("1").div(100).div("1.96").times("1107.560591"))).toBe(true);
  });
  it("tied suspects are named together", () => {
    const s = (id: string) => ({ id, measured: dec(1), reconciled: dec(1), adjustment: dec(0), adjustment_pct: dec(0), sigma: dec(1), test_statistic: dec(3), suspect: true, redundancy: "redundant" as const });
    const flags = reconciliationFlags([s("a"), s("b")], false, dec(9), dec("3.84"), dec("1.96"));
    expect(flags.find((f) => f.code === "reconciliation-suspect-meter")!.message).toMatch(/a \(.*\), b \(.*cannot be told apart/);
  });
});
