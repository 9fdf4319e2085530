"use client";

import { useState } from "react";
import { buttonSecondary } from "@/components/ui/styles";
import { csvDocument } from "@/lib/csv";
import { formatCount } from "@/lib/import/limits";
import type { ImportIssue } from "@/lib/import/types";

const PAGE = 50;

/** Every problem, a hundred at a time, and all of them as a CSV to work through beside the file. */
export function IssuesTable({ issues, fileName }: { issues: ImportIssue[]; fileName: string }) {
  const [page, setPage] = useState(0);
  const pages = Math.ceil(issues.length / PAGE);
  const shown = issues.slice(page * PAGE, (page + 1) * PAGE);
  const download = () => {
    const text = csvDocument([], ["row", "column", "problem"], issues.map((i) => [i.row, i.column ?? "", i.reason]));
    const url = URL.createObjectURL(new Blob([text], { type: "text/csv;charset=utf-8" }));
    const a = Object.assign(document.createElement("a"), { href: url, download: `${fileName.replace(/\.[^.]*$/, "")}-problems.csv` });
    a.click();
    URL.revokeObjectURL(url);
  };
  return (
    <div className="space-y-2">
      <div className="relative overflow-x-auto border border-rule bg-white" role="region" aria-label="Problems found" tabIndex={0}>
        <table className="w-full text-sm">
          <caption className="sr-only">Problems found in {fileName}</caption>
          <thead className="bg-paper-deep text-left text-xs text-ink-soft">
            <tr>
              <th scope="col" className="w-16 px-2 py-1 font-medium">Row</th>
              <th scope="col" className="w-40 px-2 py-1 font-medium">Column</th>
              <th scope="col" className="px-2 py-1 font-medium">Problem</th>
            </tr>
          </thead>
          <tbody>
            {shown.map((i, k) => (
              <tr key={k} className="border-t border-rule align-top">
                <td className="num px-2 py-1">{i.row}</td>
                <td className="num px-2 py-1">{i.column ?? <span className="text-ink-faint">whole row</span>}</td>
                <td className="px-2 py-1">{i.reason}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="flex flex-wrap items-center gap-2 text-sm">
        {pages > 1 ? (
          <>
            <button type="button" className={buttonSecondary} disabled={page === 0} onClick={() => setPage(page - 1)}>
              Previous {PAGE}
            </button>
            <span className="num text-ink-soft">
              {formatCount(page * PAGE + 1)}–{formatCount(Math.min(issues.length, (page + 1) * PAGE))} of {formatCount(issues.length)}
            </span>
            <button type="button" className={buttonSecondary} disabled={page >= pages - 1} onClick={() => setPage(page + 1)}>
              Next {PAGE}
            </button>
          </>
        ) : null}
        <button type="button" className={buttonSecondary} onClick={download}>
          Download all {formatCount(issues.length)} as CSV
        </button>
      </div>
    </div>
  );
}
