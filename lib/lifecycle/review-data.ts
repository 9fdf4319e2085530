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
import { runStoredMonth, streamFacts } from "@/lib/ledger/month-runs";
import { emissionsMethodLabel, factorSetLabel } from "@/lib/ledger/method-labels";
import { dayLabel as day, monthTiming } from "@/lib/period";
import { evidenceOf, frozenFiles } from "./sign";

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

  const [run, events, statements, cert] = await Promise.all([
    runStoredMonth(db, actor.organisationId, site.id, period),
    monthEvents(db, actor.organisationId, month.id),
    monthStatements(db, actor.organisationId, site.id, period),
    activeCertificateWithKey(db, actor.organisationId),
  ]);
  const prepared = lastOf(events, "send-for-review", month.revision);
  const frozen = run?.ok ? run.frozen : null;
  const siteFacts = frozen?.context.site ?? { name: site.name, code: site.code, meteringReference: site.meteringReference, closureTolerancePct: site.closureTolerancePct };
  const model =
    run?.ok &&
    buildMonthlyModel({
      organisation: actor.organisationName,
      site: siteFacts,
      period,
      revision: month.revision,
      statementRef: "assigned at signing",
      result: run.doc,
      streams: frozen?.context.streams ?? streamFacts(run.bundle),
      evidence: frozen ? evidenceOf(frozen, frozenFiles({ documentText: "", resultText: "" }, siteFacts.code, period, month.revision)) : null,
      balanceNote: balanceNoteOf(events, month.revision, month.balanceNote),
      preparedBy: prepared ? `${prepared.actorLabel}, environmental officer` : "not sent for sign-off yet",
      preparedAt: prepared?.at ?? null,
      revisions: [
        ...revisionFacts(events, statements),
        ...(statements.some((s) => s.revision === month.revision) ? [] : [{ revision: month.revision, signedAt: null, signer: null, reason: reopenReason(events, month.revision) }]),
      ],
      signOff: { signer: "—", role: "Signatory", signedAt: null, certificateSubject: cert?.subject ?? "no active certificate", certificateFingerprint: cert?.fingerprintSha256 ?? "—", verifyAt: `${appUrl()}/verify` },
    });
  const outside = run?.ok
    ? run.balances.filter((b) => !b.within).map((b) => `The ${b.element} balance closes at ${signed(b.closurePct, 2)} %, beyond ±${b.tolerancePct} %.`)
    : [];
  const balancedBy = lastOf(events, "balance", month.revision);
  return {
    site,
    month,
    run,
    model: model || null,
    events,
    statements,
    pre: {
      computes: !!run?.ok,
      computeProblems: run && !run.ok ? run.issues.map((i) => `${i.path}: ${i.reason}`) : [],
      outside,
      method: month.emissionsMethod ? emissionsMethodLabel(month.emissionsMethod).name : null,
      factorSet: month.factorSet ? factorSetLabel(month.factorSet).name : null,
      notEnded: notEndedReason(period),
      certificate: cert ? cert.subject : null,
      balancedByActor: balancedBy?.actorUserId === actor.userId,
    },
  } as const;
}
