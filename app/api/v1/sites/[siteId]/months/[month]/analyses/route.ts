import { v1Route } from "@/lib/api/route";
import { analysisView, requireBundle } from "@/lib/api/site-month";

type Params = { siteId: string; month: string };

/** GET /api/v1/sites/{siteId}/months/{month}/analyses: the month's gas compositions (mol %, dry). */
export const GET = v1Route<Params>({ permission: "org:read", what: "see monthly figures" }, async (_req, caller, { siteId, month }) => {
  const b = await requireBundle(caller, siteId, month);
  return Response.json({ month, version: b.month?.version ?? 0, analyses: b.analyses.map(analysisView) });
});
