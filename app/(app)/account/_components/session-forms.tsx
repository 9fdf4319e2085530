"use client";

import { useActionState } from "react";
import { Notice } from "@/components/ui/status";
import { buttonDanger, buttonSecondary } from "@/components/ui/styles";
import type { ActionResult } from "@/lib/auth/guard";
import { endOneSession, signOutEverywhere } from "../actions";

/** Ends one other session of the account. */
export function EndSessionForm({ sessionId, label }: { sessionId: string; label: string }) {
  const [state, action, pending] = useActionState<ActionResult | null, FormData>(endOneSession, null);
  return (
    <form action={action} className="inline">
      <input type="hidden" name="sessionId" value={sessionId} />
      <button type="submit" className={buttonSecondary} disabled={pending} aria-label={`End the session ${label}`}>
        {pending ? "Ending…" : "End"}
      </button>
      {state && !state.ok ? <p className="mt-1 text-sm text-fault">{state.message}</p> : null}
    </form>
  );
}

/** Ends every session of the account, this one included. */
export function SignOutEverywhereForm({ count }: { count: number }) {
  const [state, action, pending] = useActionState<ActionResult | null, FormData>(signOutEverywhere, null);
  return (
    <form action={action} className="space-y-2">
      {state && !state.ok ? <Notice tone="fault">{state.message}</Notice> : null}
      <button type="submit" className={buttonDanger} disabled={pending}>
        {pending ? "Signing out…" : `Sign out everywhere (${count} ${count === 1 ? "session" : "sessions"})`}
      </button>
    </form>
  );
}
