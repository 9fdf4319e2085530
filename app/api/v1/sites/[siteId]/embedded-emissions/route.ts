import { getDb } from "@/db";
import { HttpError, notFound } from "@/lib/auth/errors";
import { v1Route } from "@/lib/api/route";
import { loadSiteRuns } from "@/lib/ledger/site-period";
import { monthsBetween } from "@/lib/period";
import { buildCommunication, communicationPeriod } from "@/lib/ledger/cbam-communication";

type Params = { siteId: string };

/**
 * GET /api/v1/sites/{siteId}/embedded-emissions?from=YYYY-MM&to=YYYY-MM[&shipped_t=…]: the
 * communication of embedded emissions to importers (synledger.cbam-communication/1, JSON Schema at
 * /api/v1/schemas/cbam-communication.json) for the months given, as a draft (unsigned); by default
 * this calendar year's months that have ended. Months not yet ended are never counted. Nothing is written.
 */
export const GET = v1Route<Params>({ permission: "org:read", what: "read embedded emissions" }, async (req, caller, { siteId }) => {
  const q = new URL(req.url).searchParams;
  const now = new Date();
  const p = communicationPeriod(q.get("from"), q.get("to"), q.get("shipped_t"), now);
  if (!p.ok) throw new HttpError(400, "invalid_input", `The ${p.path} parameter is not valid: ${p.message}.`, [{ path: p.path, message: p.message }]);
  const loaded = await loadSiteRuns(getDb(), caller.organisationId, siteId, monthsBetween(p.from, p.to));
  if (!loaded) throw notFound("The site");
  const doc = buildCommunication({
    organisation: caller.kind === "session" ? caller.actor.organisationName : "",
    site: { id: loaded.site.id, code: loaded.site.code, name: loaded.site.name, installation: loaded.site.installation ?? null },
    from: p.from, to: p.to, runs: loaded.runs, shippedT: p.shippedT, preparedAt: now,
  });
  return Response.json(doc, { headers: { "Cache-Control": "private, no-store" } });
});
