"use client";

import { useQuery } from "@tanstack/react-query";
import type { YearSeries } from "@/lib/ledger/series";

/** Thrown with the API's own message, so the page can say what went wrong in its words. */
export class SeriesError extends Error {
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
  }
}

async function fetchSeries(siteId: string, year: string): Promise<YearSeries> {
  const res = await fetch(`/api/v1/sites/${encodeURIComponent(siteId)}/years/${encodeURIComponent(year)}/series`, { headers: { accept: "application/json" } });
  if (!res.ok) {
    const body = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
    throw new SeriesError(res.status, body?.error?.message ?? `The series could not be loaded (HTTP ${res.status}).`);
  }
  return (await res.json()) as YearSeries;
}

export function useYearSeries(siteId: string, year: string) {
  return useQuery({ queryKey: ["year-series", siteId, year], queryFn: () => fetchSeries(siteId, year) });
}
