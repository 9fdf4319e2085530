"use client";

import { Status } from "@/components/ui/status";
import { formatBytes, formatCount } from "@/lib/import/limits";
import type { Phase, Progress } from "./send-import";

const LABELS: Record<Phase, string> = { upload: "Upload the file", parse: "Read the rows", validate: "Check every row", commit: "Write the months" };

function amount(phase: Phase, done: number, total: number): string {
  if (phase === "upload") return `${formatBytes(done)} of ${formatBytes(total)}`;
  if (phase === "commit") return `${done} of ${total} month${total === 1 ? "" : "s"}`;
  return `${formatCount(done)} of ${formatCount(total)} rows`;
}

/** One bar per phase, each with words and an icon, so the state reads without colour. */
export function ImportProgress({ phases, progress }: { phases: Phase[]; progress: Partial<Record<Phase, Progress>> }) {
  const current = phases.find((p) => !progress[p] || progress[p]!.done < progress[p]!.total) ?? null;
  return (
    <ol className="max-w-xl space-y-3" aria-label="Progress">
      {phases.map((phase) => {
        const p = progress[phase];
        const finished = !!p && p.done >= p.total && current !== phase;
        const pct = p && p.total > 0 ? Math.min(100, Math.round((p.done / p.total) * 100)) : 0;
        return (
          <li key={phase}>
            <div className="flex items-baseline justify-between gap-3 text-sm">
              {finished ? <Status tone="ok">{LABELS[phase]}</Status> : phase === current ? <Status tone="pending">{LABELS[phase]}</Status> : <span className="pl-5 text-ink-faint">{LABELS[phase]}</span>}
              <span className="num text-xs text-ink-soft">{p ? amount(phase, p.done, p.total) : "waiting"}</span>
            </div>
            <div
              role="progressbar"
              aria-label={LABELS[phase]}
              aria-valuemin={0}
              aria-valuemax={100}
              aria-valuenow={pct}
              className="mt-1 h-1.5 w-full border border-rule bg-paper-deep"
            >
              <div className="h-full bg-accent transition-[width]" style={{ width: `${finished ? 100 : pct}%` }} />
            </div>
          </li>
        );
      })}
    </ol>
  );
}
