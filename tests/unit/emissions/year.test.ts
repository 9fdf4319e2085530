import { describe, expect, it } from "vitest";
import { computeEmissions, rollUpYear, type EmissionsInput } from "../../../lib/emissions/index";
import { NG, ammonia, d, gas, plant, stream } from "./fixtures";

const FC = { emissions: "fuel-calculation", factor_set: "ipcc-2006", gwp: "AR5" } as const;

function month(m: string, feedT: string, nh3: string): { month: string; input: EmissionsInput; result: ReturnType<typeof computeEmissions> } {
  // The analysis's calorific value is taken as exact here, to see meters and factors alone.
  const input = plant({ month: m, method: FC, ammonia_t: d(nh3), analyses: { ng: { ...NG, cv_uncertainty_pct: d(0) } },
    streams: [gas("feed", "feed-gas", feedT, "2", { withCarbon: false }), ammonia(nh3)] });
  return { month: m, input, result: computeEmissions(input) };
}

describe("year roll-up: factor part correlated, meter part repeating (no calibration date: one period)", () => {
  // March: 1 000 TJ → 56 100 t; April: 500 TJ → 28 050 t; meters ±2 %, factor ±3.6 % (IPCC Vol 2
  // Table 1.4 range, from memory), all expanded at 95 % (k = 1.96).
  const year = rollUpYear([month("2024-04", "10000", "20000"), month("2024-03", "20000", "46500")]);
  const k = 1.96;
  const factorM = [56100, 28050].map((v) => (v * 0.036) / k);  // 1 030.41, 515.20
  const meterM = [56100, 28050].map((v) => (v * 0.02) / k);    // 572.45, 286.22

  it("totals add and the year's intensity is total CO2e / total NH3", () => {
    expect(year.emissions.co2_t.toString()).toBe("84150");
    expect(year.ammonia_t.toString()).toBe("66500");
    expect(year.intensity.co2e_t_per_t_nh3!.toDecimalPlaces(12).eq(year.emissions.co2e_t.div(66500).toDecimalPlaces(12))).toBe(true);
    expect(year.months_included).toEqual(["2024-03", "2024-04"]);
  });
  it("factor uncertainties add linearly across months (hand calculation)", () => {
    expect(year.uncertainty.co2.factor_u_std_t.toNumber()).toBeCloseTo(factorM[0] + factorM[1], 6); // 1 545.61
  });
  it("a meter's error, all systematic by default and never recalibrated in between, adds linearly across months (hand calculation)", () => {
    expect(year.uncertainty.co2.meter_u_std_t.toNumber()).toBeCloseTo(meterM[0] + meterM[1], 6); // 858.67
    expect(year.uncertainty.co2.meter_random_u_std_t.isZero()).toBe(true);
  });
  it("combined: U95 = 1.96 × √(1 545.61² + 858.67²) = 3 465.5 t, more than treating all as independent", () => {
    const expected = k * Math.hypot(factorM[0] + factorM[1], meterM[0] + meterM[1]);
    expect(year.uncertainty.co2.u95_t.toNumber()).toBeCloseTo(expected, 6);
    expect(expected).toBeCloseTo(3465.5, 1);
    const allIndependent = k * Math.hypot(...factorM, ...meterM);
    expect(year.uncertainty.co2.u95_t.toNumber()).toBeGreaterThan(allIndependent + 100);
  });
  it("a partial year names the missing months", () => {
    expect(year.months_missing).toHaveLength(10);
    const flag = year.flags.find((f) => f.code === "months-missing")!;
    expect(flag.message).toContain("January (2024-01)");
    expect(flag.message).toContain("December (2024-12)");
    expect(flag.message).not.toContain("March");
  });
  it("a duplicated month or a month of another year is left out with an error flag", () => {
    const y = rollUpYear([month("2024-03", "20000", "46500"), month("2024-03", "20000", "46500"), month("2023-12", "1000", "100")]);
    expect(y.months_included).toEqual(["2024-03"]);
    expect(y.flags.filter((f) => f.severity === "error").map((f) => f.code).sort()).toEqual(["month-duplicated", "month-outside-year"]);
  });
});

describe("year roll-up: imported electricity", () => {
  // 2 000 MWh at 0.25 t/MWh and 1 000 MWh at 0.30 t/MWh (factors of our invented grid contract):
  // 500 + 300 = 800 t CO2 added to the direct CO2e; hand calculation.
  function monthWithPower(m: string, mwh: string, factor: string) {
    const input = plant({ month: m, method: FC, ammonia_t: d("40000"),
      streams: [gas("feed", "feed-gas", "20000", "2", { withCarbon: false }), ammonia("40000"),
        stream({ id: "power", kind: "electricity-import", unit: "MWh", quantity: d(mwh), mwh: d(mwh), factor_t_per_MWh: d(factor) })] });
    return { month: m, input, result: computeEmissions(input) };
  }
  const year = rollUpYear([monthWithPower("2024-01", "2000", "0.25"), monthWithPower("2024-02", "1000", "0.30")]);

  it("sums the months' indirect CO2e and adds it to the year's intensity", () => {
    expect(year.intensity.indirect_co2e_t.toString()).toBe("800");
    expect(year.intensity.indirect_complete).toBe(true);
    const expected = year.emissions.co2e_t.plus(800).div(80000);
    expect(year.intensity.co2e_incl_indirect_t_per_t_nh3!.eq(expected)).toBe(true);
  });
});
