/**
 * Display formatting of engine figures for statements and review screens. Input is the decimal
 * text of the result document; rounding happens here, once, with decimal.js, so a figure never
 * passes through a binary float on its way to the page.
 */
import Decimal from "decimal.js";

const D = Decimal.clone({ precision: 40, rounding: Decimal.ROUND_HALF_UP });

/** A true minus sign: a hyphen reads as a dash in tables. */
const MINUS = "\u2212";
export const DASH = "—";

function group(intPart: string): string {
  return intPart.replace(/\B(?=(\d{3})+(?!\d))/g, " ");
}

/** "74414.7569" with 1 place → "74 414.8"; null → "—". Negative values get a real minus. */
export function fixed(value: string | null | undefined, places: number): string {
  if (value === null || value === undefined || value === "") return DASH;
  const d = new D(value).toDecimalPlaces(places);
  const [i, f] = d.abs().toFixed(places).split(".");
  const sign = d.isNegative() && !d.isZero() ? MINUS : "";
  return `${sign}${group(i)}${f ? `.${f}` : ""}`;
}

/** A signed figure (closures): "+0.09" or "−0.25". */
export function signed(value: string | null | undefined, places: number): string {
  if (value === null || value === undefined) return DASH;
  const d = new D(value).toDecimalPlaces(places);
  return d.isPositive() && !d.isZero() ? `+${fixed(value, places)}` : fixed(value, places);
}

/** An input quantity exactly as entered, only grouped: the meter reading is not rounded. */
export function exact(value: string | null | undefined): string {
  if (value === null || value === undefined) return DASH;
  const d = new D(value);
  const [i, f] = d.abs().toFixed().split(".");
  return `${d.isNegative() ? MINUS : ""}${group(i)}${f ? `.${f}` : ""}`;
}

/** Small masses (CH4, N2O) keep three significant digits so they do not print as 0.0. */
export function small(value: string | null | undefined): string {
  if (value === null || value === undefined) return DASH;
  const d = new D(value);
  if (d.isZero()) return "0";
  if (d.abs().gte(100)) return fixed(value, 1);
  return exact(d.toSignificantDigits(3).toFixed());
}

/** Percentage difference a/b − 1, for "above the benchmark by 3.2 %". */
export function percentOver(value: string, reference: string): string {
  const ref = new D(reference);
  if (ref.isZero()) return DASH;
  return fixed(new D(value).div(ref).minus(1).times(100).abs().toFixed(), 1);
}

/** Exact product of two decimal texts (unit conversions for display; rounded only by `fixed`). */
export function times(a: string, b: string): string {
  return new D(a).times(new D(b)).toFixed();
}

/** MJ/kg → Btu/lb: 1 Btu(IT)/lb is 2.326 kJ/kg exactly (definition of the International Table Btu). */
export function btuPerLb(mjPerKg: string): string {
  return new D(mjPerKg).times(1000).div("2.326").toFixed();
}

export function minus(a: string, b: string): string {
  return new D(a).minus(new D(b)).toFixed();
}

/** a / b × 100 as decimal text; null when b is zero or either is missing. */
export function ratioPct(a: string | null, b: string | null): string | null {
  if (a === null || b === null || new D(b).isZero()) return null;
  return new D(a).div(new D(b)).times(100).toFixed();
}

export function compare(a: string, b: string): number {
  return new D(a).cmp(new D(b));
}

export function absWithin(value: string, limit: string): boolean {
  return new D(value).abs().lte(new D(limit));
}

/** "2026-03-12T09:04:11Z" → "2026-03-12 09:04 UTC": the same on screen, in the PDF and in mail. */
export function utcStamp(d: Date): string {
  return `${d.toISOString().slice(0, 10)} ${d.toISOString().slice(11, 16)} UTC`;
}

const MONTHS = ["January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December"];

export function monthLabel(period: string): string {
  const [y, m] = period.split("-").map(Number);
  return `${MONTHS[m - 1]} ${y}`;
}

/*
 * Dates are formatted on the server in UTC with a fixed locale so the page, its print and the
 * audit trail read the same wherever the reader sits.
 */
const dateFmt = new Intl.DateTimeFormat("en-GB", { day: "2-digit", month: "short", year: "numeric", timeZone: "UTC" });
const timeFmt = new Intl.DateTimeFormat("en-GB", { hour: "2-digit", minute: "2-digit", hour12: false, timeZone: "UTC" });

/** "12 Mar 2026". */
export function formatDate(d: Date): string {
  return dateFmt.format(d);
}

/** "12 Mar 2026 09:04 UTC". */
export function formatDateTime(d: Date): string {
  return `${dateFmt.format(d)} ${timeFmt.format(d)} UTC`;
}
