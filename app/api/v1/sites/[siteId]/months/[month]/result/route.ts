import { HttpError } from "@/lib/auth/errors";
import { documentInput } from "@/lib/api/month-file";
import { v1Route } from "@/lib/api/route";
import { requireStartedMonth } from "@/lib/api/site-month";
import { toResultDocument } from "@/lib/balance/result";
import { calculateMonth } from "@/lib/ledger/calculate-month";

type Params = { siteId: string; month: string };

/**
 * GET /api/v1/sites/{siteId}/months/{month}/result: the engine's result document for the stored
 * figures. A month that cannot be computed yet (a stream without its analysis, say) is 422 with
 * the plant-month paths to complete, not a server error.
 */
export const GET = v1Route<Params>({ permission: "org:read", what: "see results" }, async (_req, caller, { siteId, month }) => {
  const b = await requireStartedMonth(caller, siteId, month);
  const run = calculateMonth(documentInput(b, month), b.site.closureTolerancePct);
  if (!run.ok) {
    throw new HttpError(
      422,
      "not_computable",
      `The stored figures of ${month} at ${b.site.name} cannot be computed yet; the issues name what to complete.`,
      run.issues.map((i) => ({ path: i.path, message: i.reason })),
    );
  }
  return Response.json({ state: b.month.state, revision: b.month.revision, version: b.month.version, result: toResultDocument(run.result) });
});
