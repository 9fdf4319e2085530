"use client";

import { useActionState } from "react";
import { Notice } from "@/components/ui/status";
import { buttonPrimary } from "@/components/ui/styles";
import { TextField } from "@/components/ui/text-field";
import type { ActionResult } from "@/lib/auth/guard";
import { changePassword } from "../actions";

/** Current password, then the new one twice. Success signs every session out, this one too. */
export function PasswordForm({ email }: { email: string }) {
  const [state, action, pending] = useActionState<ActionResult | null, FormData>(changePassword, null);
  const e = state && !state.ok ? (state.errors ?? {}) : {};
  return (
    <form action={action} noValidate className="max-w-sm space-y-4">
      <input type="email" name="username" value={email} autoComplete="username" readOnly hidden />
      {state && !state.ok && !state.errors ? <Notice tone="fault">{state.message}</Notice> : null}
      <TextField id="current" labelText="Current password" type="password" autoComplete="current-password" error={e.current} />
      <TextField
        id="password"
        labelText="New password"
        type="password"
        autoComplete="new-password"
        error={e.password}
        hint="At least 12 characters, with three of: lower case, upper case, digits, symbols."
      />
      <TextField id="confirm" labelText="New password again" type="password" autoComplete="new-password" error={e.confirm} />
      <button type="submit" className={buttonPrimary} disabled={pending}>
        {pending ? "Changing…" : "Change password and sign out everywhere"}
      </button>
    </form>
  );
}
