"use client";

import { useId } from "react";
import { formatDateTime } from "@/reports/format";
import { Notice } from "@/components/ui/status";
import { buttonPrimary, buttonSecondary } from "@/components/ui/styles";
import type { PreviewBody } from "@/lib/import/commit";
import { formatBytes, formatCount } from "@/lib/import/limits";
import { IssuesTable } from "./issues-table";
import { MonthPlanTable } from "./month-plan";
import type { WizardStream } from "./types";

interface Props {
  preview: PreviewBody;
  streams: WizardStream[];
  confirmReplace: boolean;
  onConfirmReplace: (v: boolean) => void;
  onColumns: () => void;
  onRestart: () => void;
  onCommit: () => void;
}

const DELIMS: Record<string, string> = { ",": "comma", ";": "semicolon", "\t": "tab", "|": "vertical bar" };

export function StepCheck({ preview: p, streams, confirmReplace, onConfirmReplace, onColumns, onRestart, onCommit }: Props) {
  const id = useId();
  const readOnly = p.months.filter((m) => m.readOnly);
  const blocked = !p.canCommit || (!!p.previousImport && !confirmReplace);
  return (
    <div className="space-y-5">
      <p className="text-sm text-ink-soft">
        <span className="text-ink">{p.fileName}</span> · <span className="num">{formatBytes(p.sizeBytes)}</span> · {DELIMS[p.delimiter] ?? p.delimiter}-separated ·{" "}
        <span className="num">{formatCount(p.rowCount)}</span> {p.rowCount === 1 ? "row" : "rows"} · <span className="num">{formatCount(p.valueCount)}</span> good {p.valueCount === 1 ? "value" : "values"} ·{" "}
        <span className="num">{p.months.length}</span> month{p.months.length === 1 ? "" : "s"}
      </p>

      {p.issues.length ? (
        <section className="space-y-3">
          <Notice tone="fault" title={`${formatCount(p.issues.length)} problem${p.issues.length === 1 ? "" : "s"} in the file: nothing can be imported until they are fixed`}>
            <p>Correct the rows in the file (rows are numbered as a spreadsheet shows them, the header is row 1), or change the column mapping, then check again.</p>
          </Notice>
          <IssuesTable issues={p.issues} fileName={p.fileName} />
        </section>
      ) : (
        <Notice tone="ok" title="Every row is readable">
          <p>The totals below are the exact sums of the file&rsquo;s values per stream and calendar month.</p>
        </Notice>
      )}

      {readOnly.length ? (
        <Notice tone="locked" title={`${readOnly.map((m) => m.month).join(", ")} ${readOnly.length === 1 ? "is" : "are"} read-only`}>
          <p>A month in review, signed or submitted keeps its figures. Reopen it first, or remove its rows from the file.</p>
        </Notice>
      ) : null}

      {p.warnings.length ? (
        <Notice tone="warn" title="Worth a look before importing">
          <ul className="list-inside list-disc">
            {p.warnings.map((w, i) => (
              <li key={i}>
                <span className="num">{w.month}</span> {w.subject}: {w.message}
              </li>
            ))}
          </ul>
        </Notice>
      ) : null}

      {p.previousImport ? (
        <Notice tone="warn" title={`This file was already imported on ${formatDateTime(new Date(p.previousImport.importedAt))}`}>
          <p>
            {p.previousImport.importedBy ? `${p.previousImport.importedBy} imported it` : "It was imported"} as &ldquo;{p.previousImport.fileName}&rdquo;. Importing it again writes its
            totals over whatever the months hold now, including later corrections made by hand.
          </p>
          <label htmlFor={id} className="mt-2 flex items-center gap-2 font-medium">
            <input id={id} type="checkbox" className="size-4 accent-[var(--color-accent)]" checked={confirmReplace} onChange={(e) => onConfirmReplace(e.target.checked)} />
            Import it again and replace the current figures
          </label>
        </Notice>
      ) : null}

      {p.months.length ? (
        <div className="space-y-3">
          {p.issues.length ? <h3 className="text-sm font-medium">What the readable rows add up to so far</h3> : null}
          {p.months.map((m) => (
            <MonthPlanTable key={m.month} month={m} streams={streams} />
          ))}
        </div>
      ) : null}

      <div className="flex flex-wrap gap-2">
        <button type="button" className={buttonSecondary} onClick={onRestart}>
          Choose another file
        </button>
        <button type="button" className={buttonSecondary} onClick={onColumns}>
          Change columns
        </button>
        <button type="button" className={buttonPrimary} disabled={blocked} onClick={onCommit} aria-describedby={blocked ? `${id}-why` : undefined}>
          Import {p.months.length} month{p.months.length === 1 ? "" : "s"}
        </button>
        {blocked ? (
          <p id={`${id}-why`} className="self-center text-sm text-ink-soft">
            {p.issues.length ? "Fix the problems above first." : readOnly.length ? "A read-only month is in the file." : p.months.length === 0 ? "The file holds no values." : "Tick the re-import box above to go on."}
          </p>
        ) : null}
      </div>
    </div>
  );
}
