// One Decimal constructor for the whole engine. 50 significant digits keeps every
// intermediate (molar volumes, projections, chi-square series) far below any meter
// resolution, so rounding never shows in a closure or a reconciled flow.
import DecimalBase from "decimal.js";

export const Dec = DecimalBase.clone({ precision: 50, rounding: DecimalBase.ROUND_HALF_EVEN });
export type Dec = DecimalBase;

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
