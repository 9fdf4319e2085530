import { z } from "zod";
import { getDb } from "@/db";
import { editorOf } from "@/lib/api/actor";
import { readJsonBody } from "@/lib/api/body";
import { saveOne } from "@/lib/api/save-one";
import { v1Route } from "@/lib/api/route";
import { periodParam } from "@/lib/api/site-month";
import { readingInputSchema } from "@/lib/validations/month";

const bodySchema = readingInputSchema.omit({ stream: true }).extend({
  /** Optional here: a plant system sending one total has nothing of anyone else's to overwrite. */
  expectedVersion: z.number().int().min(0).optional(),
});

type Params = { siteId: string; month: string; stream: string };

/** PUT /api/v1/sites/{siteId}/months/{month}/readings/{stream}: one monthly total, as plant systems send it. */
export const PUT = v1Route<Params>(
  { permission: "month:enter", what: "enter monthly figures", token: "write-readings" },
  async (req, caller, { siteId, month, stream }) => {
    const period = periodParam(month);
    const { expectedVersion, ...reading } = await readJsonBody(req, bodySchema, ["expectedVersion"]);
    const saved = await saveOne(getDb(), editorOf(caller), siteId, period, expectedVersion, { readings: [{ ...reading, stream }] });
    return Response.json({ month: period, stream, version: saved.version, changed: saved.changed });
  },
);
