import { and, asc, eq, getTableColumns, sql, type SQL } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { preparedQuery, readAll } from "../prepared";
import { gasAnalyses, months, readings, streams } from "../schema";
import { findSite } from "./sites";

/** Everything the engine and the forms need of one site-month, or null when the site is not the organisation's. */
export async function loadMonthBundle(db: Db | Tx, organisationId: string, siteId: string, period: string) {
  const site = await findSite(db, organisationId, siteId);
  if (!site) return null;
  const args = { siteId: site.id, period };
  // One round of prepared queries once the site is known to be the organisation's.
  const [[month], siteStreams, monthReadings, monthAnalyses] = await readAll(db, [
    () => bundleMonth(db).execute(args),
    () => siteStreamsQuery(db).execute({ siteId: site.id }),
    () => bundleReadings(db).execute(args),
    () => bundleAnalyses(db).execute(args),
  ] as const);
  return { site, month: month ?? null, streams: siteStreams, readings: monthReadings, analyses: monthAnalyses };
}

const ofSiteMonth = and(eq(months.siteId, sql.placeholder("siteId")), eq(months.period, sql.placeholder("period")));
const bundleMonth = preparedQuery((db) => db.select().from(months).where(ofSiteMonth).limit(1).prepare("bundle_month"));

/** Every stream of a site, archived ones included (old months use them), in the site's order. */
export const siteStreamsQuery = preparedQuery((db) =>
  db.select().from(streams).where(eq(streams.siteId, sql.placeholder("siteId"))).orderBy(asc(streams.sortOrder), asc(streams.key)).prepare("site_streams"),
);
const bundleReadings = preparedQuery((db) => readingsOfMonths(db, ofSiteMonth).prepare("bundle_readings"));
const bundleAnalyses = preparedQuery((db) => analysesOfMonths(db, ofSiteMonth).prepare("bundle_analyses"));

/** The readings of the months a condition on `months` picks, in one query joined to them. */
export const readingsOfMonths = (db: Db | Tx, where: SQL | undefined) =>
  db.select(getTableColumns(readings)).from(readings).innerJoin(months, eq(months.id, readings.monthId)).where(where);

/** The gas analyses of the months a condition on `months` picks, by key. */
export const analysesOfMonths = (db: Db | Tx, where: SQL | undefined) =>
  db.select(getTableColumns(gasAnalyses)).from(gasAnalyses).innerJoin(months, eq(months.id, gasAnalyses.monthId)).where(where).orderBy(asc(gasAnalyses.key));

export type MonthBundle = NonNullable<Awaited<ReturnType<typeof loadMonthBundle>>>;

/** Locks the month row for the rest of the transaction (creating it when new). */
export async function lockMonth(tx: Tx, site: { id: string; emissionsMethod: string; factorSet: string; gwp: string }, period: string) {
  const siteId = site.id;
  // A new month takes the site's method, factor set and GWP set; from then on they are the month's own.
  await tx
    .insert(months)
    .values({ siteId, period, version: 0, emissionsMethod: site.emissionsMethod, factorSet: site.factorSet, gwp: site.gwp })
    .onConflictDoNothing({ target: [months.siteId, months.period] });
  const [row] = await tx
    .select()
    .from(months)
    .where(and(eq(months.siteId, siteId), eq(months.period, period)))
    .for("update");
  return row;
}

