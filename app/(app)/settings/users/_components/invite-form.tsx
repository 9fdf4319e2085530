"use client";

import { useActionState, useEffect, useRef } from "react";
import { FieldError } from "@/components/ui/field-error";
import { Notice } from "@/components/ui/status";
import { buttonPrimary, input, label } from "@/components/ui/styles";
import type { ActionResult } from "@/lib/auth/guard";
import { inviteMember } from "../actions";
import { RoleCheckboxes } from "./role-checkboxes";

export function InviteForm({ lifetimeHours }: { lifetimeHours: number }) {
  const [state, action, pending] = useActionState<ActionResult | null, FormData>(inviteMember, null);
  const formRef = useRef<HTMLFormElement>(null);
  // After a successful send the form is cleared for the next invitation.
  useEffect(() => {
    if (state?.ok) formRef.current?.reset();
  }, [state]);
  const errors = state && !state.ok ? state.errors : undefined;
  return (
    <form ref={formRef} action={action} noValidate className="space-y-3">
      {state ? <Notice tone={state.ok ? "ok" : "fault"}>{state.message}</Notice> : null}
      <div className="max-w-sm">
        <label htmlFor="invite-email" className={label}>
          E-mail address
        </label>
        <input
          id="invite-email"
          name="email"
          type="email"
          autoComplete="off"
          required
          aria-invalid={errors?.email ? true : undefined}
          aria-describedby={errors?.email ? "invite-email-error" : undefined}
          className={`mt-1 ${input}`}
        />
        <FieldError id="invite-email-error" message={errors?.email} />
      </div>
      <div>
        <RoleCheckboxes idPrefix="invite" legend="Roles they will hold" invalid={!!errors?.roles} describedBy={errors?.roles ? "invite-roles-error" : undefined} />
        <FieldError id="invite-roles-error" message={errors?.roles} />
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <button type="submit" className={buttonPrimary} disabled={pending}>
          {pending ? "Sending…" : "Send invitation"}
        </button>
        <p className="text-sm text-ink-soft">The e-mail holds a one-time link that expires after {lifetimeHours} hours.</p>
      </div>
    </form>
  );
}
