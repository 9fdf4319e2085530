"use client";

import { plainIssue } from "@/lib/plain-path";
import { useActionState } from "react";
import { FieldError } from "@/components/ui/field-error";
import { Notice } from "@/components/ui/status";
import { buttonPrimary, buttonSecondary, input, label } from "@/components/ui/styles";
import type { ActionResult } from "@/lib/auth/guard";

export interface TransitionFormProps {
  action: (prev: ActionResult | null, formData: FormData) => Promise<ActionResult>;
  siteId: string;
  period: string;
  version: number;
  transition: string;
  buttonLabel: string;
  /** "required", "optional" or "none": whether a written reason is asked for. */
  reason: "required" | "optional" | "none";
  reasonLabel?: string;
  /** record-submission asks for the authority's reference and date. */
  submission?: boolean;
  primary?: boolean;
}

/** One life-cycle action: hidden month version for optimistic locking, the fields it needs, one button. */
export function TransitionForm(p: TransitionFormProps) {
  const [state, formAction, pending] = useActionState(p.action, null);
  const id = `${p.transition}-form`;
  const err = state && !state.ok ? state.errors ?? {} : {};
  const today = new Date().toISOString().slice(0, 10);
  return (
    <form action={formAction} className="space-y-2" aria-describedby={`${id}-msg`}>
      <input type="hidden" name="siteId" value={p.siteId} />
      <input type="hidden" name="period" value={p.period} />
      <input type="hidden" name="transition" value={p.transition} />
      <input type="hidden" name="expectedVersion" value={p.version} />
      {p.reason !== "none" ? (
        <div>
          <label htmlFor={`${id}-reason`} className={label}>
            {p.reasonLabel ?? "Reason"} {p.reason === "optional" ? <span className="font-normal text-ink-soft">(optional)</span> : null}
          </label>
          <textarea
            id={`${id}-reason`}
            name="reason"
            rows={3}
            className={input}
            aria-invalid={err.reason ? true : undefined}
            aria-describedby={err.reason ? `${id}-reason-err` : undefined}
          />
          <FieldError id={`${id}-reason-err`} message={err.reason} />
        </div>
      ) : null}
      {p.submission ? (
        <div className="grid gap-2 sm:grid-cols-2">
          <div>
            <label htmlFor={`${id}-ref`} className={label}>
              Authority&rsquo;s reference
            </label>
            <input id={`${id}-ref`} name="reference" className={input} aria-invalid={err.reference ? true : undefined} aria-describedby={`${id}-ref-err`} />
            <FieldError id={`${id}-ref-err`} message={err.reference} />
          </div>
          <div>
            <label htmlFor={`${id}-date`} className={label}>
              Submitted on
            </label>
            <input id={`${id}-date`} name="submittedOn" type="date" max={today} defaultValue={today} className={input} aria-invalid={err.submittedOn ? true : undefined} aria-describedby={`${id}-date-err`} />
            <FieldError id={`${id}-date-err`} message={err.submittedOn} />
          </div>
        </div>
      ) : null}
      <button type="submit" className={p.primary ? buttonPrimary : buttonSecondary} disabled={pending}>
        {pending ? "Working…" : p.buttonLabel}
      </button>
      <div id={`${id}-msg`}>
        {state ? (
          <Notice tone={state.ok ? "ok" : "fault"} title={state.ok ? undefined : "Not done"}>
            {state.message}
            {!state.ok && state.errors
              ? Object.entries(state.errors)
                  .filter(([k]) => !["reason", "reference", "submittedOn"].includes(k))
                  .map(([k, v]) => (
                    <span key={k} className="block text-sm">
                      {plainIssue(k, v)}
                    </span>
                  ))
              : null}
          </Notice>
        ) : null}
      </div>
    </form>
  );
}
