import { v1Route } from "@/lib/api/route";
import { requireSite } from "@/lib/api/site-month";

/** GET /api/v1/sites/{siteId}: one site and its settings. */
export const GET = v1Route<{ siteId: string }>({ permission: "org:read", what: "see the sites" }, async (_req, caller, { siteId }) => {
  const s = await requireSite(caller, siteId);
  return Response.json({
    site: {
      id: s.id, name: s.name, code: s.code, meteringReference: s.meteringReference, closureTolerancePct: s.closureTolerancePct,
      emissionsMethod: s.emissionsMethod, factorSet: s.factorSet, gwp: s.gwp, archivedAt: s.archivedAt,
    },
  });
});
