import "server-only";
import { getDb } from "@/db";
import { loadMonthBundle, type MonthBundle } from "@/db/queries/months";
import { findSite } from "@/db/queries/sites";
import { HttpError, notFound, quoted } from "@/lib/auth/errors";
import { FIRST_YEAR, LAST_YEAR, isMonthKey, monthTiming } from "@/lib/period";
import type { ApiCaller } from "./actor";

/** The `{month}` path segment: a calendar month written YYYY-MM. */
export function periodParam(month: string): string {
  if (!isMonthKey(month))
    throw new HttpError(400, "invalid_input", `${quoted(month)} is not a month; write it as YYYY-MM (e.g. 2026-03).`, [{ path: "month", message: `must be YYYY-MM with a year ${FIRST_YEAR}..${LAST_YEAR} and a month 01..12` }]);
  return month;
}

/** The site, only when it is the caller's organisation's; otherwise the same 404 as a site that does not exist. */
export async function requireSite(caller: ApiCaller, siteId: string) {
  const site = await findSite(getDb(), caller.organisationId, siteId);
  if (!site) throw notFound("The site");
  return site;
}

export async function requireBundle(caller: ApiCaller, siteId: string, month: string): Promise<MonthBundle> {
  const bundle = await loadMonthBundle(getDb(), caller.organisationId, siteId, periodParam(month));
  if (!bundle) throw notFound("The site");
  return bundle;
}

/** For routes that need figures to exist (result, export): a month nobody started is not found. */
export async function requireStartedMonth(caller: ApiCaller, siteId: string, month: string) {
  const bundle = await requireBundle(caller, siteId, month);
  if (!bundle.month) throw new HttpError(404, "not_found", `No figures have been entered for ${month} at ${bundle.site.name} yet.`);
  return { ...bundle, month: bundle.month };
}

export function analysisView(a: MonthBundle["analyses"][number]) {
  return { key: a.key, components: a.components, sampledOn: a.sampledOn, laboratory: a.laboratory, carbonUncertaintyPct: a.carbonUncertaintyPct, cvUncertaintyPct: a.cvUncertaintyPct, note: a.note };
}

function timingView(period: string) {
  const t = monthTiming(period);
  if (t.kind === "in-progress") return { kind: t.kind, day: t.day, days: t.days, last_day: t.lastDay, closes_on: t.closesOn };
  if (t.kind === "future") return { kind: t.kind, opens_on: t.opensOn };
  return { kind: t.kind };
}

/** A site-month as the API shows it; `version` is what the next save must name. */
export function monthView(b: MonthBundle, period: string) {
  const keyOf = new Map(b.streams.map((s) => [s.id, s.key]));
  return {
    site: { id: b.site.id, name: b.site.name, code: b.site.code },
    month: period,
    state: b.month?.state ?? "open",
    /** ended, in-progress (figures may come in; cannot be closed before `closes_on`) or future. */
    timing: timingView(period),
    covered_through: b.month?.coveredThrough ?? null,
    method: b.month ? { emissions: b.month.emissionsMethod, factor_set: b.month.factorSet, gwp: b.month.gwp } : { emissions: b.site.emissionsMethod, factor_set: b.site.factorSet, gwp: b.site.gwp },
    revision: b.month?.revision ?? 1,
    version: b.month?.version ?? 0,
    updatedAt: b.month?.updatedAt ?? null,
    readings: b.readings
      .map((r) => ({ stream: keyOf.get(r.streamId) ?? r.streamId, quantity: r.quantity, unit: r.unit, source: r.source, note: r.note, updatedAt: r.updatedAt }))
      .sort((x, y) => x.stream.localeCompare(y.stream)),
    analyses: b.analyses.map(analysisView),
  };
}
