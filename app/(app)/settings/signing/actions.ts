"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { getDb } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { activateCertificate, listCertificates } from "@/db/queries/statements";
import { HttpError } from "@/lib/auth/errors";
import { guardedAction, type ActionResult } from "@/lib/auth/guard";
import { CertificateError } from "@/lib/signing/certificate";
import { registerCertificate } from "@/lib/signing/issue";

const PAGE = "/settings/signing";
const MAX_P12_BYTES = 256 * 1024;

const uploadSchema = z.object({
  label: z.string().trim().min(2, "give the certificate a name you will recognise").max(120),
  passphrase: z.string().min(1, "enter the passphrase of the PKCS#12 file").max(1000),
  activate: z.enum(["on"]).optional(),
});

/** Administrator uploads a PKCS#12; it is checked to open and to hold a matching key before it is stored. */
export async function uploadCertificate(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const result = await guardedAction<undefined>("site:manage", "manage the signing certificate", async (actor) => {
    const input = uploadSchema.parse({ label: formData.get("label"), passphrase: formData.get("passphrase"), activate: formData.get("activate") ?? undefined });
    const file = formData.get("p12");
    if (!(file instanceof Blob) || file.size === 0) throw new HttpError(400, "invalid_input", "Choose a PKCS#12 file (.p12 or .pfx).", [{ path: "p12", message: "choose a .p12 or .pfx file" }]);
    if (file.size > MAX_P12_BYTES) throw new HttpError(400, "invalid_input", "That file is too large for a PKCS#12 bundle.", [{ path: "p12", message: "at most 256 KB" }]);
    try {
      const cert = await registerCertificate(getDb(), {
        organisationId: actor.organisationId,
        label: input.label,
        p12: Buffer.from(await file.arrayBuffer()),
        passphrase: input.passphrase,
        activate: input.activate === "on",
        actor: { userId: actor.userId, name: actor.name },
      });
      return { ok: true, message: `Stored “${cert.label}” (${cert.subject})${cert.active ? "; it now signs new statements" : ""}.` };
    } catch (err) {
      if (err instanceof CertificateError) return { ok: false, message: err.message, errors: { p12: err.message } };
      throw err;
    }
  });
  if (result.ok) revalidatePath(PAGE);
  return result;
}

/** Makes another stored certificate the one that signs; statements already signed keep theirs. */
export async function activate(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const result = await guardedAction<undefined>("site:manage", "manage the signing certificate", async (actor) => {
    const id = String(formData.get("certificateId") ?? "");
    const db = getDb();
    const cert = (await listCertificates(db, actor.organisationId)).find((c) => c.id === id);
    if (!cert) return { ok: false, message: "That certificate is not one of your organisation's; reload the page." };
    if (cert.validTo < new Date()) return { ok: false, message: "That certificate has expired and cannot sign." };
    await db.transaction(async (tx) => {
      await activateCertificate(tx, actor.organisationId, cert.id);
      await recordAudit(tx, {
        organisationId: actor.organisationId,
        actorUserId: actor.userId,
        actorLabel: actor.name,
        channel: "form",
        action: "certificate.activated",
        entity: "signing_certificate",
        entityId: cert.id,
        after: { label: cert.label, fingerprint: cert.fingerprintSha256 },
      });
    });
    return { ok: true, message: `“${cert.label}” now signs new statements.` };
  });
  if (result.ok) revalidatePath(PAGE);
  return result;
}
