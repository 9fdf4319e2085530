import { HttpError } from "@/lib/auth/errors";
import { v1Route } from "@/lib/api/route";
import { requireStartedMonth } from "@/lib/api/site-month";
import { getDb } from "@/db";
import { runOfBundle } from "@/lib/ledger/month-runs";

type Params = { siteId: string; month: string };

/**
 * GET /api/v1/sites/{siteId}/months/{month}/result: the engine's result document. For a month
 * In review, Signed or Submitted it is the document frozen with the revision (never computed
 * again), with the snapshot's digests; otherwise it is computed from the stored figures. A month
 * that cannot be computed yet is 422 with the plant-month paths to complete.
 */
export const GET = v1Route<Params>({ permission: "org:read", what: "see results" }, async (_req, caller, { siteId, month }) => {
  const b = await requireStartedMonth(caller, siteId, month);
  const run = await runOfBundle(getDb(), b, month);
  if (!run.ok) {
    throw new HttpError(
      422,
      "not_computable",
      `The stored figures of ${month} at ${b.site.name} cannot be computed yet; the issues name what to complete.`,
      run.issues.map((i) => ({ path: i.path, message: i.reason })),
    );
  }
  const frozen = run.frozen
    ? {
        snapshot_id: run.frozen.snapshotId,
        frozen_at: run.frozen.frozenAt,
        engine_version: run.frozen.engineVersion,
        document_sha256: run.frozen.documentSha256,
        result_sha256: run.frozen.resultSha256,
      }
    : null;
  return Response.json({ state: b.month.state, revision: b.month.revision, version: b.month.version, frozen, result: run.doc });
});
