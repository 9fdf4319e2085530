"use client";

import { useActionState } from "react";
import { Notice } from "@/components/ui/status";
import { buttonPrimary } from "@/components/ui/styles";
import type { ActionResult } from "@/lib/auth/guard";

type SignAction = (prev: ActionResult<{ id: string }> | null, form: FormData) => Promise<ActionResult<{ id: string }>>;

/** A signatory's button with the hidden fields that name what is signed; the server decides again whether it may be. */
export function SignButtonForm({ action, fields, label }: { action: SignAction; fields: Record<string, string>; label: string }) {
  const [state, run, pending] = useActionState(action, null);
  return (
    <form action={run} className="space-y-2">
      {Object.entries(fields).map(([name, value]) => (
        <input key={name} type="hidden" name={name} value={value} />
      ))}
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

/** The signatory's button for the year's annual statement. */
export function AnnualSignForm({ action, siteId, year, label }: { action: SignAction; siteId: string; year: string; label: string }) {
  return <SignButtonForm action={action} fields={{ siteId, year }} label={label} />;
}
