import type { InstallationIdentity } from "@/lib/validations/installation";
import "server-only";
import { and, asc, count, eq, inArray, isNull, sql } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { months, sites, streams } from "../schema";
import type { SiteValues } from "@/lib/validations/site";

/** Every site of the organisation, archived ones too, with how many active streams each has. */
export async function listSitesForAdmin(db: Db | Tx, organisationId: string) {
  return db
    .select({
      id: sites.id,
      name: sites.name,
      code: sites.code,
      meteringReference: sites.meteringReference,
      closureTolerancePct: sites.closureTolerancePct,
      factorSet: sites.factorSet,
      emissionsMethod: sites.emissionsMethod,
      gwp: sites.gwp,
      archivedAt: sites.archivedAt,
      streamCount: count(streams.id),
    })
    .from(sites)
    .leftJoin(streams, and(eq(streams.siteId, sites.id), isNull(streams.archivedAt)))
    .where(eq(sites.organisationId, organisationId))
    .groupBy(sites.id)
    .orderBy(asc(sites.name));
}
export type AdminSiteRow = Awaited<ReturnType<typeof listSitesForAdmin>>[number];

/** The site row locked for the rest of the transaction, only if it belongs to the organisation. */
export async function lockSite(tx: Tx, organisationId: string, siteId: string) {
  if (!/^[0-9a-f-]{36}$/i.test(siteId)) return null;
  const [row] = await tx
    .select()
    .from(sites)
    .where(and(eq(sites.id, siteId), eq(sites.organisationId, organisationId)))
    .for("update");
  return row ?? null;
}

export async function insertSite(tx: Tx, organisationId: string, values: SiteValues) {
  const [row] = await tx.insert(sites).values({ organisationId, ...values }).returning();
  return row;
}

export async function updateSite(tx: Tx, siteId: string, values: SiteValues) {
  const [row] = await tx.update(sites).set(values).where(eq(sites.id, siteId)).returning();
  return row;
}

export async function setInstallation(tx: Tx, siteId: string, installation: InstallationIdentity) {
  const [row] = await tx.update(sites).set({ installation }).where(eq(sites.id, siteId)).returning();
  return row;
}

export async function setSiteArchived(tx: Tx, siteId: string, archived: boolean) {
  const [row] = await tx
    .update(sites)
    .set({ archivedAt: archived ? sql`now()` : null })
    .where(eq(sites.id, siteId))
    .returning();
  return row;
}

/** The fields of a site an audit event shows before and after a change. */
export function siteSnapshot(s: typeof sites.$inferSelect) {
  return {
    name: s.name,
    code: s.code,
    meteringReference: s.meteringReference,
    closureTolerancePct: s.closureTolerancePct,
    factorSet: s.factorSet,
    emissionsMethod: s.emissionsMethod,
    gwp: s.gwp,
    archived: s.archivedAt !== null,
  };
}

/** The site's months by whether a change to its set-up still reaches them: Open and Balanced do, frozen ones never. */
export async function monthsReachedBySetup(db: Db | Tx, siteId: string): Promise<{ reached: string[]; frozen: string[] }> {
  const rows = await db.select({ period: months.period, state: months.state }).from(months).where(eq(months.siteId, siteId)).orderBy(asc(months.period));
  const frozen = (s: string) => s === "in_review" || s === "signed" || s === "submitted";
  return { reached: rows.filter((r) => !frozen(r.state)).map((r) => r.period), frozen: rows.filter((r) => frozen(r.state)).map((r) => r.period) };
}

/**
 * A change of the site's default method, factor set or GWP set reaches the months not yet sent
 * for review that still follow the old default (a month whose officer chose otherwise keeps its
 * choice); frozen months never change. Returns the months changed.
 */
export async function followSiteDefaults(
  tx: Tx,
  siteId: string,
  before: { emissionsMethod: string; factorSet: string; gwp: string },
  after: { emissionsMethod: string; factorSet: string; gwp: string },
): Promise<string[]> {
  const changed = new Set<string>();
  for (const [col, key] of [
    [months.emissionsMethod, "emissionsMethod"],
    [months.factorSet, "factorSet"],
    [months.gwp, "gwp"],
  ] as const) {
    if (before[key] === after[key]) continue;
    const rows = await tx
      .update(months)
      .set({ [key]: after[key], version: sql`${months.version} + 1`, updatedAt: new Date() })
      .where(and(eq(months.siteId, siteId), inArray(months.state, ["open", "balanced"]), eq(col, before[key])))
      .returning({ period: months.period });
    for (const r of rows) changed.add(r.period);
  }
  return [...changed].sort();
}
