import { NextResponse } from "next/server";
import { getDb } from "@/db";
import { HttpError } from "@/lib/auth/errors";
import { apiRoute } from "@/lib/auth/guard";
import { verificationAnswer } from "@/lib/lifecycle/verification-answer";
import { readLimitedBytes, readLimitedForm } from "@/lib/import/read-multipart";
import { verifyStatementPdf } from "@/lib/signing/verify";

/** Statements are a few hundred kilobytes; anything far larger is not one of ours. */
const MAX_BYTES = 20 * 1024 * 1024;

/** The PDF from a multipart form (field "file") or a raw body, refused past the limit while reading. */
async function uploadedPdf(req: Request): Promise<Buffer> {
  const type = req.headers.get("content-type") ?? "";
  let bytes: Buffer;
  if (type.startsWith("multipart/form-data")) {
    const form = await readLimitedForm(req, MAX_BYTES);
    const file = form.get("file");
    if (!(file instanceof Blob)) throw new HttpError(400, "invalid_input", "Attach the PDF as the form field \"file\".", [{ path: "file", message: "required" }]);
    bytes = Buffer.from(await file.arrayBuffer());
  } else {
    bytes = await readLimitedBytes(req, MAX_BYTES, "The file");
  }
  if (bytes.length === 0) throw new HttpError(400, "invalid_input", "The file is empty.", [{ path: "file", message: "empty" }]);
  if (bytes.length > MAX_BYTES) throw new HttpError(413, "too_large", "The file is larger than 20 MB; a Synledger statement never is.");
  return bytes;
}

/**
 * Checks a PDF against the signed statements of the caller's organisation: issued, altered or
 * unknown, with the explanation a verifier needs. Any member may ask, auditors included; the
 * file is read, hashed and forgotten, never stored.
 */
export const POST = apiRoute("org:read", "verify statements", async (req, actor) => {
  const pdf = await uploadedPdf(req);
  const verdict = await verifyStatementPdf(getDb(), { organisationId: actor.organisationId }, pdf);
  return NextResponse.json(verificationAnswer(verdict));
});
