import { describe, expect, it } from "vitest";
import { computeEmissions, type EmissionsInput } from "../../../lib/emissions/index";
import { NG, d, gas, plant, stream } from "./fixtures";
import { mulberry32, normalGenerator } from "./prng";

const FC = { emissions: "fuel-calculation", factor_set: "ipcc-2006", gwp: "AR5" } as const;

describe("uncertainty of the month's CO2 (GUM first order, 95 %)", () => {
  // An analysis whose carbon content is taken as exact, to see the meter alone.
  const exactCarbon = { ng: { ...NG, carbon_uncertainty_pct: d(0) } };
  it("one meter, mass balance: feed 55 000 t CO2 metered at ±1.5 % → ±825 t (hand calculation)", () => {
    const r = computeEmissions(plant({ analyses: exactCarbon, streams: [gas("feed", "feed-gas", "20000", "1.5")] }));
    expect(r.uncertainty.co2.u95_t.toDecimalPlaces(9).toString()).toBe("825");
    expect(r.uncertainty.co2.u95_pct!.toDecimalPlaces(9).toString()).toBe("1.5");
    expect(r.uncertainty.co2.analysis_components).toEqual([]);
  });
  it("the analysis's carbon content counts too: entered ±0.8 % → 55 000 × √(1.5² + 0.8²) % = 935.0 t (hand calculation)", () => {
    const r = computeEmissions(plant({ analyses: { ng: { ...NG, carbon_uncertainty_pct: d("0.8") } }, streams: [gas("feed", "feed-gas", "20000", "1.5")] }));
    expect(r.uncertainty.co2.u95_t.toNumber()).toBeCloseTo(55000 * Math.hypot(0.015, 0.008), 6); // 935.00
    expect(r.uncertainty.co2.analysis_components.map((c) => c.key)).toEqual(["ng:carbon"]);
    expect(r.uncertainty.co2.analysis_u_std_t.times("1.96").toNumber()).toBeCloseTo(440, 6);
    expect(r.flags.map((f) => f.code)).not.toContain("analysis-uncertainty-default");
  });
  it("an analysis stating none takes the set's default (1 %, unconfirmed) and says so; feed and fuel share it", () => {
    const r = computeEmissions(plant({ streams: [gas("feed", "feed-gas", "20000", "1.5"), gas("fuel", "fuel-gas", "8000", "2")] }));
    // One analysis behind both streams: its error moves both, so 77 000 t × 1 % / 1.96 in one part.
    expect(r.uncertainty.co2.analysis_components).toHaveLength(1);
    expect(r.uncertainty.co2.analysis_u_std_t.times("1.96").toNumber()).toBeCloseTo(770, 6);
    expect(r.uncertainty.co2.u95_t.toNumber()).toBeCloseTo(Math.hypot(55000 * 0.015, 22000 * 0.02, 770), 6);
    expect(r.flags.find((f) => f.code === "analysis-uncertainty-default")?.message).toContain("1.0 %");
  });
  it("one meter with a default factor: 56 100 t × √(2² + 0.5² + 3.6²) % (IPCC Table 1.4 range; the volume reaches energy through the analysis's calorific value)", () => {
    const feed = gas("feed", "feed-gas", "20000", "2", { withCarbon: false });
    const r = computeEmissions(plant({ method: FC, streams: [feed] }));
    // Metered in tonnes, so the analysis's calorific value (default ±0.5 %) turns it into TJ.
    const byHand = 56100 * Math.sqrt(0.02 ** 2 + 0.005 ** 2 + 0.036 ** 2); // 2 315.7
    expect(r.uncertainty.co2.u95_t.toNumber()).toBeCloseTo(byHand, 6);
    expect(r.uncertainty.co2.factor_components[0].key).toBe("ipcc-2006:natural-gas:co2");
    expect(r.uncertainty.co2.analysis_components.map((c) => c.key)).toEqual(["ng:cv"]);
  });
  it("a meter without uncertainty_pct is reported and flagged", () => {
    const r = computeEmissions(plant({ streams: [gas("feed", "feed-gas", "20000", null)] }));
    expect(r.uncertainty.co2.meters_without_uncertainty).toEqual(["feed"]);
    expect(r.flags.map((f) => f.code)).toContain("uncertainty-incomplete");
  });

  it("two meters sharing one factor: analytic figure within 2 % of a 100 000-draw Monte Carlo of the same model", () => {
    // feed 1 000 TJ (±1.5 %), fuel 400 TJ (±2 %), both × 56 100 kg/TJ (±3.6 %, one factor for both).
    const input: EmissionsInput = plant({ method: FC, analyses: { ng: { ...NG, cv_uncertainty_pct: d(0) } }, streams: [
      gas("feed", "feed-gas", "20000", "1.5", { withCarbon: false }), gas("fuel", "fuel-gas", "8000", "2", { withCarbon: false }),
    ] });
    const r = computeEmissions(input);
    const analytic = r.uncertainty.co2.u95_t.toNumber();
    // Hand check of the analytic figure: meters independent, the factor correlated across streams.
    const A1 = 56100, A2 = 22440, k = 1.96;
    const uMeter = Math.hypot((A1 * 0.015) / k, (A2 * 0.02) / k);
    const uFactor = ((A1 + A2) * 0.036) / k;
    expect(analytic).toBeCloseTo(k * Math.hypot(uMeter, uFactor), 6);

    const normal = normalGenerator(mulberry32(20240301));
    const N = 100_000;
    const ys = new Float64Array(N);
    let mean = 0;
    for (let i = 0; i < N; i++) {
      const e1 = normal() * (0.015 / k), e2 = normal() * (0.02 / k), ef = normal() * (0.036 / k);
      ys[i] = (1000 * (1 + e1) + 400 * (1 + e2)) * 56.1 * (1 + ef);
      mean += ys[i];
    }
    mean /= N;
    let v = 0;
    for (const y of ys) v += (y - mean) ** 2;
    const mcU95 = k * Math.sqrt(v / (N - 1));
    expect(Math.abs(mcU95 - analytic) / analytic).toBeLessThan(0.02);
    const sorted = Array.from(ys).sort((a, b) => a - b);
    const halfWidth = (sorted[Math.floor(0.975 * N)] - sorted[Math.floor(0.025 * N)]) / 2;
    expect(Math.abs(halfWidth - analytic) / analytic).toBeLessThan(0.02);
  });
});

describe("activity-data tier each meter reaches (Reg. (EU) 601/2012 Annex II Table 1: 7.5 / 5 / 2.5 / 1.5 %)", () => {
  it("maps stated uncertainties to tiers, also under a set without its own thresholds", () => {
    const m = (id: string, pct: string | null) => stream({ id, kind: "fuel-gas", uncertainty_pct: pct === null ? null : d(pct) });
    const r = computeEmissions(plant({ streams: [m("a", "1.5"), m("b", "2"), m("c", "5"), m("e", "7.5"), m("f", "8"), m("g", null)] }));
    const tiers = Object.fromEntries(r.tiers.map((t) => [t.stream_id, t.tier]));
    expect(tiers).toEqual({ a: 4, b: 3, c: 2, e: 1, f: 0, g: null });
  });
});
