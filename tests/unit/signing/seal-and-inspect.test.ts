import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { renderAnnualStatement, renderMonthlyStatement } from "@/reports/render";
import { CertificateError, readP12 } from "@/lib/signing/certificate";
import { createDemoCertificate } from "@/lib/signing/demo-certificate";
import { sha256Hex } from "@/lib/signing/hash";
import { extractPkcs7, inspectSignedPdf } from "@/lib/signing/inspect";
import { sealPdf } from "@/lib/signing/seal";
import { findStatementRefs, statementReason } from "@/lib/signing/statement-ref";
import { sampleAnnual, sampleMonthly } from "./sample-models";

const dir = mkdtempSync(path.join(tmpdir(), "synledger-sign-"));
const file = (name: string, data: Buffer) => {
  const p = path.join(dir, name);
  writeFileSync(p, data);
  return p;
};
/** pdfsig exits non-zero for an invalid signature; we want its words either way. */
const pdfsig = (pdf: Buffer, name: string) => {
  const r = spawnSync("pdfsig", [file(name, pdf)], { encoding: "utf8" });
  if (r.error) throw r.error;
  return r.stdout + r.stderr;
};
/** Text with line breaks folded to spaces: a sentence may wrap anywhere. */
const pdftotext = (pdf: Buffer, name: string) => execFileSync("pdftotext", [file(name, pdf), "-"], { encoding: "utf8" }).replace(/\s+/g, " ");

const REF = sampleMonthly.header.statementRef;
let unsigned: Buffer;
let signed: Buffer;
let cert: { p12: Buffer; passphrase: string };
const signingTime = new Date("2026-04-11T14:32:05Z");

beforeAll(async () => {
  unsigned = await renderMonthlyStatement(sampleMonthly);
  cert = createDemoCertificate({ commonName: "Vellmar Estuary statements", organisation: "Vellmar Nitrogen Co.", bits: 2048 });
  signed = await sealPdf(unsigned, cert.p12, cert.passphrase, {
    reason: statementReason(REF, "monthly statement 2026-03 revision 2"),
    location: "Estuary works",
    name: "Tomasz Ferreira",
    contactInfo: "statements@vellmar.example",
    signingTime,
  });
}, 60_000);

/** A copy with one byte changed: the first occurrence of `from` (latin1) becomes `to`. */
function tamper(pdf: Buffer, from: string, to: string): { copy: Buffer; at: number } {
  const at = pdf.indexOf(Buffer.from(from, "latin1"));
  expect(at, `"${from}" not found`).toBeGreaterThan(0);
  const copy = Buffer.from(pdf);
  copy[at + from.length - 1] = to.charCodeAt(0);
  return { copy, at };
}

describe("a rendered statement shows the figures it was given, with units", () => {
  it("pdftotext finds figures and their units, the cautions and page numbers", () => {
    const text = pdftotext(signed, "monthly.pdf");
    const m = sampleMonthly;
    const q = (x: { value: string; unit: string }) => `${x.value} ${x.unit}`;
    for (const s of [q(m.summary.co2e.gross), q(m.summary.co2e.net), q(m.co2.gross), q(m.co2.net), q(m.summary.ammonia), q(m.inputs[0].quantity), m.summary.uncertainty, q(m.intensities[0].value)]) {
      expect(text).toContain(s);
    }
    expect(text).toContain("only as good as the meters");
    expect(text).toContain("never gives operating instructions");
    expect(text).toMatch(/page 1 of [4-8]/);
    expect(text).toContain(REF);
    expect(text).toContain(m.signOff.signer);
    expect(text).toContain("Declaration of the signatory");
    expect(text).not.toContain("from memory");
  });
  it("the annual statement prints twelve months and the year's totals", async () => {
    const text = pdftotext(await renderAnnualStatement(sampleAnnual), "annual.pdf");
    for (const m of ["Jan 2026", "Jun 2026", "Dec 2026"]) expect(text).toContain(m);
    expect(text).toContain("961 946.6");
    expect(text).toContain("Combined uncertainty");
  });
});

describe("sealing", () => {
  it("pdfsig reports the signature valid and the whole document signed", () => {
    const out = pdfsig(signed, "signed.pdf");
    expect(out).toContain("Signature is Valid");
    expect(out).toContain("Signer Certificate Common Name: Vellmar Estuary statements");
    expect(out).toContain("Total document signed");
    expect(out).toContain("SHA-256");
  });
  it("inspectSignedPdf agrees, names the signer and the signing time", () => {
    const r = inspectSignedPdf(signed)!;
    expect(r).not.toBeNull();
    expect(r.signedDigestOk).toBe(true);
    expect(r.coversWholeFile).toBe(true);
    expect(r.signerSubject).toBe("CN=Vellmar Estuary statements, O=Vellmar Nitrogen Co., OU=Greenhouse-gas statements");
    expect(r.signingTime?.toISOString()).toBe(signingTime.toISOString());
    expect(r.certificateFingerprint).toBe(readP12(cert.p12, cert.passphrase).fingerprintSha256);
    const [a, b, c, d] = r.byteRange;
    expect(a).toBe(0);
    expect(c + d).toBe(signed.length);
    expect(signed[b]).toBe("<".charCodeAt(0));
  });
  it("the signature names the statement", () => {
    expect(findStatementRefs(signed)).toEqual([REF]);
    expect(findStatementRefs(unsigned)).toEqual([]);
  });
  it("openssl cms verifies the extracted PKCS#7 over the signed bytes, and refuses other bytes", () => {
    const [, b, c, d] = inspectSignedPdf(signed)!.byteRange;
    const der = file("sig.der", extractPkcs7(signed)!);
    const content = Buffer.concat([signed.subarray(0, b), signed.subarray(c, c + d)]);
    const verify = (data: Buffer, name: string) =>
      spawnSync("openssl", ["cms", "-verify", "-binary", "-inform", "DER", "-in", der, "-noverify", "-content", file(name, data), "-out", path.join(dir, "out.bin")], {
        encoding: "utf8",
      });
    const ok = verify(content, "content.bin");
    expect(ok.status, ok.stderr).toBe(0);
    expect(ok.stderr).toContain("Verification successful");
    const other = Buffer.from(content);
    other[Math.floor(other.length / 2)] ^= 0x01;
    expect(verify(other, "other.bin").status).not.toBe(0);
  });
  it("an unsigned PDF has no signature to inspect", () => {
    expect(inspectSignedPdf(unsigned)).toBeNull();
  });
});

describe("one changed byte breaks the seal", () => {
  it("in the document title (first signed range): pdfsig no longer says valid, the digest fails", () => {
    const { copy, at } = tamper(signed, "revision 2", "3");
    const [, b] = inspectSignedPdf(signed)!.byteRange;
    expect(at).toBeLessThan(b);
    const out = pdfsig(copy, "tampered-1.pdf");
    expect(out).not.toContain("Signature is Valid");
    expect(out).toContain("Digest Mismatch");
    const r = inspectSignedPdf(copy)!;
    expect(r.digestMatches).toBe(false);
    expect(r.signedDigestOk).toBe(false);
    expect(r.signatureValid).toBe(true); // the signed attributes are intact; the content is not
  });
  it("in the signature dictionary's location (second signed range)", () => {
    const { copy } = tamper(signed, "/Location (Estuary", "e");
    const out = pdfsig(copy, "tampered-2.pdf");
    expect(out).not.toContain("Signature is Valid");
    expect(out).toContain("Digest Mismatch");
    expect(inspectSignedPdf(copy)!.signedDigestOk).toBe(false);
  });
  it("bytes appended after signing are reported as not covered", () => {
    const r = inspectSignedPdf(Buffer.concat([signed, Buffer.from("\n% appended\n")]))!;
    expect(r.digestMatches).toBe(true);
    expect(r.coversWholeFile).toBe(false);
  });
  it("the hash of the file changes with any byte", () => {
    const copy = Buffer.from(signed);
    copy[copy.length - 3] ^= 0x20;
    expect(sha256Hex(copy)).not.toBe(sha256Hex(signed));
  });
});

describe("certificates", () => {
  it("a wrong passphrase is refused with a message for the uploader", () => {
    expect(() => readP12(cert.p12, "not-the-passphrase")).toThrow(CertificateError);
  });
  it("the demo certificate is valid from now for about three years", () => {
    const d = readP12(cert.p12, cert.passphrase);
    expect(d.validFrom.getTime()).toBeLessThanOrEqual(Date.now());
    const years = (d.validTo.getTime() - d.validFrom.getTime()) / (365 * 86_400_000);
    expect(years).toBeGreaterThan(2.9);
    expect(years).toBeLessThan(3.1);
    expect(d.fingerprintSha256).toMatch(/^[0-9a-f]{64}$/);
  });
});
