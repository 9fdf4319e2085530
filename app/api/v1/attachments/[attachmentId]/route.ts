import { getDb } from "@/db";
import { attachmentContent } from "@/db/queries/attachments";
import { notFound } from "@/lib/auth/errors";
import { personOf, v1Route } from "@/lib/api/route";
import { deleteAttachment } from "@/lib/attachments/service";

type Params = { attachmentId: string };

/** RFC 6266: a plain ASCII name for old clients, the exact UTF-8 name for the others. */
function disposition(name: string): string {
  const ascii = name.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(name)}`;
}

/**
 * GET → the file, always as a download with the type detected at upload. nosniff and a sandboxing
 * CSP keep a browser from ever running what it holds, whatever it contains.
 */
export const GET = v1Route<Params>({ permission: "org:read", what: "download attachments" }, async (_req, caller, { attachmentId }) => {
  const actor = personOf(caller);
  const file = await attachmentContent(getDb(), actor.organisationId, attachmentId);
  if (!file) throw notFound("The attachment");
  return new Response(new Uint8Array(file.content), {
    headers: {
      "content-type": file.mediaType === "text/csv" ? "text/csv; charset=utf-8" : file.mediaType,
      "content-length": String(file.content.length),
      "content-disposition": disposition(file.fileName),
      "x-content-type-options": "nosniff",
      "content-security-policy": "default-src 'none'; frame-ancestors 'none'; sandbox",
      "cache-control": "private, no-store",
      etag: `"${file.sha256}"`,
    },
  });
});

/** DELETE → by the uploader or an administrator, while the month is not signed. */
export const DELETE = v1Route<Params>({ permission: "org:read", what: "delete attachments" }, async (_req, caller, { attachmentId }) => {
  const actor = personOf(caller);
  await deleteAttachment(getDb(), actor, attachmentId);
  return new Response(null, { status: 204 });
});
