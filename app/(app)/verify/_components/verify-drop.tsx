"use client";

import { useActionState, useRef, useState, type DragEvent } from "react";
import { Notice } from "@/components/ui/status";
import { buttonPrimary } from "@/components/ui/styles";
import type { ActionResult } from "@/lib/auth/guard";
import type { VerificationAnswer } from "@/lib/lifecycle/verification-answer";

const TONE = { issued: "ok", altered: "fault", unknown: "warn" } as const;

type Action = (prev: ActionResult<VerificationAnswer> | null, formData: FormData) => Promise<ActionResult<VerificationAnswer>>;

/**
 * A form (works before hydration) with a drop zone on top: dropping a file puts it in the file
 * input and submits. The server action answers with the verdict in words.
 */
export function VerifyDrop({ action }: { action: Action }) {
  const [state, formAction, pending] = useActionState(action, null);
  const [over, setOver] = useState(false);
  const form = useRef<HTMLFormElement>(null);
  const fileInput = useRef<HTMLInputElement>(null);

  function onDrop(e: DragEvent) {
    e.preventDefault();
    setOver(false);
    if (!fileInput.current || e.dataTransfer.files.length === 0) return;
    fileInput.current.files = e.dataTransfer.files;
    form.current?.requestSubmit();
  }

  return (
    <div className="space-y-4">
      <form ref={form} action={formAction}>
        <div
          onDragOver={(e) => {
            e.preventDefault();
            setOver(true);
          }}
          onDragLeave={() => setOver(false)}
          onDrop={onDrop}
          className={`flex flex-col items-center gap-3 border-2 border-dashed px-6 py-8 text-center ${over ? "border-accent bg-accent-wash" : "border-rule-strong bg-white"}`}
        >
          <span className="font-medium">{pending ? "Checking…" : "Drop a statement PDF here, or choose a file and check it"}</span>
          <input ref={fileInput} type="file" name="file" accept="application/pdf,.pdf" aria-label="Statement PDF to verify" className="text-sm" />
          <button type="submit" className={buttonPrimary} disabled={pending}>
            Check the file
          </button>
          <span className="text-xs text-ink-soft">PDF, up to 1 MB here; larger files through POST /api/v1/verify</span>
        </div>
      </form>
      <div aria-live="polite">
        {state && !state.ok ? <Notice tone="fault" title="Could not check the file">{state.message}</Notice> : null}
        {state?.ok && state.data ? <AnswerView file={state.message ?? "uploaded file"} a={state.data} /> : null}
      </div>
    </div>
  );
}

function AnswerView({ file, a }: { file: string; a: VerificationAnswer }) {
  const s = a.statement;
  return (
    <div className="space-y-3" data-verdict={a.verdict}>
      <Notice tone={TONE[a.verdict]} title={a.headline}>
        <ul className="mt-1 list-disc space-y-0.5 pl-5 text-sm">
          {a.explanation.map((t) => (
            <li key={t}>{t}</li>
          ))}
        </ul>
      </Notice>
      <dl className="grid gap-x-4 gap-y-1 border border-rule bg-white px-4 py-3 text-sm sm:grid-cols-[9rem_1fr]">
        <dt className="text-ink-soft">File</dt>
        <dd>{file}</dd>
        <dt className="text-ink-soft">Its SHA-256</dt>
        <dd className="num break-all text-xs">{a.sha256}</dd>
        {s ? (
          <>
            <dt className="text-ink-soft">{a.verdict === "issued" ? "Statement" : "Claims to be"}</dt>
            <dd>
              {s.site} ({s.siteCode}), {s.periodLabel}, revision {s.revision}
            </dd>
            <dt className="text-ink-soft">Signed by</dt>
            <dd>
              {s.signer} ({s.signerRole}), <span className="num">{s.signedAtText}</span>
            </dd>
            <dt className="text-ink-soft">Stored SHA-256</dt>
            <dd className="num break-all text-xs">{s.sha256}</dd>
            {/* Key figures only for a verified copy: beside an altered file they would read as its content. */}
            {(a.verdict === "issued" ? Object.entries(s.summary) : []).map(([k, v]) => (
              <div key={k} className="contents">
                <dt className="text-ink-soft">{SUMMARY_LABELS[k] ?? k}</dt>
                <dd className="num">{v}</dd>
              </div>
            ))}
          </>
        ) : null}
      </dl>
    </div>
  );
}

const SUMMARY_LABELS: Record<string, string> = {
  ammonia: "Ammonia",
  grossCo2: "Gross CO2",
  netCo2: "Net CO2",
  co2e: "CO2e",
  intensity: "Intensity",
};
