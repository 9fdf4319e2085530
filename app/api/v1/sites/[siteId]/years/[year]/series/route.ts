import { getDb } from "@/db";
import { loadSiteSeries } from "@/lib/ledger/site-year";
import { notFound } from "@/lib/auth/errors";
import { v1Route } from "@/lib/api/route";
import { yearParam } from "@/lib/ledger/exports";

type Params = { siteId: string; year: string };

/**
 * GET /api/v1/sites/{siteId}/years/{year}/series: the year month by month (production,
 * intensities against benchmarks and the theoretical minimum, closures, H2:N2, suspect meters),
 * computed from the stored figures by the engine. Months nobody started are present with nulls,
 * so a chart keeps its twelve slots. Nothing is written.
 */
export const GET = v1Route<Params>({ permission: "org:read", what: "read yearly series" }, async (_req, caller, { siteId, year }) => {
  const series = await loadSiteSeries(getDb(), caller.organisationId, siteId, yearParam(year));
  if (!series) throw notFound("The site");
  return Response.json(series, { headers: { "Cache-Control": "private, no-store" } });
});
