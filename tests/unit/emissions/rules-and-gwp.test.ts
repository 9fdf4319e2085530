import { describe, expect, it } from "vitest";
import { computeEmissions } from "../../../lib/emissions/index";
import { EU_MRR } from "../../../lib/emissions/factor-sets/eu-mrr";
import { FactorSetRegistry } from "../../../lib/emissions/registry";
import { co2Stream, plant, withMethod } from "./fixtures";

// Reference plant: 21 000 t C in (feed + fuel), 40 000 t CO2 to urea. Under IPCC 44/12 the gross
// CO2 is 77 000 t; CH4 0.4 t and N2O 0.04 t from 400 TJ of fuel (1 and 0.1 kg/TJ, IPCC Vol 2
// Tables 2.2/2.3, from memory).
describe("CO2 exported to urea: deducted under one rule set and not under another", () => {
  it("IPCC 2006 deducts urea CO2 as R (Vol 3 §3.2 Eq 3.1, from memory)", () => {
    const r = computeEmissions(plant());
    expect(r.co2.gross_t.toString()).toBe("77000");
    expect(r.co2.deductible_t.toString()).toBe("40000");
    expect(r.co2.net_t.toString()).toBe("37000");
    expect(r.emissions.transferred_co2_t.toString()).toBe("40000");
    expect(r.emissions.net_co2e_t.toString()).toBe(r.emissions.co2e_t.minus(40000).toString());
  });
  it("EU MRR does not deduct urea CO2 (Reg. 601/2012 Art 49, published)", () => {
    const r = computeEmissions(withMethod(plant(), { factor_set: "eu-mrr" }));
    expect(r.co2.deductible_t.toString()).toBe("0");
    expect(r.co2.net_t.toString()).toBe("76944");
    expect(r.emissions.transferred_co2_t.toString()).toBe("40000"); // still shown
    expect(r.transfers.by_destination.urea).toMatchObject({ deducted: false });
  });
  it("40 CFR 98 does not deduct urea CO2 (98.72, 98.76(b), published)", () => {
    const r = computeEmissions(withMethod(plant(), { factor_set: "us-40cfr98" }));
    expect(r.co2.deductible_t.toString()).toBe("0");
    expect(r.emissions.net_co2e_t.eq(r.emissions.co2e_t)).toBe(true);
  });
  it("EU MRR deducts a transfer to storage (Art 49, published) but not a sale", () => {
    const input = plant({}, [co2Stream("ccs", "co2-export", "5000", "2", "storage"), co2Stream("food", "co2-export", "1000", "2", "sale")]);
    const r = computeEmissions(withMethod(input, { factor_set: "eu-mrr" }));
    expect(r.co2.deductible_t.toString()).toBe("5000");
    expect(r.emissions.transferred_co2_t.toString()).toBe("46000");
    expect(r.transfers.by_destination.sale.co2_t.toString()).toBe("1000");
    expect(r.co2.net_t.toString()).toBe("71944"); // 76 944 − 5 000
  });
  it("EU MRR deducts CO2 bound in precipitated calcium carbonate (Reg. (EU) 2018/2066 Art 49(1)(b)); IPCC and 40 CFR 98 do not", () => {
    const input = plant({}, [co2Stream("pcc", "co2-export", "3000", "2", "pcc")]);
    const eu = computeEmissions(withMethod(input, { factor_set: "eu-mrr" }));
    expect(eu.co2.deductible_t.toString()).toBe("3000");
    expect(eu.transfers.by_destination.pcc).toMatchObject({ deducted: true });
    expect(eu.transfers.by_destination.pcc.rule_source).toContain("2018/2066 Art 49(1)(b)");
    expect(eu.citations.find((c) => c.key === "deduction.pcc")?.status).toBe("confirmed");
    const ipcc = computeEmissions(input);
    expect(ipcc.co2.deductible_t.toString()).toBe("40000"); // urea only
    const us = computeEmissions(withMethod(input, { factor_set: "us-40cfr98" }));
    expect(us.co2.deductible_t.toString()).toBe("0");
  });
  it("an organisation's own set without a pcc rule treats pcc as other", () => {
    const { pcc: _pcc, ...rules } = EU_MRR.deduction_rules;
    void _pcc;
    const own = { ...EU_MRR, id: "own-set", deduction_rules: { ...rules, other: { deducted: true, source: "our own rule for other transfers", status: "unconfirmed" as const } } };
    const input = plant({}, [co2Stream("pcc", "co2-export", "3000", "2", "pcc")]);
    const r = computeEmissions(withMethod(input, { factor_set: "own-set" }), new FactorSetRegistry([own]));
    const row = r.transfers.rows.find((x) => x.id === "pcc")!;
    expect(row).toMatchObject({ destination: "pcc", deducted: true, rule_source: "our own rule for other transfers" });
  });
  it("EU MRR counts no CH4 or N2O (EU ETS covers CO2 only for ammonia, from memory)", () => {
    const r = computeEmissions(withMethod(plant(), { factor_set: "eu-mrr" }));
    expect(r.emissions.ch4_t.isZero() && r.emissions.n2o_t.isZero()).toBe(true);
    expect(r.flags.map((f) => f.code)).toContain("non-co2-outside-scope");
  });
});

describe("GWP sets change CO2e and nothing else", () => {
  const run = (gwp: "AR4" | "AR5" | "AR6") => computeEmissions(withMethod(plant(), { gwp }));
  const [ar4, ar5, ar6] = [run("AR4"), run("AR5"), run("AR6")];
  it("CO2, CH4, N2O, transfers and uncertainty are identical across AR4/AR5/AR6", () => {
    for (const r of [ar5, ar6]) {
      expect(r.emissions.co2_t.eq(ar4.emissions.co2_t)).toBe(true);
      expect(r.emissions.ch4_t.eq(ar4.emissions.ch4_t)).toBe(true);
      expect(r.emissions.n2o_t.eq(ar4.emissions.n2o_t)).toBe(true);
      expect(r.emissions.transferred_co2_t.eq(ar4.emissions.transferred_co2_t)).toBe(true);
      expect(r.uncertainty.co2.u95_t.eq(ar4.uncertainty.co2.u95_t)).toBe(true);
    }
  });
  it("CO2e = 77 000 + 0.4 × GWP(CH4) + 0.04 × GWP(N2O) (AR4 Table 2.14 and AR5 Table 8.7 published; AR6 Table 7.15 from memory)", () => {
    expect(ar4.emissions.co2e_t.toString()).toBe("77021.92"); // 0.4 × 25 + 0.04 × 298 = 10 + 11.92
    expect(ar5.emissions.co2e_t.toString()).toBe("77021.8");  // 0.4 × 28 + 0.04 × 265 = 11.2 + 10.6
    expect(ar6.emissions.co2e_t.toString()).toBe("77022.84"); // 0.4 × 29.8 + 0.04 × 273 = 11.92 + 10.92 (from memory)
  });
});
