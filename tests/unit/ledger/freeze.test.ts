/**
 * What a frozen month keeps (lib/ledger/freeze.ts). Canonical JSON is checked against the
 * examples of RFC 8785 (JSON Canonicalization Scheme) section 3.2.3 (key order by UTF-16 code
 * units) and 3.2.2 (no whitespace); the digest against the SHA-256 of the empty string given in
 * FIPS 180-4's test vectors (e3b0c442…b855).
 */
import { readFileSync } from "node:fs";
import Decimal from "decimal.js";
import { describe, expect, it } from "vitest";
import { calculate } from "@/lib/balance/calculate";
import { toResultDocument } from "@/lib/balance/result";
import { parsePlantMonthText } from "@/lib/balance/schema";
import { canonicalJson, freezeCalculation, sha256Of, thawCalculation } from "@/lib/ledger/freeze";

describe("canonical JSON", () => {
  it("sorts keys by UTF-16 code units and writes no whitespace (RFC 8785 3.2.3)", () => {
    expect(canonicalJson({ b: 1, a: { d: [1, 2], c: "x" } })).toBe('{"a":{"c":"x","d":[1,2]},"b":1}');
    // RFC 8785 3.2.3's sorting example: "\u20ac" (Euro) sorts after "\r" and before "\ud83d\ude00".
    expect(canonicalJson({ "\u20ac": 1, "\r": 2, "\ud83d\ude00": 3 })).toBe('{"\\r":2,"€":1,"😀":3}');
  });

  it("gives the same text whatever the order the object was built in", () => {
    expect(canonicalJson({ x: 1, y: [{ q: 1, p: 2 }] })).toBe(canonicalJson({ y: [{ p: 2, q: 1 }], x: 1 }));
  });

  it("digests with SHA-256 (FIPS 180-4 test vector for the empty message)", () => {
    expect(sha256Of("")).toBe("e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
  });
});

describe("frozen calculation", () => {
  const parsed = parsePlantMonthText(readFileSync("examples/estuary-2026-03.json", "utf8"));
  if (!parsed.ok) throw new Error("example does not parse");
  const result = calculate(parsed.doc);

  it("thaws to the same calculation, every Decimal with the same digits", () => {
    const frozen = freezeCalculation(result);
    const thawed = thawCalculation(frozen);
    // The engine uses two Decimal clones of the same precision, so the thawed values are compared by their digits.
    expect(freezeCalculation(thawed)).toBe(frozen);
    expect(frozen).toContain('"$dec"');
    expect(Decimal.isDecimal(thawed.emissions.detail.emissions.co2e_t)).toBe(true);
    expect(thawed.emissions.detail.emissions.co2e_t.toFixed()).toBe(result.emissions.detail.emissions.co2e_t.toFixed());
  });

  it("the result document of the thawed calculation is the original's, byte for byte in canonical form", () => {
    const thawed = thawCalculation(freezeCalculation(result));
    expect(canonicalJson(toResultDocument(thawed))).toBe(canonicalJson(toResultDocument(result)));
  });
});
