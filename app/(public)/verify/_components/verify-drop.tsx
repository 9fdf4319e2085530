"use client";

import Link from "next/link";
import { useActionState, useRef, useState, type DragEvent } from "react";
import { Notice } from "@/components/ui/status";
import { buttonPrimary, link } from "@/components/ui/styles";
import type { ActionResult } from "@/lib/auth/guard";
import type { PublicStatementFacts, VerificationAnswer } from "@/lib/lifecycle/verification-answer";
import { kindLabelOf } from "@/lib/statement-kind";

const TONE = { issued: "ok", superseded: "warn", altered: "fault", unknown: "warn" } as const;

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
      <dl className="grid gap-x-4 gap-y-1 border border-rule bg-white px-4 py-3 text-sm sm:grid-cols-[10rem_1fr]">
        <dt className="text-ink-soft">File</dt>
        <dd className="break-all">{file}</dd>
        <dt className="text-ink-soft">Its SHA-256</dt>
        <dd className="num break-all text-xs">{a.sha256}</dd>
      </dl>
      {s ? (
        <div className="space-y-1">
          <h3 className="text-sm font-semibold">{a.verdict === "altered" ? "The statement it claims to be" : "The statement"}</h3>
          {/* Key figures only for a copy that is the stored file: beside an altered one they would read as its content. */}
          <FactsList s={s} figures={a.verdict !== "altered"} />
        </div>
      ) : null}
      {a.supersededBy ? (
        <p className="text-sm">
          Replaced by{" "}
          <Link className={link} href={`/verify/${a.supersededBy.reference}`}>
            revision {a.supersededBy.revision}, reference {a.supersededBy.reference}
          </Link>
          .
        </p>
      ) : null}
    </div>
  );
}

/** A statement's public facts: installation, period, kind, revision, signer and time, the stored digest and, when asked, the key figures. */
export function FactsList({ s, figures }: { s: PublicStatementFacts; figures: boolean }) {
  return (
    <dl className="grid gap-x-4 gap-y-1 border border-rule bg-white px-4 py-3 text-sm sm:grid-cols-[10rem_1fr]">
      <dt className="text-ink-soft">Installation</dt>
      <dd>{s.installation}</dd>
      <dt className="text-ink-soft">Operator</dt>
      <dd>{s.operator ?? "not recorded in this statement"}</dd>
      <dt className="text-ink-soft">Identifiers</dt>
      <dd className="num">{s.identifiers ?? "not recorded in this statement"}</dd>
      <dt className="text-ink-soft">Statement</dt>
      <dd>
        {kindLabelOf(s.kind)}, {s.periodLabel}, revision {s.revision}
      </dd>
      <dt className="text-ink-soft">Signed by</dt>
      <dd>
        {s.signer} ({s.signerRole}), <span className="num">{s.signedAtText}</span>
      </dd>
      <dt className="text-ink-soft">Reference</dt>
      <dd className="num break-all text-xs">
        <Link className={link} href={`/verify/${s.reference}`}>
          {s.reference}
        </Link>
      </dd>
      <dt className="text-ink-soft">Stored SHA-256</dt>
      <dd className="num break-all text-xs">{s.sha256}</dd>
      <dt className="text-ink-soft">Certificate, SHA-256</dt>
      <dd className="num break-all text-xs">{s.certificateFingerprint}</dd>
      {figures
        ? s.figures.map((f) => (
            <div key={f.label} className="contents">
              <dt className="text-ink-soft">{f.label}</dt>
              <dd className="num">{f.value}</dd>
            </div>
          ))
        : null}
    </dl>
  );
}
