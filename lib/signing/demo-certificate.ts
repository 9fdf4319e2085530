import { generateKeyPairSync, randomBytes } from "node:crypto";
import forge from "node-forge";

export interface DemoCertificate {
  p12: Buffer;
  passphrase: string;
}

/**
 * A self-signed signing certificate for demos and tests. Real sites upload one from their
 * certificate authority; verifiers then see a trusted issuer instead of "unknown issuer".
 * Node's key generation is used because forge's pure-JS RSA takes seconds for 3072 bits.
 */
export function createDemoCertificate(input: {
  commonName: string;
  organisation: string;
  bits?: 2048 | 3072;
  validDays?: number;
  passphrase?: string;
}): DemoCertificate {
  const { privateKey: pem } = generateKeyPairSync("rsa", {
    modulusLength: input.bits ?? 3072,
    privateKeyEncoding: { type: "pkcs8", format: "pem" },
    publicKeyEncoding: { type: "spki", format: "pem" },
  });
  const key = forge.pki.privateKeyFromPem(pem) as forge.pki.rsa.PrivateKey;
  const cert = forge.pki.createCertificate();
  cert.publicKey = forge.pki.setRsaPublicKey(key.n, key.e);
  // A leading 01 keeps the serial a positive INTEGER whatever the random bytes are.
  cert.serialNumber = "01" + randomBytes(15).toString("hex");
  const now = new Date();
  cert.validity.notBefore = new Date(now.getTime() - 60_000);
  cert.validity.notAfter = new Date(now.getTime() + (input.validDays ?? 3 * 365) * 86_400_000);
  const subject = [
    { shortName: "CN", value: input.commonName },
    { shortName: "O", value: input.organisation },
    { shortName: "OU", value: "Greenhouse-gas statements" },
  ];
  cert.setSubject(subject);
  cert.setIssuer(subject);
  cert.setExtensions([
    { name: "basicConstraints", cA: false, critical: true },
    { name: "keyUsage", digitalSignature: true, nonRepudiation: true, critical: true },
    { name: "subjectKeyIdentifier" },
  ]);
  cert.sign(key, forge.md.sha256.create());

  const passphrase = input.passphrase ?? randomBytes(24).toString("base64url");
  // 3DES bags: the AES variant forge writes is not read back by every PDF signer.
  const asn1 = forge.pkcs12.toPkcs12Asn1(key, [cert], passphrase, {
    algorithm: "3des",
    friendlyName: input.commonName,
    generateLocalKeyId: true,
  });
  return { p12: Buffer.from(forge.asn1.toDer(asn1).getBytes(), "binary"), passphrase };
}
