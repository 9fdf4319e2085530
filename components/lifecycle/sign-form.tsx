"use client";

import { useActionState, useEffect, useState } from "react";
import { Notice } from "@/components/ui/status";
import { buttonPrimary, link } from "@/components/ui/styles";
import type { ActionResult } from "@/lib/auth/guard";
import { plainIssue } from "@/lib/plain-path";
import type { UnconfirmedRow } from "@/reports/model";

export interface SignFormProps {
  action: (prev: ActionResult | null, formData: FormData) => Promise<ActionResult>;
  siteId: string;
  period: string;
  version: number;
  /** The unsigned PDF exactly as it will be signed. */
  previewHref: string;
  declaration: string[];
  unconfirmed: UnconfirmedRow[];
}

const STEPS = ["Rendering the statement from the frozen record", "Attaching the frozen documents and making it PDF/A", "Sealing it with the organisation's certificate", "Storing it with its audit record"];

/**
 * Signing as the signatory does it: open the PDF that will be signed, tick the declaration it
 * prints, acknowledge each unconfirmed value, sign, and watch it seal. The server checks the
 * same ticks again (lib/lifecycle/sign.ts); the button waits for all of them.
 */
export function SignForm(p: SignFormProps) {
  const [state, formAction, pending] = useActionState(p.action, null);
  const [declared, setDeclared] = useState(false);
  const [acked, setAcked] = useState<Set<string>>(new Set());
  const [opened, setOpened] = useState(false);
  const [step, setStep] = useState(0);
  const ready = declared && p.unconfirmed.every((u) => acked.has(u.key));

  useEffect(() => {
    if (!pending) return;
    const t = setInterval(() => setStep((s) => Math.min(s + 1, STEPS.length - 1)), 700);
    return () => clearInterval(t);
  }, [pending]);

  const toggle = (key: string) =>
    setAcked((prev) => {
      const next = new Set(prev);
      if (next.has(key)) next.delete(key);
      else next.add(key);
      return next;
    });

  return (
    <form action={formAction} onSubmit={() => setStep(0)} className="space-y-3" aria-describedby="sign-form-msg">
      <input type="hidden" name="siteId" value={p.siteId} />
      <input type="hidden" name="period" value={p.period} />
      <input type="hidden" name="transition" value="sign" />
      <input type="hidden" name="expectedVersion" value={p.version} />

      <div className="border border-rule bg-paper px-3 py-2">
        <p className="text-sm font-medium">1. Read the statement you are about to sign</p>
        <p className="text-sm text-ink-soft">
          <a className={link} href={p.previewHref} target="_blank" rel="noopener" onClick={() => setOpened(true)}>
            Open the statement as it will be signed (PDF)
          </a>{" "}
          — the same pages the signature will cover; only its reference and the seal are added at signing.
          {opened ? <span className="ml-1 text-accent-strong">Opened.</span> : null}
        </p>
      </div>

      <fieldset className="border border-rule bg-paper px-3 py-2">
        <legend className="px-1 text-sm font-medium">2. The declaration printed on page 1</legend>
        <ol className="mb-2 list-decimal space-y-1 pl-5 text-sm text-ink-soft">
          {p.declaration.map((d) => (
            <li key={d}>{d}</li>
          ))}
        </ol>
        <label className="flex items-start gap-2 text-sm">
          <input type="checkbox" name="declaration" value="yes" checked={declared} onChange={(e) => setDeclared(e.target.checked)} className="mt-0.5 size-4" />
          <span>I have read the statement and I make this declaration.</span>
        </label>
      </fieldset>

      {p.unconfirmed.length ? (
        <fieldset className="border border-warn/40 bg-warn-wash px-3 py-2">
          <legend className="px-1 text-sm font-medium">3. Values not yet confirmed in their published source ({p.unconfirmed.length})</legend>
          <p className="mb-2 text-sm">Each is printed in the statement as unconfirmed. Acknowledge each one to sign.</p>
          <ul className="space-y-1.5">
            {p.unconfirmed.map((u) => (
              <li key={u.key}>
                <label className="flex items-start gap-2 text-sm">
                  <input type="checkbox" name="acknowledged" value={u.key} checked={acked.has(u.key)} onChange={() => toggle(u.key)} className="mt-0.5 size-4" />
                  <span>
                    <span className="font-medium">{u.item}</span> <span className="num">{u.value}</span>
                    <span className="block text-xs text-ink-soft">Cited: {u.source}</span>
                  </span>
                </label>
              </li>
            ))}
          </ul>
        </fieldset>
      ) : (
        <p className="text-sm text-ink-soft">Every cited value in this statement was confirmed in its published source or is the site&rsquo;s own figure.</p>
      )}

      <div className="flex flex-wrap items-center gap-3">
        <button type="submit" className={buttonPrimary} disabled={pending || !ready} aria-disabled={!ready}>
          {pending ? "Signing…" : "Sign the statement"}
        </button>
        {!ready && !pending ? <span className="text-sm text-ink-soft">Tick the declaration{p.unconfirmed.length ? " and every acknowledgement" : ""} to sign.</span> : null}
      </div>

      {pending ? (
        <div role="status" aria-live="polite" className="border border-rule bg-white px-3 py-2 text-sm">
          <progress className="h-1.5 w-full" max={STEPS.length} value={step + 1} aria-label="Signing progress" />
          <ol className="mt-2 space-y-0.5">
            {STEPS.map((s, i) => (
              <li key={s} className={i < step ? "text-ink-soft" : i === step ? "font-medium" : "text-ink-faint"}>
                {i < step ? "✓ " : i === step ? "… " : ""}
                {s}
              </li>
            ))}
          </ol>
        </div>
      ) : null}

      <div id="sign-form-msg">
        {state && !state.ok ? (
          <Notice tone="fault" title="Not signed">
            {state.message}
            {state.errors
              ? Object.entries(state.errors).map(([k, v]) => (
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
