import { and, asc, eq, inArray, isNull, like, max } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { gasAnalyses, months, readings, sites, statements, streams } from "../schema";
import { findSite, listSites } from "./sites";
import { latestSnapshotsOf } from "./snapshots";

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

/**
 * Every stored row of one site's year in five queries (the engine runs are lib/ledger's): the
 * site, its streams, the months, their readings and analyses, and the snapshots of the months
 * that are frozen. Null when the site is not the organisation's.
 */
export async function loadSiteYearRows(db: Db | Tx, organisationId: string, siteId: string, year: string) {
  const site = await findSite(db, organisationId, siteId);
  if (!site) return null;
  const [siteStreams, monthRows] = await Promise.all([
    db.select().from(streams).where(eq(streams.siteId, site.id)).orderBy(asc(streams.sortOrder), asc(streams.key)),
    db.select().from(months).where(and(eq(months.siteId, site.id), like(months.period, `${year}-%`))).orderBy(asc(months.period)),
  ]);
  const ids = monthRows.map((m) => m.id);
  const frozen = monthRows.filter((m) => m.state === "in_review" || m.state === "signed" || m.state === "submitted");
  const [allReadings, allAnalyses, snapshots] = ids.length
    ? await Promise.all([
        db.select().from(readings).where(inArray(readings.monthId, ids)),
        db.select().from(gasAnalyses).where(inArray(gasAnalyses.monthId, ids)).orderBy(asc(gasAnalyses.key)),
        latestSnapshotsOf(db, frozen.map((m) => ({ monthId: m.id, revision: m.revision }))),
      ])
    : [[], [], new Map()];
  return { site, year, streams: siteStreams, months: monthRows, readings: allReadings, analyses: allAnalyses, snapshots };
}
export type SiteYearRows = NonNullable<Awaited<ReturnType<typeof loadSiteYearRows>>>;

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
