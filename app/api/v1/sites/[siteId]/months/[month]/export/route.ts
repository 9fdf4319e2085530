import { getDb } from "@/db";
import { exportFileName } from "@/lib/api/month-file";
import { v1Route } from "@/lib/api/route";
import { requireStartedMonth } from "@/lib/api/site-month";
import { canonicalJson } from "@/lib/ledger/freeze";
import { runOfBundle } from "@/lib/ledger/month-runs";

type Params = { siteId: string; month: string };

/**
 * GET /api/v1/sites/{siteId}/months/{month}/export: the plant-month file as a download. A frozen
 * month gives the document it was frozen with, in its canonical form, byte for byte: the file's
 * SHA-256 is the one the signed statement prints (also in X-Synledger-Document-Sha256).
 */
export const GET = v1Route<Params>({ permission: "org:read", what: "export months" }, async (_req, caller, { siteId, month }) => {
  const b = await requireStartedMonth(caller, siteId, month);
  const run = await runOfBundle(getDb(), b, month);
  const body = run.frozen ? canonicalJson(run.document) : `${JSON.stringify(run.document, null, 2)}\n`;
  return new Response(body, {
    headers: {
      "Content-Type": "application/json; charset=utf-8",
      "Content-Disposition": `attachment; filename="${exportFileName(b.site.code, month)}"`,
      "Cache-Control": "private, no-store",
      "X-Synledger-Month-Version": String(b.month.version),
      ...(run.frozen ? { "X-Synledger-Document-Sha256": run.frozen.documentSha256 } : {}),
    },
  });
});
