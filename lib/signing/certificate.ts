import forge from "node-forge";
import { sha256Hex } from "./hash";

export interface CertificateDetails {
  subject: string;
  fingerprintSha256: string;
  validFrom: Date;
  validTo: Date;
}

/** "CN=…, O=…, OU=…" in the order the certificate lists them. */
export function subjectText(cert: forge.pki.Certificate): string {
  return cert.subject.attributes.map((a) => `${a.shortName ?? a.name ?? a.type}=${String(a.value)}`).join(", ");
}

/** SHA-256 over the certificate's DER: the same number verification computes from a PDF. */
export function certificateFingerprint(cert: forge.pki.Certificate): string {
  const der = forge.asn1.toDer(forge.pki.certificateToAsn1(cert)).getBytes();
  return sha256Hex(Buffer.from(der, "binary"));
}

/** Thrown when an uploaded PKCS#12 cannot be used for signing; the message is for the person uploading. */
export class CertificateError extends Error {}

/**
 * Opens a PKCS#12 with its passphrase and checks it can sign: one private key and the
 * certificate that matches it. Used when an administrator uploads a certificate.
 */
export function readP12(p12: Buffer, passphrase: string): CertificateDetails {
  let store: forge.pkcs12.Pkcs12Pfx;
  try {
    const asn1 = forge.asn1.fromDer(forge.util.createBuffer(p12.toString("binary")));
    store = forge.pkcs12.pkcs12FromAsn1(asn1, false, passphrase);
  } catch {
    throw new CertificateError("The file is not a PKCS#12 bundle, or the passphrase is wrong.");
  }
  const keyBags = store.getBags({ bagType: forge.pki.oids.pkcs8ShroudedKeyBag })[forge.pki.oids.pkcs8ShroudedKeyBag] ?? [];
  const certBags = store.getBags({ bagType: forge.pki.oids.certBag })[forge.pki.oids.certBag] ?? [];
  const key = keyBags[0]?.key as forge.pki.rsa.PrivateKey | undefined;
  if (!key) throw new CertificateError("The bundle holds no private key.");
  const cert = certBags
    .map((b) => b.cert)
    .find((c): c is forge.pki.Certificate => {
      const pub = c?.publicKey as forge.pki.rsa.PublicKey | undefined;
      return !!pub?.n && pub.n.equals(key.n) && pub.e.equals(key.e);
    });
  if (!cert) throw new CertificateError("No certificate in the bundle matches its private key.");
  return {
    subject: subjectText(cert),
    fingerprintSha256: certificateFingerprint(cert),
    validFrom: cert.validity.notBefore,
    validTo: cert.validity.notAfter,
  };
}
