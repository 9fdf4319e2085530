import { getDb } from "@/db";
import { editorOf } from "@/lib/api/actor";
import { readJsonBody } from "@/lib/api/body";
import { v1Route } from "@/lib/api/route";
import { periodParam } from "@/lib/api/site-month";
import { setMonthMethod } from "@/lib/ledger/month-method";
import { monthMethodSchema } from "@/lib/validations/month-method";

type Params = { siteId: string; month: string };

/**
 * PUT /api/v1/sites/{siteId}/months/{month}/method: the month's emissions method, factor set and
 * GWP set, `{ "emissions", "factor_set", "gwp", "expectedVersion" }`. Environmental officers and
 * administrators; 409 once the month is In review, Signed or Submitted, or on a stale version.
 */
export const PUT = v1Route<Params>({ permission: "month:method", what: "choose the month's method and factor set" }, async (req, caller, { siteId, month }) => {
  const period = periodParam(month);
  const input = await readJsonBody(req, monthMethodSchema, ["expectedVersion"]);
  // v1Route refuses tokens here (no `token` rule), so the caller is a person.
  const who = editorOf(caller);
  const out = await setMonthMethod(getDb(), { organisationId: who.organisationId, userId: who.userId!, name: who.label, channel: who.channel }, siteId, period, input);
  return Response.json({ month: period, version: out.version, changed: out.changed, method: out.method });
});
