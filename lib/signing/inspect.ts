import { createHash } from "node:crypto";
import forge from "node-forge";
import { certificateFingerprint, subjectText } from "./certificate";

export interface SignatureInspection {
  /** [start1, length1, start2, length2] as the signature dictionary states them. */
  byteRange: [number, number, number, number];
  /** messageDigest equals the hash of the signed ranges AND the RSA signature over the signed attributes holds. */
  signedDigestOk: boolean;
  /** The two halves separately, so a report can say which failed. */
  digestMatches: boolean;
  signatureValid: boolean;
  signerSubject: string | null;
  certificateFingerprint: string | null;
  signingTime: Date | null;
  /** The ranges start at 0, end at the last byte and leave out only the signature's hex string. */
  coversWholeFile: boolean;
  /** Why something could not be checked (unreadable PKCS#7, unsupported digest …). */
  problem: string | null;
}

const BYTE_RANGE = /\/ByteRange\s*\[\s*(\d+)\s+(\d+)\s+(\d+)\s+(\d+)\s*\]/g;
const CONTENTS_HEX = /\/Contents\s*<([0-9A-Fa-f\s]+)>/g;

const DIGESTS: Record<string, string> = {
  [forge.pki.oids.sha256]: "sha256",
  [forge.pki.oids.sha384]: "sha384",
  [forge.pki.oids.sha512]: "sha512",
};

function last<T>(items: T[]): T | undefined {
  return items[items.length - 1];
}

/**
 * The DER PKCS#7 of the last signature, or null when the file has none. Reads the hex string
 * the ByteRange leaves out; without a usable ByteRange it falls back to the last /Contents hex,
 * so a copy whose dictionary was damaged still shows whose certificate it carries.
 */
export function extractPkcs7(pdf: Buffer): Buffer | null {
  const text = pdf.toString("latin1");
  const range = last([...text.matchAll(BYTE_RANGE)]);
  let hex: string | undefined;
  if (range) {
    const [b, c] = [Number(range[2]), Number(range[3])];
    if (c > b + 1 && c <= pdf.length && text[b] === "<" && text[c - 1] === ">") hex = text.slice(b + 1, c - 1);
  }
  hex ??= last([...text.matchAll(CONTENTS_HEX)])?.[1];
  if (!hex) return null;
  hex = hex.replace(/\s+/g, "");
  if (!/^[0-9A-Fa-f]*$/.test(hex) || hex.length % 2) return null;
  // The placeholder is zero-padded; DER says its own length, so trailing zeros are harmless.
  return Buffer.from(hex, "hex");
}

function attribute(attrs: forge.asn1.Asn1[], oid: string): forge.asn1.Asn1 | undefined {
  for (const attr of attrs) {
    const parts = attr.value as forge.asn1.Asn1[];
    if (forge.asn1.derToOid(parts[0].value as string) === oid) return (parts[1].value as forge.asn1.Asn1[])[0];
  }
  return undefined;
}

function readTime(node: forge.asn1.Asn1 | undefined): Date | null {
  if (!node) return null;
  const v = node.value as string;
  return node.type === forge.asn1.Type.UTCTIME ? forge.asn1.utcTimeToDate(v) : forge.asn1.generalizedTimeToDate(v);
}

/**
 * Checks the last signature of a PDF the way a verifier would, without trusting its chain:
 * (1) SHA-256 of the two signed ranges equals the messageDigest signed attribute, and
 * (2) the signature over the DER of the signed attributes verifies with the embedded
 * certificate's public key. Returns null when the file carries no signature at all.
 */
export function inspectSignedPdf(pdf: Buffer): SignatureInspection | null {
  const text = pdf.toString("latin1");
  const range = last([...text.matchAll(BYTE_RANGE)]);
  const der = extractPkcs7(pdf);
  if (!range && !der) return null;
  const byteRange = (range ? range.slice(1, 5).map(Number) : [0, 0, 0, 0]) as SignatureInspection["byteRange"];
  const [a, b, c, d] = byteRange;
  const result: SignatureInspection = {
    byteRange,
    signedDigestOk: false,
    digestMatches: false,
    signatureValid: false,
    signerSubject: null,
    certificateFingerprint: null,
    signingTime: null,
    coversWholeFile: !!range && a === 0 && b < c && c + d === pdf.length,
    problem: null,
  };
  if (!range) result.problem = "The signature dictionary has no readable /ByteRange.";
  if (!der) return { ...result, problem: "The signature's /Contents could not be read." };

  let p7: forge.pkcs7.PkcsSignedData & { rawCapture: Record<string, unknown> };
  try {
    // parseAllBytes off: the zero padding after the DER is expected (the types only know `strict`).
    const fromDer = forge.asn1.fromDer as unknown as (b: forge.util.ByteBuffer, o: { parseAllBytes: boolean }) => forge.asn1.Asn1;
    const asn1 = fromDer(forge.util.createBuffer(der.toString("binary")), { parseAllBytes: false });
    p7 = forge.pkcs7.messageFromAsn1(asn1) as typeof p7;
  } catch (err) {
    return { ...result, problem: `The PKCS#7 signature cannot be read (${err instanceof Error ? err.message : "unknown error"}).` };
  }
  const cap = p7.rawCapture;
  const signers = (cap.signerInfos as unknown[] | undefined) ?? [];
  const serial = typeof cap.serial === "string" ? forge.util.bytesToHex(cap.serial) : "";
  const cert = p7.certificates.find((x) => x.serialNumber.replace(/^0+/, "") === serial.replace(/^0+/, "")) ?? p7.certificates[0];
  if (cert) {
    result.signerSubject = subjectText(cert);
    result.certificateFingerprint = certificateFingerprint(cert);
  }
  const attrs = cap.authenticatedAttributes as forge.asn1.Asn1[] | undefined;
  if (signers.length !== 1 || !attrs || !cert) {
    return { ...result, problem: "Expected exactly one signer with signed attributes and its certificate." };
  }
  result.signingTime = readTime(attribute(attrs, forge.pki.oids.signingTime));
  const digestName = DIGESTS[forge.asn1.derToOid(cap.digestAlgorithm as string)];
  if (!digestName) return { ...result, problem: "The signature uses a digest other than SHA-256/384/512." };

  const claimed = attribute(attrs, forge.pki.oids.messageDigest)?.value as string | undefined;
  if (range && c + d <= pdf.length) {
    const actual = createHash(digestName).update(pdf.subarray(a, a + b)).update(pdf.subarray(c, c + d)).digest("binary");
    result.digestMatches = claimed !== undefined && claimed === actual;
  }

  // The signature covers the signed attributes re-encoded as a SET (tag 0x31), not as the [0] they are stored under.
  const set = forge.asn1.create(forge.asn1.Class.UNIVERSAL, forge.asn1.Type.SET, true, attrs);
  const attrsHash = createHash(digestName).update(Buffer.from(forge.asn1.toDer(set).getBytes(), "binary")).digest("binary");
  try {
    result.signatureValid = (cert.publicKey as forge.pki.rsa.PublicKey).verify(attrsHash, cap.signature as string);
  } catch {
    result.signatureValid = false;
  }
  result.signedDigestOk = result.digestMatches && result.signatureValid;
  return result;
}
