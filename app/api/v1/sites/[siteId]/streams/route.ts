import { getDb } from "@/db";
import { listStreamsOfSite } from "@/db/queries/api-reads";
import { v1Route } from "@/lib/api/route";
import { requireSite } from "@/lib/api/site-month";

/** GET /api/v1/sites/{siteId}/streams: the metered streams; a site's token may read them to learn the keys. */
export const GET = v1Route<{ siteId: string }>(
  { permission: "org:read", what: "see the streams", token: "read-streams" },
  async (_req, caller, { siteId }) => {
    const site = await requireSite(caller, siteId);
    return Response.json({ site: { id: site.id, name: site.name }, streams: await listStreamsOfSite(getDb(), site.id) });
  },
);
