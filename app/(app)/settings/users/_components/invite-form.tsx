"use client";

import { useActionState } from "react";
import { FieldError } from "@/components/ui/field-error";
import { Notice } from "@/components/ui/status";
import { buttonPrimary, input, label } from "@/components/ui/styles";
import type { ActionResult } from "@/lib/auth/guard";
import { isRole, type Role } from "@/lib/auth/roles";
import { inviteMember } from "../actions";
import { RoleCheckboxes } from "./role-checkboxes";

type InviteState = (ActionResult & { values?: { email: string; roles: Role[] } }) | null;

/**
 * React resets a form after its action; on a refusal the typed address and ticked roles come
 * back through the state (as default values) so nothing has to be entered twice.
 */
async function inviteKeepingValues(prev: InviteState, formData: FormData): Promise<InviteState> {
  const result = await inviteMember(prev, formData);
  if (result.ok) return result;
  const roles = formData.getAll("roles").map(String).filter(isRole);
  return { ...result, values: { email: String(formData.get("email") ?? ""), roles } };
}

export function InviteForm({ lifetimeHours }: { lifetimeHours: number }) {
  const [state, action, pending] = useActionState<InviteState, FormData>(inviteKeepingValues, null);
  const values = state && !state.ok ? state.values : undefined;
  const errors = state && !state.ok ? state.errors : undefined;
  return (
    <form action={action} noValidate className="space-y-3">
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
          defaultValue={values?.email}
          aria-invalid={errors?.email ? true : undefined}
          aria-describedby={errors?.email ? "invite-email-error" : undefined}
          className={`mt-1 ${input}`}
        />
        <FieldError id="invite-email-error" message={errors?.email} />
      </div>
      <div>
        <RoleCheckboxes idPrefix="invite" legend="Roles they will hold" defaultRoles={values?.roles} invalid={!!errors?.roles} describedBy={errors?.roles ? "invite-roles-error" : undefined} />
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
