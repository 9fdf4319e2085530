import { and, asc, eq, gte, isNull, lte, sql } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { preparedQuery } from "../prepared";
import { months, sites } from "../schema";
import { UUID } from "./uuid";


/** Active sites of one organisation, by name. */
export async function listSites(db: Db | Tx, organisationId: string) {
  return db
    .select({ id: sites.id, name: sites.name, code: sites.code, createdAt: sites.createdAt })
    .from(sites)
    .where(and(eq(sites.organisationId, organisationId), isNull(sites.archivedAt)))
    .orderBy(asc(sites.name));
}

/**
 * One site, only if it belongs to the organisation. A malformed id returns null instead of
 * reaching PostgreSQL (which would reject it as an error), so callers answer 404 either way.
 */
export async function findSite(db: Db | Tx, organisationId: string, siteId: string) {
  if (!UUID.test(siteId)) return null;
  const [row] = await findSiteQuery(db).execute({ siteId, organisationId });
  return row ?? null;
}

// Every site page and site route starts here, so prepared (db/prepared.ts).
const findSiteQuery = preparedQuery((db) =>
  db
    .select()
    .from(sites)
    .where(and(eq(sites.id, sql.placeholder("siteId")), eq(sites.organisationId, sql.placeholder("organisationId"))))
    .limit(1)
    .prepare("find_site"),
);

/** The month record of a site, if anybody has started it. The site must already be checked. */
export async function findMonth(db: Db | Tx, siteId: string, period: string) {
  const [row] = await db
    .select({ id: months.id, state: months.state, revision: months.revision, updatedAt: months.updatedAt })
    .from(months)
    .where(and(eq(months.siteId, siteId), eq(months.period, period)))
    .limit(1);
  return row ?? null;
}

/** Month records of all active sites of the organisation within [from, to] ("YYYY-MM", inclusive). */
export async function listMonthsOfOrganisation(db: Db | Tx, organisationId: string, from: string, to: string) {
  return db
    .select({ siteId: months.siteId, period: months.period, state: months.state, revision: months.revision })
    .from(months)
    .innerJoin(sites, eq(sites.id, months.siteId))
    .where(and(eq(sites.organisationId, organisationId), isNull(sites.archivedAt), gte(months.period, from), lte(months.period, to)));
}
