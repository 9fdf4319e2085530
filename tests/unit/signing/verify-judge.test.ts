import { describe, expect, it } from "vitest";
import type { CertificateSummary, StatementSummary } from "@/db/queries/statements";
import type { SignatureInspection } from "@/lib/signing/inspect";
import { judge } from "@/lib/signing/verify";

const FP = "a".repeat(64);
const stmt = { id: "s1", certificateFingerprint: FP, period: "2026-03", revision: 2 } as StatementSummary;
const cert = { id: "c1", fingerprintSha256: FP, label: "Estuary" } as CertificateSummary;
const sig = (over: Partial<SignatureInspection> = {}): SignatureInspection => ({
  byteRange: [0, 10, 20, 10],
  signedDigestOk: true,
  digestMatches: true,
  signatureValid: true,
  signerSubject: "CN=x",
  certificateFingerprint: FP,
  signingTime: null,
  coversWholeFile: true,
  problem: null,
  ...over,
});
const base = { sha256: "f".repeat(64), stored: null, signature: null, claimed: null, certificate: null };

describe("verification verdicts from looked-up facts", () => {
  it("a stored hash is issued, whatever else", () => {
    expect(judge({ ...base, stored: stmt, signature: sig() }).verdict).toBe("issued");
  });
  it("no signature is unknown, even if it names our statement in clear", () => {
    const v = judge({ ...base, claimed: stmt });
    expect(v.verdict).toBe("unknown");
  });
  it("a signature by a stranger's certificate that names nothing of ours is unknown", () => {
    expect(judge({ ...base, signature: sig() }).verdict).toBe("unknown");
  });
  it("our certificate with a failing digest is altered, and says the content changed", () => {
    const v = judge({ ...base, signature: sig({ digestMatches: false, signedDigestOk: false }), certificate: cert });
    expect(v.verdict).toBe("altered");
    if (v.verdict !== "altered") return;
    expect(v.reasons.join(" ")).toMatch(/content was changed after signing/);
  });
  it("naming our statement but signed with another certificate is altered, with both reasons", () => {
    const v = judge({ ...base, signature: sig({ certificateFingerprint: "b".repeat(64) }), claimed: stmt });
    expect(v.verdict).toBe("altered");
    if (v.verdict !== "altered") return;
    expect(v.reasons.join(" ")).toMatch(/not one of this organisation's certificates/);
  });
  it("a valid signature by our certificate over bytes we never stored is still altered", () => {
    const v = judge({ ...base, signature: sig({ coversWholeFile: false }), certificate: cert, claimed: stmt });
    expect(v.verdict).toBe("altered");
    if (v.verdict !== "altered") return;
    expect(v.reasons.join(" ")).toMatch(/outside the signed ranges/);
  });
});
