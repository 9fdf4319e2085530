"use client";

import { useState, useTransition } from "react";
import { archiveSite } from "@/app/(app)/settings/sites/actions";
import { buttonSecondary } from "@/components/ui/styles";

/** Archiving a site is undoable, so it asks once and does not delete anything. */
export function ArchiveSiteButton({ siteId, archived }: { siteId: string; archived: boolean }) {
  const [pending, start] = useTransition();
  const [error, setError] = useState<string | null>(null);
  return (
    <span className="inline-flex flex-col items-end">
      <button
        type="button"
        className={buttonSecondary}
        disabled={pending}
        onClick={() => {
          if (!archived && !window.confirm("Archive this site? It leaves the site pickers; its months and statements stay readable.")) return;
          start(async () => {
            const r = await archiveSite(siteId, !archived);
            setError(r.ok ? null : r.message);
          });
        }}
      >
        {pending ? "…" : archived ? "Restore site" : "Archive site"}
      </button>
      {error ? (
        <span role="alert" className="text-xs text-fault">
          {error}
        </span>
      ) : null}
    </span>
  );
}
