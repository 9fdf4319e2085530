// EU emissions trading monitoring check and CBAM embedded emissions (issue 14). Each threshold is
// checked against the article that sets it; the figures of the worked examples are hand-computed.
import { describe, expect, it } from "vitest";
import { D, dec, type Decimal } from "../../../lib/emissions/decimal";
import { embeddedEmissions } from "../../../lib/emissions/cbam";
import {
  annualReportContent, activityTierOf, activityTierRequired, annualUncertaintyPct, classifySourceStreams, etsBenchmark, installationCategory, materialityPct, monitoringCheck,
} from "../../../lib/emissions/eu-ets";
import { EU_MRR } from "../../../lib/emissions/factor-sets/eu-mrr";
import type { YearMonthEntry } from "../../../lib/emissions/year";
import { rollUp, toYearDocument } from "../../../lib/balance/year";
import { calculate } from "../../../lib/balance/calculate";
import { demoPlantMonths } from "../../../lib/demo/scenario";

/** A month reduced to what the check and CBAM read: per-stream CO2e, meters, ammonia, transfers, electricity. */
function month(m: string, o: {
  streams: { id: string; kind: "feed-gas" | "fuel-gas" | "purge-gas"; co2e: string; quantity: string; u: string | null; sys?: string; analysis?: string; t?: string; gj?: string; carbon?: string }[];
  exports?: { id: string; destination: "urea" | "storage" | "pcc"; t: string }[];
  ammonia: string; storage?: string; urea?: string; power?: { mwh: string; factor?: string };
}): YearMonthEntry {
  const co2e = o.streams.reduce((a, s) => a.plus(s.co2e), new D(0));
  const streams = [
    ...o.streams.map((s) => ({ id: s.id, kind: s.kind, unit: "Sm3", quantity: dec(s.quantity), uncertainty_pct: s.u === null ? null : dec(s.u),
      t: s.t ? dec(s.t) : null, gj_lhv: s.gj ? dec(s.gj) : null, carbon_t: s.carbon ? dec(s.carbon) : null,
      ...(s.sys !== undefined ? { systematic_pct: dec(s.sys) } : {}), ...(s.analysis ? { analysis: s.analysis } : {}) })),
    ...(o.exports ?? []).map((x) => ({ id: x.id, kind: "co2-export", destination: x.destination, unit: "t", quantity: dec(x.t), uncertainty_pct: null, t: dec(x.t) })),
    ...(o.power ? [{ id: "power", kind: "electricity-import", unit: "MWh", quantity: dec(o.power.mwh), uncertainty_pct: null, mwh: dec(o.power.mwh),
      ...(o.power.factor ? { factor_t_per_MWh: dec(o.power.factor) } : {}) }] : []),
  ];
  const by = (t?: string) => ({ co2_t: dec(t ?? 0) });
  return {
    month: m,
    input: { month: m, ammonia_t: dec(o.ammonia), streams, analyses: {}, method: { emissions: "carbon-mass-balance", factor_set: "eu-mrr", gwp: "AR5" } },
    result: {
      month: m, factor_set: { id: "eu-mrr" }, emissions: { co2e_t: co2e },
      method: "carbon-mass-balance", uncertainty: { co2: { meters_without_uncertainty: [] } },
      by_stream: o.streams.map((s) => ({ id: s.id, kind: s.kind, co2_t: dec(s.co2e), co2e_t: dec(s.co2e) })),
      transfers: { by_destination: { urea: by(o.urea), storage: by(o.storage), pcc: by(), sale: by(), other: by() } },
    },
  } as unknown as YearMonthEntry;
}

const places = (x: Decimal | null, n: number) => x?.toDecimalPlaces(n).toFixed(n);

describe("installation category (Reg. (EU) 2018/2066 Art 19(2))", () => {
  it("A up to and including 50 000 t CO2(e), B up to and including 500 000 t, C above", () => {
    expect(installationCategory(dec(50_000))).toBe("A");
    expect(installationCategory(dec("50000.001"))).toBe("B");
    expect(installationCategory(dec(500_000))).toBe("B");
    expect(installationCategory(dec("500000.001"))).toBe("C");
  });
  it("materiality level 5 % for categories A and B, 2 % for C (Reg. (EU) 2018/2067 Art 23, read in 600/2012 Art 23)", () => {
    expect(materialityPct("A").toFixed()).toBe("5");
    expect(materialityPct("B").toFixed()).toBe("5");
    expect(materialityPct("C").toFixed()).toBe("2");
  });
});

describe("source-stream classes (Art 19(3)): jointly below the limit, smallest first", () => {
  it("a large installation: de minimis below 20 000 t (2 % capped), minor below 100 000 t (10 % capped)", () => {
    const c = classifySourceStreams([{ id: "a", t: dec(900_000) }, { id: "b", t: dec(85_000) }, { id: "c", t: dec(15_000) }]);
    expect([c.get("a"), c.get("b"), c.get("c")]).toEqual(["major", "minor", "de-minimis"]);
  });
  it("a small installation: the absolute limits 1 000 t and 5 000 t are higher than 2 % and 10 % of 30 000 t", () => {
    const c = classifySourceStreams([{ id: "a", t: dec(27_000) }, { id: "b", t: dec(2_500) }, { id: "c", t: dec(500) }]);
    expect([c.get("a"), c.get("b"), c.get("c")]).toEqual(["major", "minor", "de-minimis"]);
  });
  it("'less than' is strict: a stream of exactly 1 000 t is not de minimis on the absolute limit", () => {
    const c = classifySourceStreams([{ id: "big", t: dec(20_000) }, { id: "one", t: dec(1_000) }]);
    expect(c.get("one")).toBe("minor");
  });
});

describe("activity-data tiers (Annex II Table 1, gaseous fuels: 7.5 / 5 / 2.5 / 1.5 %) and what Art 26 requires", () => {
  it("the tier an annual uncertainty reaches", () => {
    expect(activityTierOf(dec("1.5"))).toBe(4);
    expect(activityTierOf(dec("2.0"))).toBe(3);
    expect(activityTierOf(dec("5"))).toBe(2);
    expect(activityTierOf(dec("7.5"))).toBe(1);
    expect(activityTierOf(dec("7.6"))).toBe(0);
  });
  it("major streams: category A at least tier 2 (Annex V), B and C the highest (4); one lower for C, two for A and B with the authority's approval", () => {
    expect(activityTierRequired("A", "major")).toMatchObject({ required: 2, with_approval: 1 });
    expect(activityTierRequired("B", "major")).toMatchObject({ required: 4, with_approval: 2 });
    expect(activityTierRequired("C", "major")).toMatchObject({ required: 4, with_approval: 3 });
    expect(activityTierRequired("C", "minor")).toMatchObject({ required: 1 });
    expect(activityTierRequired("C", "de-minimis")).toMatchObject({ required: null });
  });
  it("annual uncertainty: all repeating → the quantity-weighted mean; all random → √Σ(U·q)² / Σq (GUM 5.1.2)", () => {
    const months = (sys: string) => [
      { quantity: dec(100), uncertainty_pct: dec(2), systematic_share: dec(sys) },
      { quantity: dec(300), uncertainty_pct: dec(2), systematic_share: dec(sys) },
    ];
    expect(places(annualUncertaintyPct(months("1")), 10)).toBe("2.0000000000");
    // √(200² + 600²) / 400 = √400 000 / 400 = 1.5811388300…
    expect(places(annualUncertaintyPct(months("0")), 10)).toBe("1.5811388301");
    expect(annualUncertaintyPct([{ quantity: dec(1), uncertainty_pct: null, systematic_share: dec(1) }])).toBeNull();
  });
});

describe("worked examples, one per category", () => {
  const year = (scale: string, u: string) =>
    ["2026-01", "2026-02"].map((m) => month(m, {
      ammonia: "1000",
      streams: [
        { id: "feed", kind: "feed-gas", co2e: new D(scale).times("0.7").toFixed(), quantity: "1000000", u, analysis: "ng" },
        { id: "fuel", kind: "fuel-gas", co2e: new D(scale).times("0.3").toFixed(), quantity: "400000", u: "1.5", analysis: "ng" },
      ],
    }));
  it("category A (40 000 t over the year): the feed meter at ±4 % reaches tier 2, which is all Annex V asks", () => {
    const c = monitoringCheck(year("20000", "4"));
    expect(c.installation_category).toBe("A");
    expect(c.source_streams.find((s) => s.id === "feed")).toMatchObject({ class: "major", tier_achieved: 2, tier_required: 2 });
    expect(c.flags.filter((f) => f.code === "eu-ets-activity-tier-shortfall")).toEqual([]);
    expect(c.materiality_threshold_t.toFixed()).toBe("2000"); // 5 % of 40 000 t
  });
  it("category B (300 000 t): the feed meter at ±2.0 % reaches tier 3, short of tier 4", () => {
    const c = monitoringCheck(year("150000", "2.0"));
    expect(c.installation_category).toBe("B");
    expect(c.flags.some((f) => f.code === "eu-ets-activity-tier-shortfall" && f.message.startsWith("feed:"))).toBe(true);
    expect(c.materiality_threshold_t.toFixed()).toBe("15000");
  });
  it("category C (1 200 000 t): a feed meter at ±2.0 % is flagged with the tier it needs and the uncertainty that meets it", () => {
    const c = monitoringCheck(year("600000", "2.0"));
    expect(c.installation_category).toBe("C");
    const feed = c.source_streams.find((s) => s.id === "feed")!;
    expect(feed).toMatchObject({ class: "major", tier_achieved: 3, tier_required: 4, tier_with_approval: 3 });
    expect(feed.uncertainty_needed_pct?.toFixed()).toBe("1.5");
    const flag = c.flags.find((f) => f.code === "eu-ets-activity-tier-shortfall")!;
    expect(flag.message).toContain("feed: its meter reaches tier 3 (±2 %)");
    expect(flag.message).toContain("needs tier 4, an uncertainty of ±1.5 % or better");
    expect(flag.message).toContain("tier 3 is allowed only where the competent authority accepts");
    expect(c.materiality_threshold_pct.toFixed()).toBe("2");
    expect(c.materiality_threshold_t.toFixed()).toBe("24000"); // 2 % of 1 200 000 t
    // The fuel meter at ±1.5 % reaches tier 4: no flag names it.
    expect(c.flags.some((f) => f.message.startsWith("fuel:"))).toBe(false);
  });
  it("default factors (no analysis) on a major stream of category B are flagged against tier 3", () => {
    const months = ["2026-01"].map((m) => month(m, { ammonia: "1000", streams: [{ id: "feed", kind: "feed-gas", co2e: "200000", quantity: "1", u: "1" }] }));
    const c = monitoringCheck(months);
    expect(c.source_streams[0]).toMatchObject({ factor_origin: "default", factor_tier_achieved: 1, factor_tier_required: 3 });
    expect(c.flags.some((f) => f.code === "eu-ets-factor-tier-shortfall")).toBe(true);
  });
});

describe("annual emissions report content, per source stream (hand-computed)", () => {
  const months = [
    month("2026-01", { ammonia: "1000", exports: [{ id: "to-urea", destination: "urea", t: "500" }, { id: "to-store", destination: "storage", t: "40" }],
      streams: [{ id: "feed", kind: "feed-gas", co2e: "1300", quantity: "600000", u: "1", analysis: "ng", t: "480", gj: "23000", carbon: "354.5" }] }),
    month("2026-02", { ammonia: "1000", exports: [{ id: "to-urea", destination: "urea", t: "520" }],
      streams: [{ id: "feed", kind: "feed-gas", co2e: "1200", quantity: "560000", u: "1", analysis: "ng", t: "445", gj: "21200", carbon: "330" }] }),
  ];
  const r = annualReportContent(months, monitoringCheck(months), "2026");
  const feed = r.streams[0];
  it("activity data, calorific value, carbon content and the implied emission factor", () => {
    expect(feed.activity).toEqual([{ unit: "Sm3", quantity: dec(1_160_000) }]);
    expect(feed.mass_t!.toFixed()).toBe("925");
    expect(places(feed.ncv_gj_per_t, 6)).toBe("47.783784"); // 44 200 GJ / 925 t
    expect(places(feed.carbon_t_per_t, 6)).toBe("0.740000"); // 684.5 / 925
    expect(places(feed.emission_factor_t_per_tj, 4)).toBe("56.5611"); // 2 500 t CO2 / 44.2 TJ
    expect(feed.oxidation_factor).toMatch(/^not applied/);
  });
  it("transfers by receiver kind: only storage deducted under Art 49; totals and gaps", () => {
    expect(r.transfers.map((t) => [t.id, t.co2_t.toFixed(), t.deducted_under_eu_rules])).toEqual([["to-urea", "1020", false], ["to-store", "40", true]]);
    expect(r.totals.deducted_t.toFixed()).toBe("40");
    expect(r.totals.net_co2e_t.toFixed()).toBe("2460");
    expect(r.data_gaps[0]).toContain("2026-03");
  });
});

describe("EU ammonia benchmark", () => {
  it("2021–2025: the EU set's value is unconfirmed in Implementing Reg. (EU) 2021/447, so it is left out; none at all for 2026 (act not found)", () => {
    const b = etsBenchmark("2024", EU_MRR.benchmarks, dec(1_650_000), dec(1_000_000))!;
    expect(b.status).toBe("unconfirmed");
    expect(b.value).toBeNull();
    expect(b.difference_pct).toBeNull();
    expect(places(b.intensity_t_per_t, 4)).toBe("1.6500"); // CO2e before deductions ÷ NH3
    // A confirmed value is compared: (1.65 − 1.57) / 1.57 × 100 = 5.0955 %.
    const confirmed = etsBenchmark("2024", EU_MRR.benchmarks.map((x) => ({ ...x, status: "confirmed" as const })), dec(1_650_000), dec(1_000_000))!;
    expect(places(confirmed.difference_pct, 4)).toBe("5.0955");
    expect(etsBenchmark("2026", EU_MRR.benchmarks, dec(1), dec(1))).toBeNull();
  });
});

describe("CBAM specific embedded emissions (Reg. (EU) 2023/956 Annex IV section 2), a hand-computed year", () => {
  const months = [
    month("2026-01", { ammonia: "1000", urea: "500", power: { mwh: "300", factor: "0.4" },
      streams: [{ id: "feed", kind: "feed-gas", co2e: "1300", quantity: "1", u: "1" }, { id: "fuel", kind: "fuel-gas", co2e: "500", quantity: "1", u: "1" }] }),
    month("2026-02", { ammonia: "1200", urea: "600", storage: "100", power: { mwh: "350", factor: "0.4" },
      streams: [{ id: "feed", kind: "feed-gas", co2e: "1450", quantity: "1", u: "1" }, { id: "fuel", kind: "fuel-gas", co2e: "550", quantity: "1", u: "1" }] }),
  ];
  const c = embeddedEmissions(months);
  it("direct: (1 800 + 2 000 − 100 to storage) t ÷ 2 200 t; CO2 to urea stays counted", () => {
    expect(c.production_t.toFixed()).toBe("2200");
    expect(c.direct_t.toFixed()).toBe("3700");
    expect(c.urea_co2_t.toFixed()).toBe("1100");
    expect(places(c.see_direct_t_per_t, 6)).toBe("1.681818"); // 3700 / 2200
  });
  it("indirect: 650 MWh × 0.4 t/MWh ÷ 2 200 t; total the sum", () => {
    expect(c.indirect_t.toFixed()).toBe("260");
    expect(places(c.see_indirect_t_per_t, 6)).toBe("0.118182"); // 260 / 2200
    expect(places(c.see_total_t_per_t, 6)).toBe("1.800000");
  });
  it("electricity without a factor leaves the indirect figure out rather than counting it as zero", () => {
    const partial = embeddedEmissions([month("2026-03", { ammonia: "1000", power: { mwh: "300" }, streams: [{ id: "feed", kind: "feed-gas", co2e: "1", quantity: "1", u: "1" }] })]);
    expect(partial.indirect_complete).toBe(false);
    expect(partial.see_indirect_t_per_t).toBeNull();
    expect(partial.see_total_t_per_t).toBeNull();
  });
});

describe("the year document carries eu_ets and cbam with the stable keys (CLI --year --json)", () => {
  const months = demoPlantMonths("estuary");
  const doc = toYearDocument(rollUp(months.map((d) => ({ file: d.month, doc: d, result: calculate(d) }))));
  it("keys and types", () => {
    expect(doc.eu_ets.installation_category).toMatch(/^[ABC]$/);
    expect(typeof doc.eu_ets.emissions_t).toBe("string");
    expect(typeof doc.eu_ets.materiality_threshold_pct).toBe("string");
    for (const s of doc.eu_ets.source_streams) {
      expect(["major", "minor", "de-minimis"]).toContain(s.class);
      expect(s.tier_required === null || Number.isInteger(s.tier_required)).toBe(true);
    }
    for (const k of ["production_t", "see_direct_t_per_t", "see_indirect_t_per_t", "see_total_t_per_t"] as const) expect(typeof doc.cbam[k]).toBe("string");
  });
  it("SEE direct equals the year's CO2e less what went to storage, divided by the ammonia, from the document's own totals", () => {
    const expected = new D(doc.emissions.co2e_t!).minus(doc.transfers_by_destination.storage!).minus(doc.transfers_by_destination.pcc!).div(doc.ammonia_t!);
    expect(new D(doc.cbam.see_direct_t_per_t!).toSignificantDigits(12).eq(expected.toSignificantDigits(12))).toBe(true);
  });
});
