import DecimalBase from "decimal.js";
import type { EmissionsResult } from "./result";

export const EMISSIONS_DOCUMENT_FORMAT = "synledger.emissions/1";

/** Significant digits written: far beyond any meter, short enough for a stable, readable file. */
const DIGITS = 12;

type Json = string | number | boolean | null | Json[] | { [k: string]: Json };

/** Decimal → plain string, never exponent notation, trailing zeros dropped. */
export function decimalString(d: DecimalBase): string {
  const s = d.toSignificantDigits(DIGITS).toFixed();
  return s === "-0" ? "0" : s;
}

function toJson(v: unknown): Json {
  if (v === null || v === undefined) return null;
  if (DecimalBase.isDecimal(v)) return decimalString(v as DecimalBase);
  if (typeof v === "string" || typeof v === "boolean") return v;
  if (typeof v === "number") return v; // only small integers (tier numbers) reach here
  if (Array.isArray(v)) return v.map(toJson);
  if (typeof v === "object") {
    const out: { [k: string]: Json } = {};
    for (const [k, x] of Object.entries(v as Record<string, unknown>)) {
      if (x === undefined) continue;
      out[k] = toJson(x);
    }
    return out;
  }
  return String(v);
}

/**
 * The result as stable JSON: snake_case keys (the result types already use them), every number a
 * string, keys in the order of the result type, so two runs of the same month give identical text.
 * The `emissions`, `intensity` and `flags` members match synledger.result/1 and can be merged in.
 */
export function toEmissionsDocument(result: EmissionsResult): { format: string } & { [k: string]: Json } {
  return { format: EMISSIONS_DOCUMENT_FORMAT, ...(toJson(result) as { [k: string]: Json }) };
}
