"use client";

import Link from "next/link";
import { useEffect } from "react";
import { Notice } from "@/components/ui/status";
import { buttonPrimary, link } from "@/components/ui/styles";

/** For pages outside the signed-in shell (sign-in, invitations, forbidden). */
export default function RootError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  useEffect(() => {
    console.error(error);
  }, [error]);
  return (
    <main className="mx-auto max-w-md space-y-4 px-5 py-16">
      <h1 className="text-xl font-semibold">This page could not be shown</h1>
      <Notice tone="fault" title="Something went wrong on our side">
        Nothing was changed. Try again in a moment
        {error.digest ? (
          <>
            ; if it keeps happening, quote the reference <span className="num">{error.digest}</span> to your administrator
          </>
        ) : null}
        .
      </Notice>
      <div className="flex items-center gap-4">
        <button type="button" onClick={reset} className={buttonPrimary}>
          Try again
        </button>
        <Link href="/sign-in" className={link}>
          Go to sign-in
        </Link>
      </div>
    </main>
  );
}
