import "server-only";
import { createHash } from "node:crypto";
import { and, asc, eq, inArray, isNull, like, max } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { gasAnalyses, months, readings, sites, statements, streams } from "../schema";
import { methodOf } from "./months";
import { findSite, listSites } from "./sites";
import { calculateMonth, type MonthCalculation } from "@/lib/ledger/calculate-month";
import { rollUpRuns, type MonthRun } from "@/lib/ledger/year";
import { buildSeries, type YearSeries } from "@/lib/ledger/series";

/**
 * Engine runs kept in memory, keyed by a hash of the exact document and tolerance the engine
 * reads: a saved figure, a changed stream setting or a new method gives a new key, so a stale
 * result can never be served, while a page that reads twelve unchanged months twice does not
 * compute them twice. Bounded so a long-running server does not grow without end.
 */
const CACHE_MAX = 600;
const g = globalThis as unknown as { __synledgerRunCache?: Map<string, MonthCalculation> };
const cache = (g.__synledgerRunCache ??= new Map());

function cachedCalculation(input: Parameters<typeof calculateMonth>[0], tolerance: string): MonthCalculation {
  const key = createHash("sha256").update(JSON.stringify([input, tolerance])).digest("hex");
  const hit = cache.get(key);
  if (hit) {
    // Re-insert so the Map's order approximates least-recently-used.
    cache.delete(key);
    cache.set(key, hit);
    return hit;
  }
  const calc = calculateMonth(input, tolerance);
  cache.set(key, calc);
  if (cache.size > CACHE_MAX) cache.delete(cache.keys().next().value!);
  return calc;
}

/** The latest year in which any active site of the organisation has a month, or null. */
export async function latestYearOfOrganisation(db: Db | Tx, organisationId: string): Promise<string | null> {
  const [row] = await db
    .select({ p: max(months.period) })
    .from(months)
    .innerJoin(sites, eq(sites.id, months.siteId))
    .where(and(eq(sites.organisationId, organisationId), isNull(sites.archivedAt)));
  return row?.p ? row.p.slice(0, 4) : null;
}

/** The latest year with a month at one site (already checked to be the caller's), or null. */
export async function latestYearOfSite(db: Db | Tx, siteId: string): Promise<string | null> {
  const [row] = await db.select({ p: max(months.period) }).from(months).where(eq(months.siteId, siteId));
  return row?.p ? row.p.slice(0, 4) : null;
}

/** Years in which the site has months, newest first. */
export async function yearsOfSite(db: Db | Tx, siteId: string): Promise<string[]> {
  const rows = await db.selectDistinct({ p: months.period }).from(months).where(eq(months.siteId, siteId));
  return [...new Set(rows.map((r) => r.p.slice(0, 4)))].sort().reverse();
}

export type SiteRow = NonNullable<Awaited<ReturnType<typeof findSite>>>;
export type StreamRow = typeof streams.$inferSelect;

export interface SiteYear {
  site: SiteRow;
  year: string;
  streams: StreamRow[];
  runs: MonthRun[];
}

/**
 * Every stored month of one site in one year, each through the engine: four queries for the
 * whole year rather than four per month. Null when the site is not the organisation's.
 */
export async function loadSiteYear(db: Db | Tx, organisationId: string, siteId: string, year: string): Promise<SiteYear | null> {
  const site = await findSite(db, organisationId, siteId);
  if (!site) return null;
  const [siteStreams, monthRows] = await Promise.all([
    db.select().from(streams).where(eq(streams.siteId, site.id)).orderBy(asc(streams.sortOrder), asc(streams.key)),
    db.select().from(months).where(and(eq(months.siteId, site.id), like(months.period, `${year}-%`))).orderBy(asc(months.period)),
  ]);
  const ids = monthRows.map((m) => m.id);
  const [allReadings, allAnalyses] = ids.length
    ? await Promise.all([
        db.select().from(readings).where(inArray(readings.monthId, ids)),
        db.select().from(gasAnalyses).where(inArray(gasAnalyses.monthId, ids)).orderBy(asc(gasAnalyses.key)),
      ])
    : [[], []];
  const active = new Set(siteStreams.filter((s) => s.archivedAt === null).map((s) => s.id));

  const runs: MonthRun[] = monthRows.map((m) => {
    const monthReadings = allReadings.filter((r) => r.monthId === m.id);
    const input = {
      siteName: site.name,
      period: m.period,
      method: methodOf({ site, month: m }),
      streams: siteStreams,
      readings: monthReadings.map((r) => ({ streamId: r.streamId, quantity: r.quantity, unit: r.unit, note: r.note })),
      analyses: allAnalyses.filter((a) => a.monthId === m.id).map((a) => ({ key: a.key, components: a.components, note: a.note })),
    };
    const calc = cachedCalculation(input, site.closureTolerancePct);
    return {
      id: m.id,
      period: m.period,
      state: m.state,
      revision: m.revision,
      version: m.version,
      document: calc.document,
      result: calc.ok ? calc.result : null,
      issues: calc.ok ? [] : calc.issues,
      readings: { present: monthReadings.filter((r) => active.has(r.streamId)).length, expected: active.size },
    };
  });
  return { site, year, streams: siteStreams, runs };
}

/** The series of a loaded year (see lib/ledger/series.ts). */
export function seriesOf(y: SiteYear): YearSeries {
  return buildSeries({
    site: y.site,
    year: y.year,
    runs: y.runs,
    streams: y.streams.map((s) => ({ key: s.key, name: s.name, meterTag: s.meterTag })),
    rollUp: rollUpRuns(y.runs),
  });
}

/** The organisation's active sites and the year the overview shows (the latest with months). */
export async function overviewScope(db: Db | Tx, organisationId: string) {
  const [siteList, year] = await Promise.all([listSites(db, organisationId), latestYearOfOrganisation(db, organisationId)]);
  return { sites: siteList, year };
}

/** When a monthly statement of the year was last signed, or null: an annual statement older than that is out of date. */
export async function lastMonthlySigning(db: Db | Tx, siteId: string, year: string): Promise<Date | null> {
  const [row] = await db
    .select({ at: max(statements.signedAt) })
    .from(statements)
    .where(and(eq(statements.siteId, siteId), eq(statements.kind, "monthly"), like(statements.period, `${year}-%`)));
  return row?.at ?? null;
}

/** Locks the year's month rows so none changes state while the annual statement is signed. */
export async function lockMonthsOfYear(tx: Tx, siteId: string, year: string): Promise<void> {
  await tx.select({ id: months.id }).from(months).where(and(eq(months.siteId, siteId), like(months.period, `${year}-%`))).for("update");
}
