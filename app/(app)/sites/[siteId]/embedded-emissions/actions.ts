"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db";
import { HttpError } from "@/lib/auth/errors";
import { guardedAction, type ActionResult } from "@/lib/auth/guard";
import { signCommunication } from "@/lib/lifecycle/sign-cbam";
import { communicationPeriod } from "@/lib/ledger/cbam-communication";

/** The signatory signs the communication of embedded emissions for the period the officer prepared. */
export async function signCommunicationAction(_prev: ActionResult<{ id: string }> | null, form: FormData): Promise<ActionResult<{ id: string }>> {
  const siteId = String(form.get("siteId") ?? "");
  const result = await guardedAction<{ id: string }>("month:sign", "sign communications of embedded emissions", async (actor) => {
    const p = communicationPeriod(String(form.get("from") ?? ""), String(form.get("to") ?? ""), String(form.get("shipped_t") ?? "") || null);
    if (!p.ok) throw new HttpError(400, "invalid_input", p.message, [{ path: p.path, message: p.message }]);
    const issued = await signCommunication(getDb(), actor, siteId, p.from, p.to, p.shippedT);
    return { ok: true, message: `Signed: the communication of embedded emissions, ${p.from} to ${p.to}.`, data: { id: issued.id } };
  });
  if (result.ok) revalidatePath(`/sites/${siteId}/embedded-emissions`);
  return result;
}
