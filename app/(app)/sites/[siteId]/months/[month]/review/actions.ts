"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { z } from "zod";
import { getDb } from "@/db";
import { guardedAction, type ActionResult } from "@/lib/auth/guard";
import { explainFlag } from "@/lib/ledger/flag-notes";
import { setMonthMethod } from "@/lib/ledger/month-method";
import { transitionMonth } from "@/lib/lifecycle/service";
import { TRANSITIONS } from "@/lib/lifecycle/transitions";
import { STATE_LABELS } from "@/lib/month-states";

const transitionSchema = z.object({
  siteId: z.string().min(1),
  period: z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/),
  transition: z.enum(TRANSITIONS),
  expectedVersion: z.coerce.number().int().min(0),
  reason: z.string().max(4000, "at most 4000 characters").optional(),
  reference: z.string().max(120).optional(),
  submittedOn: z.string().max(10).optional(),
  /** sign: the declaration checkbox ("yes" when ticked). */
  declaration: z.literal("yes").optional(),
});

/**
 * One life-cycle step from the review page. Role, state, version and preconditions are all
 * checked by the service inside its transaction; this only reads the form and names the outcome.
 */
export async function transitionAction(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const raw = Object.fromEntries([...formData.entries()].filter(([k, v]) => !k.startsWith("$") && typeof v === "string"));
  let notified = 0;
  const result = await guardedAction<undefined>("org:read", "change the month's state", async (actor) => {
    const { declaration, ...input } = transitionSchema.parse(raw);
    // One checkbox per unconfirmed value, each named "acknowledged": every ticked one arrives.
    const acknowledged = formData.getAll("acknowledged").filter((v): v is string => typeof v === "string" && v.length <= 200).slice(0, 200);
    const out = await transitionMonth(getDb(), actor, { ...input, declaration: declaration === "yes", acknowledged });
    notified = out.notified;
    const mail = out.notified ? ` ${out.notified} ${out.notified === 1 ? "person was" : "people were"} notified.` : "";
    return { ok: true, message: `Done: the month is now ${STATE_LABELS[out.state]} (revision ${out.revision}).${mail}` };
  });
  if (result.ok) {
    const siteId = encodeURIComponent(String(formData.get("siteId")));
    const period = encodeURIComponent(String(formData.get("period")));
    const transition = encodeURIComponent(String(formData.get("transition")));
    revalidatePath(`/sites/${siteId}/months/${period}/review`);
    revalidatePath("/statements");
    // The form that was used disappears with the old state, so the outcome travels in the URL.
    redirect(`/sites/${siteId}/months/${period}/review?done=${transition}&notified=${notified}`);
  }
  return result;
}

const methodFormSchema = z.object({
  siteId: z.string().min(1),
  period: z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/),
  emissions: z.string(),
  factor_set: z.string(),
  gwp: z.string(),
  expectedVersion: z.coerce.number().int().min(0),
});

/** The officer (or an administrator) chooses the month's method, factor set and GWP set on the review page. */
export async function setMonthMethodAction(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const raw = Object.fromEntries([...formData.entries()].filter(([k, v]) => !k.startsWith("$") && typeof v === "string"));
  const result = await guardedAction<undefined>("month:method", "choose the month's method and factor set", async (actor) => {
    const f = methodFormSchema.parse(raw);
    const out = await setMonthMethod(getDb(), { organisationId: actor.organisationId, userId: actor.userId, name: actor.name }, f.siteId, f.period, {
      emissions: f.emissions as never,
      factor_set: f.factor_set,
      gwp: f.gwp as never,
      expectedVersion: f.expectedVersion,
    });
    return { ok: true, message: out.changed ? "Saved: the month is computed with the new choice." : "Nothing changed." };
  });
  if (result.ok) revalidatePath(`/sites/${encodeURIComponent(String(formData.get("siteId")))}/months/${encodeURIComponent(String(formData.get("period")))}/review`);
  return result;
}

const explainSchema = z.object({
  siteId: z.string().min(1),
  period: z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/),
  code: z.string().min(1).max(120),
  stream: z.string().max(200).default(""),
  text: z.string().max(4000),
});

/** The engineer or the officer explains one flag of the month's current revision. */
export async function explainFlagAction(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const raw = Object.fromEntries([...formData.entries()].filter(([k, v]) => !k.startsWith("$") && typeof v === "string"));
  const result = await guardedAction<undefined>("month:explain", "explain flags", async (actor) => {
    const f = explainSchema.parse(raw);
    await explainFlag(getDb(), actor, f.siteId, f.period, { code: f.code, stream: f.stream, text: f.text });
    return { ok: true, message: "Explanation saved; it is printed with the flag on the statement." };
  });
  if (result.ok) revalidatePath(`/sites/${encodeURIComponent(String(formData.get("siteId")))}/months/${encodeURIComponent(String(formData.get("period")))}/review`);
  return result;
}
