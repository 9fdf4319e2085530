"use client";

import type { IssueDetail } from "@/lib/auth/errors";
import { Notice } from "@/components/ui/status";
import { buttonSecondary } from "@/components/ui/styles";

const ISO = /(\d{4}-\d{2}-\d{2})T(\d{2}:\d{2}):\d{2}(?:\.\d+)?Z/g;
/** The service writes instants as ISO; people read "2026-12-02 00:46 UTC". */
const readable = (text: string) => text.replace(ISO, "$1 $2 UTC");

/** What changed since the engineer opened the month; their own entries stay in the form. */
export function ConflictNotice({ message, changes, onLoadTheirs, loading }: { message: string; changes: IssueDetail[]; onLoadTheirs: () => void; loading: boolean }) {
  return (
    <Notice tone="warn" title="Not saved: someone else saved this month first">
      <p>{message}</p>
      {changes.length ? (
        <ul className="mt-1.5 space-y-0.5 text-sm" aria-label="Changes since you opened the month">
          {changes.map((c, i) => (
            <li key={i}>
              <span className="num font-medium">{c.path.replace(/^readings\./, "")}</span>: <span className="num">{readable(c.message)}</span>
            </li>
          ))}
        </ul>
      ) : (
        <p className="mt-1 text-sm text-ink-soft">Their change was to the gas analyses or the month&rsquo;s state.</p>
      )}
      <div className="mt-2 flex flex-wrap items-center gap-2">
        <button type="button" className={buttonSecondary} onClick={onLoadTheirs} disabled={loading}>
          {loading ? "Loading…" : "Load their figures (discards yours)"}
        </button>
        <span className="text-sm text-ink-soft">Or note your figures, load theirs, and enter your corrections again.</span>
      </div>
    </Notice>
  );
}
