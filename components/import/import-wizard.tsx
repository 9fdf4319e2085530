"use client";

import { useRouter } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import { Notice, Status } from "@/components/ui/status";
import { buttonSecondary } from "@/components/ui/styles";
import type { CommitBody, PreviewBody } from "@/lib/import/commit";
import type { Delimiter, ImportMappingInput } from "@/lib/import/mapping";
import { proposeMapping } from "./guess-mapping";
import { ImportProgress } from "./import-progress";
import { sendImport, type ApiError, type Phase, type Progress } from "./send-import";
import { StepCheck } from "./step-check";
import { StepColumns } from "./step-columns";
import { StepDone } from "./step-done";
import { StepFile, sampleFile } from "./step-file";
import type { FileSample, SavedMapping, WizardStream } from "./types";

type Step = "file" | "columns" | "check" | "commit" | "done";
const STEPS: { key: Step; label: string; heading: string }[] = [
  { key: "file", label: "File", heading: "Choose the file" },
  { key: "columns", label: "Columns", heading: "Say what each column holds" },
  { key: "check", label: "Check", heading: "Check every row" },
  { key: "commit", label: "Import", heading: "Import" },
  { key: "done", label: "Result", heading: "Result" },
];

interface Props {
  siteId: string;
  streams: WizardStream[];
  saved: SavedMapping[];
}

/**
 * File → columns → check → import → result. The browser reads only the file's head (to offer its
 * columns); the server parses and checks all of it at "check", and again at "import", which
 * writes everything in one transaction or nothing.
 */
export function ImportWizard({ siteId, streams, saved }: Props) {
  const [step, setStep] = useState<Step>("file");
  const [sample, setSample] = useState<FileSample | null>(null);
  const [mapping, setMapping] = useState<ImportMappingInput | null>(null);
  const [from, setFrom] = useState<string | null>(null);
  const [preview, setPreview] = useState<PreviewBody | null>(null);
  const [result, setResult] = useState<CommitBody | null>(null);
  const [confirmReplace, setConfirmReplace] = useState(false);
  const [progress, setProgress] = useState<Partial<Record<Phase, Progress>>>({});
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<ApiError | null>(null);
  const router = useRouter();
  const heading = useRef<HTMLHeadingElement>(null);
  const first = useRef(true);

  // Keyboard and screen-reader users land on the new step's heading, not at the page top.
  useEffect(() => {
    if (first.current) first.current = false;
    else heading.current?.focus();
  }, [step, busy]);

  const restart = () => {
    setStep("file");
    setSample(null);
    setPreview(null);
    setResult(null);
    setError(null);
    setConfirmReplace(false);
  };

  async function send(kind: "preview" | "commit", m: ImportMappingInput) {
    if (!sample) return;
    const form = new FormData();
    form.set("file", sample.file);
    form.set("mapping", JSON.stringify(m));
    if (kind === "commit" && confirmReplace) form.set("confirmReplace", "true");
    setProgress({});
    setError(null);
    setBusy(true);
    const outcome = await sendImport<PreviewBody | CommitBody>(`/api/v1/sites/${siteId}/imports/${kind}`, form, (p) => setProgress((old) => ({ ...old, [p.phase]: p })));
    setBusy(false);
    if (!outcome.ok) return setError(outcome.error);
    if (kind === "preview") setPreview(outcome.body as PreviewBody);
    else {
      setResult(outcome.body as CommitBody);
      setStep("done");
      // The page's own list of recent imports is server-rendered: fetch it again.
      router.refresh();
    }
  }

  const index = STEPS.findIndex((s) => s.key === step);
  const title = busy ? (step === "commit" ? "Importing…" : "Checking every row…") : STEPS[index].heading;

  return (
    <div className="space-y-5">
      <ol className="flex flex-wrap gap-x-5 gap-y-1 border-b border-rule pb-2 text-sm" aria-label="Steps">
        {STEPS.map((s, i) => (
          <li key={s.key} aria-current={i === index ? "step" : undefined} className={i === index ? "font-semibold text-ink" : "text-ink-soft"}>
            {i < index ? <Status tone="ok">{`${i + 1}. ${s.label}`}</Status> : <span className={i === index ? "border-b-2 border-accent pb-0.5" : ""}>{`${i + 1}. ${s.label}`}</span>}
          </li>
        ))}
      </ol>
      <h2 ref={heading} tabIndex={-1} className="text-lg font-semibold outline-none">
        {title}
      </h2>

      {error ? (
        <Notice tone="fault" title={error.message}>
          {error.issues?.length ? (
            <ul className="list-inside list-disc">
              {error.issues.slice(0, 20).map((i, k) => (
                <li key={k}>
                  <span className="num">{i.path}</span>: {i.message}
                </li>
              ))}
            </ul>
          ) : null}
          <button type="button" className={`${buttonSecondary} mt-2`} onClick={() => (step === "commit" ? setStep("check") : setError(null))}>
            {step === "commit" ? "Back to the check" : "Dismiss"}
          </button>
        </Notice>
      ) : null}

      {busy ? <ImportProgress phases={step === "commit" ? ["upload", "parse", "validate", "commit"] : ["upload", "parse", "validate"]} progress={progress} /> : null}

      {step === "file" && !busy ? (
        <StepFile
          streams={streams}
          onSampled={(s) => {
            const proposal = proposeMapping(s, streams, saved);
            setSample(s);
            setMapping(proposal.mapping);
            setFrom(proposal.from);
            setStep("columns");
          }}
        />
      ) : null}

      {step === "columns" && sample && mapping && !busy ? (
        <StepColumns
          sample={sample}
          mapping={mapping}
          from={from}
          streams={streams}
          onChange={setMapping}
          onDelimiter={async (d: Delimiter) => {
            const s = await sampleFile(sample.file, d);
            setSample(s);
            setMapping({ ...proposeMapping(s, streams, []).mapping, name: mapping.name, delimiter: d });
            setFrom(null);
          }}
          onBack={restart}
          onNext={(m) => {
            setConfirmReplace(false);
            setPreview(null);
            setStep("check");
            void send("preview", m);
          }}
        />
      ) : null}

      {step === "check" && preview && !busy ? (
        <StepCheck
          preview={preview}
          streams={streams}
          confirmReplace={confirmReplace}
          onConfirmReplace={setConfirmReplace}
          onColumns={() => setStep("columns")}
          onRestart={restart}
          onCommit={() => {
            setStep("commit");
            void send("commit", mapping!);
          }}
        />
      ) : null}
      {step === "check" && !preview && !busy && error ? (
        <button type="button" className={buttonSecondary} onClick={() => setStep("columns")}>
          Change columns
        </button>
      ) : null}

      {step === "done" && result ? <StepDone result={result} siteId={siteId} onRestart={restart} /> : null}
    </div>
  );
}
