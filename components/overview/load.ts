import "server-only";
import { cache } from "react";
import { getDb } from "@/db";
import { loadSiteYear, seriesOf } from "@/lib/ledger/site-year";

/**
 * One load per site and year per request: the overview's site card and its attention list both
 * read the same year, and React's cache makes the second read free.
 */
export const loadSeries = cache(async (organisationId: string, siteId: string, year: string) => {
  const y = await loadSiteYear(getDb(), organisationId, siteId, year);
  return y ? seriesOf(y) : null;
});
