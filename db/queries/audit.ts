import { and, asc, desc, eq, gte, isNotNull, lte, sql, type SQL } from "drizzle-orm";
import { eventHash, checkChain, type ChainReport } from "@/lib/audit/chain";
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

/**
 * Call inside the transaction that makes the change, so the record and the change stand or fall
 * together. The event is chained to the organisation's previous one (lib/audit/chain.ts): a
 * transaction-scoped advisory lock per organisation makes the read of the last hash and the insert
 * one step, so concurrent writers (several app instances) still form one unbroken chain.
 */
export async function recordAudit(tx: Db | Tx, entry: AuditEntry): Promise<void> {
  await tx.transaction(async (t) => {
    await t.execute(sql`select pg_advisory_xact_lock(hashtextextended(${`audit:${entry.organisationId}`}, 0))`);
    const [last] = await t
      .select({ hash: auditEvents.hash })
      .from(auditEvents)
      .where(and(eq(auditEvents.organisationId, entry.organisationId), isNotNull(auditEvents.hash)))
      .orderBy(desc(auditEvents.id))
      .limit(1);
    const fields = {
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
      // Milliseconds, as JavaScript reads the column back: the hash is over what can be re-read.
      at: new Date(),
    };
    const prevHash = last?.hash ?? null;
    await t.insert(auditEvents).values({ ...fields, prevHash, hash: eventHash(prevHash, fields) });
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

/** Checks the hash chain of every organisation (or one), reading each organisation's events in order. */
export async function verifyAuditChains(db: Db | Tx, organisationId?: string): Promise<ChainReport> {
  const orgs = organisationId
    ? [organisationId]
    : (await db.selectDistinct({ id: auditEvents.organisationId }).from(auditEvents)).map((r) => r.id);
  const report: ChainReport = { organisations: orgs.length, events: 0, beforeChain: 0, breaks: [] };
  for (const org of orgs) {
    const rows = await db.select().from(auditEvents).where(eq(auditEvents.organisationId, org)).orderBy(asc(auditEvents.id));
    const r = checkChain(rows);
    report.events += r.checked;
    report.beforeChain += r.beforeChain;
    if (r.firstBreak) report.breaks.push(r.firstBreak);
  }
  return report;
}
