import "server-only";
import { cache } from "react";
import { getDb } from "@/db";
import { loadSiteSeries } from "@/lib/ledger/site-year";

/**
 * One load per site and year per request: the overview's site card and its attention list both
 * read the same year, and React's cache makes the second read free. Across requests the series
 * is kept by the site's data version (lib/ledger/site-year.ts).
 */
export const loadSeries = cache(async (organisationId: string, siteId: string, year: string) => loadSiteSeries(getDb(), organisationId, siteId, year));
