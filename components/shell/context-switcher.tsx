"use client";

import { useParams, useRouter, useSearchParams } from "next/navigation";
import { useState, type FormEvent } from "react";
import { buttonSecondary } from "@/components/ui/styles";

export interface SiteOption {
  id: string;
  name: string;
  code: string;
}

/**
 * Picks the site and month to work on. It navigates on "Open" rather than on every change, so
 * keyboard users can move through the options without being carried off mid-choice.
 */
export function ContextSwitcher({ sites, defaultMonth, idPrefix = "ctx" }: { sites: SiteOption[]; defaultMonth: string; idPrefix?: string }) {
  const params = useParams<{ siteId?: string; month?: string }>();
  const search = useSearchParams();
  const router = useRouter();
  // A page filtered by site (the audit trail, statements) names it in the query: show the same one.
  const wanted = params.siteId ?? search.get("site") ?? undefined;
  const currentSite = sites.find((s) => s.id === wanted)?.id ?? sites[0]?.id ?? "";
  const currentMonth = params.month ?? defaultMonth;
  const [siteId, setSiteId] = useState(currentSite);
  const [month, setMonth] = useState(currentMonth);
  const [error, setError] = useState<string | null>(null);
  // The header stays mounted across client-side navigation: follow the site and month in the URL,
  // or "Open month" would open the site shown before the last link was followed.
  const [inUrl, setInUrl] = useState(`${currentSite}/${currentMonth}`);
  if (inUrl !== `${currentSite}/${currentMonth}`) {
    setInUrl(`${currentSite}/${currentMonth}`);
    setSiteId(currentSite);
    setMonth(currentMonth);
    setError(null);
  }

  if (sites.length === 0) {
    return (
      <p className="text-sm text-ink-soft" role="status">
        No sites yet: the site and month pickers appear once a site is set up.
      </p>
    );
  }

  function open(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    if (!/^\d{4}-(0[1-9]|1[0-2])$/.test(month)) {
      setError("Choose a month (year and month).");
      return;
    }
    setError(null);
    router.push(`/sites/${siteId}/months/${month}`);
  }

  return (
    <form onSubmit={open} className="flex flex-wrap items-end gap-2" aria-label="Site and month">
      <div>
        <label htmlFor={`${idPrefix}-site`} className="block text-xs text-ink-soft">
          Site
        </label>
        <select
          id={`${idPrefix}-site`}
          value={siteId}
          onChange={(e) => setSiteId(e.target.value)}
          className="mt-0.5 w-full min-w-40 border border-rule-strong bg-white px-2 py-1 text-sm sm:w-auto"
        >
          {sites.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name} ({s.code})
            </option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor={`${idPrefix}-month`} className="block text-xs text-ink-soft">
          Month
        </label>
        <input
          id={`${idPrefix}-month`}
          type="month"
          value={month}
          min="2000-01"
          max="2100-12"
          onChange={(e) => setMonth(e.target.value)}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${idPrefix}-month-error` : undefined}
          className="num mt-0.5 w-full min-w-36 border border-rule-strong bg-white px-2 py-[3px] text-sm sm:w-auto"
        />
      </div>
      <button type="submit" className={`${buttonSecondary} py-1`}>
        Open month
      </button>
      {error ? (
        <p id={`${idPrefix}-month-error`} role="alert" className="w-full text-xs text-fault">
          {error}
        </p>
      ) : null}
    </form>
  );
}
