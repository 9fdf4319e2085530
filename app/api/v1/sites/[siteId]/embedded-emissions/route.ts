import { getDb } from "@/db";
import { HttpError, notFound, quoted } from "@/lib/auth/errors";
import { v1Route } from "@/lib/api/route";
import { loadSiteRuns } from "@/lib/ledger/site-period";
import { buildCommunication, monthsBetween } from "@/lib/ledger/cbam-communication";
import { currentMonthKey, isMonthKey, previousMonth } from "@/lib/period";

type Params = { siteId: string };

const bad = (path: string, message: string) => new HttpError(400, "invalid_input", `The ${path} parameter is not valid: ${message}.`, [{ path, message }]);
const MAX_MONTHS = 36;

/**
 * GET /api/v1/sites/{siteId}/embedded-emissions?from=YYYY-MM&to=YYYY-MM[&shipped_t=…]: the
 * communication of embedded emissions to importers (synledger.cbam-communication/1, JSON Schema at
 * /api/v1/schemas/cbam-communication.json) for the months given; by default this calendar year's
 * months that have ended. Months not yet ended are never counted. Nothing is written.
 */
export const GET = v1Route<Params>({ permission: "org:read", what: "read embedded emissions" }, async (req, caller, { siteId }) => {
  const q = new URL(req.url).searchParams;
  const now = new Date();
  const lastEnded = previousMonth(currentMonthKey(now));
  const from = q.get("from") ?? `${lastEnded.slice(0, 4)}-01`;
  const to = q.get("to") ?? lastEnded;
  if (!isMonthKey(from)) throw bad("from", `${quoted(from)} is not a month; write it as YYYY-MM`);
  if (!isMonthKey(to)) throw bad("to", `${quoted(to)} is not a month; write it as YYYY-MM`);
  if (from > to) throw bad("to", `${to} is before from (${from})`);
  if (to > lastEnded) throw bad("to", `${to} has not ended; the last ended month is ${lastEnded}`);
  if (monthsBetween(from, to).length > MAX_MONTHS) throw bad("to", `at most ${MAX_MONTHS} months at a time`);
  const shipped = q.get("shipped_t");
  if (shipped !== null && !/^\d{1,12}(\.\d{1,6})?$/.test(shipped)) throw bad("shipped_t", "a quantity in tonnes, e.g. 25000 or 25000.5");
  const loaded = await loadSiteRuns(getDb(), caller.organisationId, siteId, monthsBetween(from, to));
  if (!loaded) throw notFound("The site");
  const doc = buildCommunication({
    organisation: caller.kind === "session" ? caller.actor.organisationName : "",
    site: { id: loaded.site.id, code: loaded.site.code, name: loaded.site.name, installation: loaded.site.installation ?? null },
    from, to, runs: loaded.runs, shippedT: shipped, preparedAt: now,
  });
  return Response.json(doc, { headers: { "Cache-Control": "private, no-store" } });
});
