/**
 * The ledger's calendar vocabulary, in one place: a month key is "YYYY-MM", a year key "YYYY",
 * both within the years the ledger accepts. Values from a URL or a body are checked here by
 * fixed patterns only; nothing a caller sends is ever made into a pattern.
 */
export const FIRST_YEAR = 2000;
export const LAST_YEAR = 2100;

const MONTH_SHAPE = /^(\d{4})-(0[1-9]|1[0-2])$/;
const YEAR_SHAPE = /^\d{4}$/;

const inRange = (year: string) => Number(year) >= FIRST_YEAR && Number(year) <= LAST_YEAR;

/** "2026-03": four-digit year within FIRST_YEAR..LAST_YEAR and a month 01..12. */
export function isMonthKey(value: unknown): value is string {
  if (typeof value !== "string") return false;
  const m = MONTH_SHAPE.exec(value);
  return m !== null && inRange(m[1]);
}

/** "2026": four digits within FIRST_YEAR..LAST_YEAR. */
export function isYearKey(value: unknown): value is string {
  return typeof value === "string" && YEAR_SHAPE.test(value) && inRange(value);
}

/** The year of a month key ("2026-03" → "2026"). */
export const yearOfMonth = (month: string): string => month.slice(0, 4);

/** True when the month key lies in the given year key; both are checked first. */
export function isMonthOfYear(month: unknown, year: unknown): boolean {
  return isMonthKey(month) && isYearKey(year) && yearOfMonth(month) === year;
}
