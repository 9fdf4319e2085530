import type { ReactNode } from "react";
import type { Mark, Qty } from "@/reports/model";
import { Status, type StatusTone } from "@/components/ui/status";

/** A figure with its unit, in tabular mono; the unit is never dropped. */
export function QtyCell({ q, strong }: { q: Qty; strong?: boolean }) {
  return (
    <span className={`num whitespace-nowrap ${strong ? "font-semibold" : ""}`}>
      {q.value}
      {q.unit ? <span className="ml-1 font-sans text-xs text-ink-soft">{q.unit}</span> : null}
    </span>
  );
}

const TONE: Record<Mark, StatusTone> = { ok: "ok", attention: "warn", fail: "fault", info: "info" };

export function MarkText({ mark, children }: { mark: Mark; children: ReactNode }) {
  return <Status tone={TONE[mark]}>{children}</Status>;
}

export interface Column<R> {
  title: string;
  numeric?: boolean;
  cell: (r: R) => ReactNode;
}

/** A dense, print-friendly table: numbers right-aligned, header units in the column titles. */
export function FigureTable<R>({ caption, columns, rows, empty = "Nothing to show." }: { caption?: string; columns: Column<R>[]; rows: R[]; empty?: string }) {
  return (
    <div className="relative overflow-x-auto border border-rule bg-white" role="region" aria-label={caption ?? "Figures"} tabIndex={0}>
      <table className="w-full border-collapse text-sm">
        {caption ? <caption className="sr-only">{caption}</caption> : null}
        <thead>
          <tr className="border-b border-rule-strong bg-paper-deep text-left">
            {columns.map((c) => (
              <th key={c.title} scope="col" className={`px-3 py-1.5 text-xs font-semibold text-ink-soft ${c.numeric ? "text-right" : ""}`}>
                {c.title}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.length === 0 ? (
            <tr>
              <td colSpan={columns.length} className="px-3 py-2 text-ink-soft">
                {empty}
              </td>
            </tr>
          ) : (
            rows.map((r, i) => (
              <tr key={i} className="border-b border-rule last:border-b-0 align-top">
                {columns.map((c) => (
                  <td key={c.title} className={`px-3 py-1.5 ${c.numeric ? "text-right" : ""}`}>
                    {c.cell(r)}
                  </td>
                ))}
              </tr>
            ))
          )}
        </tbody>
      </table>
    </div>
  );
}

export function Section({ id, title, children, note }: { id: string; title: string; children: ReactNode; note?: ReactNode }) {
  return (
    <section aria-labelledby={id} className="space-y-2">
      <h2 id={id} className="text-base font-semibold">
        {title}
      </h2>
      {note ? <p className="max-w-prose text-sm text-ink-soft">{note}</p> : null}
      {children}
    </section>
  );
}
