"use client";

import { useTransition, useState } from "react";
import { archiveStream } from "@/app/(app)/settings/sites/actions";

/** Archive or restore in place; the page's data refreshes through the action's revalidation. */
export function ArchiveStreamButton({ siteId, streamId, streamKey, archived }: { siteId: string; streamId: string; streamKey: string; archived: boolean }) {
  const [pending, start] = useTransition();
  const [error, setError] = useState<string | null>(null);
  return (
    <span className="inline-flex flex-col items-end">
      <button
        type="button"
        disabled={pending}
        onClick={() =>
          start(async () => {
            const r = await archiveStream(siteId, streamId, !archived);
            setError(r.ok ? null : r.message);
          })
        }
        className="whitespace-nowrap border border-rule-strong bg-paper px-2 py-0.5 text-xs hover:bg-paper-deep disabled:opacity-60"
        aria-label={`${archived ? "Restore" : "Archive"} stream ${streamKey}`}
      >
        {pending ? "…" : archived ? "Restore" : "Archive"}
      </button>
      {error ? (
        <span role="alert" className="text-xs text-fault">
          {error}
        </span>
      ) : null}
    </span>
  );
}
