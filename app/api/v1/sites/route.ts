import { getDb } from "@/db";
import { listSiteDetails } from "@/db/queries/api-reads";
import { v1Route } from "@/lib/api/route";

/** GET /api/v1/sites: the organisation's active sites. */
export const GET = v1Route({ permission: "org:read", what: "see the sites" }, async (_req, caller) => {
  return Response.json({ sites: await listSiteDetails(getDb(), caller.organisationId) });
});
