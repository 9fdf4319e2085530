"use client";

import { useActionState } from "react";
import { Notice } from "@/components/ui/status";
import { buttonPrimary } from "@/components/ui/styles";
import { TextField } from "@/components/ui/text-field";
import { acceptInvitation, type AcceptState } from "./actions";

/** New account: name and a password chosen twice. Existing account: that account's password. */
export function AcceptForm({ token, email, hasAccount }: { token: string; email: string; hasAccount: boolean }) {
  const [state, action, pending] = useActionState<AcceptState, FormData>(acceptInvitation, {});
  const e = state.errors ?? {};
  return (
    <form action={action} noValidate className="space-y-4">
      <input type="hidden" name="token" value={token} />
      {/* Lets password managers file the new password under the right address. */}
      <input type="email" name="username" value={email} autoComplete="username" readOnly hidden />
      {state.message ? <Notice tone="fault">{state.message}</Notice> : null}
      {hasAccount ? (
        <TextField id="password" labelText={`Password of your account ${email}`} type="password" autoComplete="current-password" error={e.password} />
      ) : (
        <>
          <TextField id="name" labelText="Your name" autoComplete="name" error={e.name} defaultValue={state.name} hint="As colleagues know you; it appears in the audit trail." />
          <TextField
            id="password"
            labelText="Choose a password"
            type="password"
            autoComplete="new-password"
            error={e.password}
            hint="At least 12 characters, with three of: lower case, upper case, digits, symbols."
          />
          <TextField id="confirm" labelText="Type the password again" type="password" autoComplete="new-password" error={e.confirm} />
        </>
      )}
      <button type="submit" className={`${buttonPrimary} w-full py-2`} disabled={pending}>
        {pending ? "Accepting…" : hasAccount ? "Accept and add to my account" : "Create my account"}
      </button>
    </form>
  );
}
