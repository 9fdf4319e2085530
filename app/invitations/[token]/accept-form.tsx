"use client";

import { useActionState } from "react";
import { FieldError } from "@/components/ui/field-error";
import { Notice } from "@/components/ui/status";
import { buttonPrimary, input, label } from "@/components/ui/styles";
import { acceptInvitation, type AcceptState } from "./actions";

function Field(props: {
  id: string;
  labelText: string;
  type?: string;
  autoComplete: string;
  error?: string;
  hint?: string;
  defaultValue?: string;
}) {
  const described = [props.hint ? `${props.id}-hint` : null, props.error ? `${props.id}-error` : null].filter(Boolean).join(" ");
  return (
    <div>
      <label htmlFor={props.id} className={label}>
        {props.labelText}
      </label>
      {props.hint ? (
        <p id={`${props.id}-hint`} className="text-xs text-ink-soft">
          {props.hint}
        </p>
      ) : null}
      <input
        id={props.id}
        name={props.id}
        type={props.type ?? "text"}
        autoComplete={props.autoComplete}
        required
        defaultValue={props.defaultValue}
        aria-invalid={props.error ? true : undefined}
        aria-describedby={described || undefined}
        className={`mt-1 ${input}`}
      />
      <FieldError id={`${props.id}-error`} message={props.error} />
    </div>
  );
}

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
        <Field id="password" labelText={`Password of your account ${email}`} type="password" autoComplete="current-password" error={e.password} />
      ) : (
        <>
          <Field id="name" labelText="Your name" autoComplete="name" error={e.name} defaultValue={state.name} hint="As colleagues know you; it appears in the audit trail." />
          <Field
            id="password"
            labelText="Choose a password"
            type="password"
            autoComplete="new-password"
            error={e.password}
            hint="At least 12 characters, with three of: lower case, upper case, digits, symbols."
          />
          <Field id="confirm" labelText="Type the password again" type="password" autoComplete="new-password" error={e.confirm} />
        </>
      )}
      <button type="submit" className={`${buttonPrimary} w-full py-2`} disabled={pending}>
        {pending ? "Accepting…" : hasAccount ? "Accept and add to my account" : "Create my account"}
      </button>
    </form>
  );
}
