// Property tests (fast-check): invariances a correct engine must have, independent of any value.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { calculate } from "../../../lib/balance/calculate";
import { Dec, dec } from "../../../lib/balance/decimal";
import { CUBIC_FOOT_M3, R, REFERENCES, calorificValues, compressibility } from "../../../lib/balance/gas-properties";
import { parsePlantMonth, type PlantMonth } from "../../../lib/balance/schema";
import { MMBTU_GJ } from "../../../lib/balance/units";
import { demoPlantMonths } from "../../../lib/demo/scenario";
import { STOICH_PLANT } from "./fixtures";

const base = demoPlantMonths("estuary")[2];
const scaled = (doc: PlantMonth, k: Dec): PlantMonth => ({ ...doc, streams: doc.streams.map((s) => ({ ...s, quantity: s.quantity.times(k) })) });
const same = (a: Dec | null, b: Dec | null, tol = "1e-25") => expect(a === null ? b === null : b !== null && a.minus(b).abs().lte(tol), `${a} vs ${b}`).toBe(true);

describe("invariance under scale", () => {
  it("scaling every flow by k leaves closures, ratio and intensities unchanged", () => {
    const r0 = calculate(base, { reconcile: false });
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 10_000 }), fc.integer({ min: 0, max: 6 }), (mant, exp) => {
        const k = dec(mant).div(dec(10).pow(exp));
        const r = calculate(scaled(base, k), { reconcile: false });
        for (const b of ["carbon", "nitrogen", "hydrogen"] as const) same(r.balances[b].closure_pct, r0.balances[b].closure_pct);
        same(r.balances.h2n2Ratio, r0.balances.h2n2Ratio);
        same(r.feed.gj_lhv_per_t_nh3, r0.feed.gj_lhv_per_t_nh3);
        same(r.feed.feed_efficiency_pct, r0.feed.feed_efficiency_pct);
      }),
      { numRuns: 25, seed: 7 },
    );
  });
});

describe("the same plant in Sm3, Nm3, scf, t or GJ gives the same kmol", () => {
  // Quantities rewritten with the test's own formulas: V = n·Z·R·T/p at each reference,
  // m = n·M, E = n·CV; only Z, M and CV per mole come from the engine (checked elsewhere).
  const feed = base.streams[0];
  const gas = calculate(base, { reconcile: false }).flows[0].gas!;
  const kmol = calculate(base, { reconcile: false }).streams[0].kmol!;
  const volume = (ref: "15C" | "0C" | "60F") => kmol.times(compressibility(gas, ref)).times(R).times(REFERENCES[ref].T).div(REFERENCES[ref].p).times(1000);
  const cv15 = calorificValues(gas, "15C");
  const cv60 = calorificValues(gas, "60F");
  const forms: [string, Dec][] = [
    ["Sm3", volume("15C")],
    ["kSm3", volume("15C").div(1000)],
    ["Nm3", volume("0C")],
    ["MNm3", volume("0C").div(1e6)],
    ["scf", volume("60F").div(CUBIC_FOOT_M3)],
    ["MMscf", volume("60F").div(CUBIC_FOOT_M3).div(1e6)],
    ["t", kmol.times(gas.molarMass).div(1000)],
    ["kg", kmol.times(gas.molarMass)],
    ["GJ-LHV", kmol.times(cv15.netMolar).div(1000)],
    ["GJ-HHV", kmol.times(cv15.grossMolar).div(1000)],
    ["MMBtu-HHV", kmol.times(cv60.grossMolar).div(1000).div(MMBTU_GJ)],
  ];
  it.each(forms)("feed written in %s", (unit, quantity) => {
    const doc = { ...base, streams: base.streams.map((s, i) => (i === 0 ? { ...feed, unit: unit as typeof feed.unit, quantity } : s)) };
    const r = calculate(doc, { reconcile: false });
    same(r.streams[0].kmol, kmol, "1e-24"); // ~1e5 kmol at 34 significant digits
  });
});

describe("plant reconciliation properties", () => {
  const parsed = parsePlantMonth(STOICH_PLANT);
  if (!parsed.ok) throw new Error("fixture");
  it("reconciled flows satisfy every closable balance to 1e-20 and never move an exact meter", () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: -300, max: 300 }), { minLength: 6, maxLength: 6 }),
        fc.integer({ min: 0, max: 5 }),
        (errs, exactIdx) => {
          const doc: PlantMonth = {
            ...parsed.doc,
            streams: parsed.doc.streams.map((s, i) => ({
              ...s,
              quantity: s.quantity.times(dec(1).plus(dec(errs[i]).div(10_000))),
              ...(i === exactIdx ? { uncertainty_pct: undefined } : {}),
            })),
          };
          const r = calculate(doc);
          const rec = r.reconciliation!;
          for (const b of rec.constraints) expect(rec.closures_after[b]!.abs().lte("1e-20")).toBe(true);
          const exact = rec.streams.find((s) => s.id === doc.streams[exactIdx].id)!;
          expect(exact.reconciled.eq(exact.measured)).toBe(true);
          expect(exact.redundancy).toBe("exact");
        },
      ),
      { numRuns: 30, seed: 11 },
    );
  });
});
