/**
 * The verification verdict in words a verifier can act on, shared by POST /api/v1/verify and
 * the verify page. Pure: it only rephrases what lib/signing/verify.ts decided.
 */
import type { StatementSummary } from "@/db/queries/statements";
import type { Verification } from "@/lib/signing/verify";
import { monthLabel, utcStamp } from "@/reports/format";

export interface StatementFacts {
  id: string;
  site: string;
  siteCode: string;
  kind: "monthly" | "annual";
  period: string;
  periodLabel: string;
  revision: number;
  signer: string;
  signerRole: string;
  signedAt: string;
  signedAtText: string;
  sha256: string;
  certificateFingerprint: string;
  summary: Record<string, string>;
}

export interface VerificationAnswer {
  verdict: Verification["verdict"];
  sha256: string;
  headline: string;
  explanation: string[];
  statement: StatementFacts | null;
}

function facts(s: StatementSummary): StatementFacts {
  return {
    id: s.id,
    site: s.siteName,
    siteCode: s.siteCode,
    kind: s.kind,
    period: s.period,
    periodLabel: s.kind === "monthly" ? monthLabel(s.period) : `Calendar year ${s.period}`,
    revision: s.revision,
    signer: s.signerName,
    signerRole: s.signerRole,
    signedAt: s.signedAt.toISOString(),
    signedAtText: utcStamp(s.signedAt),
    sha256: s.sha256,
    certificateFingerprint: s.certificateFingerprint,
    summary: s.summary,
  };
}

export function verificationAnswer(v: Verification): VerificationAnswer {
  if (v.verdict === "issued") {
    const s = facts(v.statement);
    return {
      verdict: "issued",
      sha256: v.sha256,
      headline: `Issued: this is the signed statement of ${s.site}, ${s.periodLabel}, revision ${s.revision}.`,
      explanation: [
        `The file is byte for byte the one stored when ${s.signer} (${s.signerRole}) signed it on ${s.signedAtText}.`,
        "Its SHA-256 matches the stored statement, so not a single byte has changed since signing.",
        "A later revision may exist if the month was reopened; check the statements list for the latest one.",
      ],
      statement: s,
    };
  }
  if (v.verdict === "altered") {
    const claimed = v.claimed ? facts(v.claimed) : null;
    return {
      verdict: "altered",
      sha256: v.sha256,
      headline: claimed
        ? `Altered: this file claims to be ${claimed.site}, ${claimed.periodLabel}, revision ${claimed.revision}, but it is not the file that was signed.`
        : "Altered: this file was signed with one of your organisation's certificates, but it is not a statement we stored.",
      explanation: [...v.reasons, "Do not rely on this copy. Download the statement again from Synledger, or ask the signatory for it."],
      statement: claimed,
    };
  }
  return {
    verdict: "unknown",
    sha256: v.sha256,
    headline: "Unknown: this file is not a statement of your organisation.",
    explanation: [
      v.reason,
      "Synledger only recognises statements signed for the organisation you are signed in to. A statement of another organisation, or any other PDF, is answered this way.",
    ],
    statement: null,
  };
}
