import "server-only";
import { and, asc, eq } from "drizzle-orm";
import type { Tx } from "@/db/client";
import type { MonthBundle } from "@/db/queries/months";
import { statements, type MonthRow } from "@/db/schema";
import type { findSite } from "@/db/queries/sites";
import { HttpError } from "@/lib/auth/errors";
import { issueStatement, NoSigningCertificate, signOffFacts } from "@/lib/signing/issue";
import { buildMonthlyModel, statementSummary, type StreamFacts } from "@/reports/build-model";
import { renderMonthlyStatement } from "@/reports/render";
import { balanceNoteOf, lastOf, reopenReason, revisionFacts, type TransitionEvent } from "./history";
import { runStoredMonth } from "./month-engine";
import type { LifecycleActor } from "./service";

type Site = NonNullable<Awaited<ReturnType<typeof findSite>>>;

/** Stream facts for the statement's input table: names, meters and how each figure was obtained. */
export function streamFacts(bundle: MonthBundle): StreamFacts[] {
  const readingOf = new Map(bundle.readings.map((r) => [r.streamId, r]));
  return bundle.streams.map((s) => ({
    key: s.key,
    name: s.name,
    kind: s.kind,
    meterTag: s.meterTag,
    calibratedOn: s.calibratedOn,
    source: readingOf.get(s.id)?.source ?? null,
    note: readingOf.get(s.id)?.note ?? null,
    uncertaintyPct: s.uncertaintyPct,
  }));
}

/**
 * Renders the monthly statement from the engine run of the stored month and seals it, inside
 * the caller's transaction (issueStatement runs as a savepoint): the statement row, its audit
 * record and the month's move to Signed commit together or not at all.
 */
export async function signMonth(tx: Tx, actor: LifecycleActor, site: Site, month: MonthRow, events: TransitionEvent[]) {
  // Segregation of duties: the person who closed this revision's balance does not also sign it.
  const balanced = lastOf(events, "balance", month.revision);
  if (balanced?.actorUserId === actor.userId) {
    throw new HttpError(
      403,
      "segregation_of_duties",
      "You closed the balance of this revision yourself, so another signatory must sign it.",
    );
  }
  const run = await runStoredMonth(tx, actor.organisationId, site.id, month.period);
  if (!run || !run.ok) throw new HttpError(422, "precondition_failed", "The month no longer computes from its stored figures; return it with comments.");

  const earlier = await tx
    .select({ revision: statements.revision, signedAt: statements.signedAt, signerName: statements.signerName })
    .from(statements)
    .where(and(eq(statements.siteId, site.id), eq(statements.kind, "monthly"), eq(statements.period, month.period)))
    .orderBy(asc(statements.revision));
  const prepared = lastOf(events, "send-for-review", month.revision);
  const doc = run.doc;

  try {
    return await issueStatement(tx, {
      organisationId: actor.organisationId,
      siteId: site.id,
      kind: "monthly",
      period: month.period,
      monthId: month.id,
      revision: month.revision,
      signer: { userId: actor.userId, name: actor.name, role: "Signatory" },
      location: site.name,
      contactInfo: actor.email,
      summary: statementSummary(doc),
      channel: actor.channel ?? "form",
      render: (ctx) =>
        renderMonthlyStatement(
          buildMonthlyModel({
            organisation: actor.organisationName,
            site: { name: site.name, code: site.code, meteringReference: site.meteringReference, closureTolerancePct: site.closureTolerancePct },
            period: month.period,
            revision: month.revision,
            statementRef: ctx.statementId,
            result: doc,
            streams: streamFacts(run.bundle),
            balanceNote: balanceNoteOf(events, month.revision, month.balanceNote),
            preparedBy: prepared ? `${prepared.actorLabel}, environmental officer` : "not recorded",
            preparedAt: prepared?.at ?? null,
            revisions: [
              ...revisionFacts(events, earlier),
              { revision: month.revision, signedAt: ctx.signedAt, signer: actor.name, reason: reopenReason(events, month.revision) },
            ],
            signOff: signOffFacts(actor.name, ctx),
          }),
        ),
    });
  } catch (err) {
    if (err instanceof NoSigningCertificate) throw new HttpError(422, "no_certificate", err.message);
    throw err;
  }
}
