import "server-only";
/**
 * A site's months over any period (which may span calendar years): each year's months loaded as the
 * year page loads them (lib/ledger/site-year), only the months asked for, and only those that
 * have ended. What the embedded-emissions communication reads.
 */
import type { Db, Tx } from "@/db/client";
import type { SiteRow } from "@/db/queries/overview";
import { loadSiteYear } from "./site-year";
import { endedRuns, type MonthRun } from "./year";

export async function loadSiteRuns(db: Db | Tx, organisationId: string, siteId: string, months: readonly string[], now = new Date()): Promise<{ site: SiteRow; runs: MonthRun[] } | null> {
  const years = [...new Set(months.map((m) => m.slice(0, 4)))];
  const wanted = new Set(months);
  let site: SiteRow | null = null;
  const runs: MonthRun[] = [];
  for (const year of years) {
    const y = await loadSiteYear(db, organisationId, siteId, year, wanted);
    if (!y) return null;
    site = y.site;
    runs.push(...endedRuns(y.runs, now));
  }
  return site ? { site, runs } : null;
}
