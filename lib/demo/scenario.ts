// Demo scenario: twelve months of 2026 for each site of the invented Vellmar Nitrogen Co.,
// as plant-month documents (typed, Decimal) and as JSON text with numbers as strings.
import type { PlantMonth } from "../balance/schema";
import { buildPlantMonth } from "./build-month";
import { type SiteKey, demoSite } from "./sites";

export { demoOrganisation, demoSite } from "./sites";
export type { DemoOrganisation, DemoSite, DemoStream, SiteKey } from "./sites";

export const DEMO_YEAR = 2026;
const DAYS_2026 = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
const monthId = (m: number) => `${DEMO_YEAR}-${String(m + 1).padStart(2, "0")}`;

export function demoPlantMonths(siteKey: SiteKey, variant?: string): PlantMonth[] {
  const site = demoSite(siteKey);
  return DAYS_2026.map((days, m) => buildPlantMonth(site, { days, month: monthId(m), ...(variant ? { variant } : {}) }));
}

export interface DemoSeedMonth {
  doc: PlantMonth;
  /** The last day the figures cover (the running month: yesterday), or null for a whole month. */
  coveredThrough: string | null;
}

const daysOf = (month: string) => new Date(Date.UTC(Number(month.slice(0, 4)), Number(month.slice(5, 7)), 0)).getUTCDate();

/**
 * The months the demo seed stores, as on the day it runs: every complete month from January
 * 2026 to the month before `now`, and the running month with only the days that have passed
 * (none on its first day). Deterministic for a given day.
 */
export function demoSeedMonths(siteKey: SiteKey, now = new Date()): DemoSeedMonth[] {
  const site = demoSite(siteKey);
  const current = `${now.getUTCFullYear()}-${String(now.getUTCMonth() + 1).padStart(2, "0")}`;
  const out: DemoSeedMonth[] = [];
  for (let i = 0; i < 60; i++) {
    const d = new Date(Date.UTC(DEMO_YEAR, i, 1));
    const month = `${d.getUTCFullYear()}-${String(d.getUTCMonth() + 1).padStart(2, "0")}`;
    if (month > current) break;
    if (month < current) {
      out.push({ doc: buildPlantMonth(site, { days: daysOf(month), month }), coveredThrough: null });
      continue;
    }
    const elapsed = now.getUTCDate() - 1;
    if (elapsed > 0) out.push({ doc: buildPlantMonth(site, { days: elapsed, month, variant: "running" }), coveredThrough: `${month}-${String(elapsed).padStart(2, "0")}` });
  }
  return out;
}

/** Twelve whole months of any calendar year for a site, for tests that need a year that has ended. */
export function demoYearMonths(siteKey: SiteKey, year: number): PlantMonth[] {
  const site = demoSite(siteKey);
  return Array.from({ length: 12 }, (_, m) => {
    const month = `${year}-${String(m + 1).padStart(2, "0")}`;
    return buildPlantMonth(site, { days: daysOf(month), month, variant: `year-${year}` });
  });
}

/** One document per day of 2026 (dated with its month), for the benchmark. */
export function demoPlantDays(siteKey: SiteKey): PlantMonth[] {
  const site = demoSite(siteKey);
  return DAYS_2026.flatMap((days, m) =>
    Array.from({ length: days }, (_, d) => buildPlantMonth(site, { days: 1, month: monthId(m), variant: `day-${d + 1}`, drift: false })),
  );
}

/** The plant-month as JSON text in the file format (numbers written as strings, exact). */
export function plantMonthJson(doc: PlantMonth): string {
  return JSON.stringify(doc, (_k, v) => (v !== null && typeof v === "object" && "toFixed" in v && "d" in v ? v.toFixed() : v), 2) + "\n";
}
