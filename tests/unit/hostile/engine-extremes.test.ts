/**
 * Documents that parse but carry extreme figures (a quantity of 1e29, an uncertainty of 1e-29 %,
 * a component at 100 %) must either calculate or be refused with CalculationInputError and a
 * path, which the API turns into a 400. Any other throw would be a 500 for a client's typo.
 */
import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { calculate, CalculationInputError } from "@/lib/balance/calculate";
import { toResultDocument } from "@/lib/balance/result";
import { parsePlantMonthText } from "@/lib/balance/schema";

const BASE = JSON.parse(readFileSync("examples/estuary-2026-03.json", "utf8")) as { streams: Record<string, unknown>[] };
const EXTREMES = ["0", "1e29", "1e-29", "9007199254740992", "0.000000001", "100", "99.999999999999999999", "123456789012345678901234567890"];
const FIELDS = ["quantity", "uncertainty_pct", "factor_t_per_MWh", "factor_t_per_GJ"];

function outcome(text: string): "calculated" | "refused" {
  const parsed = parsePlantMonthText(text);
  if (!parsed.ok) return "refused";
  try {
    toResultDocument(calculate(parsed.doc));
    return "calculated";
  } catch (e) {
    expect(e).toBeInstanceOf(CalculationInputError);
    expect((e as CalculationInputError).path.length).toBeGreaterThan(0);
    return "refused";
  }
}

describe("the engine under extreme but well-formed figures", () => {
  it("one quantity far out of scale is refused with a reason, not a crash", () => {
    const doc = structuredClone(BASE);
    doc.streams[0].quantity = "1e29";
    expect(outcome(JSON.stringify(doc))).toBe("refused");
  });

  it("any stream, any numeric field, any extreme value: calculated or refused with a path", () => {
    fc.assert(
      fc.property(fc.nat(BASE.streams.length - 1), fc.constantFrom(...FIELDS), fc.constantFrom(...EXTREMES), fc.constantFrom(...EXTREMES), (i, field, v, w) => {
        const doc = structuredClone(BASE);
        doc.streams[i][field] = v;
        doc.streams[(i + 1) % doc.streams.length].quantity = w;
        expect(["calculated", "refused"]).toContain(outcome(JSON.stringify(doc)));
      }),
      { numRuns: 120 },
    );
  });
});
