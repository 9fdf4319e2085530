import { and, asc, count, desc, eq, gte, ilike, lt, sql, type SQL } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { auditEvents, sites } from "../schema";
import type { Channel } from "./audit";

export interface AuditTrailFilter {
  siteId?: string;
  entity?: string;
  channel?: Channel;
  /** Part of the actor's name or token label, any case. */
  actor?: string;
  /** Inclusive UTC day start. */
  from?: Date;
  /** Exclusive UTC bound (the day after the last day asked for). */
  before?: Date;
}

function conditions(organisationId: string, f: AuditTrailFilter): SQL[] {
  const where: SQL[] = [eq(auditEvents.organisationId, organisationId)];
  if (f.siteId) where.push(eq(auditEvents.siteId, f.siteId));
  if (f.entity) where.push(eq(auditEvents.entity, f.entity));
  if (f.channel) where.push(eq(auditEvents.channel, f.channel));
  // Escaped so a typed % or _ matches itself rather than acting as a wildcard.
  if (f.actor) where.push(ilike(auditEvents.actorLabel, `%${f.actor.replace(/[\\%_]/g, (c) => `\\${c}`)}%`));
  if (f.from) where.push(gte(auditEvents.at, f.from));
  if (f.before) where.push(lt(auditEvents.at, f.before));
  return where;
}

/** One page of the organisation's audit trail, newest first, with the site's name where there is one. */
export async function searchAudit(db: Db | Tx, organisationId: string, f: AuditTrailFilter, page: { limit: number; offset: number }) {
  return db
    .select({
      id: auditEvents.id,
      at: auditEvents.at,
      siteId: auditEvents.siteId,
      siteName: sites.name,
      actorLabel: auditEvents.actorLabel,
      channel: auditEvents.channel,
      action: auditEvents.action,
      entity: auditEvents.entity,
      entityId: auditEvents.entityId,
      before: auditEvents.before,
      after: auditEvents.after,
      reason: auditEvents.reason,
    })
    .from(auditEvents)
    .leftJoin(sites, and(eq(sites.id, auditEvents.siteId), eq(sites.organisationId, organisationId)))
    .where(and(...conditions(organisationId, f)))
    .orderBy(desc(auditEvents.at), desc(auditEvents.id))
    .limit(page.limit)
    .offset(page.offset);
}
export type AuditTrailRow = Awaited<ReturnType<typeof searchAudit>>[number];

export async function countAudit(db: Db | Tx, organisationId: string, f: AuditTrailFilter): Promise<number> {
  const [row] = await db.select({ n: count() }).from(auditEvents).where(and(...conditions(organisationId, f)));
  return row?.n ?? 0;
}

/** The kinds of record the organisation's trail holds, for the entity filter. */
export async function auditEntities(db: Db | Tx, organisationId: string): Promise<string[]> {
  const rows = await db
    .selectDistinct({ entity: auditEvents.entity })
    .from(auditEvents)
    .where(eq(auditEvents.organisationId, organisationId))
    .orderBy(asc(auditEvents.entity));
  return rows.map((r) => r.entity);
}

/** Sites named in the trail, archived ones included, for the site filter. */
export async function auditSites(db: Db | Tx, organisationId: string) {
  return db
    .select({ id: sites.id, name: sites.name, archived: sql<boolean>`${sites.archivedAt} is not null` })
    .from(sites)
    .where(eq(sites.organisationId, organisationId))
    .orderBy(asc(sites.name));
}
