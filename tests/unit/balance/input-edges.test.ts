// Edges of the plant-month input the audit found (issue 16): a byte-order mark, a character that
// prints as nothing, a quantity orders of magnitude off, less feed than the chemistry allows.
import { describe, expect, it } from "vitest";
import { calculate, CalculationInputError } from "../../../lib/balance/calculate";
import { parsePlantMonth, parsePlantMonthText } from "../../../lib/balance/schema";
import { demoPlantMonths, plantMonthJson } from "../../../lib/demo/scenario";

const march = plantMonthJson(demoPlantMonths("estuary").find((d) => d.month === "2026-03")!);

describe("reading the file", () => {
  it("a UTF-8 byte-order mark before the document is ignored (RFC 8259 §8.1 allows it)", () => {
    const r = parsePlantMonthText(`\uFEFF${march}`);
    expect(r.ok).toBe(true);
  });
  it("a character that prints as nothing is named by its code point, not shown as an invisible quote", () => {
    const r = parsePlantMonthText(march.replace('"streams"', '\u200B"streams"'));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0].reason).toContain("U+200B");
  });
  it("a duplicated key is refused with its path, not silently overwritten", () => {
    const r = parsePlantMonthText(march.replace('"format": "synledger.plant-month/1",', '"format": "synledger.plant-month/1", "format": "synledger.plant-month/1",'));
    expect(r.ok).toBe(false);
  });
});

describe("figures", () => {
  const json = JSON.parse(march);
  it("a quantity of 1e30 that leaves the balances unsolvable names that stream's quantity", () => {
    const doc = structuredClone(json);
    doc.streams[0].quantity = "1e30";
    const parsed = parsePlantMonth(doc);
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
    let err: unknown;
    try {
      calculate(parsed.doc);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(CalculationInputError);
    expect((err as CalculationInputError).path).toBe("streams[0].quantity");
    expect((err as CalculationInputError).message).toContain(doc.streams[0].id);
  });
  it("feed below the theoretical minimum (efficiency above 100 %) is flagged; the demo month is not (common practice, no source)", () => {
    const ok = parsePlantMonth(json);
    if (!ok.ok) throw new Error("demo month did not parse");
    expect(calculate(ok.doc).flags.map((f) => f.code)).not.toContain("feed-below-theoretical-minimum");
    const lean = structuredClone(json);
    const feed = lean.streams.find((s: { kind: string }) => s.kind === "feed-gas");
    feed.quantity = String(Number(feed.quantity) * 0.5);
    const r = parsePlantMonth(lean);
    if (!r.ok) throw new Error(JSON.stringify(r.issues));
    const res = calculate(r.doc, { reconcile: false });
    expect(res.feed.feed_efficiency_pct!.gt(100)).toBe(true);
    expect(res.flags.find((f) => f.code === "feed-below-theoretical-minimum")?.severity).toBe("warning");
  });
});
