/**
 * The verification verdict in words a verifier can act on, shared by POST /api/v1/verify and the
 * public verify pages. Pure: it only rephrases what lib/signing/verify.ts decided. Whoever holds a
 * copy may ask, without an account, so a statement is described by its public facts only: the
 * installation, period, kind, revision, who signed it and when, and the key figures printed in
 * it. Nothing else of the organisation (no ids of its records, no users, no other statements).
 */
import type { StatementSummary } from "@/db/queries/statements";
import { verifyUrl } from "@/lib/signing/public-url";
import type { Verification } from "@/lib/signing/verify";
import { periodLabelOf } from "@/lib/statement-kind";
import { utcStamp } from "@/reports/format";

/** Key figures as the statement prints them, in its order. */
const FIGURE_LABELS: Record<string, string> = {
  co2e: "Total CO2e, gross",
  netCo2e: "Total CO2e, net",
  grossCo2: "Gross CO2",
  netCo2: "Net CO2",
  ammonia: "Ammonia produced",
  intensity: "Intensity",
  uncertainty: "Uncertainty of gross CO2 (95 %)",
  months: "Months in the year",
};
const FIGURE_ORDER = Object.keys(FIGURE_LABELS);
const figureRank = (key: string) => (FIGURE_ORDER.includes(key) ? FIGURE_ORDER.indexOf(key) : FIGURE_ORDER.length);

/** Summary keys that describe the installation rather than a figure. */
const INSTALLATION_KEYS = new Set(["operator", "identifiers"]);

export interface PublicStatementFacts {
  /** The statement's reference, printed in the PDF and in APP_URL/verify/REF. */
  reference: string;
  installation: string;
  operator: string | null;
  /** "EU ETS permit NM-GHG-0417; …", as frozen when the statement was signed. */
  identifiers: string | null;
  kind: "monthly" | "annual" | "cbam";
  period: string;
  periodLabel: string;
  revision: number;
  signer: string;
  signerRole: string;
  signedAt: string;
  signedAtText: string;
  sha256: string;
  certificateFingerprint: string;
  figures: { label: string; value: string }[];
  verifyUrl: string;
}

export interface VerificationAnswer {
  verdict: Verification["verdict"];
  sha256: string;
  headline: string;
  explanation: string[];
  statement: PublicStatementFacts | null;
  /** The later revision that replaced the statement (verdict "superseded"). */
  supersededBy: PublicStatementFacts | null;
}

export function publicFacts(s: StatementSummary): PublicStatementFacts {
  const summary = s.summary ?? {};
  return {
    reference: s.id,
    installation: s.siteName,
    operator: summary.operator ?? null,
    identifiers: summary.identifiers ?? null,
    kind: s.kind,
    period: s.period,
    periodLabel: periodLabelOf(s.kind, s.period),
    revision: s.revision,
    signer: s.signerName,
    signerRole: s.signerRole,
    signedAt: s.signedAt.toISOString(),
    signedAtText: utcStamp(s.signedAt),
    sha256: s.sha256,
    certificateFingerprint: s.certificateFingerprint,
    // jsonb keeps its own key order, so the statement's order is restored here.
    figures: Object.entries(summary)
      .filter(([k]) => !INSTALLATION_KEYS.has(k))
      .sort(([a], [b]) => figureRank(a) - figureRank(b))
      .map(([k, v]) => ({ label: FIGURE_LABELS[k] ?? k, value: v })),
    verifyUrl: verifyUrl(s.id),
  };
}

export function verificationAnswer(v: Verification): VerificationAnswer {
  if (v.verdict === "issued" || v.verdict === "superseded") {
    const s = publicFacts(v.statement);
    const what = `${s.kind} statement of ${s.installation}, ${s.periodLabel}, revision ${s.revision}`;
    const signed = `The file is byte for byte the one stored when ${s.signer} (${s.signerRole}) signed it on ${s.signedAtText}; its SHA-256 matches, so not a single byte has changed since.`;
    if (v.verdict === "superseded") {
      const n = publicFacts(v.supersededBy);
      return {
        verdict: "superseded",
        sha256: v.sha256,
        headline: `Superseded: this is the signed ${what}, but revision ${n.revision} replaced it on ${n.signedAtText}.`,
        explanation: [signed, `The month or year was reopened and signed again: rely on revision ${n.revision}, reference ${n.reference} (${n.verifyUrl}).`],
        statement: s,
        supersededBy: n,
      };
    }
    return {
      verdict: "issued",
      sha256: v.sha256,
      headline: `Issued: this is the signed ${what}, the latest revision of its period.`,
      explanation: [signed, "No later revision of this period has been signed."],
      statement: s,
      supersededBy: null,
    };
  }
  if (v.verdict === "altered") {
    const claimed = v.claimed ? publicFacts(v.claimed) : null;
    return {
      verdict: "altered",
      sha256: v.sha256,
      headline: claimed
        ? `Altered: this file claims to be the ${claimed.kind} statement of ${claimed.installation}, ${claimed.periodLabel}, revision ${claimed.revision}, but it is not the file that was signed.`
        : "Altered: this file carries a signature made with a certificate Synledger signs statements with, but it is not a statement Synledger stored.",
      explanation: [...v.reasons, "Do not rely on this copy. Ask the operator for the statement, or download it again from Synledger."],
      statement: claimed,
      supersededBy: null,
    };
  }
  return {
    verdict: "unknown",
    sha256: v.sha256,
    headline: "Unknown: this file is not a statement signed in Synledger.",
    explanation: [v.reason, "Nothing in it points at a stored statement or at a certificate Synledger signs with."],
    statement: null,
    supersededBy: null,
  };
}

