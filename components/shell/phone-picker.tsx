"use client";

import { useState } from "react";
import { ContextSwitcher, type SiteOption } from "./context-switcher";

/** Phones: the site and month picker folds away (and is not in the page until opened), so the page starts near the top. */
export function PhonePicker({ sites, defaultMonth }: { sites: SiteOption[]; defaultMonth: string }) {
  const [open, setOpen] = useState(false);
  return (
    <details className="w-full pb-2 sm:hidden" onToggle={(e) => setOpen((e.currentTarget as HTMLDetailsElement).open)}>
      <summary className="cursor-pointer py-1 text-sm text-accent-strong">Open a site and month</summary>
      {open ? (
        <div className="pt-1">
          <ContextSwitcher sites={sites} defaultMonth={defaultMonth} idPrefix="ctx-phone" />
        </div>
      ) : null}
    </details>
  );
}
