import "server-only";
import { and, asc, eq } from "drizzle-orm";
import type { Db, Tx } from "@/db/client";
import { latestSnapshot } from "@/db/queries/snapshots";
import { statements, type MonthRow, type MonthSnapshotRow } from "@/db/schema";
import type { findSite } from "@/db/queries/sites";
import { HttpError } from "@/lib/auth/errors";
import { runOfSnapshot, type FrozenFacts } from "@/lib/ledger/month-runs";
import type { EmbeddedFile } from "@/lib/signing/embed";
import { issueStatement, NoSigningCertificate, signOffFacts, type SigningContext } from "@/lib/signing/issue";
import type { ResultDocument } from "@/lib/balance/result";
import { buildMonthlyModel, statementSummary } from "@/reports/build-model";
import { unconfirmedRows } from "@/reports/build-model-parts";
import type { EvidenceFacts } from "@/reports/model";
import { utcStamp } from "@/reports/format";
import { renderMonthlyStatement } from "@/reports/render";
import { balanceNoteOf, lastOf, reopenReason, revisionFacts, type TransitionEvent } from "./history";
import type { LifecycleActor } from "./actor";

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

export interface Declaration {
  /** The signatory ticked the declaration printed on page 1. */
  declaration?: boolean;
  /** Keys of the unconfirmed values the signatory acknowledged, one by one. */
  acknowledged?: readonly string[];
}

/** What signing needs that the frozen record holds, loaded once for the preview and the signature alike. */
async function signingFacts(tx: Tx | Db, siteId: string, month: MonthRow, events: TransitionEvent[]) {
  const snapshot = await latestSnapshot(tx, month.id, month.revision);
  if (!snapshot) throw new HttpError(422, "precondition_failed", "This revision has no frozen record to sign; return it with comments and send it for sign-off again.");
  const frozen = runOfSnapshot(snapshot);
  const earlier = await tx
    .select({ revision: statements.revision, signedAt: statements.signedAt, signerName: statements.signerName })
    .from(statements)
    .where(and(eq(statements.siteId, siteId), eq(statements.kind, "monthly"), eq(statements.period, month.period)))
    .orderBy(asc(statements.revision));
  const files = frozenFiles(snapshot, frozen.frozen.context.site.code, month.period, month.revision);
  return { snapshot, frozen, earlier, files, prepared: lastOf(events, "send-for-review", month.revision) };
}

type SigningFacts = Awaited<ReturnType<typeof signingFacts>>;

/** The statement model of the revision as it will be signed: the preview and the signed PDF print the same. */
function modelOf(f: SigningFacts, actor: LifecycleActor, month: MonthRow, events: TransitionEvent[], ctx: SigningContext) {
  const context = f.frozen.frozen.context;
  return buildMonthlyModel({
    organisation: actor.organisationName,
    site: context.site,
    period: month.period,
    revision: month.revision,
    statementRef: ctx.statementId,
    result: f.frozen.doc,
    document: f.frozen.document,
    analyses: context.analyses,
    streams: context.streams,
    flagNotes: new Map((context.flagNotes ?? []).map((n) => [`${n.code}|${n.stream}`, { text: n.text, by: n.by }])),
    balanceNote: balanceNoteOf(events, month.revision, month.balanceNote),
    preparedBy: f.prepared ? `${f.prepared.actorLabel}, environmental officer` : "not recorded",
    preparedAt: f.prepared?.at ?? null,
    revisions: [...revisionFacts(events, f.earlier), { revision: month.revision, signedAt: ctx.signedAt, signer: actor.name, reason: reopenReason(events, month.revision) }],
    evidence: evidenceOf(f.frozen.frozen, f.files),
    signOff: signOffFacts(actor.name, ctx),
  });
}

/** Keys of the values the statement prints as unconfirmed: each must be acknowledged before signing. */
export function unconfirmedKeys(doc: ResultDocument): string[] {
  return unconfirmedRows(doc).map((r) => r.key);
}

/**
 * The unsigned PDF of the revision exactly as it would be signed now by this signatory: the same
 * frozen record and model; only the reference (given at signing) and the seal are missing.
 */
export async function previewMonthlyStatement(tx: Tx | Db, actor: LifecycleActor, site: Site, month: MonthRow, events: TransitionEvent[], cert: { subject: string; fingerprintSha256: string } | null): Promise<Buffer> {
  const f = await signingFacts(tx, site.id, month, events);
  return renderMonthlyStatement(
    modelOf(f, actor, month, events, {
      statementId: "given at signing",
      signedAt: new Date(Math.floor(Date.now() / 1000) * 1000),
      certificateSubject: cert?.subject ?? "no active certificate",
      certificateFingerprint: cert?.fingerprintSha256 ?? "—",
    }),
  );
}

/**
 * Renders the monthly statement from the revision's snapshot (frozen when it was sent for
 * review) and seals it with the two frozen documents attached, inside the caller's transaction
 * (issueStatement runs as a savepoint): the statement row, its audit record and the month's move
 * to Signed commit together or not at all. Nothing is computed again. The signatory must have
 * ticked the declaration and acknowledged every unconfirmed value the statement prints.
 */
export async function signMonth(tx: Tx, actor: LifecycleActor, site: Site, month: MonthRow, events: TransitionEvent[], declared: Declaration = {}) {
  // Segregation of duties: the person who closed this revision's balance does not also sign it.
  const balanced = lastOf(events, "balance", month.revision);
  if (balanced?.actorUserId === actor.userId) {
    throw new HttpError(403, "segregation_of_duties", "You closed the balance of this revision yourself, so another signatory must sign it.");
  }
  const f = await signingFacts(tx, site.id, month, events);
  const missing: { path: string; message: string }[] = [];
  if (declared.declaration !== true) missing.push({ path: "declaration", message: "tick the declaration printed on page 1 of the statement" });
  const rows = unconfirmedRows(f.frozen.doc);
  const acknowledged = new Set(declared.acknowledged ?? []);
  for (const r of rows) if (!acknowledged.has(r.key)) missing.push({ path: `acknowledged.${r.key}`, message: `acknowledge the unconfirmed value: ${r.item}` });
  if (missing.length) {
    throw new HttpError(
      422,
      "declaration_required",
      declared.declaration !== true
        ? "Read the statement, tick the declaration and acknowledge each unconfirmed value before signing."
        : `Acknowledge each unconfirmed value before signing (${missing.length} still to acknowledge).`,
      missing,
    );
  }

  try {
    const signed = await issueStatement(tx, {
      organisationId: actor.organisationId,
      siteId: site.id,
      kind: "monthly",
      period: month.period,
      monthId: month.id,
      snapshotId: f.snapshot.id,
      revision: month.revision,
      signer: { userId: actor.userId, name: actor.name, role: "Signatory" },
      location: site.name,
      contactInfo: actor.email,
      summary: statementSummary(f.frozen.doc, f.frozen.frozen.context.site.installation),
      channel: actor.channel ?? "form",
      files: f.files,
      render: (ctx) => renderMonthlyStatement(modelOf(f, actor, month, events, ctx)),
    });
    return { ...signed, acknowledged: rows.map((r) => r.key) };
  } catch (err) {
    if (err instanceof NoSigningCertificate) throw new HttpError(422, "no_certificate", err.message);
    throw err;
  }
}
