import { ZodError } from "zod";
import { getDb } from "@/db";
import { listStreamsOfSite } from "@/db/queries/api-reads";
import { HttpError, zodIssues } from "@/lib/auth/errors";
import { editorOf } from "@/lib/api/actor";
import { readBodyText } from "@/lib/api/body";
import { planImport } from "@/lib/api/plant-month-import";
import { v1Route } from "@/lib/api/route";
import { periodParam, requireSite } from "@/lib/api/site-month";
import { saveMonthFigures } from "@/lib/ledger/save-month";

type Params = { siteId: string; month: string };

/**
 * POST /api/v1/sites/{siteId}/months/{month}/import: a plant-month file (the export format) as
 * the body. Its readings and analyses are saved in one transaction; readings of streams the file
 * leaves out stay as they are. `?expectedVersion=N` guards against overwriting someone's save.
 */
export const POST = v1Route<Params>({ permission: "month:enter", what: "import monthly figures" }, async (req, caller, { siteId, month }) => {
  const period = periodParam(month);
  const site = await requireSite(caller, siteId);
  const raw = new URL(req.url).searchParams.get("expectedVersion");
  if (raw !== null && !/^\d{1,9}$/.test(raw)) throw new HttpError(400, "invalid_input", "expectedVersion must be a whole number.", [{ path: "expectedVersion", message: "must be a whole number ≥ 0" }]);
  const text = await readBodyText(req);
  const db = getDb();
  const streams = await listStreamsOfSite(db, site.id);
  // Without expectedVersion the file is saved over whatever version is current when the month is locked.
  const plan = planImport(text, period, site, streams, raw !== null ? Number(raw) : 0);
  try {
    const saved = await saveMonthFigures(db, editorOf(caller, "import"), site.id, period, plan.input, { againstCurrentVersion: raw === null });
    return Response.json({ month: period, version: saved.version, changed: saved.changed, readings: plan.input.readings?.length ?? 0, analyses: plan.input.analyses?.length ?? 0 });
  } catch (err) {
    // Issues are reported in the file's own terms, so the sender can find the line to fix.
    if (err instanceof HttpError) throw new HttpError(err.status, err.code, err.message, err.issues.map((i) => ({ ...i, path: plan.filePath(i.path) })));
    if (err instanceof ZodError) {
      throw new HttpError(400, "invalid_input", "Some figures in the file need attention; nothing was saved.", zodIssues(err.issues).map((i) => ({ ...i, path: plan.filePath(i.path) })));
    }
    throw err;
  }
});
