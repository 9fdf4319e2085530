"use client";

import { useActionState } from "react";
import { FieldError } from "@/components/ui/field-error";
import { Status } from "@/components/ui/status";
import { buttonSecondary } from "@/components/ui/styles";
import type { ActionResult } from "@/lib/auth/guard";
import type { Role } from "@/lib/auth/roles";
import { changeMemberRoles } from "../actions";
import { RoleCheckboxes } from "./role-checkboxes";

/** One member's roles with its own Save, so editing one row never submits another. */
export function MemberRolesForm({ userId, name, roles }: { userId: string; name: string; roles: Role[] }) {
  const [state, action, pending] = useActionState<ActionResult | null, FormData>(changeMemberRoles, null);
  const errorId = `roles-${userId}-error`;
  const error = state && !state.ok ? (state.errors?.roles ?? state.message) : undefined;
  return (
    <form action={action} className="flex flex-wrap items-start gap-x-4 gap-y-2">
      <input type="hidden" name="userId" value={userId} />
      <div className="min-w-0 flex-1">
        <RoleCheckboxes idPrefix={`m-${userId}`} legend={`Roles of ${name}`} defaultRoles={roles} hideLegend invalid={!!error} describedBy={error ? errorId : undefined} />
        <FieldError id={errorId} message={error} />
        {state?.ok && state.message ? (
          <p className="mt-1 text-sm" role="status">
            <Status tone="ok">{state.message}</Status>
          </p>
        ) : null}
      </div>
      <button type="submit" className={buttonSecondary} disabled={pending} aria-label={`Save roles of ${name}`}>
        {pending ? "Saving…" : "Save roles"}
      </button>
    </form>
  );
}
