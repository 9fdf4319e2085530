import "server-only";
import { HttpError, quoted, type IssueDetail } from "@/lib/auth/errors";
import { parsePlantMonthText } from "@/lib/balance/schema";
import type { MonthFiguresInput } from "@/lib/validations/month";

interface SiteStream {
  key: string;
  kind: string;
  archivedAt: Date | null;
  /** Absent: metered (callers that do not load it). */
  metered?: boolean;
}

export interface ImportPlan {
  input: MonthFiguresInput;
  /** Turns an issue path of the saved figures (`readings[1].unit`) back into the file's own (`streams[3].unit`). */
  filePath: (path: string) => string;
}

/**
 * A plant-month file → the figures saveMonthFigures takes. Only measured figures come in:
 * readings and analyses. What describes the site (kinds, meters, uncertainties, factors) and the
 * method belong to site set-up and the officer, so the file is checked against them, not obeyed.
 */
/** A file names its site by name (as exported) or by code; case and surrounding spaces do not matter. */
function sameSite(named: string, site: { name: string; code: string }): boolean {
  const n = named.trim().toLowerCase();
  return n === site.name.trim().toLowerCase() || n === site.code.trim().toLowerCase();
}

export function planImport(text: string, period: string, site: { name: string; code: string }, streams: SiteStream[], expectedVersion: number): ImportPlan {
  const siteName = site.name;
  const parsed = parsePlantMonthText(text);
  if (!parsed.ok) {
    throw new HttpError(400, "invalid_plant_month", "The file is not a valid plant-month document; nothing was saved.", parsed.issues.map((i) => ({ path: i.path, message: i.reason })));
  }
  const doc = parsed.doc;
  const byKey = new Map(streams.map((s) => [s.key, s]));
  const issues: IssueDetail[] = [];
  if (!sameSite(doc.site, site)) issues.push({ path: "site", message: `the file is for ${quoted(doc.site)}, but it was sent to ${site.name} (code ${site.code}); import it into its own site, or correct "site" in the file` });
  if (doc.month !== period) issues.push({ path: "month", message: `the file is for ${doc.month}, but it was sent to ${period}` });
  doc.streams.forEach((s, i) => {
    const known = byKey.get(s.id);
    if (!known) issues.push({ path: `streams[${i}].id`, message: `${siteName} has no stream "${s.id}" (its streams: ${streams.map((x) => x.key).join(", ") || "none yet"})` });
    else if (known.kind !== s.kind) issues.push({ path: `streams[${i}].kind`, message: `"${s.id}" is a ${known.kind} stream at ${siteName}, not ${s.kind}` });
    else if (known.archivedAt) issues.push({ path: `streams[${i}].id`, message: `"${s.id}" is archived at ${siteName}; it takes no new readings` });
    else if (s.metered === false && known.metered !== false) issues.push({ path: `streams[${i}].metered`, message: `"${s.id}" is metered at ${siteName}; declare it not metered in site settings first` });
  });
  if (issues.length) throw new HttpError(400, "invalid_input", "The file does not match the site; nothing was saved.", issues);

  const analysisKeys = Object.keys(doc.analyses);
  const input: MonthFiguresInput = {
    expectedVersion,
    // Decimal.toFixed() writes the exact value without an exponent: no digit is lost or invented.
    // A stream not metered with no estimate in the file has nothing to save.
    readings: doc.streams.filter((s) => !s.quantity_missing).map((s) => ({ stream: s.id, quantity: s.quantity.toFixed(), unit: s.unit, ...(s.note ? { note: s.note } : {}) })),
    analyses: analysisKeys.map((key) => {
      const a = doc.analyses[key];
      const components = Object.fromEntries(Object.entries(a.components).flatMap(([c, v]) => (v === undefined ? [] : [[c, v.toFixed()]])));
      return {
        key, components,
        ...(a.carbon_uncertainty_pct !== undefined ? { carbonUncertaintyPct: a.carbon_uncertainty_pct.toFixed() } : {}),
        ...(a.cv_uncertainty_pct !== undefined ? { cvUncertaintyPct: a.cv_uncertainty_pct.toFixed() } : {}),
        ...(a.note ? { note: a.note } : {}),
      };
    }),
  };
  const filePath = (path: string) =>
    path
      .replace(/^readings\[(\d+)\]\.stream/, "streams[$1].id")
      .replace(/^readings\[(\d+)\]/, "streams[$1]")
      .replace(/^analyses\[(\d+)\]/, (_m, i: string) => `analyses.${analysisKeys[Number(i)]}`);
  return { input, filePath };
}
