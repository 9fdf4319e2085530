import { and, asc, count, desc, eq, gte, ilike, inArray, lt, sql, type SQL } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { apiTokens, attachments, auditEvents, importBatches, invitations, memberships, months, signingCertificates, sites, statements, streams, users } from "../schema";
import type { Channel } from "./audit";
import { UUID } from "./uuid";

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
      organisationId: auditEvents.organisationId,
      actorUserId: auditEvents.actorUserId,
      prevHash: auditEvents.prevHash,
      hash: auditEvents.hash,
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

const MONTH_NAMES = ["January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December"];
const monthWords = (period: string) => `${MONTH_NAMES[Number(period.slice(5, 7)) - 1] ?? "?"} ${period.slice(0, 4)}`;

/**
 * What each event's record is, in words ("Estuary Works · March 2026", "Statement of Estuary
 * Works · March 2026, revision 1", a person's name): the trail stores ids, people read names.
 * A record that no longer resolves keeps a neutral label, never its id.
 */
export async function auditRecordLabels(db: Db | Tx, organisationId: string, rows: Pick<AuditTrailRow, "id" | "entity" | "entityId" | "siteName">[]): Promise<Map<number, string>> {
  const ids = (entity: string) => [...new Set(rows.filter((r) => r.entity === entity && r.entityId && UUID.test(r.entityId)).map((r) => r.entityId!))];
  const byId = async (entity: string, q: (list: string[]) => Promise<{ id: string; label: string }[]>) => {
    const list = ids(entity);
    return new Map(list.length ? (await q(list)).map((x) => [x.id, x.label]) : []);
  };
  const [monthL, statementL, userL, memberL, inviteL, streamL, tokenL, attachL, certL, batchL, siteL] = await Promise.all([
    byId("month", async (l) =>
      (await db.select({ id: months.id, period: months.period, site: sites.name }).from(months).innerJoin(sites, eq(sites.id, months.siteId)).where(and(inArray(months.id, l), eq(sites.organisationId, organisationId)))).map(
        (m) => ({ id: m.id, label: `${m.site} · ${monthWords(m.period)}` }),
      ),
    ),
    byId("statement", async (l) =>
      (
        await db
          .select({ id: statements.id, kind: statements.kind, period: statements.period, revision: statements.revision, site: sites.name })
          .from(statements)
          .innerJoin(sites, eq(sites.id, statements.siteId))
          .where(and(inArray(statements.id, l), eq(statements.organisationId, organisationId)))
      ).map((s) => ({ id: s.id, label: `${s.kind === "annual" ? "Annual statement" : s.kind === "cbam" ? "Embedded-emissions communication" : "Monthly statement"}, ${s.site} · ${s.kind === "monthly" ? monthWords(s.period) : s.period}, revision ${s.revision}` })),
    ),
    byId("user", async (l) => (await db.select({ id: users.id, label: users.name }).from(users).where(inArray(users.id, l)))),
    byId("membership", async (l) => {
      const viaMembership = await db.select({ id: memberships.id, label: users.name }).from(memberships).innerJoin(users, eq(users.id, memberships.userId)).where(inArray(memberships.id, l));
      const viaUser = await db.select({ id: users.id, label: users.name }).from(users).where(inArray(users.id, l));
      return [...viaMembership, ...viaUser];
    }),
    byId("invitation", async (l) => (await db.select({ id: invitations.id, label: invitations.email }).from(invitations).where(and(inArray(invitations.id, l), eq(invitations.organisationId, organisationId))))),
    byId("stream", async (l) =>
      (await db.select({ id: streams.id, key: streams.key, site: sites.name }).from(streams).innerJoin(sites, eq(sites.id, streams.siteId)).where(and(inArray(streams.id, l), eq(sites.organisationId, organisationId)))).map(
        (s) => ({ id: s.id, label: `Stream ${s.key} at ${s.site}` }),
      ),
    ),
    byId("api_token", async (l) => (await db.select({ id: apiTokens.id, label: apiTokens.label }).from(apiTokens).where(and(inArray(apiTokens.id, l), eq(apiTokens.organisationId, organisationId))))),
    byId("attachment", async (l) => (await db.select({ id: attachments.id, label: attachments.fileName }).from(attachments).where(inArray(attachments.id, l)))),
    byId("signing_certificate", async (l) => (await db.select({ id: signingCertificates.id, label: signingCertificates.label }).from(signingCertificates).where(and(inArray(signingCertificates.id, l), eq(signingCertificates.organisationId, organisationId))))),
    byId("import_batch", async (l) => (await db.select({ id: importBatches.id, label: importBatches.fileName }).from(importBatches).where(inArray(importBatches.id, l)))),
    byId("site", async (l) => (await db.select({ id: sites.id, label: sites.name }).from(sites).where(and(inArray(sites.id, l), eq(sites.organisationId, organisationId))))),
  ]);
  const tables: Record<string, Map<string, string>> = {
    month: monthL, statement: statementL, user: userL, membership: memberL, invitation: inviteL, stream: streamL,
    api_token: tokenL, attachment: attachL, signing_certificate: certL, import_batch: batchL, site: siteL,
  };
  const out = new Map<number, string>();
  for (const r of rows) {
    const id = r.entityId ?? "";
    const slash = /^(\d{4}-\d{2})\/(.+)$/.exec(id);
    if ((r.entity === "reading" || r.entity === "analysis") && slash) out.set(r.id, `${r.siteName ? `${r.siteName} · ` : ""}${monthWords(slash[1])} · ${slash[2]}`);
    else if (tables[r.entity]?.has(id)) out.set(r.id, tables[r.entity].get(id)!);
    else if (UUID.test(id)) out.set(r.id, "a record no longer on file");
    else if (id) out.set(r.id, id);
  }
  return out;
}
