"use client";

import { useId, useState } from "react";
import { FieldError } from "@/components/ui/field-error";
import { buttonPrimary, buttonSecondary, input, label } from "@/components/ui/styles";
import { DATE_FORMATS } from "@/lib/import/dates";
import { DELIMITERS, LAYOUT_LABELS, importMappingSchema, type ImportLayout, type ImportMappingInput } from "@/lib/import/mapping";
import { THOUSANDS_SEPARATORS } from "@/lib/import/numbers";
import { AnalysisFields, LongFields, WideFields } from "./layout-fields";
import { SelectField } from "./select-field";
import type { FileSample, WizardStream } from "./types";

const DELIMITER_LABELS: Record<string, string> = { auto: "Detect from the header", ",": "Comma ,", ";": "Semicolon ;", "\t": "Tab", "|": "Vertical bar |" };
const DELIMITER_WORDS: Record<string, string> = { ",": "comma", ";": "semicolon", "\t": "tab", "|": "vertical bar" };
const THOUSANDS_LABELS: Record<string, string> = { none: "None (refuse 1,234)", ",": "Comma 1,234", ".": "Dot 1.234", " ": "Space 1 234", "'": "Apostrophe 1'234" };

function switchLayout(m: ImportMappingInput, layout: ImportLayout): ImportMappingInput {
  const { name, delimiter, dateColumn, dateFormat, decimalSeparator, thousandsSeparator } = m;
  const common = { name, delimiter, dateColumn, dateFormat, decimalSeparator, thousandsSeparator };
  if (layout === "long") return { ...common, layout, streamColumn: "", quantityColumn: "" };
  if (layout === "wide") return { ...common, layout, columns: [] };
  return { ...common, layout, analysisColumn: "", components: [] };
}

interface Props {
  sample: FileSample;
  mapping: ImportMappingInput;
  from: string | null;
  streams: WizardStream[];
  onChange: (m: ImportMappingInput) => void;
  onDelimiter: (d: (typeof DELIMITERS)[number]) => void;
  onBack: () => void;
  onNext: (m: ImportMappingInput) => void;
}

export function StepColumns({ sample, mapping, from, streams, onChange, onDelimiter, onBack, onNext }: Props) {
  const nameId = useId();
  const [errors, setErrors] = useState<Record<string, string>>({});
  const set = (m: ImportMappingInput) => {
    setErrors({});
    onChange(m);
  };
  const submit = () => {
    const r = importMappingSchema.safeParse(mapping);
    if (r.success) return onNext(mapping);
    const e: Record<string, string> = {};
    for (const i of r.error.issues) e[String(i.path[0] ?? "")] ??= i.message;
    setErrors(e);
  };
  const headerOptions = [{ value: "", label: "— choose a column —" }, ...sample.headers.map((h) => ({ value: h, label: h }))];

  return (
    <form
      className="space-y-6"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
      noValidate
    >
      {from ? (
        <p className="text-sm text-ink-soft">
          The saved layout <strong className="text-ink">{from}</strong> fits this file&rsquo;s columns and is filled in. Change anything that differs.
        </p>
      ) : null}

      <fieldset>
        <legend className="text-sm font-medium">How the file is laid out</legend>
        <div className="mt-2 grid gap-2 sm:grid-cols-3">
          {(Object.keys(LAYOUT_LABELS) as ImportLayout[]).map((l) => (
            <label key={l} className={`flex cursor-pointer items-start gap-2 border px-3 py-2 text-sm ${mapping.layout === l ? "border-accent bg-accent-wash" : "border-rule bg-white"}`}>
              <input type="radio" name="layout" className="mt-0.5 accent-[var(--color-accent)]" checked={mapping.layout === l} onChange={() => set(switchLayout(mapping, l))} />
              <span>{LAYOUT_LABELS[l]}</span>
            </label>
          ))}
        </div>
      </fieldset>

      <div className="grid gap-4 sm:grid-cols-3">
        <SelectField text="Delimiter" value={mapping.delimiter ?? "auto"} options={DELIMITERS.map((d) => ({ value: d, label: DELIMITER_LABELS[d] }))} onChange={(v) => onDelimiter(v as (typeof DELIMITERS)[number])} hint={`Read as ${DELIMITER_WORDS[sample.delimiter] ?? sample.delimiter}-separated: ${sample.headers.length} columns.`} />
        <SelectField text="Date column" value={mapping.dateColumn} options={headerOptions} error={errors.dateColumn} onChange={(v) => set({ ...mapping, dateColumn: v })} />
        <SelectField
          text="Date format"
          value={mapping.dateFormat}
          options={DATE_FORMATS.map((f) => ({ value: f, label: f.length === 7 || f === "MM/YYYY" ? `${f} (monthly totals)` : `${f} (daily values)` }))}
          error={errors.dateFormat}
          onChange={(v) => set({ ...mapping, dateFormat: v as (typeof DATE_FORMATS)[number] })}
          hint="03/04/2026 is 3 April in DD/MM and 4 March in MM/DD: check it."
        />
        <SelectField text="Decimal separator" value={mapping.decimalSeparator ?? "."} options={[{ value: ".", label: "Dot 1234.5" }, { value: ",", label: "Comma 1234,5" }]} onChange={(v) => set({ ...mapping, decimalSeparator: v as "." | "," })} />
        <SelectField text="Thousands separator" value={mapping.thousandsSeparator ?? "none"} options={THOUSANDS_SEPARATORS.map((t) => ({ value: t, label: THOUSANDS_LABELS[t] }))} error={errors.thousandsSeparator} onChange={(v) => set({ ...mapping, thousandsSeparator: v as (typeof THOUSANDS_SEPARATORS)[number] })} />
        <div>
          <label htmlFor={nameId} className={label}>
            Save this layout as
          </label>
          <input id={nameId} className={`${input} mt-1`} value={mapping.name} onChange={(e) => set({ ...mapping, name: e.target.value })} aria-invalid={!!errors.name} aria-describedby={errors.name ? `${nameId}-err` : undefined} />
          <FieldError id={`${nameId}-err`} message={errors.name} />
        </div>
      </div>

      {mapping.layout === "long" ? <LongFields mapping={mapping} headers={sample.headers} streams={streams} errors={errors} set={set} /> : null}
      {mapping.layout === "wide" ? <WideFields mapping={mapping} headers={sample.headers} streams={streams} errors={errors} set={set} /> : null}
      {mapping.layout === "analyses" ? <AnalysisFields mapping={mapping} headers={sample.headers} streams={streams} errors={errors} set={set} /> : null}

      <section aria-labelledby={`${nameId}-sample`}>
        <h3 id={`${nameId}-sample`} className="text-sm font-medium">
          First rows of {sample.file.name}
        </h3>
        <div className="relative mt-2 overflow-x-auto border border-rule bg-white" role="region" aria-label="The first rows of the file" tabIndex={0}>
          <table className="w-full text-sm">
            <thead className="bg-paper-deep text-left text-xs text-ink-soft">
              <tr>
                <th className="px-2 py-1 font-medium">Row</th>
                {sample.headers.map((h, i) => (
                  <th key={i} className="whitespace-nowrap px-2 py-1 font-medium">
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {sample.rows.map((r, i) => (
                <tr key={i} className="border-t border-rule">
                  <td className="num px-2 py-1 text-ink-faint">{i + 2}</td>
                  {r.map((c, j) => (
                    <td key={j} className="num whitespace-nowrap px-2 py-1">
                      {c}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </section>

      <div className="flex gap-2">
        <button type="button" className={buttonSecondary} onClick={onBack}>
          Back
        </button>
        <button type="submit" className={buttonPrimary}>
          Next: check every row
        </button>
      </div>
    </form>
  );
}
