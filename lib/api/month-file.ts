import "server-only";
import type { MonthBundle } from "@/db/queries/months";
import { methodOf } from "@/db/queries/months";
import type { MonthDocumentInput } from "@/lib/ledger/month-document";

/** What monthDocument and calculateMonth need, from a loaded site-month. */
export function documentInput(b: MonthBundle, period: string): MonthDocumentInput {
  return { siteName: b.site.name, period, method: methodOf(b), streams: b.streams, readings: b.readings, analyses: b.analyses };
}

/** Our download name: synledger-<site code>-<YYYY-MM>.plant-month.json, safe in any header or file system. */
export function exportFileName(siteCode: string, period: string): string {
  const code = siteCode.replace(/[^A-Za-z0-9_-]+/g, "-").replace(/^-+|-+$/g, "") || "site";
  return `synledger-${code}-${period}.plant-month.json`;
}
