"use client";

import { monthLabel } from "@/reports/format";
import { MonthStateBadge, type MonthState } from "@/components/ui/month-state";
import { Status } from "@/components/ui/status";
import type { PreviewBody } from "@/lib/import/commit";
import type { WizardStream } from "./types";

type Month = PreviewBody["months"][number];

/** What one month would receive, beside what it holds now, so a surprising total stands out. */
export function MonthPlanTable({ month, streams }: { month: Month; streams: WizardStream[] }) {
  const name = (key: string) => streams.find((s) => s.key === key)?.name ?? key;
  return (
    <section className="border border-rule bg-white">
      <header className="flex flex-wrap items-center justify-between gap-2 border-b border-rule bg-paper-deep px-3 py-1.5">
        <h4 className="font-semibold">{monthLabel(month.month)}</h4>
        <span className="text-sm">
          {month.readOnly ? <Status tone="locked">Read-only: {month.state?.replace("_", " ")}; this file cannot be imported</Status> : <MonthStateBadge state={(month.state as MonthState | null) ?? null} />}
        </span>
      </header>
      {month.readings.length ? (
        <table className="w-full text-sm">
          <thead className="text-left text-xs text-ink-soft">
            <tr>
              <th scope="col" className="px-3 py-1 font-medium">Stream</th>
              <th scope="col" className="px-3 py-1 text-right font-medium">Total from the file</th>
              <th scope="col" className="px-3 py-1 text-right font-medium">Values summed</th>
              <th scope="col" className="px-3 py-1 text-right font-medium">Stored now</th>
            </tr>
          </thead>
          <tbody>
            {month.readings.map((r) => {
              const now = month.current.find((c) => c.stream === r.stream);
              const same = now && now.unit === r.unit && now.quantity === r.quantity;
              return (
                <tr key={r.stream} className="border-t border-rule">
                  <td className="px-3 py-1">
                    {name(r.stream)} <span className="num text-xs text-ink-faint">{r.stream}</span>
                  </td>
                  <td className="num px-3 py-1 text-right">
                    {r.quantity} <span className="text-ink-soft">{r.unit}</span>
                  </td>
                  <td className="num px-3 py-1 text-right">{r.values}</td>
                  <td className="num px-3 py-1 text-right text-ink-soft">
                    {now ? `${now.quantity} ${now.unit}` : "—"}
                    {same ? <span className="ml-1 font-sans text-xs">(unchanged)</span> : null}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      ) : null}
      {month.analyses.map((a) => (
        <p key={a.key} className="border-t border-rule px-3 py-1.5 text-sm">
          Analysis <strong>{a.key}</strong>
          {a.sampledOn ? <span className="text-ink-soft">, sampled {a.sampledOn}</span> : null}:{" "}
          <span className="num">
            {Object.entries(a.components)
              .map(([c, v]) => `${c} ${v}`)
              .join(" · ")}{" "}
            mol %
          </span>
        </p>
      ))}
    </section>
  );
}
