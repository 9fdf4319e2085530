// One Decimal constructor for the whole engine. 34 significant digits (the digits of IEEE 754
// decimal128) keep every intermediate (molar volumes, projections, chi-square series) far below
// any meter resolution: figures are published with 15 significant digits, and the golden test
// (tests/unit/engine/golden.test.ts) shows every published digit of the demo months, the
// benchmark's variants and the examples identical to the figures computed at 50 digits before
// (issue 16). Fewer digits make each product and quotient cheaper; 28 would move some 15th digits.
import DecimalBase from "decimal.js";

export const Dec = DecimalBase.clone({ precision: 34, rounding: DecimalBase.ROUND_HALF_EVEN });
export type Dec = DecimalBase;

/**
 * Stored figures added up outside the engine (a month's total of daily readings on import) keep
 * 50 digits: a total is a record, not an intermediate, and must not depend on the engine's
 * working precision.
 */
export const RecordDec = DecimalBase.clone({ precision: 50, rounding: DecimalBase.ROUND_HALF_EVEN });

/** Reads a decimal literal (string), a safe integer or a Decimal; refuses a JS float so none sneaks in. */
export function dec(value: string | number | Dec | bigint): Dec {
  if (typeof value === "bigint") return new Dec(value.toString());
  if (typeof value === "number" && !Number.isSafeInteger(value)) throw new Error(`dec(${value}): pass non-integers as strings`);
  return new Dec(value as string);
}

export const ZERO = new Dec(0);
export const ONE = new Dec(1);
export const HUNDRED = new Dec(100);

export function sum(values: Iterable<Dec>): Dec {
  let s = ZERO;
  for (const v of values) s = s.plus(v);
  return s;
}

/** Plain decimal text without exponent, trimmed to `places` decimals (for reports and JSON). */
export function fmt(value: Dec | null | undefined, places?: number): string | null {
  if (value === null || value === undefined) return null;
  const v = places === undefined ? value.toSignificantDigits(20) : value.toDecimalPlaces(places);
  const text = places === undefined ? v.toFixed() : v.toFixed(places);
  return text === "-0" ? "0" : text.replace(/^-0(\.0+)?$/, (m) => m.slice(1));
}

/** Decimal → JSON string: 15 significant digits, no exponent; rounding dust below 1e-25 prints as 0. */
export function num(x: Dec | null | undefined): string | null {
  if (x === null || x === undefined) return null;
  if (x.abs().lt("1e-25")) return "0";
  return x.toSignificantDigits(15).toFixed();
}


// One fast square root for both engine halves (lib/emissions/decimal.ts).
export { sqrtOf } from "../emissions/decimal";
