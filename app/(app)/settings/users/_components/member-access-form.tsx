"use client";

import { useActionState } from "react";
import { buttonDanger, buttonSecondary } from "@/components/ui/styles";
import type { ActionResult } from "@/lib/auth/guard";
import { removeMember, setMemberAccess } from "../actions";

function Outcome({ state }: { state: ActionResult | null }) {
  if (!state?.message) return null;
  return (
    <p className={`mt-1 max-w-56 text-sm ${state.ok ? "text-ink-soft" : "text-fault"}`} role={state.ok ? "status" : "alert"}>
      {state.message}
    </p>
  );
}

/** Disable / enable a member's account, and remove them from the organisation; both end their sessions. */
export function MemberAccessForm({ userId, name, disabled }: { userId: string; name: string; disabled: boolean }) {
  const [accessState, accessAction, accessPending] = useActionState<ActionResult | null, FormData>(setMemberAccess, null);
  const [removeState, removeAction, removePending] = useActionState<ActionResult | null, FormData>(removeMember, null);
  return (
    <div className="flex flex-col items-start gap-1.5">
      <form action={accessAction}>
        <input type="hidden" name="userId" value={userId} />
        <input type="hidden" name="access" value={disabled ? "enable" : "disable"} />
        <button type="submit" className={buttonSecondary} disabled={accessPending} aria-label={`${disabled ? "Enable" : "Disable"} the account of ${name}`}>
          {accessPending ? "Saving…" : disabled ? "Enable account" : "Disable account"}
        </button>
        <Outcome state={accessState} />
      </form>
      <form
        action={removeAction}
        onSubmit={(e) => {
          if (!window.confirm(`Remove ${name} from the organisation? Their roles are taken away and their sessions end.`)) e.preventDefault();
        }}
      >
        <input type="hidden" name="userId" value={userId} />
        <button type="submit" className={buttonDanger} disabled={removePending} aria-label={`Remove ${name} from the organisation`}>
          {removePending ? "Removing…" : "Remove"}
        </button>
        <Outcome state={removeState} />
      </form>
    </div>
  );
}
