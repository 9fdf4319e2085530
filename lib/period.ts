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

/** The calendar month now, "YYYY-MM", in UTC: the ledger's months are calendar months in UTC. */
export function currentMonthKey(now = new Date()): string {
  return `${now.getUTCFullYear()}-${String(now.getUTCMonth() + 1).padStart(2, "0")}`;
}

export function daysInMonth(month: string): number {
  const [y, m] = month.split("-").map(Number);
  return new Date(Date.UTC(y, m, 0)).getUTCDate();
}

/** "2026-12" → "2026-12-31". */
export const lastDayOf = (month: string): string => `${month}-${String(daysInMonth(month)).padStart(2, "0")}`;

/** "2026-12" → "2027-01-01": the day a month's figures are complete and it can be closed. */
export function dayAfter(month: string): string {
  const [y, m] = month.split("-").map(Number);
  const d = new Date(Date.UTC(y, m, 1));
  return d.toISOString().slice(0, 10);
}

/** "2026-12" → "2026-11". */
export function previousMonth(month: string): string {
  const [y, m] = month.split("-").map(Number);
  const d = new Date(Date.UTC(y, m - 2, 1));
  return `${d.getUTCFullYear()}-${String(d.getUTCMonth() + 1).padStart(2, "0")}`;
}

export type MonthTiming =
  /** Its last day has passed: complete, can be balanced and signed. */
  | { kind: "ended" }
  /** The running month: figures may come in as the days pass; `day` of `days` is today. */
  | { kind: "in-progress"; day: number; days: number; lastDay: string; closesOn: string }
  /** Has not begun: nothing can be entered before `opensOn`. */
  | { kind: "future"; opensOn: string };

/** Where a month stands against today (UTC). */
export function monthTiming(month: string, now = new Date()): MonthTiming {
  const current = currentMonthKey(now);
  if (month < current) return { kind: "ended" };
  if (month > current) return { kind: "future", opensOn: `${month}-01` };
  return { kind: "in-progress", day: now.getUTCDate(), days: daysInMonth(month), lastDay: lastDayOf(month), closesOn: dayAfter(month) };
}

export const hasEnded = (month: string, now = new Date()): boolean => month < currentMonthKey(now);

const DAY_LABEL = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });

/** "2026-12-31" → "31 December 2026" (UTC, a fixed locale: the same on every page and in every e-mail). */
export const dayLabel = (iso: string): string => DAY_LABEL.format(new Date(`${iso}T00:00:00Z`));

/** Every month key from `from` to `to` inclusive. */
export function monthsBetween(from: string, to: string): string[] {
  const out: string[] = [];
  let y = Number(from.slice(0, 4));
  let m = Number(from.slice(5, 7));
  const end = Number(to.slice(0, 4)) * 12 + Number(to.slice(5, 7));
  while (y * 12 + m <= end && out.length < 120) {
    out.push(`${y}-${String(m).padStart(2, "0")}`);
    m += 1;
    if (m > 12) {
      m = 1;
      y += 1;
    }
  }
  return out;
}

/** The calendar month before the current one: the one plants usually close. */
export const previousMonthKey = (now = new Date()): string => previousMonth(currentMonthKey(now));

/** The `count` month keys ending at `last`, newest first. */
export function monthKeysBack(last: string, count: number): string[] {
  const [y, m] = last.split("-").map(Number);
  return Array.from({ length: count }, (_, i) => {
    const d = new Date(Date.UTC(y, m - 1 - i, 1));
    return `${d.getUTCFullYear()}-${String(d.getUTCMonth() + 1).padStart(2, "0")}`;
  });
}
