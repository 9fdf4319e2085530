import type { Db } from "@/db/client";
import {
  certificateByFingerprint,
  laterRevisionOf,
  statementById,
  statementBySha256,
  type CertificateSummary,
  type StatementScope,
  type StatementSummary,
} from "@/db/queries/statements";
import { sha256Hex } from "./hash";
import { inspectSignedPdf, type SignatureInspection } from "./inspect";
import { findStatementRefs } from "./statement-ref";

/**
 * What a verifier is told about an uploaded PDF:
 * - issued: byte-for-byte one of the statements we stored (the SHA-256 matches), and the latest
 *   revision of its period;
 * - superseded: byte-for-byte a stored statement, but a later revision of the same period was
 *   signed since (the answer names it);
 * - altered: it carries a signature and names one of our statements or was signed with one of
 *   our certificates, but it is not a file we stored (a byte changed, something appended, or a
 *   digest that fails);
 * - unknown: no signature, or nothing in it points at a statement or certificate of ours.
 *
 * Public verification (anyone holding a copy, no account) looks among all stored statements and
 * is answered with public facts only (lib/lifecycle/verification-answer.ts). A scope of one
 * organisation, optionally of granted sites, is kept for callers inside the app: there a
 * statement of a site outside the grant is "unknown".
 */
export type Verification =
  | { verdict: "issued"; sha256: string; statement: StatementSummary; signature: SignatureInspection | null }
  | { verdict: "superseded"; sha256: string; statement: StatementSummary; supersededBy: StatementSummary; signature: SignatureInspection | null }
  | {
      verdict: "altered";
      sha256: string;
      reasons: string[];
      /** The statement the file claims to be, when it names one of ours. */
      claimed: StatementSummary | null;
      certificate: CertificateSummary | null;
      signature: SignatureInspection;
    }
  | { verdict: "unknown"; sha256: string; reason: string; signature: SignatureInspection | null };

export interface VerificationFacts {
  sha256: string;
  stored: StatementSummary | null;
  /** The newest later revision of the stored statement's period, if any. */
  later?: StatementSummary | null;
  signature: SignatureInspection | null;
  claimed: StatementSummary | null;
  certificate: CertificateSummary | null;
}

/** The decision alone, from facts already looked up; kept pure so it is tested without a database. */
export function judge(f: VerificationFacts): Verification {
  if (f.stored && f.later) return { verdict: "superseded", sha256: f.sha256, statement: f.stored, supersededBy: f.later, signature: f.signature };
  if (f.stored) return { verdict: "issued", sha256: f.sha256, statement: f.stored, signature: f.signature };
  if (!f.signature) return { verdict: "unknown", sha256: f.sha256, reason: "The file carries no digital signature.", signature: null };
  if (!f.claimed && !f.certificate) {
    return {
      verdict: "unknown",
      sha256: f.sha256,
      reason: "The signature was not made with a certificate of this organisation and names none of its statements.",
      signature: f.signature,
    };
  }
  const s = f.signature;
  const reasons = ["The file is not byte-for-byte any statement stored for this organisation."];
  if (!s.digestMatches) reasons.push("The signed bytes do not match the digest in the signature: the content was changed after signing.");
  if (!s.signatureValid) reasons.push("The signature itself does not verify with its certificate.");
  if (s.digestMatches && s.signatureValid && !s.coversWholeFile) reasons.push("Bytes were added or changed outside the signed ranges.");
  if (!f.certificate) reasons.push("The signing certificate is not one of this organisation's certificates.");
  if (f.claimed && f.certificate && f.claimed.certificateFingerprint !== f.certificate.fingerprintSha256) {
    reasons.push("The statement it names was signed with a different certificate.");
  }
  if (s.problem) reasons.push(s.problem);
  return { verdict: "altered", sha256: f.sha256, reasons, claimed: f.claimed, certificate: f.certificate, signature: s };
}

export async function verifyStatementPdf(db: Db, scope: StatementScope, pdf: Buffer): Promise<Verification> {
  const sha256 = sha256Hex(pdf);
  const signature = inspectSignedPdf(pdf);
  const stored = await statementBySha256(db, scope, sha256);
  if (stored) return judge({ sha256, stored, later: await laterRevisionOf(db, stored), signature, claimed: null, certificate: null });
  let claimed: StatementSummary | null = null;
  for (const id of findStatementRefs(pdf)) {
    claimed = await statementById(db, scope, id);
    if (claimed) break;
  }
  if (!claimed && "siteIds" in scope && scope.siteIds && (await namesStatementOutsideSites(db, scope.organisationId, pdf))) {
    // Certificates belong to the organisation, not to a site: without this, an auditor limited
    // to some sites would be told "altered" about an intact statement of a site they cannot see.
    return { verdict: "unknown", sha256, reason: "The file is not a statement of the sites you have access to.", signature };
  }
  const certificate = signature?.certificateFingerprint
    ? await certificateByFingerprint(db, "organisationId" in scope ? scope.organisationId : null, signature.certificateFingerprint)
    : null;
  return judge({ sha256, stored: null, signature, claimed, certificate });
}

async function namesStatementOutsideSites(db: Db, organisationId: string, pdf: Buffer): Promise<boolean> {
  for (const id of findStatementRefs(pdf)) {
    if (await statementById(db, { organisationId }, id)) return true;
  }
  return false;
}
