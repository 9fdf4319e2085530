// 40 CFR 98 Subpart G literally (issue 15): feedstock CO2 by Eq G-1 with the rule's standard
// conditions, checked against a hand calculation from the rule's text in binary floating point.
//   40 CFR 98.73(b)(1) Eq G-1: CO2 = Σ_n 44/12 × Fdstk_n × CC_n × MW / MVC × 0.001,
//   Fdstk in scf, MVC = 849.5 scf per kg-mole at standard conditions (98.73(b), read);
//   standard conditions 68 °F (Subpart P's definition, § 98.163, read) and 14.7 psia (§ 98.6, unconfirmed).
// The file's volume is metered at 60 °F and 14.696 psia: restated by the ideal-gas law with the
// gas's own compressibility at both temperatures, V68 = V60 × (T68/T60) × (p60/p68) × (Z68/Z60).
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { calculate } from "../../../lib/balance/calculate";
import { compressibility } from "../../../lib/balance/gas-properties";
import { parsePlantMonthText } from "../../../lib/balance/schema";
import { toResultDocument } from "../../../lib/balance/result";

const parsed = parsePlantMonthText(readFileSync("examples/dunmoor-2026-07.json", "utf8"));
if (!parsed.ok) throw new Error("example does not parse");
const result = calculate(parsed.doc);
const feed = parsed.doc.streams.find((s) => s.id === "feed")!;
const gas = result.analyses[feed.analysis!];

describe("Eq G-1 on the demo's US month (examples/dunmoor-2026-07.json)", () => {
  // Hand calculation, floats: the rule's text and the month's own analysis (molar mass, carbon content).
  const rankine = (f: number) => f + 459.67;
  const z60 = Number(compressibility(gas.gas, "60F").toString());
  const z68 = Number(compressibility(gas.gas, "68F").toString());
  const v60 = Number(feed.quantity.toString()) * 1e6; // MMscf → scf at 60 °F, 14.696 psia
  const v68 = v60 * (rankine(68) / rankine(60)) * (14.696 / 14.7) * (z68 / z60);
  const cc = Number(gas.carbon_mass_fraction.toString());
  const mw = Number(gas.molar_mass.toString());
  const hand = (44 / 12) * v68 * cc * mw / 849.5 * 0.001;
  const row = result.emissions.detail.by_stream.find((r) => r.id === "feed")!;

  it("the feed's CO2 equals the hand calculation to 0.01 %", () => {
    const engine = Number(row.co2_t.toString());
    expect(Math.abs(engine / hand - 1)).toBeLessThan(1e-4);
  });

  it("the result says which equation produced the figure and that the volume was restated", () => {
    expect(row.basis).toMatch(/^40 CFR 98\.73\(b\)\(1\) Eq G-1: 44\/12 × [\d.]+ scf \(MMscf restated to 68 °F, 14\.7 psia\)/);
    const doc = toResultDocument(result);
    expect(doc.emissions_by_stream.find((r) => r.id === "feed")!.basis).toContain("Eq G-1");
  });

  it("restating matters: carbon in kmol × 44/12 through the 60 °F real-gas volume is about 0.2 % higher than Eq G-1", () => {
    const kmolWay = Number(result.streams.find((s) => s.id === "feed")!.carbon_t!.toString()) * 44 / 12;
    const excess = kmolWay / hand - 1;
    expect(excess).toBeGreaterThan(0.001);
    expect(excess).toBeLessThan(0.004);
  });
});

describe("GWP values by reporting year under 40 CFR 98 (Table A-1's history)", () => {
  const withMonth = (month: string, gwp: "AR4" | "AR5") => calculate({ ...parsed.doc, month, method: { ...parsed.doc.method, gwp } });
  it("an AR5 month of reporting year 2024 is flagged: Table A-1 before the 2024 amendment carries AR4 values", () => {
    const flags = withMonth("2024-07", "AR5").flags.filter((f) => f.code === "gwp-not-the-rules-for-year");
    expect(flags).toHaveLength(1);
    expect(flags[0].message).toContain("Reporting year 2024 under us-40cfr98 uses AR4 values");
  });
  it("AR4 in 2024 and AR5 in 2026 are the rule's own: no flag", () => {
    expect(withMonth("2024-07", "AR4").flags.some((f) => f.code === "gwp-not-the-rules-for-year")).toBe(false);
    expect(result.flags.some((f) => f.code === "gwp-not-the-rules-for-year")).toBe(false);
  });
});
