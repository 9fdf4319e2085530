"use client";

import type { KeyboardEvent } from "react";
import { useFormContext } from "react-hook-form";
import { FieldError } from "@/components/ui/field-error";
import { STREAM_KIND_LABELS } from "@/lib/validations/stream";
import type { StreamKind } from "@/lib/balance/types";
import { SOURCES, type MonthFormValues, type StreamInfo } from "./month-values";

/** Read-only (a frozen month, or a role that does not enter figures): the fields read as text, not as controls. */
const cell =
  "border border-rule-strong bg-white px-2 py-1 text-base sm:text-sm aria-[invalid=true]:border-fault aria-[invalid=true]:bg-fault-wash/40 disabled:appearance-none disabled:border-transparent disabled:bg-transparent disabled:px-0 disabled:text-ink disabled:opacity-100";
/** On phones each stream is a card with its fields stacked; the small labels stand in for the column headers. */
const cardLabel = "mb-0.5 block text-xs text-ink-soft sm:hidden";

export const quantityId = (i: number) => `reading-${i}-quantity`;

/**
 * Enter moves to the next row's quantity, the way a column of meter totals is typed from a
 * print-out; after the last row it moves to the first gas analysis (or the save button).
 */
export function focusAfterRow(i: number) {
  const next = document.getElementById(quantityId(i + 1)) ?? document.querySelector<HTMLElement>("[data-analysis-first]") ?? document.getElementById("month-save");
  next?.focus();
  if (next instanceof HTMLInputElement) next.select();
}

export function ReadingsTable({ streams }: { streams: StreamInfo[] }) {
  const { register, formState } = useFormContext<MonthFormValues>();
  // Values also go into the server-rendered HTML, so figures show before the page turns interactive.
  const initial = formState.defaultValues?.readings ?? [];
  const onKeyDown = (i: number) => (e: KeyboardEvent<HTMLTableRowElement>) => {
    const t = e.target as HTMLElement;
    if (e.key !== "Enter" || e.shiftKey || e.nativeEvent.isComposing || !(t instanceof HTMLInputElement || t instanceof HTMLSelectElement)) return;
    e.preventDefault();
    focusAfterRow(i);
  };
  return (
    <div className="relative border border-rule bg-white sm:overflow-x-auto">
      <table className="w-full border-collapse text-sm max-sm:block">
        <caption className="sr-only">Monthly totals, one row per stream. Enter moves to the next quantity.</caption>
        <thead className="max-sm:hidden">
          <tr className="text-left text-xs text-ink-soft">
            <th scope="col" className="border-b border-rule-strong px-2 py-1.5 font-medium">Stream</th>
            <th scope="col" className="border-b border-rule-strong px-2 py-1.5 text-right font-medium">Monthly total</th>
            <th scope="col" className="border-b border-rule-strong px-2 py-1.5 font-medium">Unit</th>
            <th scope="col" className="border-b border-rule-strong px-2 py-1.5 font-medium">Source</th>
            <th scope="col" className="border-b border-rule-strong px-2 py-1.5 font-medium">Note</th>
          </tr>
        </thead>
        <tbody className="max-sm:block">
          {streams.map((s, i) => {
            const err = formState.errors.readings?.[i];
            const qErr = err?.quantity?.message ?? err?.stream?.message;
            const uErr = err?.unit?.message;
            const describedBy = [`reading-${i}-what`, qErr ? `reading-${i}-error` : "", uErr ? `reading-${i}-unit-error` : ""].filter(Boolean).join(" ");
            return (
              <tr
                key={s.id}
                onKeyDown={onKeyDown(i)}
                className={`border-b border-rule align-top last:border-0 max-sm:grid max-sm:grid-cols-2 max-sm:gap-x-3 max-sm:gap-y-2 max-sm:px-3 max-sm:py-3 ${s.archived ? "bg-paper" : ""}`}
              >
                <th scope="row" className="px-2 py-1.5 text-left font-normal max-sm:col-span-2 max-sm:p-0">
                  <label htmlFor={quantityId(i)} className="font-medium">
                    {s.name}
                  </label>
                  <span id={`reading-${i}-what`} className="block text-xs text-ink-soft">
                    <span className="num">{s.key}</span> · {STREAM_KIND_LABELS[s.kind as StreamKind] ?? s.kind}
                    {s.meterTag ? <> · <span className="num">{s.meterTag}</span></> : null}
                    {s.metered === false ? " · no meter: the balances solve it, a figure here is an estimate" : ""}
                    {s.archived ? " · archived stream" : ""}
                  </span>
                </th>
                <td className="px-2 py-1.5 max-sm:col-span-2 max-sm:p-0 sm:w-44">
                  <span aria-hidden="true" className={cardLabel}>
                    Monthly total
                  </span>
                  <input
                    id={quantityId(i)}
                    inputMode="decimal"
                    autoComplete="off"
                    spellCheck={false}
                    className={`${cell} num w-full text-right`}
                    aria-invalid={qErr ? true : undefined}
                    aria-describedby={describedBy}
                    defaultValue={initial[i]?.quantity}
                    {...register(`readings.${i}.quantity`)}
                  />
                  <FieldError id={`reading-${i}-error`} message={qErr} />
                </td>
                <td className="px-2 py-1.5 max-sm:p-0 sm:w-28">
                  <span aria-hidden="true" className={cardLabel}>
                    Unit
                  </span>
                  <select aria-label={`Unit of ${s.name}`} className={`${cell} num w-full`} aria-invalid={uErr ? true : undefined} defaultValue={initial[i]?.unit} {...register(`readings.${i}.unit`)}>
                    {s.units.map((u) => (
                      <option key={u} value={u}>
                        {u}
                      </option>
                    ))}
                  </select>
                  <FieldError id={`reading-${i}-unit-error`} message={uErr} />
                </td>
                <td className="px-2 py-1.5 max-sm:p-0 sm:w-28">
                  <span aria-hidden="true" className={cardLabel}>
                    Source
                  </span>
                  <select aria-label={`Source of ${s.name}`} className={`${cell} w-full`} defaultValue={initial[i]?.source} {...register(`readings.${i}.source`)}>
                    {SOURCES.map((o) => (
                      <option key={o.value} value={o.value}>
                        {o.label}
                      </option>
                    ))}
                  </select>
                </td>
                <td className="px-2 py-1.5 max-sm:col-span-2 max-sm:p-0">
                  <span aria-hidden="true" className={cardLabel}>
                    Note
                  </span>
                  <input aria-label={`Note on ${s.name}`} autoComplete="off" className={`${cell} w-full sm:min-w-32`} defaultValue={initial[i]?.note} {...register(`readings.${i}.note`)} />
                  <FieldError id={`reading-${i}-note-error`} message={err?.note?.message} />
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
