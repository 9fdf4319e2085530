import { and, asc, eq, isNull, like, sql } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { preparedQuery } from "../prepared";
import { months, sites, streams } from "../schema";

/** Fields of a site the API shows; never anything of another organisation. */
export const siteFields = {
  id: sites.id,
  name: sites.name,
  code: sites.code,
  meteringReference: sites.meteringReference,
  closureTolerancePct: sites.closureTolerancePct,
  emissionsMethod: sites.emissionsMethod,
  factorSet: sites.factorSet,
  gwp: sites.gwp,
  archivedAt: sites.archivedAt,
};

/**
 * One page of the organisation's active sites with their settings, by name then id: at most
 * `limit`, after the site named by `after` when given. One more row is read than answered, so
 * the caller knows whether a next page exists.
 */
export async function listSiteDetails(db: Db | Tx, organisationId: string, limit: number, after?: { name: string; id: string }) {
  const rows = after
    ? await siteDetailsAfterQuery(db).execute({ organisationId, limit: limit + 1, afterName: after.name, afterId: after.id })
    : await siteDetailsQuery(db).execute({ organisationId, limit: limit + 1 });
  return { sites: rows.slice(0, limit), more: rows.length > limit };
}

const activeOfOrganisation = and(eq(sites.organisationId, sql.placeholder("organisationId")), isNull(sites.archivedAt));
const siteDetailsQuery = preparedQuery((db) =>
  db.select(siteFields).from(sites).where(activeOfOrganisation).orderBy(asc(sites.name), asc(sites.id)).limit(sql.placeholder("limit")).prepare("site_details"),
);
const siteDetailsAfterQuery = preparedQuery((db) =>
  db
    .select(siteFields)
    .from(sites)
    .where(and(activeOfOrganisation, sql`(${sites.name}, ${sites.id}) > (${sql.placeholder("afterName")}::text, ${sql.placeholder("afterId")}::uuid)`))
    .orderBy(asc(sites.name), asc(sites.id))
    .limit(sql.placeholder("limit"))
    .prepare("site_details_after"),
);

/** Streams of a site already checked to be the caller's, archived ones included (old months use them). */
export async function listStreamsOfSite(db: Db | Tx, siteId: string) {
  return db
    .select({
      key: streams.key,
      name: streams.name,
      kind: streams.kind,
      unit: streams.unit,
      analysisKey: streams.analysisKey,
      destination: streams.destination,
      fate: streams.fate,
      uncertaintyPct: streams.uncertaintyPct,
      metered: streams.metered,
      systematicPct: streams.systematicPct,
      indirectFactor: streams.indirectFactor,
      meterTag: streams.meterTag,
      calibratedOn: streams.calibratedOn,
      archivedAt: streams.archivedAt,
    })
    .from(streams)
    .where(eq(streams.siteId, siteId))
    .orderBy(asc(streams.sortOrder), asc(streams.key));
}

/** Month records of one site in one calendar year, oldest first. */
export async function listMonthsOfSite(db: Db | Tx, siteId: string, year: string) {
  return db
    .select({ period: months.period, state: months.state, revision: months.revision, version: months.version, updatedAt: months.updatedAt })
    .from(months)
    .where(and(eq(months.siteId, siteId), like(months.period, `${year}-%`)))
    .orderBy(asc(months.period));
}
