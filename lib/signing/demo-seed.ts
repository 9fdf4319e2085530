import type { Db, Tx } from "@/db/client";
import { recordAudit } from "@/db/queries/audit";
import { activateCertificate, activeCertificateWithKey, insertSigningCertificate, type CertificateSummary } from "@/db/queries/statements";
import { organisations } from "@/db/schema";
import { eq } from "drizzle-orm";
import { readP12 } from "./certificate";
import { createDemoCertificate } from "./demo-certificate";
import { sealPassphrase } from "./passphrase-crypto";

/**
 * Gives an organisation a self-signed signing certificate when it has no active one, so the
 * demo can be signed end to end without an administrator uploading a PKCS#12 first. Real
 * organisations upload theirs on Settings → Signing. Idempotent: an active certificate is kept.
 */
export async function ensureDemoCertificate(tx: Db | Tx, organisationId: string): Promise<CertificateSummary | null> {
  if (await activeCertificateWithKey(tx, organisationId)) return null;
  const [org] = await tx.select({ name: organisations.name }).from(organisations).where(eq(organisations.id, organisationId));
  if (!org) throw new Error(`organisation ${organisationId} does not exist`);
  const demo = createDemoCertificate({ commonName: `${org.name} statements (demo)`, organisation: org.name });
  const details = readP12(demo.p12, demo.passphrase);
  const created = await insertSigningCertificate(tx, {
    organisationId,
    label: "Demo certificate (self-signed)",
    p12: demo.p12,
    passphraseSealed: sealPassphrase(demo.passphrase, details.fingerprintSha256),
    subject: details.subject,
    fingerprintSha256: details.fingerprintSha256,
    validFrom: details.validFrom,
    validTo: details.validTo,
  });
  await activateCertificate(tx, organisationId, created.id);
  await recordAudit(tx, {
    organisationId,
    actorLabel: "demo seed",
    channel: "seed",
    action: "certificate.added",
    entity: "signing_certificate",
    entityId: created.id,
    after: { label: created.label, subject: created.subject, fingerprint: created.fingerprintSha256, active: true },
  });
  return { ...created, active: true };
}
