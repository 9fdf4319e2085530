import { describe, expect, it } from "vitest";
import {
  BUILT_IN_FACTOR_SETS, EU_MRR, FactorSetError, FactorSetRegistry, IPCC_2006, US_40CFR98, computeEmissions, factorSetSchema, parseFactorSet,
} from "../../../lib/emissions/index";
import { gas, plant } from "./fixtures";

// Loose JSON shape for editing a set the way an uploaded file would be edited.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Json = any;

/** A site's own set, as an organisation would upload it: JSON, a laboratory factor for its gas. */
function siteSet(): Record<string, unknown> {
  const json = JSON.parse(JSON.stringify(IPCC_2006)) as Record<string, Json>;
  json.id = "north-works-lab-2024";
  json.name = "North Works laboratory factors 2024";
  json.fuels["site-gas"] = {
    ...json.fuels["natural-gas"],
    label: "Pipeline gas, site laboratory",
    co2: { value: "55800", unit: "kg CO2/TJ NCV", uncertainty_pct: "1.0", source: "Site laboratory report L-2024-07", status: "confirmed", checked: "report L-2024-07 as filed by the site" },
    co2_from_analysis: false,
  };
  json.fuel_by_analysis = { ng: "site-gas" };
  return json;
}

describe("factor set schema", () => {
  it("every built-in set validates", () => {
    for (const s of BUILT_IN_FACTOR_SETS) expect(factorSetSchema.safeParse(s).success).toBe(true);
  });
  it("a custom set validates, registers and is used for its mapped analysis: 1 000 TJ × 55 800 kg/TJ = 55 800 t", () => {
    const reg = new FactorSetRegistry([siteSet()]);
    expect(reg.get("north-works-lab-2024")?.fuels["site-gas"].co2?.value).toBe("55800");
    const input = plant({ method: { emissions: "fuel-calculation", factor_set: "north-works-lab-2024", gwp: "AR5" },
      streams: [gas("feed", "feed-gas", "20000", "1.5")] });
    const r = computeEmissions(input, reg);
    expect(r.emissions.co2_t.toString()).toBe("55800");
    expect(r.factor_set.built_in).toBe(false);
  });
  it("a broken set is rejected with the JSON path of each fault", () => {
    const broken = siteSet() as Record<string, Json>;
    broken.fuels["natural-gas"].co2.value = "fifty-six thousand";
    broken.deduction_rules.urea.status = "confirmed"; // without saying where it was read
    delete broken.stoichiometric_factor.denominator;
    const r = parseFactorSet(broken);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const paths = r.issues.map((i) => i.path);
    expect(paths).toContain('$.fuels["natural-gas"].co2.value');
    expect(paths).toContain("$.deduction_rules.urea.checked");
    expect(paths).toContain("$.stoichiometric_factor.denominator");
    expect(() => new FactorSetRegistry([broken])).toThrow(FactorSetError);
  });
  it("cross-field rules: a mapping to an unknown fuel and a missing default row are named", () => {
    const s = siteSet() as Record<string, Json>;
    s.fuel_by_analysis = { ng: "no-such-fuel" };
    s.default_row = "no-such-row";
    const r = parseFactorSet(s);
    expect(r.ok ? [] : r.issues.map((i) => i.path)).toEqual(["$.fuel_by_analysis.ng", "$.default_row"]);
  });
  it("a custom set may not take a built-in id", () => {
    const s = siteSet();
    s.id = "eu-mrr";
    expect(() => new FactorSetRegistry([s])).toThrow(/already exists/);
  });
  it("an unknown factor set in the input is an error naming the known ones", () => {
    expect(() => computeEmissions(plant({ method: { emissions: "carbon-mass-balance", factor_set: "nope", gwp: "AR5" } })))
      .toThrow(/ipcc-2006, us-40cfr98, eu-mrr/);
  });
});

describe("built-in sets record provenance as docs/provenance.md does", () => {
  it("IPCC tables unconfirmed; 40 CFR 98 Tables C-1/C-2, Eq G-1, and EU 601/2012 Art 36(3), 37(1), 49(1), Annex II confirmed", () => {
    expect(IPCC_2006.fuels["natural-gas"].co2).toMatchObject({ value: "56100", status: "unconfirmed" });
    // 40 CFR 98 Table C-1: natural gas 53.06 kg CO2/mmBtu, 1.026 × 10^-3 mmBtu/scf; Table C-2: 1.0 × 10^-3 kg CH4, 1.0 × 10^-4 kg N2O per mmBtu.
    expect(US_40CFR98.fuels["natural-gas"].co2).toMatchObject({ value: "53.06", status: "confirmed" });
    expect(US_40CFR98.fuels["natural-gas"].ch4).toMatchObject({ value: "1.0E-03", status: "confirmed" });
    expect(US_40CFR98.fuels["natural-gas"].n2o).toMatchObject({ value: "1.0E-04", status: "confirmed" });
    expect(US_40CFR98.fuels["natural-gas"].default_energy_per_volume).toMatchObject({ value: "1.026E-03", volume_unit: "scf", status: "confirmed" });
    // Reg. (EU) 601/2012 Art 36(3): 3.664 t CO2/t C; Art 37(1): oxidation factor 1; Art 49(1): only transfers to storage deducted.
    expect(EU_MRR.stoichiometric_factor).toMatchObject({ numerator: "3.664", status: "confirmed" });
    expect(EU_MRR.fuels["natural-gas"].oxidation_factor).toMatchObject({ value: "1", status: "confirmed" });
    expect(EU_MRR.deduction_rules).toMatchObject({ storage: { deducted: true, status: "confirmed" }, urea: { deducted: false, status: "confirmed" }, sale: { deducted: false } });
    expect(EU_MRR.benchmarks.find((b) => b.id === "eu-ammonia-2021-2025")).toMatchObject({ value: "1.570", status: "unconfirmed" });
    // Reg. (EU) 601/2012 Annex II Table 1: ± 7.5 / 5 / 2.5 / 1.5 % for tiers 1–4.
    expect(EU_MRR.activity_tiers?.map((t) => t.max_uncertainty_pct)).toEqual(["7.5", "5", "2.5", "1.5"]);
  });
  it("every confirmed value says where its published text was read; the US and EU sets show no IPCC benchmark", () => {
    const all = (v: unknown): { status: string; checked?: string }[] =>
      v && typeof v === "object" ? [...("status" in v ? [v as { status: string; checked?: string }] : []), ...Object.values(v).flatMap(all)] : [];
    for (const set of BUILT_IN_FACTOR_SETS) for (const c of all(set)) if (c.status === "confirmed") expect(c.checked?.length, set.id).toBeGreaterThan(10);
    expect(US_40CFR98.benchmarks).toEqual([]);
    expect(EU_MRR.benchmarks.every((b) => b.kind === "product-benchmark")).toBe(true);
  });
});
