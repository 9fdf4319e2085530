/**
 * What a frozen month keeps, as text with a digest: the plant-month document and the result
 * document in canonical JSON (RFC 8785, JSON Canonicalization Scheme: keys sorted, no
 * whitespace), so the same document always gives the same bytes and the same SHA-256; and the
 * engine's full calculation with every Decimal kept as its exact digits, so the pages of a frozen
 * month show what was frozen without computing anything again. Pure: no database, no framework.
 */
import { createHash } from "node:crypto";
import canonicalize from "canonicalize";
import type { CalculationResult } from "@/lib/balance/calculate";
import { Dec } from "@/lib/balance/decimal";

export function canonicalJson(value: unknown): string {
  const text = canonicalize(value);
  if (text === undefined) throw new Error("nothing to canonicalise");
  return text;
}

export const sha256Of = (text: string): string => createHash("sha256").update(text, "utf8").digest("hex");

const DEC_TAG = "$dec";

/** The calculation as JSON; each Decimal becomes {"$dec": "<exact digits>"}. */
export function freezeCalculation(result: CalculationResult): string {
  return JSON.stringify(result, function (this: Record<string, unknown>, key: string) {
    // The replacer's value argument has already been through Decimal's toJSON; read the original.
    const original = this[key];
    return Dec.isDecimal(original) ? { [DEC_TAG]: (original as Dec).toString() } : (original as unknown);
  });
}

/** The calculation back, every tagged number a Decimal again with the same digits. */
export function thawCalculation(text: string): CalculationResult {
  return JSON.parse(text, (_key, value: unknown) => {
    if (value !== null && typeof value === "object" && !Array.isArray(value)) {
      const keys = Object.keys(value);
      if (keys.length === 1 && keys[0] === DEC_TAG) return new Dec((value as Record<string, string>)[DEC_TAG]);
    }
    return value;
  }) as CalculationResult;
}
