import { and, asc, eq } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { gasAnalyses, months, readings, streams } from "../schema";
import { findSite } from "./sites";

/** Everything the engine and the forms need of one site-month, or null when the site is not the organisation's. */
export async function loadMonthBundle(db: Db | Tx, organisationId: string, siteId: string, period: string) {
  const site = await findSite(db, organisationId, siteId);
  if (!site) return null;
  const [month] = await db
    .select()
    .from(months)
    .where(and(eq(months.siteId, site.id), eq(months.period, period)))
    .limit(1);
  const siteStreams = await db.select().from(streams).where(eq(streams.siteId, site.id)).orderBy(asc(streams.sortOrder), asc(streams.key));
  const monthReadings = month ? await db.select().from(readings).where(eq(readings.monthId, month.id)) : [];
  const monthAnalyses = month
    ? await db.select().from(gasAnalyses).where(eq(gasAnalyses.monthId, month.id)).orderBy(asc(gasAnalyses.key))
    : [];
  return { site, month: month ?? null, streams: siteStreams, readings: monthReadings, analyses: monthAnalyses };
}
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

