"use client";

import { useActionState } from "react";
import { Notice } from "@/components/ui/status";
import { buttonPrimary } from "@/components/ui/styles";
import type { ActionResult } from "@/lib/auth/guard";

type SignAction = (prev: ActionResult<{ id: string }> | null, form: FormData) => Promise<ActionResult<{ id: string }>>;

/** The signatory's button; the server decides again whether the year may be signed. */
export function AnnualSignForm({ action, siteId, year, label }: { action: SignAction; siteId: string; year: string; label: string }) {
  const [state, run, pending] = useActionState(action, null);
  return (
    <form action={run} className="space-y-2">
      <input type="hidden" name="siteId" value={siteId} />
      <input type="hidden" name="year" value={year} />
      <button type="submit" className={buttonPrimary} disabled={pending}>
        {pending ? "Signing…" : label}
      </button>
      {state ? (
        <Notice tone={state.ok ? "ok" : "fault"} title={state.ok ? "Done" : "Not signed"}>
          {state.message}
        </Notice>
      ) : null}
    </form>
  );
}
