import { getDb } from "@/db";
import { listBatches, listMappings } from "@/db/queries/imports";
import { findSite } from "@/db/queries/sites";
import { notFound } from "@/lib/auth/errors";
import { personOf, v1Route } from "@/lib/api/route";

/** GET → the site's recent import batches and its saved column mappings. */
export const GET = v1Route<{ siteId: string }>({ permission: "org:read", what: "see imports" }, async (_req, caller, { siteId }) => {
  const actor = personOf(caller);
  const db = getDb();
  const site = await findSite(db, actor.organisationId, siteId);
  if (!site) throw notFound("The site");
  const [batches, mappings] = await Promise.all([listBatches(db, site.id, 50), listMappings(db, site.id)]);
  return Response.json({ batches, mappings });
});
