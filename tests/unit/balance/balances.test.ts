import { describe, expect, it } from "vitest";
import { balanceFlags, balanceTerms, closure, elementBalances } from "../../../lib/balance/balances";
import { calculate } from "../../../lib/balance/calculate";
import { Dec, dec } from "../../../lib/balance/decimal";
import { M_NH3, feedFigures, minimumFeed, mixPerMole } from "../../../lib/balance/feed";
import { compositionOf, gasProperties } from "../../../lib/balance/gas-properties";
import { parsePlantMonth, type PlantMonth } from "../../../lib/balance/schema";
import { DRY_AIR, analysesOf, streamFlows, streamGas } from "../../../lib/balance/streams";
import { type LooseDoc, STOICH_PLANT, variant } from "./fixtures";

// Default tolerance: rounding at the engine's 34 significant digits on figures of up to ~1e6 kmol.
const near = (x: Dec | null, expected: string, tol = "1e-25") => expect(x !== null && x.minus(expected).abs().lte(tol), `${x} vs ${expected}`).toBe(true);
const docOf = (raw: unknown): PlantMonth => {
  const r = parsePlantMonth(raw);
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return r.doc;
};
const flowsOf = (doc: PlantMonth) => streamFlows(doc, analysesOf(doc).gases);

describe("pure-methane plant built on paper to close (fixtures.ts derivation)", () => {
  const doc = docOf(STOICH_PLANT);
  const bal = elementBalances(flowsOf(doc));
  it("carbon: 69 037 + 10 000 kmol in, the same out, closure 0", () => {
    near(bal.carbon.in_kmol, "79037");
    near(bal.carbon.out_kmol, "79037");
    near(bal.carbon.closure_pct, "0");
  });
  it("nitrogen: 78 084 kmol N2 in, 156 168 / 2 out, closure 0", () => {
    near(bal.nitrogen.in_kmol, "78084");
    near(bal.nitrogen.closure_pct, "0");
  });
  it("hydrogen: 4 × 69 037 − 2 × 20 948 = 234 252 available = 3/2 × 156 168 used, closure 0", () => {
    near(bal.hydrogen.in_kmol, "234252");
    near(bal.hydrogen.out_kmol, "234252");
    near(bal.hydrogen.closure_pct, "0");
  });
  it("H2:N2 ratio 3", () => near(bal.h2n2Ratio, "3"));
  it("theoretical minimum feed = the plant's own feed: efficiency 100 %, 20.8341 GJ/t (hand calc 0.44206880 × 802.648 / 17.031; ISO 6976:2016 methane net at 15 °C)", () => {
    const f = feedFigures(flowsOf(doc));
    near(f.feed_efficiency_pct, "100", "1e-25");
    near(f.theoretical_min_gj_lhv_per_t_nh3, "20.834104652712783537", "1e-15");
    // (69 037 + 10 000) kmol × 802.648 MJ/kmol / 2659.697208 t (hand calc)
    near(f.gj_lhv_per_t_nh3, "23.851921859820969515", "1e-15");
  });
  it("a 3 % high feed meter shows as carbon −(0.03·69037/79037·…) — carbon and hydrogen open, nitrogen unchanged", () => {
    const high = docOf(variant((d) => (d.streams[0].quantity = "1140.78740873"))); // 1107.560591 × 1.03
    const b = elementBalances(flowsOf(high));
    // carbon: out 79037, in 79037 + 2071.11 → (79037 / 81108.11 − 1) × 100 = −2.5535 %
    near(b.carbon.closure_pct, "-2.5535", "0.0001");
    near(b.nitrogen.closure_pct, "0");
    // hydrogen: available 234252 + 0.03 × 4 × 69037 = 242536.44 → (234252 / 242536.44 − 1) × 100 = −3.4157 %
    near(b.hydrogen.closure_pct, "-3.4157", "0.0001");
  });
});

describe("theoretical minimum feed", () => {
  it("pure methane with dry air: 0.44207 kmol/kmol NH3, 20.84 GJ/t (derivation in feed.ts; common practice ~20.9, from memory)", () => {
    const m = minimumFeed({ n2: dec(0), h2eq: dec(4), ncv: dec("802.648") }, { n2: DRY_AIR.n2PerMol, h2eq: DRY_AIR.h2EquivalentsPerMol })!;
    near(m.feed_kmol_per_kmol_nh3, "0.44206879770503560268", "1e-18");
    near(m.gj_lhv_per_t_nh3, "20.9", "0.1");
    near(m.air_kmol_per_kmol_nh3, dec("0.5").div("0.78084").toFixed(), "1e-30");
  });
  it("no solution when the feed brings no hydrogen", () => {
    expect(minimumFeed({ n2: dec(0), h2eq: dec(0), ncv: dec(0) }, { n2: DRY_AIR.n2PerMol, h2eq: DRY_AIR.h2EquivalentsPerMol })).toBeNull();
  });
  it("mixPerMole weights two feed meters by kmol (hand calc: 1:1 CH4 and C2H6 → 5.5 H2-eq)", () => {
    const doc = docOf(variant((d) => {
      d.analyses.ethane = { components: { C2H6: "100" } };
      d.streams.push({ id: "feed2", kind: "feed-gas", analysis: "ethane", quantity: "2075.94259", unit: "t" }); // 69037 kmol × 30.07 kg/kmol
    }));
    const feeds = flowsOf(doc).filter((f) => f.stream.kind === "feed-gas");
    near(mixPerMole(feeds)!.h2eq, "5.5", "1e-30");
    expect(M_NH3.toFixed()).toBe("17.031");
  });
});

describe("balance rules of the plant-month format", () => {
  it("purge burnt as fuel is internal to carbon; flared purge leaves; both leave nitrogen and hydrogen", () => {
    const purge = (fate: string) => docOf(variant((d) => {
      d.analyses.purge = { components: { H2: "60", N2: "20", CH4: "15", Ar: "5" } };
      d.streams.push({ id: "purge", kind: "purge-gas", analysis: "purge", fate, quantity: "100", unit: "t" });
    }));
    const asFuel = flowsOf(purge("fuel")).find((f) => f.stream.id === "purge")!;
    const flared = flowsOf(purge("flare")).find((f) => f.stream.id === "purge")!;
    expect(balanceTerms(asFuel).carbon).toBeUndefined();
    expect(balanceTerms(flared).carbon?.side).toBe("out");
    expect(balanceTerms(asFuel).nitrogen?.side).toBe("out");
    // H2-eq per kmol purge = 0.60 + 4 × 0.15 = 1.2 (format: CcHh 2c + h/2, H2 1)
    near(asFuel.gas!.h2EquivalentsPerMol, "1.2");
  });
  it("fuel enters carbon only", () => {
    const fuel = flowsOf(docOf(STOICH_PLANT)).find((f) => f.stream.id === "fuel")!;
    expect(Object.keys(balanceTerms(fuel))).toEqual(["carbon"]);
  });
  it("carbon closure null with an info flag when only an export leaves", () => {
    const doc = docOf(variant((d) => d.streams.splice(5, 1)));
    const flows = flowsOf(doc);
    const b = elementBalances(flows);
    expect(b.carbon.closure_pct).toBeNull();
    expect(b.closable.carbon).toBe(false);
    expect(balanceFlags(flows, b).map((f) => f.code)).toContain("carbon-closure-open");
  });
  it("missing streams, ratio and tolerance flags", () => {
    const doc = docOf(variant((d) => (d.streams = d.streams.filter((s: LooseDoc) => s.kind !== "ammonia" && s.kind !== "process-air"))));
    const flows = flowsOf(doc);
    const codes = balanceFlags(flows, elementBalances(flows)).map((f) => f.code);
    expect(codes).toEqual(expect.arrayContaining(["missing-ammonia", "missing-process-air", "nitrogen-closure-open", "hydrogen-closure-open"]));
    const off = docOf(variant((d) => (d.streams[3].quantity = "2500")));
    const f2 = flowsOf(off);
    const codes2 = balanceFlags(f2, elementBalances(f2), { closureTolerancePct: dec(2) }).map((f) => f.code);
    expect(codes2).toEqual(expect.arrayContaining(["nitrogen-closure-out-of-tolerance", "hydrogen-closure-out-of-tolerance"]));
    // a site tolerance of 10 % accepts the same 6 % gap
    expect(balanceFlags(f2, elementBalances(f2), { closureTolerancePct: dec(10) }).some((f) => f.code.endsWith("out-of-tolerance"))).toBe(false);
    const noFeed = docOf(variant((d) => d.streams.splice(0, 1)));
    expect(balanceFlags(flowsOf(noFeed), elementBalances(flowsOf(noFeed))).map((f) => f.code)).toContain("missing-feed");
  });
  it("an H2:N2 ratio of 3.2 is flagged (2.9–3.1, common practice)", () => {
    const doc = docOf(variant((d) => (d.streams[2].quantity = "2715.3852"))); // air × 0.9375 → ratio ≈ 3.2
    const flows = flowsOf(doc);
    expect(balanceFlags(flows, elementBalances(flows)).map((f) => f.code)).toContain("h2-n2-ratio-out-of-range");
  });
  it("closure = (out − in) / in × 100", () => expect(closure(dec(100), dec(98)).toFixed()).toBe("-2"));
  it("dry air is used for process air without analysis; normalised analysis is flagged", () => {
    const doc = docOf(variant((d) => {
      delete d.streams[2].analysis;
      d.analyses.methane.components.CH4 = "99.7";
    }));
    expect(streamGas(doc.streams[2], {})).toBe(DRY_AIR);
    const r = calculate(doc);
    expect(r.flags.find((f) => f.code === "composition-normalised")?.severity).toBe("warning");
    expect(gasProperties(compositionOf({ CH4: "99.7" })).fractions.CH4!.toFixed()).toBe("1");
  });
});
