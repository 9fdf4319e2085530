/**
 * Dates in import files. The mapping names the one format a file uses: "03/04/2026" is the 3rd
 * of April in DD/MM/YYYY and the 4th of March in MM/DD/YYYY, so the format is never guessed.
 * Month formats (YYYY-MM, MM/YYYY) mark a file of monthly totals; day formats one of daily values.
 */
export const DATE_FORMATS = ["YYYY-MM-DD", "DD/MM/YYYY", "DD.MM.YYYY", "MM/DD/YYYY", "YYYY-MM", "MM/YYYY"] as const;
export type DateFormat = (typeof DATE_FORMATS)[number];

export const MONTH_FORMATS: readonly DateFormat[] = ["YYYY-MM", "MM/YYYY"];

export function isMonthFormat(format: DateFormat): boolean {
  return MONTH_FORMATS.includes(format);
}

const PATTERNS: Record<DateFormat, { re: RegExp; order: ("y" | "m" | "d")[] }> = {
  // A time after an ISO date (plant historians often write "2026-03-01T00:00" or "2026-03-01 06:00")
  // is allowed and ignored: the value is the day's total whichever hour the system stamps it with.
  "YYYY-MM-DD": { re: /^(\d{4})-(\d{2})-(\d{2})(?:[T ]\d{2}:\d{2}(?::\d{2})?)?$/, order: ["y", "m", "d"] },
  "DD/MM/YYYY": { re: /^(\d{1,2})\/(\d{1,2})\/(\d{4})$/, order: ["d", "m", "y"] },
  "DD.MM.YYYY": { re: /^(\d{1,2})\.(\d{1,2})\.(\d{4})$/, order: ["d", "m", "y"] },
  "MM/DD/YYYY": { re: /^(\d{1,2})\/(\d{1,2})\/(\d{4})$/, order: ["m", "d", "y"] },
  "YYYY-MM": { re: /^(\d{4})-(\d{2})$/, order: ["y", "m"] },
  "MM/YYYY": { re: /^(\d{1,2})\/(\d{4})$/, order: ["m", "y"] },
};

export type DateResult = { ok: true; day: string | null; month: string } | { ok: false; reason: string };

export function daysInMonth(month: string): number {
  const [y, m] = month.split("-").map(Number);
  return new Date(Date.UTC(y, m, 0)).getUTCDate();
}

export function parseDate(text: string, format: DateFormat): DateResult {
  const t = text.trim();
  if (!t) return { ok: false, reason: "the date is empty" };
  const p = PATTERNS[format];
  const match = p.re.exec(t);
  if (!match) return { ok: false, reason: `"${t}" is not a date in ${format}` };
  const parts: Record<string, number> = {};
  p.order.forEach((k, i) => (parts[k] = Number(match[i + 1])));
  const { y, m } = parts;
  if (y < 2000 || y > 2100) return { ok: false, reason: `"${t}": year ${y} is outside 2000–2100` };
  if (m < 1 || m > 12) return { ok: false, reason: `"${t}" has no month ${m} (read as ${format})` };
  const month = `${y}-${String(m).padStart(2, "0")}`;
  if (parts.d === undefined) return { ok: true, day: null, month };
  const d = parts.d;
  if (d < 1 || d > daysInMonth(month)) return { ok: false, reason: `"${t}": ${month} has no day ${d} (read as ${format})` };
  return { ok: true, day: `${month}-${String(d).padStart(2, "0")}`, month };
}
