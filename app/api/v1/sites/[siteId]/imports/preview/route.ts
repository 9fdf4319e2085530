import { getDb } from "@/db";
import { findSite } from "@/db/queries/sites";
import { notFound } from "@/lib/auth/errors";
import { personOf, v1Route } from "@/lib/api/route";
import { analyseImport, readImportRequest } from "@/lib/import/analyse";
import { previewBody } from "@/lib/import/commit";
import { progressResponse } from "@/lib/import/progress-response";

/**
 * POST multipart (file, mapping, [confirmReplace]) → every bad row and cell, the monthly totals
 * the file would write beside the current ones, and whether this file was imported before.
 * Writes nothing. Send `Accept: application/x-ndjson` for progress lines.
 */
export const POST = v1Route<{ siteId: string }>({ permission: "month:enter", what: "import monthly figures" }, async (req, caller, { siteId }) => {
  const actor = personOf(caller);
  const db = getDb();
  // The site is checked before the upload is read, so another organisation's id costs nothing.
  if (!(await findSite(db, actor.organisationId, siteId))) throw notFound("The site");
  const request = await readImportRequest(req);
  return progressResponse(req, async (emit) => previewBody(request, await analyseImport(db, actor.organisationId, siteId, request, emit)));
});
