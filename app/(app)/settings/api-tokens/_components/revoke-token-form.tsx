"use client";

import { useActionState } from "react";
import { buttonDanger } from "@/components/ui/styles";
import type { ActionResult } from "@/lib/auth/guard";
import { revokeSiteApiToken } from "../actions";

export function RevokeTokenForm({ tokenId, label }: { tokenId: string; label: string }) {
  const [state, action, pending] = useActionState<ActionResult | null, FormData>(revokeSiteApiToken, null);
  return (
    <form
      action={action}
      className="flex flex-col items-end gap-1"
      onSubmit={(e) => {
        // Revoking cannot be undone and stops a plant system at once: ask first.
        if (!window.confirm(`Revoke "${label}"? Systems using it are refused from the next request.`)) e.preventDefault();
      }}
    >
      <input type="hidden" name="tokenId" value={tokenId} />
      <button type="submit" className={`${buttonDanger} px-2 py-1 text-xs`} disabled={pending} aria-label={`Revoke the token ${label}`}>
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
