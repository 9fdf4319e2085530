import { and, desc, eq, gte, lte, type SQL } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { auditEvents } from "../schema";

export type Channel = (typeof auditEvents.$inferInsert)["channel"];

export interface AuditEntry {
  organisationId: string;
  siteId?: string | null;
  actorUserId?: string | null;
  actorLabel: string;
  channel: Channel;
  action: string;
  entity: string;
  entityId?: string | null;
  before?: unknown;
  after?: unknown;
  reason?: string | null;
}

/** Call inside the transaction that makes the change, so the record and the change stand or fall together. */
export async function recordAudit(tx: Db | Tx, entry: AuditEntry): Promise<void> {
  await tx.insert(auditEvents).values({
    organisationId: entry.organisationId,
    siteId: entry.siteId ?? null,
    actorUserId: entry.actorUserId ?? null,
    actorLabel: entry.actorLabel,
    channel: entry.channel,
    action: entry.action,
    entity: entry.entity,
    entityId: entry.entityId ?? null,
    before: entry.before ?? null,
    after: entry.after ?? null,
    reason: entry.reason ?? null,
  });
}

export interface AuditFilter {
  entity?: string;
  siteId?: string;
  from?: Date;
  to?: Date;
  limit?: number;
}

export async function listAudit(db: Db, organisationId: string, f: AuditFilter = {}) {
  const where: SQL[] = [eq(auditEvents.organisationId, organisationId)];
  if (f.entity) where.push(eq(auditEvents.entity, f.entity));
  if (f.siteId) where.push(eq(auditEvents.siteId, f.siteId));
  if (f.from) where.push(gte(auditEvents.at, f.from));
  if (f.to) where.push(lte(auditEvents.at, f.to));
  return db
    .select()
    .from(auditEvents)
    .where(and(...where))
    .orderBy(desc(auditEvents.at), desc(auditEvents.id))
    .limit(Math.min(f.limit ?? 200, 1000));
}
