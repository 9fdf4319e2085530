import { getDb } from "@/db";
import { editorOf } from "@/lib/api/actor";
import { readJsonBody } from "@/lib/api/body";
import { tokenRefused, v1Route } from "@/lib/api/route";
import { monthView, periodParam, requireBundle } from "@/lib/api/site-month";
import { saveMonthFigures } from "@/lib/ledger/save-month";
import { monthFiguresSchema } from "@/lib/validations/month";

type Params = { siteId: string; month: string };

/** GET /api/v1/sites/{siteId}/months/{month}: readings, analyses, state and the version to save against. */
export const GET = v1Route<Params>({ permission: "org:read", what: "see monthly figures" }, async (_req, caller, { siteId, month }) => {
  return Response.json(monthView(await requireBundle(caller, siteId, month), month));
});

/**
 * PUT /api/v1/sites/{siteId}/months/{month}: the month's figures as the entry form sends them.
 * A site token may use it for readings only (no analyses, removals or notes).
 */
export const PUT = v1Route<Params>(
  { permission: "month:enter", what: "enter monthly figures", token: "write-readings" },
  async (req, caller, { siteId, month }) => {
    const period = periodParam(month);
    const input = await readJsonBody(req, monthFiguresSchema, ["expectedVersion"]);
    if (caller.kind === "token" && (input.analyses.length || input.removeReadings.length || input.balanceNote !== undefined)) {
      throw tokenRefused("send readings only (no analyses, removeReadings or balanceNote)");
    }
    const saved = await saveMonthFigures(getDb(), editorOf(caller), siteId, period, input);
    return Response.json({ month: period, version: saved.version, changed: saved.changed });
  },
);
