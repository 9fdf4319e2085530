import { and, asc, desc, eq, getTableColumns, inArray, isNull, like, max, sql } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { preparedQuery, readAll } from "../prepared";
import { FROZEN_MONTH_STATES } from "@/lib/month-states";
import { months, monthSnapshots, sites, statements, streams, type MonthSnapshotRow } from "../schema";
import { analysesOfMonths, readingsOfMonths, siteStreamsQuery } from "./months";
import { findSite, listSites } from "./sites";
import { UUID } from "./uuid";

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
 * Every stored row of one site's year: the site (checked to be the organisation's) first, then in
 * one round of prepared queries its streams, the months, their readings and analyses, and the
 * latest snapshot of each frozen month's revision. Null when the site is not the organisation's.
 * The year, the series, the overview, the ledger and the annual statement all read this.
 */
export async function loadSiteYearRows(db: Db | Tx, organisationId: string, siteId: string, year: string) {
  const site = await findSite(db, organisationId, siteId);
  if (!site) return null;
  const args = { siteId: site.id, pattern: `${year}-%` };
  const [siteStreams, monthRows, allReadings, allAnalyses, snapshotRows] = await readAll(db, [
    () => siteStreamsQuery(db).execute({ siteId: site.id }),
    () => yearMonths(db).execute(args),
    () => yearReadings(db).execute(args),
    () => yearAnalyses(db).execute(args),
    () => yearSnapshots(db).execute(args),
  ] as const);
  // Newest first: the first row of a month is its latest snapshot of the current revision.
  const snapshots = new Map<string, MonthSnapshotRow>();
  for (const r of snapshotRows) if (!snapshots.has(r.monthId)) snapshots.set(r.monthId, r);
  return { site, year, streams: siteStreams, months: monthRows, readings: allReadings, analyses: allAnalyses, snapshots };
}

const ofSiteYear = and(eq(months.siteId, sql.placeholder("siteId")), like(months.period, sql.placeholder("pattern")));
const yearMonths = preparedQuery((db) => db.select().from(months).where(ofSiteYear).orderBy(asc(months.period)).prepare("year_months"));
const yearReadings = preparedQuery((db) => readingsOfMonths(db, ofSiteYear).prepare("year_readings"));
const yearAnalyses = preparedQuery((db) => analysesOfMonths(db, ofSiteYear).prepare("year_analyses"));
const yearSnapshots = preparedQuery((db) =>
  db
    .select(getTableColumns(monthSnapshots))
    .from(monthSnapshots)
    .innerJoin(months, and(eq(months.id, monthSnapshots.monthId), eq(monthSnapshots.revision, months.revision)))
    .where(and(ofSiteYear, inArray(months.state, [...FROZEN_MONTH_STATES])))
    .orderBy(desc(monthSnapshots.seq))
    .prepare("year_snapshots"),
);
/**
 * The site's data version (see sites.data_version), or null when the site is not the
 * organisation's: what a result kept in memory is keyed by, read without loading any figures.
 */
export async function siteDataVersion(db: Db | Tx, organisationId: string, siteId: string): Promise<number | null> {
  if (!UUID.test(siteId)) return null;
  const [row] = await siteDataVersionQuery(db).execute({ siteId, organisationId });
  return row?.v ?? null;
}

const siteDataVersionQuery = preparedQuery((db) =>
  db
    .select({ v: sites.dataVersion })
    .from(sites)
    .where(and(eq(sites.id, sql.placeholder("siteId")), eq(sites.organisationId, sql.placeholder("organisationId"))))
    .limit(1)
    .prepare("site_data_version"),
);

export type SiteYearRows = NonNullable<Awaited<ReturnType<typeof loadSiteYearRows>>>;

/** The organisation's active sites and the year the overview shows (the latest with months). */
export async function overviewScope(db: Db | Tx, organisationId: string) {
  const [siteList, year] = await readAll(db, [() => listSites(db, organisationId), () => latestYearOfOrganisation(db, organisationId)] as const);
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
