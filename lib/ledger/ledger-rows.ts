import "server-only";
/**
 * The monthly ledger's rows: every site's running month and the twelve before it, each with its
 * state, revision, ammonia, the three closures, CO2e, intensity, open flags and who acts next.
 * Read from the same year runs as the year page (frozen months from their snapshots).
 */
import type { Db } from "@/db/client";
import { listSites } from "@/db/queries/sites";
import type { Role } from "@/lib/auth/roles";
import { currentMonthKey, monthKeysBack, monthTiming } from "@/lib/period";
import { STATE_LABELS, type MonthState } from "@/lib/month-states";
import { mapLimited } from "@/lib/concurrency";
import { loadSiteSeries } from "./site-year";
import type { SeriesMonth } from "./series";

export interface LedgerRow {
  siteId: string;
  siteName: string;
  month: string;
  state: MonthState | null;
  stateLabel: string;
  timing: "ended" | "in-progress" | "future";
  revision: number | null;
  ammonia_t: string | null;
  closure: { carbon: string | null; nitrogen: string | null; hydrogen: string | null };
  tolerancePct: string;
  co2e_t: string | null;
  intensity: string | null;
  /** Warnings and errors the engine raised for the month. */
  flags: string[];
  next: { role: Role; todo: string } | null;
  frozen: boolean;
}

/** Who acts next on a month, in words: the same steps as the overview's "waiting for" list. */
export function nextStep(m: Pick<SeriesMonth, "state" | "timing" | "computes">): LedgerRow["next"] {
  if (m.timing === "in-progress") return { role: "process_engineer", todo: "enter figures as the days pass" };
  if (m.state === null) return m.timing === "ended" ? { role: "process_engineer", todo: "enter or import the figures" } : null;
  if (!m.computes) return { role: "process_engineer", todo: "complete the figures" };
  switch (m.state) {
    case "open":
      return { role: "process_engineer", todo: "close the balance" };
    case "balanced":
      return { role: "environmental_officer", todo: "send for sign-off" };
    case "in_review":
      return { role: "signatory", todo: "sign or return" };
    case "signed":
      return { role: "environmental_officer", todo: "record the submission" };
    default:
      return null;
  }
}

export async function ledgerRows(db: Db, organisationId: string, now = new Date()): Promise<{ rows: LedgerRow[]; months: string[] }> {
  const months = monthKeysBack(currentMonthKey(now), 13);
  const years = [...new Set(months.map((m) => m.slice(0, 4)))];
  const inWindow = new Set(months);
  const sites = await listSites(db, organisationId);
  // Four sites at a time: their queries overlap while leaving pooled connections for other
  // requests. Kept in memory by the site's data version: an unchanged site costs one small query
  // per year.
  const loaded = await mapLimited(sites, 4, (site) => Promise.all(years.map((year) => loadSiteSeries(db, organisationId, site.id, year, now, inWindow))));
  const rows: LedgerRow[] = [];
  for (const [i, site] of sites.entries()) {
    const byMonth = new Map<string, SeriesMonth>();
    let tolerance = "2";
    for (const series of loaded[i]) {
      if (!series) continue;
      tolerance = series.tolerance_pct;
      for (const m of series.months) byMonth.set(m.month, m);
    }
    // From the site's first month on (its first stored month, or the month it was set up): earlier
    // months were never the site's to fill, and listing them as "not started" would be noise.
    const firstStored = [...byMonth.values()].filter((m) => m.state !== null).map((m) => m.month).sort()[0];
    const setUp = `${site.createdAt.getUTCFullYear()}-${String(site.createdAt.getUTCMonth() + 1).padStart(2, "0")}`;
    const first = firstStored && firstStored < setUp ? firstStored : setUp;
    for (const month of months.filter((m) => m >= first)) {
      const m = byMonth.get(month);
      const timing = monthTiming(month, now).kind;
      const state = (m?.state ?? null) as MonthState | null;
      rows.push({
        siteId: site.id,
        siteName: site.name,
        month,
        state,
        stateLabel: state ? STATE_LABELS[state] : "Not started",
        timing,
        revision: m?.revision ?? null,
        ammonia_t: m?.ammonia_t ?? null,
        closure: m?.closure_pct ?? { carbon: null, nitrogen: null, hydrogen: null },
        tolerancePct: tolerance,
        co2e_t: m?.co2e_t ?? null,
        intensity: m?.co2e_t_per_t_nh3 ?? null,
        flags: (m?.flags ?? []).filter((f) => f.severity !== "info").map((f) => f.message),
        next: nextStep({ state: m?.state ?? null, timing, computes: m?.computes ?? false }),
        frozen: m?.frozen ?? false,
      });
    }
  }
  return { rows, months };
}
