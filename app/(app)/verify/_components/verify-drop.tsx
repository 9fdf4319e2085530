"use client";

import { useState, type DragEvent } from "react";
import { Notice } from "@/components/ui/status";
import type { VerificationAnswer } from "@/lib/lifecycle/verification-answer";

type Outcome = { kind: "answer"; file: string; answer: VerificationAnswer } | { kind: "error"; file: string; message: string };

const TONE = { issued: "ok", altered: "fault", unknown: "warn" } as const;

/** Drop zone (or file picker) that posts the PDF to /api/v1/verify and shows the verdict in words. */
export function VerifyDrop() {
  const [busy, setBusy] = useState(false);
  const [over, setOver] = useState(false);
  const [outcome, setOutcome] = useState<Outcome | null>(null);

  async function check(file: File) {
    setBusy(true);
    setOutcome(null);
    try {
      const body = new FormData();
      body.set("file", file);
      const res = await fetch("/api/v1/verify", { method: "POST", body });
      const json = await res.json();
      setOutcome(res.ok ? { kind: "answer", file: file.name, answer: json } : { kind: "error", file: file.name, message: json?.error?.message ?? `The server answered ${res.status}.` });
    } catch {
      setOutcome({ kind: "error", file: file.name, message: "The check could not reach the server; try again." });
    } finally {
      setBusy(false);
    }
  }

  function onDrop(e: DragEvent) {
    e.preventDefault();
    setOver(false);
    const f = e.dataTransfer.files[0];
    if (f) void check(f);
  }

  return (
    <div className="space-y-4">
      <label
        onDragOver={(e) => {
          e.preventDefault();
          setOver(true);
        }}
        onDragLeave={() => setOver(false)}
        onDrop={onDrop}
        className={`flex cursor-pointer flex-col items-center gap-1 border-2 border-dashed px-6 py-10 text-center ${over ? "border-accent bg-accent-wash" : "border-rule-strong bg-white"}`}
      >
        <span className="font-medium">{busy ? "Checking…" : "Drop a statement PDF here, or choose a file"}</span>
        <span className="text-sm text-ink-soft">PDF, up to 20 MB</span>
        <input
          type="file"
          accept="application/pdf,.pdf"
          className="sr-only"
          aria-label="Statement PDF to verify"
          onChange={(e) => {
            const f = e.target.files?.[0];
            if (f) void check(f);
            e.target.value = "";
          }}
        />
      </label>
      <div aria-live="polite">
        {outcome?.kind === "error" ? <Notice tone="fault" title={`Could not check ${outcome.file}`}>{outcome.message}</Notice> : null}
        {outcome?.kind === "answer" ? <AnswerView file={outcome.file} a={outcome.answer} /> : null}
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
            {Object.entries(s.summary).map(([k, v]) => (
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
