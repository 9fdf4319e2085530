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
