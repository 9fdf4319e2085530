import "server-only";
import { HttpError } from "@/lib/auth/errors";
import { formatBytes } from "./limits";

/** Room for the multipart boundaries and the small text fields sent beside the file. */
const FORM_OVERHEAD = 256 * 1024;

export const tooLarge = (what: string, size: number, limit: number) =>
  new HttpError(413, "too_large", `${what} is ${formatBytes(size)}; the limit is ${formatBytes(limit)}.`);

/**
 * Reads a request body into memory, refusing it once it passes `limit` bytes instead of
 * buffering whatever a client sends (Content-Length can be absent or wrong with chunked uploads).
 */
export async function readLimitedBytes(req: Request, limit: number, what = "The upload", shownLimit = limit): Promise<Buffer> {
  const declared = Number(req.headers.get("content-length") ?? "0");
  if (declared > limit) throw tooLarge(what, declared, shownLimit);
  const chunks: Uint8Array[] = [];
  let total = 0;
  if (req.body) {
    const reader = req.body.getReader();
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      total += value.byteLength;
      if (total > limit) {
        await reader.cancel();
        throw tooLarge(what, total, shownLimit);
      }
      chunks.push(value);
    }
  }
  return Buffer.concat(chunks);
}

/** Reads a multipart body within the limit (see readLimitedBytes). */
export async function readLimitedForm(req: Request, maxFileBytes: number): Promise<FormData> {
  const type = req.headers.get("content-type") ?? "";
  if (!type.toLowerCase().startsWith("multipart/form-data")) {
    throw new HttpError(415, "unsupported_media_type", "Send the file as multipart/form-data with a field named \"file\".");
  }
  const bytes = await readLimitedBytes(req, maxFileBytes + FORM_OVERHEAD, "The upload", maxFileBytes);
  try {
    return await new Response(new Uint8Array(bytes), { headers: { "content-type": type } }).formData();
  } catch {
    throw new HttpError(400, "invalid_input", "The multipart body could not be read.");
  }
}

/** The uploaded file of a form, its bytes and name, within the size limit. */
export async function formFile(form: FormData, maxBytes: number): Promise<{ name: string; type: string; bytes: Buffer }> {
  const file = form.get("file");
  if (!file || typeof file === "string") {
    throw new HttpError(400, "invalid_input", "No file in the upload.", [{ path: "file", message: "choose a file" }]);
  }
  if (file.size > maxBytes) throw tooLarge(`"${file.name}"`, file.size, maxBytes);
  if (file.size === 0) throw new HttpError(400, "invalid_input", `"${file.name}" is empty.`, [{ path: "file", message: "the file is empty" }]);
  return { name: file.name || "upload", type: file.type, bytes: Buffer.from(await file.arrayBuffer()) };
}
