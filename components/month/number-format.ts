/**
 * Display-only rounding of engineering figures. Values stay Decimal (or decimal text) until
 * here; rounding happens once, for the eye, with thin-space thousands groups.
 */
import { Dec } from "@/lib/balance/decimal";

function group(intPart: string): string {
  return intPart.replace(/\B(?=(\d{3})+(?!\d))/g, "\u2009");
}

export function formatDecimal(value: Dec | string | null | undefined, places: number): string {
  if (value === null || value === undefined || value === "") return "—";
  const d = typeof value === "string" ? new Dec(value) : value;
  const text = d.toFixed(places);
  const negative = text.startsWith("-");
  const [i, f] = (negative ? text.slice(1) : text).split(".");
  const isZero = /^[0.]+$/.test(text.replace("-", ""));
  return `${negative && !isZero ? "\u2212" : ""}${group(i)}${f ? `.${f}` : ""}`;
}

/** A closure or deviation with its sign always shown (+0.42, −1.10). */
export function formatSigned(value: Dec | null | undefined, places: number): string {
  if (value === null || value === undefined) return "—";
  const body = formatDecimal(value, places);
  return value.gte(0) && !body.startsWith("\u2212") ? `+${body}` : body;
}
