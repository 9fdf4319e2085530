"use client";

import Link from "next/link";
import { useEffect } from "react";
import { Notice } from "@/components/ui/status";
import { buttonPrimary, link } from "@/components/ui/styles";

/** Shown inside the shell, so the navigation stays usable when one page fails. */
export default function AppError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  useEffect(() => {
    console.error(error);
  }, [error]);
  return (
    <div className="max-w-prose space-y-4">
      <h1 className="text-xl font-semibold">This page could not be shown</h1>
      <Notice tone="fault" title="Something went wrong on our side">
        Nothing you entered was lost or changed by this error. Try again; if it keeps happening, tell your administrator
        {error.digest ? (
          <>
            {" "}
            and quote the reference <span className="num">{error.digest}</span>
          </>
        ) : null}
        .
      </Notice>
      <div className="flex items-center gap-4">
        <button type="button" onClick={reset} className={buttonPrimary}>
          Try again
        </button>
        <Link href="/" className={link}>
          Back to the overview
        </Link>
      </div>
    </div>
  );
}
