"use client";

import Link from "next/link";
import { formatDateTime, monthLabel } from "@/reports/format";
import { Notice } from "@/components/ui/status";
import { buttonSecondary, link } from "@/components/ui/styles";
import type { CommitBody } from "@/lib/import/commit";
import { formatCount } from "@/lib/import/limits";

export function StepDone({ result: r, siteId, onRestart }: { result: CommitBody; siteId: string; onRestart: () => void }) {
  return (
    <div className="space-y-4">
      <Notice tone="ok" title={`Imported ${r.fileName}`}>
        <p>
          <span className="num">{formatCount(r.rowCount)}</span> rows on {formatDateTime(new Date(r.importedAt))}.{" "}
          {r.changed === 0 ? (
            "The months already held exactly these figures, so none changed; the import itself is recorded in the audit trail."
          ) : (
            <>
              <span className="num">{r.changed}</span> figure{r.changed === 1 ? "" : "s"} changed; every change is in the audit trail under the channel &ldquo;import&rdquo;.
            </>
          )}
          {r.replaced ? ` This replaces the import of ${formatDateTime(new Date(r.replaced.importedAt))}.` : ""}
        </p>
      </Notice>
      <table className="w-full max-w-2xl border border-rule bg-white text-sm">
        <thead className="bg-paper-deep text-left text-xs text-ink-soft">
          <tr>
            <th scope="col" className="px-3 py-1 font-medium">Month</th>
            <th scope="col" className="px-3 py-1 text-right font-medium">Readings</th>
            <th scope="col" className="px-3 py-1 text-right font-medium">Analyses</th>
            <th scope="col" className="px-3 py-1 text-right font-medium">Changed</th>
            <th scope="col" className="px-3 py-1 text-right font-medium">Version</th>
          </tr>
        </thead>
        <tbody>
          {r.months.map((m) => (
            <tr key={m.month} className="border-t border-rule">
              <td className="px-3 py-1">
                <Link className={link} href={`/sites/${siteId}/months/${m.month}`}>
                  {monthLabel(m.month)}
                </Link>
              </td>
              <td className="num px-3 py-1 text-right">{m.readings}</td>
              <td className="num px-3 py-1 text-right">{m.analyses}</td>
              <td className="num px-3 py-1 text-right">{m.changed}</td>
              <td className="num px-3 py-1 text-right">{m.version}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <button type="button" className={buttonSecondary} onClick={onRestart}>
        Import another file
      </button>
    </div>
  );
}
