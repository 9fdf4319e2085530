import { getDb } from "@/db";
import { findSite } from "@/db/queries/sites";
import { notFound } from "@/lib/auth/errors";
import { personOf, v1Route } from "@/lib/api/route";
import { readImportRequest } from "@/lib/import/analyse";
import { commitImport } from "@/lib/import/commit";
import { progressResponse } from "@/lib/import/progress-response";

/**
 * POST multipart (file, mapping, [confirmReplace=true]) → the file is validated again and written
 * in one transaction, or refused whole: 400 with every bad row, 409 `already_imported` (with the
 * date of the first import) or 409 `month_read_only` (naming the months).
 */
export const POST = v1Route<{ siteId: string }>({ permission: "month:enter", what: "import monthly figures" }, async (req, caller, { siteId }) => {
  const actor = personOf(caller);
  const db = getDb();
  if (!(await findSite(db, actor.organisationId, siteId))) throw notFound("The site");
  const request = await readImportRequest(req);
  return progressResponse(req, (emit) => commitImport(db, actor, siteId, request, emit));
});
