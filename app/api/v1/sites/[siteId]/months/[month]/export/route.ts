import { documentInput, exportFileName } from "@/lib/api/month-file";
import { v1Route } from "@/lib/api/route";
import { requireStartedMonth } from "@/lib/api/site-month";
import { monthDocument } from "@/lib/ledger/month-document";

type Params = { siteId: string; month: string };

/** GET /api/v1/sites/{siteId}/months/{month}/export: the plant-month file as a download. */
export const GET = v1Route<Params>({ permission: "org:read", what: "export months" }, async (_req, caller, { siteId, month }) => {
  const b = await requireStartedMonth(caller, siteId, month);
  const body = `${JSON.stringify(monthDocument(documentInput(b, month)), null, 2)}\n`;
  return new Response(body, {
    headers: {
      "Content-Type": "application/json; charset=utf-8",
      "Content-Disposition": `attachment; filename="${exportFileName(b.site.code, month)}"`,
      "Cache-Control": "private, no-store",
      "X-Synledger-Month-Version": String(b.month.version),
    },
  });
});
