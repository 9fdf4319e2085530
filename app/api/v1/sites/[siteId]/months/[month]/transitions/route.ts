import { z } from "zod";
import { getDb } from "@/db";
import { editorOf } from "@/lib/api/actor";
import { readJsonBody } from "@/lib/api/body";
import { v1Route } from "@/lib/api/route";
import { periodParam } from "@/lib/api/site-month";
import { transitionMonth } from "@/lib/lifecycle/service";
import { TRANSITIONS } from "@/lib/lifecycle/transitions";
import { STATE_LABELS } from "@/lib/month-states";

type Params = { siteId: string; month: string };

const bodySchema = z.strictObject({
  transition: z.enum(TRANSITIONS),
  expectedVersion: z.number().int().min(0),
  reason: z.string().max(4000, "at most 4000 characters").optional(),
  reference: z.string().max(120).optional(),
  submittedOn: z.string().max(10).optional(),
  /** sign: the declaration made, and the keys of the unconfirmed values acknowledged one by one. */
  declaration: z.boolean().optional(),
  acknowledged: z.array(z.string().max(200)).max(200).optional(),
});

/**
 * POST /api/v1/sites/{siteId}/months/{month}/transitions: one life-cycle step, as the review page
 * takes it: `{ "transition", "expectedVersion", "reason"? … }`. The service checks role, state,
 * version and preconditions in one transaction (403, 409 stale or wrong state, 422 precondition)
 * and queues the notices; the answer is the month's new state and version. People only, no tokens.
 */
export const POST = v1Route<Params>({ permission: "org:read", what: "change the month's state" }, async (req, caller, { siteId, month }) => {
  const period = periodParam(month);
  const input = await readJsonBody(req, bodySchema, ["expectedVersion"]);
  // v1Route refuses tokens here (no `token` rule), so the caller is a person.
  if (caller.kind !== "session") throw new Error("unreachable: tokens are refused before the handler");
  const out = await transitionMonth(getDb(), { ...caller.actor, channel: editorOf(caller).channel }, { siteId, period, ...input });
  return Response.json({ month: period, state: out.state, label: STATE_LABELS[out.state], version: out.version, revision: out.revision, notified: out.notified, statementId: out.statementId ?? null });
});
