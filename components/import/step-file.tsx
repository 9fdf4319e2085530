"use client";

import { useId, useState } from "react";
import { FieldError } from "@/components/ui/field-error";
import { buttonPrimary, label } from "@/components/ui/styles";
import { CsvFileError, decodeCsv, parseCsv } from "@/lib/import/csv";
import { MAX_IMPORT_BYTES, MAX_IMPORT_ROWS, formatBytes, formatCount } from "@/lib/import/limits";
import type { Delimiter } from "@/lib/import/mapping";
import { csvDocument } from "@/lib/csv";
import type { FileSample, WizardStream } from "./types";

/** Template files to fill in: the site's own streams in the two layouts of meter totals, and one for a lab analysis. */
function templates(streams: WizardStream[]) {
  const now = new Date();
  const prev = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - 1, 1));
  const day = (d: number) => `${prev.getUTCFullYear()}-${String(prev.getUTCMonth() + 1).padStart(2, "0")}-${String(d).padStart(2, "0")}`;
  const meters = streams;
  const long = csvDocument([], ["Date", "Tag", "Total", "Unit"], [1, 2].flatMap((d) => meters.map((s) => [day(d), s.meterTag ?? s.key, "", s.unit])));
  const wide = csvDocument([], ["Date", ...meters.map((s) => s.meterTag ?? s.key)], [1, 2].map((d) => [day(d), ...meters.map(() => "")]));
  const keys = [...new Set(streams.flatMap((s) => (s.analysisKey ? [s.analysisKey] : [])))];
  const lab = csvDocument([], ["Date", "Sample point", "CH4", "C2H6", "C3H8", "CO2", "N2"], keys.map((k) => [day(14), k, "", "", "", "", ""]));
  return { long, wide, lab };
}

function download(name: string, text: string) {
  const url = URL.createObjectURL(new Blob([text], { type: "text/csv;charset=utf-8" }));
  const a = Object.assign(document.createElement("a"), { href: url, download: name });
  a.click();
  URL.revokeObjectURL(url);
}

/** Reads only the head of the file in the browser, to offer its columns; the server reads it all. */
export async function sampleFile(file: File, delimiter: Delimiter = "auto"): Promise<FileSample> {
  const head = new Uint8Array(await file.slice(0, 64 * 1024).arrayBuffer());
  // Lenient: the slice may cut a multi-byte character in two; the server decodes strictly.
  const text = decodeCsv(head, { lenient: true });
  const table = parseCsv(text, delimiter, 6);
  return { file, delimiter: table.delimiter, headers: table.headers, rows: table.rows.slice(0, 5).map((r) => r.cells) };
}

export function StepFile({ onSampled, streams }: { onSampled: (s: FileSample) => void; streams: WizardStream[] }) {
  const id = useId();
  const [error, setError] = useState<string | undefined>();
  const [file, setFile] = useState<File | null>(null);
  const [busy, setBusy] = useState(false);

  async function next() {
    if (!file) return setError("Choose a CSV file first.");
    if (file.size > MAX_IMPORT_BYTES) return setError(`"${file.name}" is ${formatBytes(file.size)}; the limit is ${formatBytes(MAX_IMPORT_BYTES)}. Split it by month.`);
    if (file.size === 0) return setError(`"${file.name}" is empty.`);
    setBusy(true);
    try {
      const s = await sampleFile(file);
      if (s.headers.length === 0) setError(`"${file.name}" has no header line.`);
      else onSampled(s);
    } catch (err) {
      setError(err instanceof CsvFileError ? err.message : "The file could not be read.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <form
      className="max-w-xl space-y-4"
      onSubmit={(e) => {
        e.preventDefault();
        void next();
      }}
    >
      <div>
        <label htmlFor={id} className={label}>
          CSV file from the plant historian, the DCS or the laboratory
        </label>
        <input
          id={id}
          type="file"
          accept=".csv,.txt,text/csv"
          aria-invalid={!!error}
          aria-describedby={`${id}-hint${error ? ` ${id}-err` : ""}`}
          onChange={(e) => {
            setFile(e.target.files?.[0] ?? null);
            setError(undefined);
          }}
          className="mt-1 block w-full border border-rule-strong bg-white p-2 text-sm file:mr-3 file:border file:border-rule-strong file:bg-paper-deep file:px-3 file:py-1 file:text-sm file:text-ink"
        />
        <p id={`${id}-hint`} className="mt-1 text-sm text-ink-soft">
          UTF-8 text, comma, semicolon, tab or bar separated, with a header line. Up to <span className="num">{formatBytes(MAX_IMPORT_BYTES)}</span> and{" "}
          <span className="num">{formatCount(MAX_IMPORT_ROWS)}</span> rows. Nothing is saved until the last step.
        </p>
        <FieldError id={`${id}-err`} message={error} />
      </div>
      <button type="submit" className={buttonPrimary} disabled={busy}>
        {busy ? "Reading…" : "Next: columns"}
      </button>

      <section aria-labelledby={`${id}-shapes`} className="border-t border-rule pt-3 text-sm">
        <h3 id={`${id}-shapes`} className="font-medium">
          What the file may look like
        </h3>
        <ul className="mt-1 list-disc space-y-1 pl-5 text-ink-soft">
          <li>
            <span className="text-ink">One row per meter and day</span> (or month): a date column, a tag or stream column, a total and optionally a unit —{" "}
            <span className="num">Date, Tag, Total, Unit</span>.
          </li>
          <li>
            <span className="text-ink">One row per day, one column per meter</span>: a date column and a column for each tag or stream key.
          </li>
          <li>
            <span className="text-ink">A gas analysis</span>: a date, the sample point (the analysis name or its stream) and one column per component in mol %.
          </li>
        </ul>
        <p className="mt-1 text-ink-soft">The next step matches the columns to this site&rsquo;s streams; dates may be written YYYY-MM-DD or day/month/year.</p>
        <p className="mt-2 flex flex-wrap gap-x-3 gap-y-1">
          <span className="text-ink-soft">Templates with this site&rsquo;s streams:</span>
          <button type="button" className="text-accent-strong underline" onClick={() => download("synledger-template-rows.csv", templates(streams).long)}>
            a row per meter
          </button>
          <button type="button" className="text-accent-strong underline" onClick={() => download("synledger-template-columns.csv", templates(streams).wide)}>
            a column per meter
          </button>
          <button type="button" className="text-accent-strong underline" onClick={() => download("synledger-template-analysis.csv", templates(streams).lab)}>
            a gas analysis
          </button>
        </p>
      </section>
    </form>
  );
}
