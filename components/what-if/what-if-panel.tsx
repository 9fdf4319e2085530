"use client";

import { useDeferredValue, useMemo, useState } from "react";
import { Notice } from "@/components/ui/status";
import { input, label } from "@/components/ui/styles";
import { fixed, signed } from "@/reports/format";
import { difference, runWhatIf, whatIfProblems, type Figures, type WhatIfChanges } from "./what-if-model";

interface Option {
  id: string;
  name: string;
}

const ROWS: { key: keyof Figures; label: string; unit: string; places: number }[] = [
  { key: "ammonia_t", label: "Ammonia", unit: "t NH3", places: 1 },
  { key: "co2_t", label: "Gross CO2", unit: "t CO2", places: 1 },
  { key: "deducted_co2_t", label: "Deducted transfers", unit: "t CO2", places: 1 },
  { key: "net_co2_t", label: "Net CO2", unit: "t CO2", places: 1 },
  { key: "co2e_t", label: "CO2e, direct", unit: "t CO2e", places: 1 },
  { key: "net_co2e_t", label: "Net CO2e", unit: "t CO2e", places: 1 },
  { key: "co2e_t_per_t_nh3", label: "CO2e intensity", unit: "t CO2e/t NH3", places: 3 },
  { key: "net_co2e_t_per_t_nh3", label: "Net CO2e intensity", unit: "t CO2e/t NH3", places: 3 },
  { key: "gj_lhv_per_t_nh3", label: "Energy", unit: "GJ NCV/t NH3", places: 2 },
];

/**
 * Changes on a copy of the recorded months, computed in this browser by the ledger's own engine.
 * There is no save button and no request: the figures go nowhere.
 */
export function WhatIfPanel({
  documents,
  tolerance,
  factorSets,
  methods,
  gwps,
}: {
  documents: Record<string, unknown>[];
  tolerance: string;
  factorSets: Option[];
  methods: Option[];
  gwps: Option[];
}) {
  const [c, setC] = useState<WhatIfChanges>({ scope: "year", storageT: "0", fuelPct: "0", feedPct: "0", factorSet: "", method: "", gwp: "" });
  const deferred = useDeferredValue(c);
  const bad = whatIfProblems(deferred);
  const typed = whatIfProblems(c);
  const outcome = useMemo(() => (bad.length ? null : runWhatIf(documents, deferred, tolerance)), [documents, deferred, tolerance, bad.length]);
  const set = (k: keyof WhatIfChanges) => (e: { target: { value: string } }) => setC({ ...c, [k]: e.target.value.trim() });
  const months = documents.map((d) => String(d.month));

  const field = (id: keyof WhatIfChanges, text: string, unit: string) => (
    <div>
      <label htmlFor={`wi-${id}`} className={label}>
        {text} <span className="font-normal text-ink-soft">({unit})</span>
      </label>
      <input id={`wi-${id}`} inputMode="decimal" className={`${input} num`} value={c[id]} onChange={set(id)} aria-invalid={typed.some((b) => b.field === id) || undefined} aria-describedby={typed.some((b) => b.field === id) ? "wi-problems" : undefined} />
    </div>
  );
  const select = (id: keyof WhatIfChanges, text: string, options: Option[]) => (
    <div>
      <label htmlFor={`wi-${id}`} className={label}>
        {text}
      </label>
      <select id={`wi-${id}`} className={input} value={c[id]} onChange={set(id)}>
        <option value="">as recorded</option>
        {options.map((o) => (
          <option key={o.id} value={o.id}>
            {o.name}
          </option>
        ))}
      </select>
    </div>
  );

  return (
    <div className="grid gap-6 lg:grid-cols-[20rem_minmax(0,1fr)]">
      <form className="space-y-3 border border-rule bg-white px-4 py-3" onSubmit={(e) => e.preventDefault()} aria-label="Changes to try">
        <div>
          <label htmlFor="wi-scope" className={label}>
            Copy of
          </label>
          <select id="wi-scope" className={input} value={c.scope} onChange={set("scope")}>
            <option value="year">the whole year ({months.length} months)</option>
            {months.map((m) => (
              <option key={m} value={m}>
                {m}
              </option>
            ))}
          </select>
        </div>
        {field("storageT", "More CO2 to storage, each month", "t CO2, taken off the vent")}
        {field("fuelPct", "Fuel gas change", "%, e.g. -5")}
        {field("feedPct", "Feed gas change", "%")}
        {select("factorSet", "Factor set", factorSets)}
        {select("method", "Emissions method", methods)}
        {select("gwp", "GWP set", gwps)}
      </form>

      <div className="space-y-3">
        <Notice tone="info" title="Nothing here is saved">
          The changes apply to a copy in your browser. The recorded months, their versions and the audit trail stay as they are.
        </Notice>
        {bad.length ? (
          <div id="wi-problems">
            <Notice tone="warn" title="Check these changes">
              <ul className="list-disc pl-5">
                {bad.map((b) => (
                  <li key={b.field}>{b.message}.</li>
                ))}
              </ul>
            </Notice>
          </div>
        ) : null}
        {outcome ? (
          <div className="relative overflow-x-auto border border-rule bg-white" role="region" aria-label="What-if figures" tabIndex={0}>
            <table className="w-full border-collapse text-sm" aria-live="polite">
              <caption className="px-3 py-1.5 text-left text-xs text-ink-soft">
                {outcome.months.length === 1 ? outcome.months[0] : `${outcome.months.length} months`}: recorded against what-if
              </caption>
              <thead>
                <tr className="border-b border-rule-strong bg-paper-deep text-xs text-ink-soft">
                  <th scope="col" className="px-3 py-1.5 text-left">Figure</th>
                  <th scope="col" className="px-3 py-1.5 text-right">Recorded</th>
                  <th scope="col" className="px-3 py-1.5 text-right">What-if</th>
                  <th scope="col" className="px-3 py-1.5 text-right">Change</th>
                  <th scope="col" className="px-3 py-1.5 text-left">Unit</th>
                </tr>
              </thead>
              <tbody>
                {ROWS.map((r) => {
                  const d = difference(outcome.recorded[r.key], outcome.whatIf[r.key]);
                  return (
                    <tr key={r.key} className="border-b border-rule last:border-0">
                      <th scope="row" className="px-3 py-1.5 text-left font-normal">{r.label}</th>
                      <td className="num px-3 py-1.5 text-right">{fixed(outcome.recorded[r.key], r.places)}</td>
                      <td className="num px-3 py-1.5 text-right font-semibold">{fixed(outcome.whatIf[r.key], r.places)}</td>
                      <td className="num px-3 py-1.5 text-right">{d === null ? "—" : signed(d, r.places)}</td>
                      <td className="px-3 py-1.5 text-xs text-ink-soft">{r.unit}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        ) : null}
        {outcome?.problems.length ? (
          <Notice tone="warn" title="Months left out of the what-if">
            <ul className="list-disc pl-5">{outcome.problems.map((p) => <li key={p}>{p}</li>)}</ul>
          </Notice>
        ) : null}
      </div>
    </div>
  );
}
