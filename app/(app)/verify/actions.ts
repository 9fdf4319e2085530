"use server";

import { getDb } from "@/db";
import { HttpError } from "@/lib/auth/errors";
import { guardedAction, type ActionResult } from "@/lib/auth/guard";
import { verificationAnswer, type VerificationAnswer } from "@/lib/lifecycle/verification-answer";
import { verifyStatementPdf } from "@/lib/signing/verify";

/**
 * The verify page's form action: the same check as POST /api/v1/verify, as a server action so
 * the page works before (or without) JavaScript. Server actions accept bodies up to 1 MB by
 * default, well above a statement's size; larger files belong to the API.
 */
export async function verifyAction(_prev: ActionResult<VerificationAnswer> | null, formData: FormData): Promise<ActionResult<VerificationAnswer>> {
  return guardedAction<VerificationAnswer>("org:read", "verify statements", async (actor) => {
    const file = formData.get("file");
    if (!(file instanceof Blob) || file.size === 0) throw new HttpError(400, "invalid_input", "Choose a PDF file first.", [{ path: "file", message: "required" }]);
    const pdf = Buffer.from(await file.arrayBuffer());
    const verdict = await verifyStatementPdf(getDb(), { organisationId: actor.organisationId }, pdf);
    return { ok: true, data: verificationAnswer(verdict), message: file instanceof File ? file.name : "uploaded file" };
  });
}
