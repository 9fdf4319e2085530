"use client";

import { useActionState } from "react";
import { FieldError } from "@/components/ui/field-error";
import { Notice } from "@/components/ui/status";
import { buttonPrimary, buttonSecondary, input, label } from "@/components/ui/styles";
import type { ActionResult } from "@/lib/auth/guard";

type Action = (prev: ActionResult | null, formData: FormData) => Promise<ActionResult>;

export function UploadForm({ action }: { action: Action }) {
  const [state, formAction, pending] = useActionState(action, null);
  const err = state && !state.ok ? state.errors ?? {} : {};
  return (
    <form action={formAction} className="max-w-xl space-y-3 border border-rule bg-white px-4 py-3">
      <div>
        <label htmlFor="cert-label" className={label}>
          Name
        </label>
        <input id="cert-label" name="label" className={input} placeholder="e.g. Statements 2027, issued by our CA" aria-invalid={err.label ? true : undefined} aria-describedby="cert-label-err" />
        <FieldError id="cert-label-err" message={err.label} />
      </div>
      <div>
        <label htmlFor="cert-file" className={label}>
          PKCS#12 file
        </label>
        <input id="cert-file" name="p12" type="file" accept=".p12,.pfx,application/x-pkcs12" className="block text-sm" aria-invalid={err.p12 ? true : undefined} aria-describedby="cert-file-err" />
        <FieldError id="cert-file-err" message={err.p12} />
      </div>
      <div>
        <label htmlFor="cert-pass" className={label}>
          Passphrase
        </label>
        <input id="cert-pass" name="passphrase" type="password" autoComplete="off" className={input} aria-invalid={err.passphrase ? true : undefined} aria-describedby="cert-pass-err" />
        <FieldError id="cert-pass-err" message={err.passphrase} />
      </div>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" name="activate" defaultChecked /> Make it the active certificate
      </label>
      <button type="submit" className={buttonPrimary} disabled={pending}>
        {pending ? "Checking…" : "Upload"}
      </button>
      {state ? <Notice tone={state.ok ? "ok" : "fault"}>{state.message}</Notice> : null}
    </form>
  );
}

export function ActivateButton({ action, certificateId, label: name }: { action: Action; certificateId: string; label: string }) {
  const [state, formAction, pending] = useActionState(action, null);
  return (
    <form action={formAction} className="mt-2 space-y-2">
      <input type="hidden" name="certificateId" value={certificateId} />
      <button type="submit" className={buttonSecondary} disabled={pending} aria-label={`Activate ${name}`}>
        Activate
      </button>
      {state ? <Notice tone={state.ok ? "ok" : "fault"}>{state.message}</Notice> : null}
    </form>
  );
}
