// An independent calculation, written from scratch in plain JavaScript floating point: it imports
// nothing from lib/balance or lib/emissions (only the CLI entry point, to read the engine's
// answer). The plant ("Harrow Point") is invented for this test and is none of the demo or
// example plants: its own gas, feed in scf, fuel and CO2 in t. Agreement within 1e-6 relative.
//
// Data used, each with its source:
//  - atomic weights H 1.008, C 12.011, N 14.007, O 15.999: CIAAW 2021 conventional values
//  - R = 8.314462618 J/(mol K): CODATA 2018 (exact in the 2019 SI)
//  - scf at 60 °F and 14.696 psia (plant-month format); 1 ft = 0.3048 m, 1 lbf/in² from
//    0.45359237 kg × 9.80665 m/s² / (0.0254 m)² (exact by definition)
//  - Z = 1 − (Σ xᵢ sᵢ)², summation factors at 15.55 °C (60 °F) from ISO 6976:2016 Table A.3 as
//    reproduced in an open implementation (RuedigerForster/ISO_6976, src/iso6976.cpp; unconfirmed)
//  - 44/12 (IPCC 2006 Vol 3 Eq 3.1, from memory) and 3.664 (EU MRR Art 25)
//  - expanded uncertainties at 95 % with k = 1.96 (GUM, common practice)
import { describe, expect, it } from "vitest";
import { runCli } from "../../../lib/balance/cli";

const AW = { H: 1.008, C: 12.011, N: 14.007, O: 15.999 };
const GAS_DATA: Record<string, { atoms: [number, number, number, number]; s60: number }> = {
  CH4: { atoms: [1, 4, 0, 0], s60: 0.04437 },
  C2H6: { atoms: [2, 6, 0, 0], s60: 0.0916 },
  C3H8: { atoms: [3, 8, 0, 0], s60: 0.134 },
  N2: { atoms: [0, 0, 2, 0], s60: 0.0169 },
  CO2: { atoms: [1, 0, 0, 2], s60: 0.0749 },
};
const molar = ([c, h, n, o]: number[]) => c * AW.C + h * AW.H + n * AW.N + o * AW.O;
const M_CO2 = molar([1, 0, 0, 2]);
const M_NH3 = molar([0, 3, 1, 0]);

type Pct = Record<string, number>;
function gas(pct: Pct) {
  const x = Object.entries(pct).map(([k, v]) => [k, v / 100] as const);
  const M = x.reduce((a, [k, f]) => a + f * molar(GAS_DATA[k].atoms), 0);
  const cPerMol = x.reduce((a, [k, f]) => a + f * GAS_DATA[k].atoms[0], 0);
  const t60 = ((60 - 32) * 5) / 9;
  const s = x.reduce((a, [k, f]) => a + f * GAS_DATA[k].s60, 0);
  const Z = 1 - s * s;
  const p = (14.696 * 0.45359237 * 9.80665) / 0.0254 ** 2;
  const vmScf = (Z * 8.314462618 * (t60 + 273.15)) / p / 0.3048 ** 3 * 1000; // scf per kmol, real gas
  return { M, cPerMol, vmScf };
}

interface Month { month: string; feedScf: number; fuelT: number; nh3T: number; ureaT: number; ventT: number; stackT: number; purgeScf?: number }

const HARROW_GAS: Pct = { CH4: 89.6, C2H6: 5.9, C3H8: 1.4, N2: 1.9, CO2: 1.2 };
const U = { feed: 1.2, fuel: 1.8 }; // expanded, %, at 95 %

function doc(m: Month, factorSet: string): string {
  const s = (v: number) => String(v);
  return JSON.stringify({
    format: "synledger.plant-month/1", site: "Harrow Point", month: m.month,
    analyses: { "harrow-gas": { components: Object.fromEntries(Object.entries(HARROW_GAS).map(([k, v]) => [k, s(v)])) },
      "harrow-purge": { components: { H2: "58.0", N2: "24.0", CH4: "12.5", Ar: "5.5" } } },
    streams: [
      { id: "feed", kind: "feed-gas", analysis: "harrow-gas", quantity: s(m.feedScf), unit: "scf", uncertainty_pct: s(U.feed) },
      { id: "fuel", kind: "fuel-gas", analysis: "harrow-gas", quantity: s(m.fuelT), unit: "t", uncertainty_pct: s(U.fuel) },
      { id: "air", kind: "process-air", quantity: "39500", unit: "t" },
      ...(m.purgeScf ? [{ id: "purge", kind: "purge-gas", analysis: "harrow-purge", fate: "fuel", quantity: s(m.purgeScf), unit: "scf" }] : []),
      { id: "nh3", kind: "ammonia", quantity: s(m.nh3T), unit: "t", uncertainty_pct: "0.4" },
      { id: "urea", kind: "co2-export", destination: "urea", quantity: s(m.ureaT), unit: "t" },
      { id: "vent", kind: "co2-vent", quantity: s(m.ventT), unit: "t" },
      { id: "stack", kind: "stack-co2", quantity: s(m.stackT), unit: "t" },
    ],
    method: { emissions: "carbon-mass-balance", factor_set: factorSet, gwp: "AR5" },
  });
}

/** The from-scratch month: purge burnt as fuel is internal, so its carbon is not counted (format: count carbon once). */
function byHand(m: Month, co2PerC: number) {
  const g = gas(HARROW_GAS);
  const feedKmol = m.feedScf / g.vmScf;
  const fuelKmol = (m.fuelT * 1000) / g.M;
  const cIn = (feedKmol + fuelKmol) * g.cPerMol;
  const cOut = ((m.ureaT + m.ventT + m.stackT) * 1000) / M_CO2;
  const co2Of = (kmol: number) => ((kmol * g.cPerMol * AW.C) / 1000) * co2PerC;
  const co2 = co2Of(feedKmol) + co2Of(fuelKmol);
  // Standard uncertainties: each meter's, and the analysis's carbon content (no figure entered:
  // the set's default 1 % at 95 %), one analysis behind both streams, so one part for both.
  const feedU = (co2Of(feedKmol) * U.feed) / 100 / 1.96;
  const fuelU = (co2Of(fuelKmol) * U.fuel) / 100 / 1.96;
  const analysisU = (co2 * 1.0) / 100 / 1.96;
  const uStd = Math.hypot(feedU, fuelU, analysisU);
  return { cIn, closure: ((cOut - cIn) / cIn) * 100, co2, nh3Kmol: (m.nh3T * 1000) / M_NH3, perT: co2 / m.nh3T, uStd, feedU, fuelU, analysisU };
}

const engine = (text: string, args: string[]) => {
  const r = runCli(args, () => text);
  expect([r.code, r.stderr]).toEqual([0, ""]);
  return JSON.parse(r.stdout);
};
const agree = (engineText: string, mine: number, what: string) =>
  expect(Math.abs(Number(engineText) - mine) / Math.abs(mine), `${what}: engine ${engineText}, by hand ${mine}`).toBeLessThan(1e-6);

describe("independent check, one month at Harrow Point (IPCC 2006, 44/12)", () => {
  const m: Month = { month: "2027-06", feedScf: 646_250_000, fuelT: 5420.75, nh3T: 30125.4, ureaT: 28700.5, ventT: 7520.8, stackT: 14330.6 };
  const mine = byHand(m, 44 / 12);
  const out = engine(doc(m, "ipcc-2006"), ["harrow-2027-06.json", "--json"]);

  it("the plant is not trivially closed: by hand it closes at a few tenths of a per cent", () => {
    expect(Math.abs(mine.closure)).toBeGreaterThan(0.05);
    expect(Math.abs(mine.closure)).toBeLessThan(3);
  });
  it("carbon in, NH3, CO2, closure and t CO2/t NH3 agree within 1e-6", () => {
    agree(out.balances.carbon.in_kmol, mine.cIn, "carbon in, kmol");
    agree(out.balances.carbon.closure_pct, mine.closure, "carbon closure, %");
    agree(out.streams.find((s: { id: string }) => s.id === "nh3").kmol, mine.nh3Kmol, "NH3, kmol");
    agree(out.feed.ammonia_t, m.nh3T, "NH3, t");
    agree(out.emissions.co2_t, mine.co2, "CO2, t");
    agree(out.intensity.co2_t_per_t_nh3, mine.perT, "t CO2/t NH3");
  });
  it("the month's CO2 uncertainty at 95 %: meters independent, the analysis one part, 1.96 × √(Σ(CO2ᵢ × uᵢ)² + (CO2 × u_C)²)", () => {
    agree(out.uncertainty.co2.u95_t, 1.96 * mine.uStd, "U95 CO2, t");
  });
});

describe("independent check, a partial year at Harrow Point (January–March 2027, EU MRR, 3.664)", () => {
  const months: Month[] = [
    { month: "2027-01", feedScf: 661_400_000, fuelT: 5702.3, nh3T: 30890.1, ureaT: 29510.4, ventT: 7602.1, stackT: 15102.3 },
    { month: "2027-02", feedScf: 590_850_000, fuelT: 5011.6, nh3T: 27455.8, ureaT: 26480.0, ventT: 6921.3, stackT: 13170.4, purgeScf: 3_100_000 },
    { month: "2027-03", feedScf: 652_000_000, fuelT: 5490.0, nh3T: 30402.7, ureaT: 29120.7, ventT: 7460.2, stackT: 14402.8 },
  ];
  const texts = Object.fromEntries(months.map((m) => [`harrow-${m.month}.json`, doc(m, "eu-mrr")]));
  const r = runCli(["--year", ...Object.keys(texts), "--json"], (f) => texts[f]);
  const year = JSON.parse(r.stdout);
  const mine = months.map((m) => byHand(m, 3.664));
  const sum = (f: (x: ReturnType<typeof byHand>) => number) => mine.reduce((a, x) => a + f(x), 0);

  it("runs, and names the nine missing months", () => {
    expect([r.code, r.stderr]).toEqual([0, ""]);
    expect(year.months_missing).toHaveLength(9);
    expect(year.flags.find((f: { code: string }) => f.code === "months-missing").message).toContain("April (2027-04)");
  });
  it("each month: CO2 and closure agree within 1e-6 (purge burnt as fuel counted once, in the feed)", () => {
    months.forEach((m, i) => {
      const row = year.months.find((x: { month: string }) => x.month === m.month);
      agree(row.co2_t, mine[i].co2, `${m.month} CO2`);
      agree(row.carbon_closure_pct, mine[i].closure, `${m.month} closure`);
      agree(row.ammonia_t, m.nh3T, `${m.month} NH3`);
    });
  });
  it("the year: CO2, NH3 and t CO2/t NH3 agree within 1e-6", () => {
    const nh3 = months.reduce((a, m) => a + m.nh3T, 0);
    agree(year.emissions.co2_t, sum((x) => x.co2), "annual CO2");
    agree(year.ammonia_t, nh3, "annual NH3");
    // direct CO2e minus CO2 is CH4 + N2O, outside the EU set's scope for ammonia: zero here
    agree(year.intensity.co2e_t_per_t_nh3, sum((x) => x.co2) / nh3, "annual t CO2/t NH3");
  });
  it("the year's uncertainty: no factor part (3.664 is exact), each meter's (all systematic, one period) added linearly across months, each month's analysis in quadrature", () => {
    expect(year.uncertainty.co2.factor_u_std_t).toBe("0");
    const u2 = sum((x) => x.feedU) ** 2 + sum((x) => x.fuelU) ** 2 + sum((x) => x.analysisU ** 2);
    agree(year.uncertainty.co2.u95_t, 1.96 * Math.sqrt(u2), "annual U95 CO2");
  });
});
