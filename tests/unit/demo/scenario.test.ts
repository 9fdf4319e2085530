import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { calculate } from "../../../lib/balance/calculate";
import { parsePlantMonthText } from "../../../lib/balance/schema";
import { rng, seedOf } from "../../../lib/demo/prng";
import { demoOrganisation, demoPlantDays, demoPlantMonths, plantMonthJson } from "../../../lib/demo/scenario";
import { allExampleFiles } from "../../../lib/demo/write-examples";

describe("committed examples equal the generator output", () => {
  it.each(Object.keys(allExampleFiles()))("examples/%s", (name) => {
    expect(readFileSync(join("examples", name), "utf8")).toBe(allExampleFiles()[name]);
  });
});

describe("demo organisation", () => {
  const org = demoOrganisation();
  it("Vellmar Nitrogen Co. with Estuary Works (metric, IPCC 2006) and Dunmoor Works (US units, 40 CFR 98 style)", () => {
    expect(org.name).toBe("Vellmar Nitrogen Co.");
    expect(org.sites.map((s) => [s.name, s.method.factor_set, s.method.emissions])).toEqual([
      ["Estuary Works", "ipcc-2006", "carbon-mass-balance"],
      ["Dunmoor Works", "us-40cfr98", "fuel-calculation"],
    ]);
    expect(org.sites[1].streams.map((s) => s.unit)).toEqual(expect.arrayContaining(["MMscf", "MMBtu-HHV", "Mscf"]));
    for (const s of org.sites.flatMap((x) => x.streams)) expect(s.calibrated).toMatch(/^\d{4}-\d{2}-\d{2}$/);
  });
  it("the PRNG is deterministic per seed", () => {
    expect(rng(seedOf("x")).next().eq(rng(seedOf("x")).next())).toBe(true);
    expect(rng(seedOf("x")).next().eq(rng(seedOf("y")).next())).toBe(false);
  });
});

describe.each(["estuary", "dunmoor"] as const)("twelve months of 2026 at %s are physically plausible", (key) => {
  const site = demoOrganisation().sites.find((s) => s.key === key)!;
  const months = demoPlantMonths(key);
  const results = months.map((d) => calculate(d));
  it("12 documents, each valid when read back from its JSON text", () => {
    expect(months.map((m) => m.month)).toEqual(Array.from({ length: 12 }, (_, i) => `2026-${String(i + 1).padStart(2, "0")}`));
    for (const m of months) expect(parsePlantMonthText(plantMonthJson(m)).ok).toBe(true);
  });
  it("closures within ±2 % except the drift month; H2:N2 near 3; 29–31 GJ LHV/t (common practice, no source)", () => {
    results.forEach((r, i) => {
      const b = r.balances;
      if (months[i].month !== site.drift.month)
        for (const c of [b.carbon, b.nitrogen, b.hydrogen]) expect(c.closure_pct!.abs().lte(2)).toBe(true);
      expect(b.h2n2Ratio!.minus(3).abs().lte("0.25")).toBe(true);
      const gj = r.feed.gj_lhv_per_t_nh3!;
      expect(gj.gte("28.8") && gj.lte("31.2")).toBe(true);
    });
  });
  it("direct CO2 of all carbon in is 1.5–1.9 t per t NH3 (common practice 1.6–2.0, REFERENCE-VALUES)", () => {
    for (const r of results) {
      const co2 = r.balances.carbon.in_kmol.times("44.009").div(1000).div(r.feed.ammonia_t);
      expect(co2.gte("1.5") && co2.lte("1.9")).toBe(true);
    }
  });
  it("the drift month fails the global test and reconciliation names the drifting meter", () => {
    const r = results[months.findIndex((m) => m.month === site.drift.month)];
    expect(r.reconciliation!.passed).toBe(false);
    const flag = r.flags.find((f) => f.code === "reconciliation-suspect-meter")!;
    expect(flag.message).toContain(site.drift.stream);
    const others = results.filter((_, i) => months[i].month !== site.drift.month);
    expect(others.filter((x) => !x.reconciliation!.passed).length).toBeLessThanOrEqual(1);
  });
});

describe("daily documents", () => {
  it("365 day-documents for one site", () => expect(demoPlantDays("estuary").length).toBe(365));
});
