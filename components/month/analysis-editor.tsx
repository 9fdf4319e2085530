"use client";

import { useState, type KeyboardEvent } from "react";
import { useFieldArray, useFormContext, useWatch } from "react-hook-form";
import { FieldError } from "@/components/ui/field-error";
import { Status } from "@/components/ui/status";
import { buttonSecondary } from "@/components/ui/styles";
import { COMPONENTS } from "@/lib/balance/components";
import { SUM_TOLERANCE_TEXT, analysisSum, type MonthFormValues } from "./month-values";
import { formatDecimal } from "./number-format";

const cell =
  "border border-rule-strong bg-white px-2 py-1 text-base sm:text-sm aria-[invalid=true]:border-fault aria-[invalid=true]:bg-fault-wash/40 disabled:appearance-none disabled:border-transparent disabled:bg-transparent disabled:px-0 disabled:text-ink disabled:opacity-100";

/**
 * One gas analysis: components in mol % (dry), the running sum, and what the engine will do
 * with it — use as is, normalise (within 0.5 of 100, with the normalised values shown) or refuse.
 */
export function AnalysisEditor({ index, usedBy, previous, first, readOnly }: { index: number; usedBy: string[]; previous?: { period: string; components: Record<string, string> }; first: boolean; readOnly: boolean }) {
  const { control, register, formState } = useFormContext<MonthFormValues>();
  const { fields, append, remove, replace } = useFieldArray({ control, name: `analyses.${index}.components` });
  const key = useWatch({ control, name: `analyses.${index}.key` });
  const comps = useWatch({ control, name: `analyses.${index}.components` }) ?? [];
  const [adding, setAdding] = useState("");
  const s = analysisSum({ components: comps });
  const errs = formState.errors.analyses?.[index];
  const totalErr = (errs as { total?: { message?: string } } | undefined)?.total?.message;
  const free = COMPONENTS.filter((c) => !comps.some((x) => x.component === c));
  const id = (ci: number) => `analysis-${index}-comp-${ci}`;

  const onKeyDown = (ci: number) => (e: KeyboardEvent<HTMLInputElement>) => {
    if (e.key !== "Enter" || e.nativeEvent.isComposing) return;
    e.preventDefault();
    const next = document.getElementById(id(ci + 1)) ?? document.getElementById(`analysis-${index}-add`);
    next?.focus();
    if (next instanceof HTMLInputElement) next.select();
  };

  return (
    <section aria-labelledby={`analysis-${index}-title`} className="border border-rule bg-white p-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={`analysis-${index}-title`} className="font-semibold">
          Analysis <span className="num">{key}</span>
        </h3>
        <span className="text-xs text-ink-soft">
          mol %, dry{usedBy.length ? <> · used by <span className="num">{usedBy.join(", ")}</span></> : " · used by no active stream"}
        </span>
      </div>
      {previous && s.status === "empty" && !readOnly ? (
        <p className="mt-2 text-sm">
          <button
            type="button"
            className={buttonSecondary}
            onClick={() => replace(COMPONENTS.filter((c) => previous.components[c] !== undefined).map((c) => ({ component: c, value: previous.components[c] })))}
          >
            Start from the {previous.period} analysis
          </button>
        </p>
      ) : null}
      <table className="mt-2 w-full max-w-md border-collapse text-sm">
        <thead>
          <tr className="text-left text-xs text-ink-soft">
            <th scope="col" className="border-b border-rule-strong py-1 pr-2 font-medium">Component</th>
            <th scope="col" className="border-b border-rule-strong px-2 py-1 text-right font-medium">mol %</th>
            <th scope="col" className="border-b border-rule-strong px-2 py-1 text-right font-medium">Normalised (mol %)</th>
            <th scope="col" className="border-b border-rule-strong py-1"><span className="sr-only">Remove</span></th>
          </tr>
        </thead>
        <tbody>
          {fields.map((f, ci) => {
            const cErr = errs?.components?.[ci]?.value?.message;
            const norm = s.normalised[comps[ci]?.component ?? ""];
            return (
              <tr key={f.id} className="border-b border-rule last:border-0">
                <th scope="row" className="num py-1 pr-2 text-left font-normal">
                  <label htmlFor={id(ci)}>{f.component}</label>
                </th>
                <td className="w-36 px-2 py-1">
                  <input
                    id={id(ci)}
                    data-analysis-first={first && ci === 0 ? "" : undefined}
                    inputMode="decimal"
                    autoComplete="off"
                    spellCheck={false}
                    className={`${cell} num w-full min-w-[7.5rem] text-right`}
                    aria-invalid={cErr ? true : undefined}
                    aria-describedby={cErr ? `${id(ci)}-error` : undefined}
                    onKeyDown={onKeyDown(ci)}
                    defaultValue={f.value}
                    {...register(`analyses.${index}.components.${ci}.value`)}
                  />
                  <FieldError id={`${id(ci)}-error`} message={cErr} />
                </td>
                <td className="num px-2 py-1 text-right text-ink-soft">{norm ? formatDecimal(norm, 3) : ""}</td>
                <td className="py-1 text-right">
                  {readOnly ? null : <button type="button" onClick={() => remove(ci)} className="px-1 text-xs text-ink-soft underline hover:text-ink" aria-label={`Remove ${f.component}`}>
                    remove
                  </button>}
                </td>
              </tr>
            );
          })}
        </tbody>
        <tfoot>
          <tr>
            <th scope="row" className="pt-1.5 pr-2 text-left font-medium">Sum</th>
            <td className="num px-2 pt-1.5 text-right font-medium">{s.status === "empty" ? "—" : formatDecimal(s.total, 3)}</td>
            <td colSpan={2} className="px-2 pt-1.5 text-xs" aria-live="polite">
              {s.status === "exact" ? <Status tone="ok">100 mol %</Status> : null}
              {s.status === "normalised" ? <Status tone="warn">Normalised to 100</Status> : null}
              {s.status === "refused" ? <Status tone="fault">Refused: more than {SUM_TOLERANCE_TEXT} from 100</Status> : null}
              {s.status === "empty" ? <Status tone="info">Not entered</Status> : null}
            </td>
          </tr>
        </tfoot>
      </table>
      <FieldError id={`analysis-${index}-total-error`} message={totalErr} />
      {s.status === "normalised" ? (
        <p className="mt-1 text-xs text-warn">
          The sum is within {SUM_TOLERANCE_TEXT} of 100: the engine scales each component by 100 / {formatDecimal(s.total, 3)} and flags it. The figures you typed are what is saved.
        </p>
      ) : null}
      <div className={`mt-2 flex flex-wrap items-end gap-2 ${readOnly ? "hidden" : ""}`}>
        <label htmlFor={`analysis-${index}-add`} className="sr-only">
          Component to add to {key}
        </label>
        <select id={`analysis-${index}-add`} value={adding} onChange={(e) => setAdding(e.target.value)} className={`${cell} num`}>
          <option value="">Add a component…</option>
          {free.map((c) => (
            <option key={c} value={c}>
              {c}
            </option>
          ))}
        </select>
        <button
          type="button"
          className={buttonSecondary}
          disabled={!adding}
          onClick={() => {
            append({ component: adding, value: "" }, { shouldFocus: true });
            setAdding("");
          }}
        >
          Add
        </button>
      </div>
      <div className="mt-3 grid gap-2 sm:grid-cols-2 sm:items-end">
        <label className="text-xs text-ink-soft">
          Sampled on
          <input type="date" className={`${cell} num mt-0.5 block w-full`} {...register(`analyses.${index}.sampledOn`)} />
          <FieldError id={`analysis-${index}-sampled-error`} message={errs?.sampledOn?.message} />
        </label>
        <label className="text-xs text-ink-soft">
          Laboratory
          <input autoComplete="off" className={`${cell} mt-0.5 block w-full`} {...register(`analyses.${index}.laboratory`)} />
        </label>
        <label className="text-xs text-ink-soft">
          Carbon ± % (95 %)
          <input inputMode="decimal" autoComplete="off" placeholder="default" className={`${cell} num mt-0.5 block w-full text-right`} {...register(`analyses.${index}.carbonUncertaintyPct`)} />
          <FieldError id={`analysis-${index}-carbon-u-error`} message={errs?.carbonUncertaintyPct?.message} />
        </label>
        <label className="text-xs text-ink-soft">
          Calorific value ± % (95 %)
          <input inputMode="decimal" autoComplete="off" placeholder="default" className={`${cell} num mt-0.5 block w-full text-right`} {...register(`analyses.${index}.cvUncertaintyPct`)} />
          <FieldError id={`analysis-${index}-cv-u-error`} message={errs?.cvUncertaintyPct?.message} />
        </label>
        <label className="text-xs text-ink-soft">
          Note
          <input autoComplete="off" className={`${cell} mt-0.5 block w-full`} {...register(`analyses.${index}.note`)} />
        </label>
      </div>
    </section>
  );
}
