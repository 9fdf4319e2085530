import { NextResponse } from "next/server";
import { getDb } from "@/db";
import { HttpError } from "@/lib/auth/errors";
import { publicRoute } from "@/lib/auth/guard";
import { clientAddressOf } from "@/lib/net/forwarded";
import { countRequest, VERIFY_LIMIT } from "@/lib/net/rate-limit";
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
 * Checks a PDF against every stored statement: issued, superseded (naming the revision that
 * replaced it), altered or unknown, with the explanation a verifier needs and the statement's
 * public facts only. Anyone holding a copy may ask, without an account; 30 requests a minute per
 * caller address (429 with Retry-After beyond). The file is read, hashed and forgotten.
 */
export const POST = publicRoute(async (req) => {
  const rate = await countRequest(getDb(), VERIFY_LIMIT.bucket, clientAddressOf(req.headers), VERIFY_LIMIT.perMinute);
  if (!rate.allowed) {
    return NextResponse.json(
      { error: { code: "rate_limited", message: `Too many verification requests from your address this minute (limit ${rate.limit}); try again in ${rate.retryAfterSeconds} s.` } },
      { status: 429, headers: { "Retry-After": String(rate.retryAfterSeconds) } },
    );
  }
  const pdf = await uploadedPdf(req);
  const verdict = await verifyStatementPdf(getDb(), { anyOrganisation: true }, pdf);
  return NextResponse.json(verificationAnswer(verdict), { headers: { "Cache-Control": "no-store" } });
});
