"use client";

import { useActionState } from "react";
import { FieldError } from "@/components/ui/field-error";
import { Notice } from "@/components/ui/status";
import { buttonPrimary, input, label } from "@/components/ui/styles";
import type { ActionResult } from "@/lib/auth/guard";
import { createSiteApiToken, type CreatedToken } from "../actions";
import { TokenSecret } from "./token-secret";

export interface SiteChoice {
  id: string;
  name: string;
}

/** Label + site; on success the secret is shown here once and never again. */
export function CreateTokenForm({ sites, appUrl }: { sites: SiteChoice[]; appUrl: string }) {
  const [state, action, pending] = useActionState<ActionResult<CreatedToken> | null, FormData>(createSiteApiToken, null);
  const errors = state && !state.ok ? state.errors : undefined;
  return (
    <div className="space-y-4">
      {state?.ok && state.data ? <TokenSecret created={state.data} appUrl={appUrl} /> : null}
      {state && !state.ok ? <Notice tone="fault">{state.message}</Notice> : null}
      <form action={action} noValidate className="flex flex-wrap items-start gap-4">
        <div className="w-64">
          <label htmlFor="token-site" className={label}>
            Site
          </label>
          <select
            id="token-site"
            name="siteId"
            required
            aria-invalid={errors?.siteId ? true : undefined}
            aria-describedby={errors?.siteId ? "token-site-error" : undefined}
            className={`mt-1 ${input}`}
          >
            {sites.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </select>
          <FieldError id="token-site-error" message={errors?.siteId} />
        </div>
        <div className="w-80">
          <label htmlFor="token-label" className={label}>
            Label
          </label>
          <input
            id="token-label"
            name="label"
            maxLength={80}
            required
            placeholder="e.g. DCS historian, unit 2"
            aria-invalid={errors?.label ? true : undefined}
            aria-describedby={errors?.label ? "token-label-error" : "token-label-hint"}
            className={`mt-1 ${input}`}
          />
          <FieldError id="token-label-error" message={errors?.label} />
        </div>
        <button type="submit" className={`${buttonPrimary} mt-6`} disabled={pending || sites.length === 0}>
          {pending ? "Creating…" : "Create token"}
        </button>
      </form>
      <p id="token-label-hint" className="text-sm text-ink-soft">
        The label is recorded as the author of every reading the token writes, so name the system that will hold it.
      </p>
    </div>
  );
}
