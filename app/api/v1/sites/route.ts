import { getDb } from "@/db";
import { listSiteDetails } from "@/db/queries/api-reads";
import { v1Route } from "@/lib/api/route";
import { encodeSiteCursor, sitePageOf } from "@/lib/api/site-page";

/**
 * GET /api/v1/sites: the organisation's active sites by name, a page at a time (`limit`, default
 * 100, at most 500); `next` is the `after` of the following page, null on the last one.
 */
export const GET = v1Route({ permission: "org:read", what: "see the sites" }, async (req, caller) => {
  const page = sitePageOf(new URL(req.url).searchParams);
  const { sites, more } = await listSiteDetails(getDb(), caller.organisationId, page.limit, page.after);
  const last = sites.at(-1);
  return Response.json({ sites, next: more && last ? encodeSiteCursor(last) : null });
});
