import { getDb } from "@/db";
import { listBatches, listMappings } from "@/db/queries/imports";
import { findSite } from "@/db/queries/sites";
import { notFound } from "@/lib/auth/errors";
import { apiRoute } from "@/lib/auth/guard";

/** GET → the site's recent import batches and its saved column mappings. */
export const GET = apiRoute<{ siteId: string }>("org:read", "see imports", async (_req, actor, { siteId }) => {
  const db = getDb();
  const site = await findSite(db, actor.organisationId, siteId);
  if (!site) throw notFound("The site");
  const [batches, mappings] = await Promise.all([listBatches(db, site.id, 50), listMappings(db, site.id)]);
  return Response.json({ batches, mappings });
});
