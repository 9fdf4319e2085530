"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db";
import { guardedAction, type ActionResult } from "@/lib/auth/guard";
import { yearParam } from "@/lib/ledger/exports";
import { signAnnual } from "@/lib/lifecycle/sign-annual";

/** The signatory signs the year's annual statement (see sign-annual.ts for when that is allowed). */
export async function signAnnualStatementAction(_prev: ActionResult<{ id: string }> | null, form: FormData): Promise<ActionResult<{ id: string }>> {
  const siteId = String(form.get("siteId") ?? "");
  const year = String(form.get("year") ?? "");
  const result = await guardedAction<{ id: string }>("month:sign", "sign annual statements", async (actor) => {
    const issued = await signAnnual(getDb(), actor, siteId, yearParam(year));
    return { ok: true, message: `Signed: the annual statement of ${year}.`, data: { id: issued.id } };
  });
  if (result.ok) revalidatePath(`/sites/${siteId}/years/${year}`);
  return result;
}
