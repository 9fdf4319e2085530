import "server-only";
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { findSite } from "@/db/queries/sites";
import { activeCertificateWithKey } from "@/db/queries/statements";
import { months } from "@/db/schema";
import { appUrl } from "@/lib/mail/transport";
import { buildMonthlyModel } from "@/reports/build-model";
import { signed } from "@/reports/format";
import { balanceNoteOf, lastOf, monthEvents, monthStatements, reopenReason, revisionFacts } from "./history";
import { flagNotesOf } from "@/db/queries/flag-notes";
import { runStoredMonth, streamFacts, type FlagNoteFact } from "@/lib/ledger/month-runs";
import { emissionsMethodLabel, factorSetLabel } from "@/lib/ledger/method-labels";
import { plainIssue } from "@/lib/plain-path";

/** The stream ids of a plant-month document in its order, so `streams[2]` can be named. */
export const docStreamIds = (doc: Record<string, unknown>) => ((doc.streams as { id?: string }[] | undefined) ?? []).map((s) => s.id ?? "?");
import { overdueMeters } from "@/lib/ledger/calibration";
import { dayLabel as day, lastDayOf, monthTiming } from "@/lib/period";
import { evidenceOf, frozenFiles } from "./sign";

/** Explanations by `code|stream`, as the statement model looks them up. */
export const notesMap = (notes: FlagNoteFact[]) => new Map(notes.map((n) => [`${n.code}|${n.stream}`, { text: n.text, by: n.by }]));

/** Why a month cannot be balanced or sent yet, or null once its last day has passed. */
function notEndedReason(period: string): string | null {
  const t = monthTiming(period);
  if (t.kind === "in-progress") return `The month is in progress: it can be balanced and sent from ${day(t.closesOn)}, once its last day (${day(t.lastDay)}) has passed.`;
  if (t.kind === "future") return `The month has not begun (it opens on ${day(t.opensOn)}).`;
  return null;
}

/**
 * Everything the review page shows of one site-month, read in one place: the engine run of the
 * stored figures, the display model the statement would print, the history and signed PDFs, and
 * the preconditions of each next step for this actor.
 */
export async function loadReview(db: Db, actor: { organisationId: string; organisationName: string; userId: string }, siteId: string, period: string) {
  const site = await findSite(db, actor.organisationId, siteId);
  if (!site) return null;
  const [month] = await db.select().from(months).where(and(eq(months.siteId, site.id), eq(months.period, period)));
  if (!month) return { site, month: null } as const;

  const [run, events, statements, cert, liveNotes] = await Promise.all([
    runStoredMonth(db, actor.organisationId, site.id, period),
    monthEvents(db, actor.organisationId, month.id),
    monthStatements(db, actor.organisationId, site.id, period),
    activeCertificateWithKey(db, actor.organisationId),
    flagNotesOf(db, month.id, month.revision),
  ]);
  const prepared = lastOf(events, "send-for-review", month.revision);
  const frozen = run?.ok ? run.frozen : null;
  const siteFacts = frozen?.context.site ?? { name: site.name, code: site.code, meteringReference: site.meteringReference, closureTolerancePct: site.closureTolerancePct, installation: site.installation };
  const model =
    run?.ok &&
    buildMonthlyModel({
      organisation: actor.organisationName,
      site: siteFacts,
      period,
      revision: month.revision,
      statementRef: "assigned at signing",
      result: run.doc,
      document: run.document,
      analyses: frozen?.context.analyses ?? run.bundle.analyses.map((a) => ({ key: a.key, sampledOn: a.sampledOn, laboratory: a.laboratory })),
      streams: frozen?.context.streams ?? streamFacts(run.bundle),
      flagNotes: notesMap(frozen ? (frozen.context.flagNotes ?? []) : liveNotes.map((n) => ({ code: n.code, stream: n.stream, text: n.text, by: `${n.writtenByName}, ${n.writtenRole.toLowerCase()}` }))),
      evidence: frozen ? evidenceOf(frozen, frozenFiles({ documentText: "", resultText: "" }, siteFacts.code, period, month.revision)) : null,
      balanceNote: balanceNoteOf(events, month.revision, month.balanceNote),
      preparedBy: prepared ? `${prepared.actorLabel}, environmental officer` : "not sent for sign-off yet",
      preparedAt: prepared?.at ?? null,
      revisions: [
        ...revisionFacts(events, statements),
        ...(statements.some((s) => s.revision === month.revision) ? [] : [{ revision: month.revision, signedAt: null, signer: null, reason: reopenReason(events, month.revision) }]),
      ],
      signOff: { signer: "—", role: "Signatory", signedAt: null, certificateSubject: cert?.subject ?? "no active certificate", certificateFingerprint: cert?.fingerprintSha256 ?? "—", verifyAt: `${appUrl()}/verify/(reference given at signing)` },
    });
  const outside = run?.ok
    ? run.balances.filter((b) => !b.within).map((b) => `The ${b.element} balance closes at ${signed(b.closurePct, 2)} %, beyond ±${b.tolerancePct} %.`)
    : [];
  const balancedBy = lastOf(events, "balance", month.revision);
  const meters = (frozen?.context.streams ?? (run ? streamFacts(run.bundle) : [])).map((m) => ({ key: m.key, name: m.name, meterTag: m.meterTag, calibratedOn: m.calibratedOn, calibrationIntervalMonths: m.calibrationIntervalMonths ?? null }));
  return {
    site,
    month,
    overdue: overdueMeters(meters, lastDayOf(period)),
    run,
    model: model || null,
    events,
    statements,
    pre: {
      computes: !!run?.ok,
      computeProblems: run && !run.ok ? run.issues.map((i) => plainIssue(i.path, i.reason, docStreamIds(run.document))) : [],
      outside,
      method: month.emissionsMethod ? emissionsMethodLabel(month.emissionsMethod).name : null,
      factorSet: month.factorSet ? factorSetLabel(month.factorSet).name : null,
      notEnded: notEndedReason(period),
      certificate: cert ? cert.subject : null,
      balancedByActor: balancedBy?.actorUserId === actor.userId,
    },
  } as const;
}
