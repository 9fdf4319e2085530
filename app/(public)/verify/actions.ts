"use server";

import { headers } from "next/headers";
import { getDb } from "@/db";
import type { ActionResult } from "@/lib/auth/guard";
import { verificationAnswer, type VerificationAnswer } from "@/lib/lifecycle/verification-answer";
import { clientAddressOf } from "@/lib/net/forwarded";
import { countRequest, VERIFY_LIMIT } from "@/lib/net/rate-limit";
import { verifyStatementPdf } from "@/lib/signing/verify";

/** Statements are a few hundred kilobytes; server actions take bodies up to 1 MB (next.config), larger files belong to the API. */
const MAX_BYTES = 1024 * 1024;

/**
 * The verify page's form action: the same public check as POST /api/v1/verify, without an
 * account, counted against the caller's address like the API (30 a minute). The file is read,
 * hashed and forgotten, never stored.
 */
export async function verifyAction(_prev: ActionResult<VerificationAnswer> | null, formData: FormData): Promise<ActionResult<VerificationAnswer>> {
  const h = await headers();
  const rate = await countRequest(getDb(), VERIFY_LIMIT.bucket, clientAddressOf(h), VERIFY_LIMIT.perMinute);
  if (!rate.allowed) {
    return { ok: false, message: `Too many checks from your address this minute (the limit is ${rate.limit}); try again in ${rate.retryAfterSeconds} seconds.` };
  }
  const file = formData.get("file");
  if (!(file instanceof Blob) || file.size === 0) return { ok: false, message: "Choose a PDF file first.", errors: { file: "required" } };
  if (file.size > MAX_BYTES) return { ok: false, message: "The file is larger than 1 MB; check it with POST /api/v1/verify, which takes up to 20 MB.", errors: { file: "too large" } };
  const pdf = Buffer.from(await file.arrayBuffer());
  const verdict = await verifyStatementPdf(getDb(), { anyOrganisation: true }, pdf);
  return { ok: true, data: verificationAnswer(verdict), message: file instanceof File ? file.name : "uploaded file" };
}
