"use client";

import { COMPONENTS } from "@/lib/balance/components";
import type { ImportMappingInput } from "@/lib/import/mapping";
import { SelectField, type Option } from "./select-field";
import type { WizardStream } from "./types";

type Errors = Record<string, string>;
type Props<L> = { mapping: Extract<ImportMappingInput, { layout: L }>; headers: string[]; streams: WizardStream[]; errors: Errors; set: (m: ImportMappingInput) => void };

const cols = (headers: string[], none?: string): Option[] => [...(none ? [{ value: "", label: none }] : [{ value: "", label: "— choose a column —" }]), ...headers.map((h) => ({ value: h, label: h }))];

export function LongFields({ mapping, headers, errors, set }: Props<"long">) {
  return (
    <div className="grid gap-4 sm:grid-cols-3">
      <SelectField text="Stream or meter tag column" value={mapping.streamColumn} options={cols(headers)} error={errors.streamColumn} onChange={(v) => set({ ...mapping, streamColumn: v })} hint="Holds a stream key (feed) or a meter tag (EW-FQ-101)." />
      <SelectField text="Quantity column" value={mapping.quantityColumn} options={cols(headers)} error={errors.quantityColumn} onChange={(v) => set({ ...mapping, quantityColumn: v })} />
      <SelectField
        text="Unit column"
        value={mapping.unitColumn ?? ""}
        options={cols(headers, "— none: each stream's own unit —")}
        error={errors.unitColumn}
        onChange={(v) => set({ ...mapping, unitColumn: v || undefined })}
      />
    </div>
  );
}

/** Each column but the date's can feed one stream; unmapped columns are ignored. */
export function WideFields({ mapping, headers, streams, errors, set }: Props<"wide">) {
  const byColumn = new Map(mapping.columns.map((c) => [c.column, c]));
  const update = (column: string, stream: string, unit?: string) => {
    const rest = mapping.columns.filter((c) => c.column !== column);
    const next = stream ? [...rest, { column, stream, ...(unit ? { unit: unit as never } : {}) }] : rest;
    set({ ...mapping, columns: headers.flatMap((h) => next.filter((c) => c.column === h)) });
  };
  return (
    <fieldset>
      <legend className="text-sm font-medium">Which stream each column holds</legend>
      {errors.columns ? <p className="mt-1 text-sm text-fault">{errors.columns}</p> : null}
      <table className="mt-2 w-full max-w-3xl text-sm">
        <thead className="text-left text-xs text-ink-soft">
          <tr>
            <th className="py-1 pr-3 font-medium">Column in the file</th>
            <th className="py-1 pr-3 font-medium">Stream</th>
            <th className="py-1 font-medium">Unit</th>
          </tr>
        </thead>
        <tbody>
          {headers
            .filter((h) => h !== mapping.dateColumn)
            .map((h) => {
              const c = byColumn.get(h);
              const stream = streams.find((s) => s.key === c?.stream);
              return (
                <tr key={h} className="border-t border-rule">
                  <td className="num py-1.5 pr-3">{h}</td>
                  <td className="py-1.5 pr-3">
                    <select aria-label={`Stream for column ${h}`} className="w-full border border-rule-strong bg-white px-2 py-1" value={c?.stream ?? ""} onChange={(e) => update(h, e.target.value)}>
                      <option value="">— not imported —</option>
                      {streams.map((s) => (
                        <option key={s.key} value={s.key}>
                          {s.name} ({s.key}{s.meterTag ? `, ${s.meterTag}` : ""})
                        </option>
                      ))}
                    </select>
                  </td>
                  <td className="py-1.5">
                    {stream ? (
                      <select aria-label={`Unit for column ${h}`} className="num border border-rule-strong bg-white px-2 py-1" value={c?.unit ?? stream.unit} onChange={(e) => update(h, stream.key, e.target.value === stream.unit ? undefined : e.target.value)}>
                        {stream.units.map((u) => (
                          <option key={u}>{u}</option>
                        ))}
                      </select>
                    ) : (
                      <span className="text-ink-faint">—</span>
                    )}
                  </td>
                </tr>
              );
            })}
        </tbody>
      </table>
    </fieldset>
  );
}

export function AnalysisFields({ mapping, headers, errors, set }: Props<"analyses">) {
  const byColumn = new Map(mapping.components.map((c) => [c.column, c.component]));
  const update = (column: string, component: string) => {
    const rest = mapping.components.filter((c) => c.column !== column);
    const next = component ? [...rest, { column, component: component as (typeof COMPONENTS)[number] }] : rest;
    set({ ...mapping, components: headers.flatMap((h) => next.filter((c) => c.column === h)) });
  };
  return (
    <div className="space-y-4">
      <SelectField text="Analysis or stream column" value={mapping.analysisColumn} options={cols(headers)} error={errors.analysisColumn} onChange={(v) => set({ ...mapping, analysisColumn: v })} hint="Holds the analysis name (estuary-grid-gas) or the stream it was sampled from (feed)." />
      <fieldset>
        <legend className="text-sm font-medium">Component in each column (mol %, dry)</legend>
        {errors.components ? <p className="mt-1 text-sm text-fault">{errors.components}</p> : null}
        <div className="mt-2 grid gap-2 sm:grid-cols-3">
          {headers
            .filter((h) => h !== mapping.dateColumn && h !== mapping.analysisColumn)
            .map((h) => (
              <label key={h} className="flex items-center justify-between gap-2 border border-rule bg-white px-2 py-1 text-sm">
                <span className="num truncate">{h}</span>
                <select className="border border-rule-strong bg-white px-1 py-0.5" value={byColumn.get(h) ?? ""} onChange={(e) => update(h, e.target.value)}>
                  <option value="">— not imported —</option>
                  {COMPONENTS.map((c) => (
                    <option key={c}>{c}</option>
                  ))}
                </select>
              </label>
            ))}
        </div>
      </fieldset>
    </div>
  );
}
