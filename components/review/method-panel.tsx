"use client";

import { useActionState } from "react";
import { Notice } from "@/components/ui/status";
import { buttonPrimary, input, label } from "@/components/ui/styles";
import type { ActionResult } from "@/lib/auth/guard";
import type { MethodLabel } from "@/lib/ledger/method-labels";

export interface MethodPanelProps {
  siteId: string;
  period: string;
  version: number;
  current: { emissions: MethodLabel; factorSet: MethodLabel; gwp: MethodLabel };
  choices: { emissions: MethodLabel[]; factorSet: MethodLabel[]; gwp: MethodLabel[] };
  /** Null when the reader may change it now; otherwise why not. */
  lockedBecause: string | null;
  action: (prev: ActionResult | null, formData: FormData) => Promise<ActionResult>;
}

function Chosen({ title, l }: { title: string; l: MethodLabel }) {
  return (
    <div>
      <dt className="text-xs text-ink-soft">{title}</dt>
      <dd>
        {l.name}
        {l.detail ? <span className="block text-xs text-ink-soft">{l.detail}</span> : null}
        <span className="num block text-[0.7rem] text-ink-faint">{l.code}</span>
      </dd>
    </div>
  );
}

function Choice({ id, name, title, options, value }: { id: string; name: string; title: string; options: MethodLabel[]; value: string }) {
  return (
    <div>
      <label htmlFor={id} className={label}>
        {title}
      </label>
      <select id={id} name={name} defaultValue={value} className={`mt-1 ${input}`}>
        {options.map((o) => (
          <option key={o.code} value={o.code}>
            {o.name} ({o.code})
          </option>
        ))}
      </select>
    </div>
  );
}

/** The month's own method, factor set and GWP set; the officer or an administrator changes them while the month is Open or Balanced. */
export function MethodPanel(p: MethodPanelProps) {
  const [state, action, pending] = useActionState<ActionResult | null, FormData>(p.action, null);
  return (
    <section aria-labelledby="method-heading" className="space-y-3 border border-rule bg-white px-4 py-3">
      <h2 id="method-heading" className="text-base font-semibold">
        Method of this month
      </h2>
      <dl className="space-y-2 text-sm">
        <Chosen title="Emissions method" l={p.current.emissions} />
        <Chosen title="Factor set" l={p.current.factorSet} />
        <Chosen title="GWP set" l={p.current.gwp} />
      </dl>
      {p.lockedBecause ? (
        <p className="text-xs text-ink-soft">{p.lockedBecause}</p>
      ) : (
        <form action={action} className="space-y-3 border-t border-rule pt-3">
          <input type="hidden" name="siteId" value={p.siteId} />
          <input type="hidden" name="period" value={p.period} />
          <input type="hidden" name="expectedVersion" value={p.version} />
          <Choice id="method-emissions" name="emissions" title="Emissions method" options={p.choices.emissions} value={p.current.emissions.code} />
          <Choice id="method-factor-set" name="factor_set" title="Factor set" options={p.choices.factorSet} value={p.current.factorSet.code} />
          <Choice id="method-gwp" name="gwp" title="GWP set" options={p.choices.gwp} value={p.current.gwp.code} />
          {state && !state.ok ? <Notice tone="fault">{state.message}</Notice> : null}
          {state?.ok ? <Notice tone="ok">{state.message}</Notice> : null}
          <button type="submit" className={buttonPrimary} disabled={pending}>
            {pending ? "Saving…" : "Save the method"}
          </button>
        </form>
      )}
    </section>
  );
}
