import "server-only";
import { and, asc, eq, like } from "drizzle-orm";
import type { Db, Tx } from "@/db/client";
import { listStatements, type StatementSummary } from "@/db/queries/statements";
import { auditEvents } from "@/db/schema";
import type { RevisionFact, WrittenNote } from "@/reports/build-model-parts";

/**
 * The life cycle's history is read from the audit trail, which is append-only by trigger: every
 * transition writes `month.<transition>` with before/after and the reason, so the record a
 * verifier reads and the history the page shows are one and the same.
 */
export interface TransitionEvent {
  id: number;
  action: string;
  transition: string;
  actorUserId: string | null;
  actorLabel: string;
  at: Date;
  reason: string | null;
  fromState: string | null;
  toState: string | null;
  revision: number | null;
  details: Record<string, unknown>;
}

export async function monthEvents(db: Db | Tx, organisationId: string, monthId: string): Promise<TransitionEvent[]> {
  const rows = await db
    .select()
    .from(auditEvents)
    .where(and(eq(auditEvents.organisationId, organisationId), eq(auditEvents.entity, "month"), eq(auditEvents.entityId, monthId), like(auditEvents.action, "month.%")))
    .orderBy(asc(auditEvents.at), asc(auditEvents.id));
  return rows.map((r) => {
    const before = (r.before ?? {}) as Record<string, unknown>;
    const after = (r.after ?? {}) as Record<string, unknown>;
    return {
      id: r.id,
      action: r.action,
      transition: r.action.slice("month.".length),
      actorUserId: r.actorUserId,
      actorLabel: r.actorLabel,
      at: r.at,
      reason: r.reason,
      fromState: typeof before.state === "string" ? before.state : null,
      toState: typeof after.state === "string" ? after.state : null,
      revision: typeof after.revision === "number" ? after.revision : typeof before.revision === "number" ? before.revision : null,
      details: after,
    };
  });
}

export function lastOf(events: TransitionEvent[], transition: string, revision: number): TransitionEvent | null {
  return [...events].reverse().find((e) => e.transition === transition && e.revision === revision) ?? null;
}

export function monthStatements(db: Db, organisationId: string, siteId: string, period: string): Promise<StatementSummary[]> {
  return listStatements(db, { organisationId }, { siteId, kind: "monthly", period });
}

/** Signed revisions (oldest first) with the reason each was started: "First issue" or the reopen reason. */
export function revisionFacts(events: TransitionEvent[], statements: Pick<StatementSummary, "revision" | "signedAt" | "signerName">[]): RevisionFact[] {
  const reasonFor = (rev: number) =>
    rev === 1 ? "First issue" : `Reopened: ${events.find((e) => e.transition === "reopen" && e.revision === rev)?.reason ?? "reason not recorded"}`;
  return [...statements]
    .sort((a, b) => a.revision - b.revision)
    .map((s) => ({ revision: s.revision, signedAt: s.signedAt, signer: s.signerName, reason: reasonFor(s.revision) }));
}

export function reopenReason(events: TransitionEvent[], revision: number): string {
  if (revision === 1) return "First issue";
  return `Reopened: ${events.find((e) => e.transition === "reopen" && e.revision === revision)?.reason ?? "reason not recorded"}`;
}

/** The balance note of the current revision with who wrote it. */
export function balanceNoteOf(events: TransitionEvent[], revision: number, note: string | null): WrittenNote | null {
  if (!note) return null;
  const e = lastOf(events, "balance", revision);
  return { text: note, by: e ? `${e.actorLabel}, process engineer` : "process engineer" };
}
