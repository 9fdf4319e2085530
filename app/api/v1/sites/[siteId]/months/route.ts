import { HttpError } from "@/lib/auth/errors";
import { getDb } from "@/db";
import { listMonthsOfSite } from "@/db/queries/api-reads";
import { v1Route } from "@/lib/api/route";
import { requireSite } from "@/lib/api/site-month";

/** GET /api/v1/sites/{siteId}/months?year=YYYY: the months on record with state, revision and version. */
export const GET = v1Route<{ siteId: string }>({ permission: "org:read", what: "see the months" }, async (req, caller, { siteId }) => {
  const site = await requireSite(caller, siteId);
  const year = new URL(req.url).searchParams.get("year") ?? String(new Date().getUTCFullYear());
  if (!/^\d{4}$/.test(year)) throw new HttpError(400, "invalid_input", `"${year}" is not a year.`, [{ path: "year", message: "must be a four-digit year, e.g. 2026" }]);
  const rows = await listMonthsOfSite(getDb(), site.id, year);
  return Response.json({
    site: { id: site.id, name: site.name },
    year,
    months: rows.map((m) => ({ month: m.period, state: m.state, revision: m.revision, version: m.version, updatedAt: m.updatedAt })),
  });
});
