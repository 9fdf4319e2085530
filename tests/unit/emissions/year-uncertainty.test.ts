// The year's uncertainty with correlated inputs, against the GUM's own formula (JCGM 100:2008,
// Eq. (13): u²(y) = Σ_i Σ_j c_i c_j u(x_i) u(x_j) r(x_i, x_j)) written out over every input of a
// hand-worked two-month case, and against a seeded Monte Carlo of the same model (JCGM 101:2008).
import { describe, expect, it } from "vitest";
import { computeEmissions, rollUpYear, type EmissionsInput } from "../../../lib/emissions/index";
import { NG, ammonia, d, gas, plant } from "./fixtures";
import { mulberry32, normalGenerator } from "./prng";

const FC = { emissions: "fuel-calculation", factor_set: "ipcc-2006", gwp: "AR5" } as const;
const k = 1.96;

/**
 * Feed only, metered in tonnes at ±2 % (95 %), its share `sys` % systematic; the analysis's
 * calorific value at ±0.5 % (entered); the set's CO2 factor 56 100 kg/TJ at ±3.6 %.
 * March 20 000 t → 1 000 TJ → 56 100 t CO2; April 10 000 t → 28 050 t CO2.
 */
function month(m: string, feedT: string, sys: string | undefined, calibratedOn: string | undefined) {
  const feed = { ...gas("feed", "feed-gas", feedT, "2", { withCarbon: false }), ...(sys !== undefined ? { systematic_pct: d(sys) } : {}), ...(calibratedOn ? { calibrated_on: calibratedOn } : {}) };
  const input: EmissionsInput = plant({ month: m, method: FC, ammonia_t: d("30000"), analyses: { ng: { ...NG, cv_uncertainty_pct: d("0.5") } }, streams: [feed, ammonia("30000")] });
  return { month: m, input, result: computeEmissions(input) };
}

const CO2 = [56100, 28050];
/** Standard uncertainties of each input's contribution, t CO2, for month i. */
const meterU = CO2.map((v) => (v * 0.02) / k);
const cvU = CO2.map((v) => (v * 0.005) / k);
const factorU = CO2.map((v) => (v * 0.036) / k);

/**
 * u(y) by GUM Eq. (13) over the inputs [meter sys m1, m2, meter random m1, m2, cv m1, m2, factor
 * m1, m2]; the repeating share is of the meter's uncertainty (u_sys = share·u, u_rand² = u² − u_sys²).
 */
function gum(share: number, samePeriod: boolean): number {
  const u = [...meterU.map((x) => x * share), ...meterU.map((x) => x * Math.sqrt(1 - share * share)), ...cvU, ...factorU];
  const r = (i: number, j: number) => {
    if (i === j) return 1;
    const pair = (a: number) => Math.floor(a / 2); // 0 sys, 1 random, 2 cv, 3 factor
    if (pair(i) !== pair(j)) return 0;
    if (pair(i) === 0) return samePeriod ? 1 : 0; // the systematic part repeats within one calibration period
    if (pair(i) === 3) return 1; // one factor value for both months
    return 0; // random meter part and each month's analysis: independent
  };
  let v = 0;
  for (let i = 0; i < u.length; i++) for (let j = 0; j < u.length; j++) v += u[i] * u[j] * r(i, j);
  return Math.sqrt(v);
}

describe("the year's CO2 uncertainty on a hand-worked two-month case matches GUM Eq. (13)", () => {
  const cases = [
    { name: "all systematic, one calibration period (the default)", sys: undefined, cal: [undefined, undefined], share: 1, same: true },
    { name: "60 % systematic, one calibration period", sys: "60", cal: ["2023-11-02", "2023-11-02"], share: 0.6, same: true },
    { name: "all systematic, recalibrated between the months", sys: "100", cal: ["2023-11-02", "2024-04-03"], share: 1, same: false },
    { name: "all random", sys: "0", cal: [undefined, undefined], share: 0, same: true },
  ];
  for (const c of cases) {
    it(c.name, () => {
      const y = rollUpYear([month("2024-03", "20000", c.sys, c.cal[0]), month("2024-04", "10000", c.sys, c.cal[1])]);
      const u = y.uncertainty.co2;
      expect(u.u_std_t.toNumber()).toBeCloseTo(gum(c.share, c.same), 6);
      // The parts add up: meters² = systematic² + random²; total² = meters² + analyses² + factors².
      const sq = (x: { toNumber(): number }) => x.toNumber() ** 2;
      expect(sq(u.meter_u_std_t)).toBeCloseTo(sq(u.meter_systematic_u_std_t) + sq(u.meter_random_u_std_t), 3);
      expect(sq(u.u_std_t)).toBeCloseTo(sq(u.meter_u_std_t) + sq(u.analysis_u_std_t) + sq(u.factor_u_std_t), 3);
      expect(u.analysis_u_std_t.toNumber()).toBeCloseTo(Math.hypot(...cvU), 6);
      expect(u.factor_u_std_t.toNumber()).toBeCloseTo(factorU[0] + factorU[1], 6);
      expect(u.correlation).toContain("calibration period");
    });
  }

  it("correlated meters give more than independent ones: 1 082 t-style quadrature understates the year", () => {
    const correlated = rollUpYear([month("2024-03", "20000", "100", undefined), month("2024-04", "10000", "100", undefined)]).uncertainty.co2;
    const independent = rollUpYear([month("2024-03", "20000", "0", undefined), month("2024-04", "10000", "0", undefined)]).uncertainty.co2;
    expect(correlated.meter_u_std_t.toNumber()).toBeCloseTo(meterU[0] + meterU[1], 6);
    expect(independent.meter_u_std_t.toNumber()).toBeCloseTo(Math.hypot(...meterU), 6);
    expect(correlated.u95_t.gt(independent.u95_t)).toBe(true);
  });

  it("a seeded Monte Carlo of 200 000 years agrees with the analytic U95 within 2 % (JCGM 101)", () => {
    const y = rollUpYear([month("2024-03", "20000", "60", "2023-11-02"), month("2024-04", "10000", "60", "2023-11-02")]);
    const analytic = y.uncertainty.co2.u95_t.toNumber();
    const normal = normalGenerator(mulberry32(20261202));
    const N = 200_000;
    const sSys = 0.6 * 0.02 / k, sRand = Math.sqrt(1 - 0.36) * 0.02 / k, sCv = 0.005 / k, sF = 0.036 / k;
    const ys = new Float64Array(N);
    let mean = 0;
    for (let n = 0; n < N; n++) {
      const sys = normal() * sSys; // one calibration error for both months
      const f = normal() * sF; // one factor value for both months
      let total = 0;
      for (const tj of [1000, 500]) total += tj * (1 + sys + normal() * sRand) * (1 + normal() * sCv) * 56.1 * (1 + f);
      ys[n] = total;
      mean += total;
    }
    mean /= N;
    let v = 0;
    for (const x of ys) v += (x - mean) ** 2;
    const mc = k * Math.sqrt(v / (N - 1));
    expect(Math.abs(mc - analytic) / analytic, `Monte Carlo ${mc.toFixed(1)} t, analytic ${analytic.toFixed(1)} t`).toBeLessThan(0.02);
  });
});

describe("CH4 and N2O carry the range of their default factors into CO2e", () => {
  it("fuel burnt: CO2e's uncertainty adds the CH4 and N2O factor parts (IPCC 2006 Vol 2 Ch 2 Table 2.2 ranges, unconfirmed)", () => {
    const input = plant({ method: FC, analyses: { ng: { ...NG, cv_uncertainty_pct: d(0) } }, streams: [gas("fuel", "fuel-gas", "8000", "2", { withCarbon: false }), ammonia("46500")] });
    const r = computeEmissions(input);
    const keys = r.uncertainty.co2e.factor_components.map((c) => c.key).sort();
    expect(keys).toEqual(["ipcc-2006:natural-gas:ch4", "ipcc-2006:natural-gas:co2", "ipcc-2006:natural-gas:n2o"]);
    // 400 TJ × 1 kg CH4/TJ = 0.4 t CH4 × GWP 28 (AR5) = 11.2 t CO2e at ±135 %; N2O 0.04 t × 265 = 10.6 t at ±135 %.
    const ch4 = r.uncertainty.co2e.factor_components.find((c) => c.key.endsWith(":ch4"))!;
    expect(ch4.u_std_t.times(k).toNumber()).toBeCloseTo(11.2 * 1.35, 6);
    const co2Part = 22440 * 0.036, meter = (22440 + 11.2 + 10.6) * 0.02;
    expect(r.uncertainty.co2e.u95_t.toNumber()).toBeCloseTo(Math.hypot(co2Part, meter, 11.2 * 1.35, 10.6 * 1.35), 6);
    expect(r.uncertainty.co2e.value_t.eq(r.emissions.co2e_t)).toBe(true);
  });
});
