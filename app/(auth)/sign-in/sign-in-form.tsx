"use client";

import { useActionState } from "react";
import { FieldError } from "@/components/ui/field-error";
import { Notice } from "@/components/ui/status";
import { buttonPrimary, input, label } from "@/components/ui/styles";
import { signInAction, type SignInState } from "./actions";

export function SignInForm({ callbackUrl, notice }: { callbackUrl: string; notice?: string }) {
  const [state, action, pending] = useActionState<SignInState, FormData>(signInAction, {});
  const emailError = state.errors?.email;
  const passwordError = state.errors?.password;
  return (
    <form action={action} noValidate className="space-y-4" aria-describedby={state.message ? "sign-in-message" : undefined}>
      <input type="hidden" name="callbackUrl" value={callbackUrl} />
      {state.message ? (
        <div id="sign-in-message">
          <Notice tone="fault" title="Not signed in">
            {state.message}
          </Notice>
        </div>
      ) : notice ? (
        <Notice tone="ok">{notice}</Notice>
      ) : null}
      <div>
        <label htmlFor="email" className={label}>
          E-mail address
        </label>
        <input
          id="email"
          name="email"
          type="email"
          autoComplete="username"
          inputMode="email"
          required
          autoFocus
          defaultValue={state.email}
          aria-invalid={emailError ? true : undefined}
          aria-describedby={emailError ? "email-error" : undefined}
          className={`mt-1 ${input}`}
        />
        <FieldError id="email-error" message={emailError} />
      </div>
      <div>
        <label htmlFor="password" className={label}>
          Password
        </label>
        <input
          id="password"
          name="password"
          type="password"
          autoComplete="current-password"
          required
          aria-invalid={passwordError ? true : undefined}
          aria-describedby={passwordError ? "password-error" : undefined}
          className={`mt-1 ${input}`}
        />
        <FieldError id="password-error" message={passwordError} />
      </div>
      <button type="submit" className={`${buttonPrimary} w-full py-2`} disabled={pending}>
        {pending ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
