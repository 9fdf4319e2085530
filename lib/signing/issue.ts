import "server-only";
import type { Db, Tx } from "@/db/client";
import { recordAudit, type Channel } from "@/db/queries/audit";
import {
  activateCertificate,
  activeCertificateWithKey,
  insertSigningCertificate,
  insertStatement,
  type CertificateSummary,
} from "@/db/queries/statements";
import { verifyUrl } from "./public-url";
import { readP12 } from "./certificate";
import { sha256Hex } from "./hash";
import { openPassphrase, sealPassphrase } from "./passphrase-box";
import { embedFiles, type EmbeddedFile } from "./embed";
import { sealPdf } from "./seal";
import { statementReason } from "./statement-ref";

export interface ActorRef {
  userId: string;
  name: string;
  channel?: Channel;
}

/**
 * Stores an uploaded (or demo) PKCS#12 after checking it opens with its passphrase and holds a
 * matching key. The passphrase is sealed (passphrase-box.ts), never stored in clear.
 */
export async function registerCertificate(
  db: Db,
  input: { organisationId: string; label: string; p12: Buffer; passphrase: string; activate: boolean; actor: ActorRef },
): Promise<CertificateSummary> {
  const details = readP12(input.p12, input.passphrase);
  return db.transaction(async (tx) => {
    const created = await insertSigningCertificate(tx, {
      organisationId: input.organisationId,
      label: input.label,
      p12: input.p12,
      passphraseSealed: sealPassphrase(input.passphrase, details.fingerprintSha256),
      subject: details.subject,
      fingerprintSha256: details.fingerprintSha256,
      validFrom: details.validFrom,
      validTo: details.validTo,
      uploadedBy: input.actor.userId,
    });
    if (input.activate) await activateCertificate(tx, input.organisationId, created.id);
    await recordAudit(tx, {
      organisationId: input.organisationId,
      actorUserId: input.actor.userId,
      actorLabel: input.actor.name,
      channel: input.actor.channel ?? "form",
      action: "certificate.added",
      entity: "signing_certificate",
      entityId: created.id,
      after: { label: created.label, subject: created.subject, fingerprint: created.fingerprintSha256, active: input.activate },
    });
    return { ...created, active: input.activate };
  });
}

/** Everything the template needs to print the sign-off before the file is sealed. */
export interface SigningContext {
  statementId: string;
  signedAt: Date;
  certificateSubject: string;
  certificateFingerprint: string;
}

/** The sign-off a statement prints, the same for monthly and annual statements. */
export function signOffFacts(signer: string, ctx: SigningContext) {
  return {
    signer,
    role: "Signatory",
    signedAt: ctx.signedAt,
    certificateSubject: ctx.certificateSubject,
    certificateFingerprint: ctx.certificateFingerprint,
    verifyAt: verifyUrl(ctx.statementId),
  };
}

export interface IssueInput {
  organisationId: string;
  siteId: string;
  kind: "monthly" | "annual" | "cbam";
  period: string;
  monthId?: string | null;
  /** The month's revision (life cycle); the unique key refuses a second statement with the same one. */
  revision: number;
  signer: { userId: string; name: string; role: string };
  location: string;
  contactInfo: string;
  summary: Record<string, string>;
  /** Renders the unsigned PDF; gets the id, time and certificate so the page shows what the signature says. */
  render: (ctx: SigningContext) => Promise<Buffer>;
  /** Files the PDF carries (the frozen documents), embedded before sealing so the signature covers them. */
  files?: EmbeddedFile[];
  /** The frozen month the statement was rendered from. */
  snapshotId?: string | null;
  channel?: Channel;
}

export class NoSigningCertificate extends Error {}

/**
 * Signs and stores a statement in one transaction with its audit record: either the statement
 * exists, sealed and hashed, with the event that says who signed it, or nothing does. Given a
 * transaction (the month life cycle's), it runs as a savepoint inside it, so the month's state
 * change and the statement commit together.
 */
export async function issueStatement(db: Db | Tx, input: IssueInput): Promise<{ id: string; sha256: string; signedAt: Date; pdf: Buffer }> {
  return db.transaction(async (tx) => {
    const cert = await activeCertificateWithKey(tx, input.organisationId);
    // PKCS#7 signing time has whole seconds; the stored time must equal what the file says.
    const signedAt = new Date(Math.floor(Date.now() / 1000) * 1000);
    if (!cert) throw new NoSigningCertificate("The organisation has no active signing certificate; an administrator must add one.");
    if (signedAt < cert.validFrom || signedAt > cert.validTo) {
      throw new NoSigningCertificate("The organisation's signing certificate is outside its validity period.");
    }
    const statementId = crypto.randomUUID();
    const unsigned = await input.render({
      statementId,
      signedAt,
      certificateSubject: cert.subject,
      certificateFingerprint: cert.fingerprintSha256,
    });
    // Files attached and the document made PDF/A-3b before sealing, so the signature covers both.
    const withFiles = await embedFiles(unsigned, input.files ?? [], signedAt);
    const passphrase = openPassphrase(cert.passphraseSealed, cert.fingerprintSha256);
    const what = `${input.kind} statement ${input.period} revision ${input.revision}, signed by ${input.signer.name} (${input.signer.role})`;
    const pdf = await sealPdf(withFiles, cert.p12, passphrase, {
      reason: statementReason(statementId, what),
      location: input.location,
      name: input.signer.name,
      contactInfo: input.contactInfo,
      signingTime: signedAt,
    });
    const sha256 = sha256Hex(pdf);
    await insertStatement(tx, {
      id: statementId,
      organisationId: input.organisationId,
      siteId: input.siteId,
      kind: input.kind,
      period: input.period,
      monthId: input.monthId ?? null,
      snapshotId: input.snapshotId ?? null,
      revision: input.revision,
      pdf,
      sha256,
      signerUserId: input.signer.userId,
      signerName: input.signer.name,
      signerRole: input.signer.role,
      signedAt,
      certificateFingerprint: cert.fingerprintSha256,
      summary: input.summary,
    });
    await recordAudit(tx, {
      organisationId: input.organisationId,
      siteId: input.siteId,
      actorUserId: input.signer.userId,
      actorLabel: input.signer.name,
      channel: input.channel ?? "form",
      action: "statement.signed",
      entity: "statement",
      entityId: statementId,
      after: { kind: input.kind, period: input.period, revision: input.revision, sha256, certificate: cert.fingerprintSha256 },
    });
    return { id: statementId, sha256, signedAt, pdf };
  });
}
