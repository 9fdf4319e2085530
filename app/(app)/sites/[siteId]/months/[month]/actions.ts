"use server";

import { revalidatePath } from "next/cache";
import { monthEntryProps } from "@/components/month/month-entry-props";
import type { MonthFormValues } from "@/components/month/month-values";
import { getDb } from "@/db";
import { loadMonthBundle } from "@/db/queries/months";
import { HttpError, type IssueDetail } from "@/lib/auth/errors";
import { guardedAction, type ActionResult } from "@/lib/auth/guard";
import { saveMonthFigures } from "@/lib/ledger/save-month";
import type { MonthFiguresInput } from "@/lib/validations/month";

export type SaveMonthResult = ActionResult<{ version: number; changed: number }> & {
  /** "version_conflict", "month_read_only", "not_found", … when the save was refused. */
  code?: string;
  /** For a conflict: what changed since the editor's version, and by whom, in the service's words. */
  changes?: IssueDetail[];
};

/**
 * Saves the month form through the same service as the API and import (one transaction,
 * optimistic locking on expectedVersion, audit per change, channel "form"). Refusals come back
 * as data so the form keeps what the engineer typed.
 */
export async function saveMonthForm(
  siteId: string,
  period: string,
  figures: MonthFiguresInput,
): Promise<SaveMonthResult> {
  let refusal: HttpError | null = null;
  const result = await guardedAction("month:enter", "enter monthly figures", async (actor) => {
    try {
      const r = await saveMonthFigures(
        getDb(),
        {
          organisationId: actor.organisationId,
          userId: actor.userId,
          label: actor.name,
          channel: "form",
        },
        siteId,
        period,
        figures,
      );
      const message =
        r.changed === 0
          ? "Nothing had changed; the month is as you left it."
          : `Saved ${r.changed} change${r.changed === 1 ? "" : "s"}.`;
      return { ok: true, message, data: { version: r.version, changed: r.changed } };
    } catch (err) {
      if (err instanceof HttpError) refusal = err;
      throw err;
    }
  });
  if (result.ok) {
    revalidatePath(`/sites/${siteId}/months/${period}`);
    return result;
  }
  const e = refusal as HttpError | null;
  return e
    ? { ...result, code: e.code, ...(e.code === "version_conflict" ? { changes: e.issues } : {}) }
    : result;
}

/** The month as saved now, for "load their figures" after a conflict (any member may read it). */
export async function loadSavedMonth(
  siteId: string,
  period: string,
): Promise<ActionResult<{ version: number; initial: MonthFormValues }>> {
  return guardedAction("org:read", "read monthly figures", async (actor) => {
    const db = getDb();
    const bundle = await loadMonthBundle(db, actor.organisationId, siteId, period);
    if (!bundle) return { ok: false, message: "The site was not found." };
    const { initial } = monthEntryProps(bundle, null);
    return { ok: true, data: { version: bundle.month?.version ?? 0, initial } };
  });
}
