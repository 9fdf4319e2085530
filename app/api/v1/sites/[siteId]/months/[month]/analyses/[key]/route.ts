import { z } from "zod";
import { getDb } from "@/db";
import { HttpError } from "@/lib/auth/errors";
import { editorOf } from "@/lib/api/actor";
import { readJsonBody } from "@/lib/api/body";
import { v1Route } from "@/lib/api/route";
import { saveOne } from "@/lib/api/save-one";
import { periodParam } from "@/lib/api/site-month";
import { analysisInputSchema } from "@/lib/validations/month";

const bodySchema = analysisInputSchema.omit({ key: true }).extend({ expectedVersion: z.number().int().min(0).optional() });

type Params = { siteId: string; month: string; key: string };

/** PUT /api/v1/sites/{siteId}/months/{month}/analyses/{key}: adds or replaces one gas analysis. */
export const PUT = v1Route<Params>({ permission: "month:enter", what: "enter monthly figures" }, async (req, caller, { siteId, month, key }) => {
  const period = periodParam(month);
  const { expectedVersion, ...analysis } = await readJsonBody(req, bodySchema, ["expectedVersion"]);
  // The key comes from the path; checking it with the shared rule gives the same message as the form.
  const named = analysisInputSchema.shape.key.safeParse(key);
  if (!named.success) throw new HttpError(400, "invalid_input", "The analysis name in the path is not valid.", [{ path: "key", message: named.error.issues[0].message }]);
  const saved = await saveOne(getDb(), editorOf(caller), siteId, period, expectedVersion, { analyses: [{ ...analysis, key: named.data }] });
  return Response.json({ month: period, key: named.data, version: saved.version, changed: saved.changed });
});
