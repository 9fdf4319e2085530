"use client";

import { useActionState } from "react";
import { buttonDanger } from "@/components/ui/styles";
import type { ActionResult } from "@/lib/auth/guard";
import { revokeMemberInvitation } from "../actions";

export function RevokeInvitationForm({ invitationId, email }: { invitationId: string; email: string }) {
  const [state, action, pending] = useActionState<ActionResult | null, FormData>(revokeMemberInvitation, null);
  return (
    <form action={action} className="flex flex-col items-end gap-1">
      <input type="hidden" name="invitationId" value={invitationId} />
      <button type="submit" className={`${buttonDanger} px-2 py-1 text-xs`} disabled={pending} aria-label={`Revoke the invitation to ${email}`}>
        {pending ? "Revoking…" : "Revoke"}
      </button>
      {state && !state.ok ? (
        <p role="alert" className="text-xs text-fault">
          {state.message}
        </p>
      ) : null}
    </form>
  );
}
