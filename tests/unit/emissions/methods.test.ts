import { describe, expect, it } from "vitest";
import { computeEmissions } from "../../../lib/emissions/index";
import { co2Stream, d, plant, same, stream, withMethod } from "./fixtures";

describe("carbon mass balance and fuel calculation agree where both apply", () => {
  // Same analysis, complete data, no carbon leaving except as CO2: both are carbon × 44/12.
  const mb = computeEmissions(plant());
  const fc = computeEmissions(withMethod(plant(), { emissions: "fuel-calculation" }));
  it("gross CO2 = 21 000 t C × 44/12 = 77 000 t under both (hand calculation)", () => {
    expect(mb.emissions.co2_t.toString()).toBe("77000");
    expect(fc.emissions.co2_t.eq(mb.emissions.co2_t)).toBe(true);
    expect(fc.emissions.net_co2e_t.eq(mb.emissions.net_co2e_t)).toBe(true);
    for (const id of ["feed", "fuel"]) {
      const a = mb.by_stream.find((r) => r.id === id)!;
      const b = fc.by_stream.find((r) => r.id === id)!;
      expect(a.co2_t.eq(b.co2_t)).toBe(true);
    }
  });
  it("the site factor from the analysis is 0.75 kg C/kg × 44/12 / 50 MJ/kg = 55 000 kg CO2/TJ NCV (hand calculation)", () => {
    const f = fc.by_stream.find((r) => r.id === "feed")!.co2_factor!;
    expect(f.origin).toBe("analysis");
    expect(f.value.toDecimalPlaces(9).toString()).toBe("55000");
    expect(f.unit).toBe("kg CO2/TJ NCV");
  });
});

describe("purge gas: carbon counted once", () => {
  const purge = (fate: "fuel" | "vent") => stream({ id: "purge", kind: "purge-gas", fate, analysis: "ng",
    carbon_t: d(30), carbon_kmol: d(30000).div("12.011"), gj_lhv: d(2000), gj_hhv: d(2220), t: d(40) });
  it("purge burnt as fuel adds CH4/N2O of its 2 TJ but no CO2 (carbon entered with the feed)", () => {
    const r = computeEmissions(plant({}, [purge("fuel")]));
    expect(r.emissions.co2_t.toString()).toBe("77000");
    expect(r.emissions.ch4_t.toString()).toBe("0.402");  // (400 + 2) TJ × 1 kg/TJ (IPCC Vol 2 Table 2.2, from memory)
    expect(r.flags.map((f) => f.code)).toContain("purge-carbon-counted-in-feed");
  });
  it("vented purge: 30 t C leaves as CH4, 110 t less CO2 and 30 000/12.011 kmol × 16.043 kg of CH4 (hand calculation)", () => {
    const r = computeEmissions(plant({}, [purge("vent")]));
    expect(r.emissions.co2_t.toString()).toBe("76890"); // 77 000 − 30 × 44/12
    const ch4 = d(30000).div("12.011").times("16.043").div(1000).plus("0.4");
    expect(r.emissions.ch4_t.toDecimalPlaces(9).eq(ch4.toDecimalPlaces(9))).toBe(true);
  });
});

describe("measured method checked against the carbon balance", () => {
  // Balance CO2 to air = 77 000 − 40 000 (urea) = 37 000 t. Combined expanded uncertainty is the
  // root-sum-square of the expanded meter uncertainties (coverage factors cancel).
  const run = (stackT: string) => computeEmissions(withMethod(plant({}, [
    co2Stream("stack", "stack-co2", stackT, "5"), co2Stream("vent", "co2-vent", "12000", "5"),
  ]), { emissions: "measured" }));
  it("within its uncertainty: stack 26 000 + vent 12 000 = 38 000 t, 1 000 t off, U95 ≈ 1 888 t → no flag", () => {
    const r = run("26000");
    const u95 = Math.hypot(55000 * 0.015, 22000 * 0.02, 40000 * 0.02, 26000 * 0.05, 12000 * 0.05);
    expect(u95).toBeCloseTo(1887.9, 1);
    expect(r.balance_check!.difference_t.toString()).toBe("1000");
    expect(r.balance_check!.u95_t!.toNumber()).toBeCloseTo(u95, 6);
    expect(r.balance_check!.within_uncertainty).toBe(true);
    expect(r.flags.map((f) => f.code)).not.toContain("measured-disagrees-with-balance");
    // Direct total before deductions adds the exported CO2 the monitors never see.
    expect(r.emissions.co2_t.toString()).toBe("78000");
    expect(r.co2.net_t.toString()).toBe("38000");
  });
  it("beyond it: stack 29 000 t, 4 000 t off, U95 ≈ 1 994 t → flagged", () => {
    const r = run("29000");
    const u95 = Math.hypot(55000 * 0.015, 22000 * 0.02, 40000 * 0.02, 29000 * 0.05, 12000 * 0.05);
    expect(r.balance_check!.u95_t!.toNumber()).toBeCloseTo(u95, 6);
    expect(r.balance_check!.within_uncertainty).toBe(false);
    const flag = r.flags.find((f) => f.code === "measured-disagrees-with-balance");
    expect(flag?.severity).toBe("warning");
  });
});

describe("intensities, benchmarks and the theoretical minimum", () => {
  const extra = [
    stream({ id: "grid", kind: "electricity-import", unit: "MWh", quantity: d(10000), mwh: d(10000), factor_t_per_MWh: d("0.4") }),
    stream({ id: "steam-in", kind: "steam-import", unit: "GJ-LHV", quantity: d(5000), gj_lhv: d(5000), factor_t_per_GJ: d("0.06") }),
    stream({ id: "steam-out", kind: "steam-export", unit: "GJ-LHV", quantity: d(2000), gj_lhv: d(2000), factor_t_per_GJ: d("0.06") }),
  ];
  const r = computeEmissions(plant({ theoretical_min_gj_lhv_per_t_nh3: d("20.9") }, extra));
  it("direct, net and with-indirect CO2e per t NH3 (hand calculation)", () => {
    expect(same(r.intensity.co2e_t_per_t_nh3, d("77021.8").div(46500))).toBe(true);
    expect(same(r.intensity.net_co2e_t_per_t_nh3, d("37021.8").div(46500))).toBe(true);
    expect(r.intensity.indirect_co2e_t.toString()).toBe("4180"); // 4 000 + 300 − 120
    expect(same(r.intensity.co2e_incl_indirect_t_per_t_nh3, d("81201.8").div(46500))).toBe(true);
  });
  it("energy: 1 400 000 GJ / 46 500 t = 30.108 GJ/t; against 20.9 GJ/t minimum (from memory) 69.42 %", () => {
    expect(r.intensity.gj_lhv_per_t_nh3!.toDecimalPlaces(3).toString()).toBe("30.108");
    expect(r.theoretical_minimum!.efficiency_pct.toDecimalPlaces(2).toString()).toBe("69.42");
  });
  it("electricity without a factor is left out and the figure marked incomplete", () => {
    const r2 = computeEmissions(plant({}, [stream({ id: "grid", kind: "electricity-import", unit: "MWh", quantity: d(10), mwh: d(10) })]));
    expect(r2.intensity.indirect_complete).toBe(false);
    expect(r2.flags.map((f) => f.code)).toContain("electricity-factor-missing");
  });
  it("EU benchmark 1.570 (2021–25, Impl. Reg. 2021/447, from memory) applies in 2024; 1.619 (2013–20) does not", () => {
    const eu = computeEmissions(withMethod(plant(), { factor_set: "eu-mrr" }));
    const b = eu.benchmarks.find((x) => x.kind === "product-benchmark")!;
    expect(eu.benchmarks.filter((x) => x.kind === "product-benchmark")).toHaveLength(1);
    expect(b.value.toString()).toBe("1.57");
    expect(same(b.difference, d(76944).div(46500).minus("1.570"))).toBe(true);
  });
  it("a month before the set's effective date is flagged and meets the earlier benchmark", () => {
    const eu = computeEmissions(withMethod({ ...plant(), month: "2019-06" }, { factor_set: "eu-mrr" }));
    expect(eu.flags.map((f) => f.code)).toContain("factor-set-not-effective");
    expect(eu.benchmarks.find((x) => x.kind === "product-benchmark")!.value.toString()).toBe("1.619");
  });
});
