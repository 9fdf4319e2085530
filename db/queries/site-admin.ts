import "server-only";
import { and, asc, count, eq, isNull, sql } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { sites, streams } from "../schema";
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
