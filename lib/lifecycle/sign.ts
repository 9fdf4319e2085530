import "server-only";
import { and, asc, eq } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { latestSnapshot } from "@/db/queries/snapshots";
import { statements, type MonthRow, type MonthSnapshotRow } from "@/db/schema";
import type { findSite } from "@/db/queries/sites";
import { HttpError } from "@/lib/auth/errors";
import { runOfSnapshot, type FrozenFacts } from "@/lib/ledger/month-runs";
import type { EmbeddedFile } from "@/lib/signing/embed";
import { issueStatement, NoSigningCertificate, signOffFacts } from "@/lib/signing/issue";
import { buildMonthlyModel, statementSummary } from "@/reports/build-model";
import type { EvidenceFacts } from "@/reports/model";
import { utcStamp } from "@/reports/format";
import { renderMonthlyStatement } from "@/reports/render";
import { balanceNoteOf, lastOf, reopenReason, revisionFacts, type TransitionEvent } from "./history";
import type { LifecycleActor } from "./service";

type Site = NonNullable<Awaited<ReturnType<typeof findSite>>>;

/** The two frozen documents as the statement carries them: canonical JSON, named for the month. */
export function frozenFiles(s: Pick<MonthSnapshotRow, "documentText" | "resultText">, siteCode: string, period: string, revision: number): EmbeddedFile[] {
  const base = `synledger-${siteCode.replace(/[^A-Za-z0-9_-]+/g, "-") || "site"}-${period}-r${revision}`;
  return [
    { name: `${base}.plant-month.json`, mediaType: "application/json", description: "Plant-month document the figures were computed from (synledger.plant-month/1, canonical JSON)", bytes: Buffer.from(s.documentText, "utf8") },
    { name: `${base}.result.json`, mediaType: "application/json", description: "Result document of the engine (synledger.result/1, canonical JSON)", bytes: Buffer.from(s.resultText, "utf8") },
  ];
}

export function evidenceOf(f: FrozenFacts, files: EmbeddedFile[]): EvidenceFacts {
  return {
    documentSha256: f.documentSha256,
    resultSha256: f.resultSha256,
    engineVersion: f.engineVersion,
    frozenAt: utcStamp(f.frozenAt),
    files: files.map((x) => ({ name: x.name, what: x.name.endsWith(".result.json") ? "result document" : "plant-month document" })),
  };
}

/**
 * Renders the monthly statement from the revision's snapshot (frozen when it was sent for
 * review) and seals it with the two frozen documents attached, inside the caller's transaction
 * (issueStatement runs as a savepoint): the statement row, its audit record and the month's move
 * to Signed commit together or not at all. Nothing is computed again.
 */
export async function signMonth(tx: Tx, actor: LifecycleActor, site: Site, month: MonthRow, events: TransitionEvent[]) {
  // Segregation of duties: the person who closed this revision's balance does not also sign it.
  const balanced = lastOf(events, "balance", month.revision);
  if (balanced?.actorUserId === actor.userId) {
    throw new HttpError(403, "segregation_of_duties", "You closed the balance of this revision yourself, so another signatory must sign it.");
  }
  const snapshot = await latestSnapshot(tx, month.id, month.revision);
  if (!snapshot) throw new HttpError(422, "precondition_failed", "This revision has no frozen record to sign; return it with comments and send it for sign-off again.");
  const frozen = runOfSnapshot(snapshot);
  const context = frozen.frozen.context;

  const earlier = await tx
    .select({ revision: statements.revision, signedAt: statements.signedAt, signerName: statements.signerName })
    .from(statements)
    .where(and(eq(statements.siteId, site.id), eq(statements.kind, "monthly"), eq(statements.period, month.period)))
    .orderBy(asc(statements.revision));
  const prepared = lastOf(events, "send-for-review", month.revision);
  const files = frozenFiles(snapshot, context.site.code, month.period, month.revision);

  try {
    return await issueStatement(tx, {
      organisationId: actor.organisationId,
      siteId: site.id,
      kind: "monthly",
      period: month.period,
      monthId: month.id,
      snapshotId: snapshot.id,
      revision: month.revision,
      signer: { userId: actor.userId, name: actor.name, role: "Signatory" },
      location: site.name,
      contactInfo: actor.email,
      summary: statementSummary(frozen.doc),
      channel: actor.channel ?? "form",
      files,
      render: (ctx) =>
        renderMonthlyStatement(
          buildMonthlyModel({
            organisation: actor.organisationName,
            site: context.site,
            period: month.period,
            revision: month.revision,
            statementRef: ctx.statementId,
            result: frozen.doc,
            streams: context.streams,
            flagNotes: new Map((context.flagNotes ?? []).map((n) => [`${n.code}|${n.stream}`, { text: n.text, by: n.by }])),
            balanceNote: balanceNoteOf(events, month.revision, month.balanceNote),
            preparedBy: prepared ? `${prepared.actorLabel}, environmental officer` : "not recorded",
            preparedAt: prepared?.at ?? null,
            revisions: [
              ...revisionFacts(events, earlier),
              { revision: month.revision, signedAt: ctx.signedAt, signer: actor.name, reason: reopenReason(events, month.revision) },
            ],
            evidence: evidenceOf(frozen.frozen, files),
            signOff: signOffFacts(actor.name, ctx),
          }),
        ),
    });
  } catch (err) {
    if (err instanceof NoSigningCertificate) throw new HttpError(422, "no_certificate", err.message);
    throw err;
  }
}
