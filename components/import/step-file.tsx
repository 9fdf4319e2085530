"use client";

import { useId, useState } from "react";
import { FieldError } from "@/components/ui/field-error";
import { buttonPrimary, label } from "@/components/ui/styles";
import { CsvFileError, decodeCsv, parseCsv } from "@/lib/import/csv";
import { MAX_IMPORT_BYTES, MAX_IMPORT_ROWS, formatBytes, formatCount } from "@/lib/import/limits";
import type { Delimiter } from "@/lib/import/mapping";
import type { FileSample } from "./types";

/** Reads only the head of the file in the browser, to offer its columns; the server reads it all. */
export async function sampleFile(file: File, delimiter: Delimiter = "auto"): Promise<FileSample> {
  const head = new Uint8Array(await file.slice(0, 64 * 1024).arrayBuffer());
  // Lenient: the slice may cut a multi-byte character in two; the server decodes strictly.
  const text = decodeCsv(head, { lenient: true });
  const table = parseCsv(text, delimiter, 6);
  return { file, delimiter: table.delimiter, headers: table.headers, rows: table.rows.slice(0, 5).map((r) => r.cells) };
}

export function StepFile({ onSampled }: { onSampled: (s: FileSample) => void }) {
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
    </form>
  );
}
