import "server-only";
/**
 * A site's year, each month through lib/ledger/month-runs: Open and Balanced months computed
 * from the rows (cached by their exact document), frozen months read from their snapshots.
 * What the year page, the series endpoint, the exports, the overview, the trends, the what-if
 * and the annual statement all read.
 */
import { createHash } from "node:crypto";
import type { Db, Tx } from "@/db/client";
import { loadSiteYearRows, siteDataVersion, type SiteRow, type StreamRow } from "@/db/queries/overview";
import { boundedCache } from "@/lib/memo";
import { currentMonthKey } from "@/lib/period";
import { cachedCalculation, calculationKey, documentInput, isFrozenState, runOfSnapshot, type FrozenFacts } from "./month-runs";
import { buildSeries, type YearSeries } from "./series";
import { rollUpRuns, type MonthRun } from "./year";

export interface SiteYear {
  site: SiteRow;
  year: string;
  streams: StreamRow[];
  runs: MonthRun[];
  /** Snapshot facts of the frozen months, by period. */
  frozen: Map<string, FrozenFacts>;
  /**
   * A hash of everything the runs were made from (the site, its streams, each month's record
   * and either the exact engine input or the snapshot read): equal fingerprints, equal year.
   */
  fingerprint: string;
}

/**
 * `only` limits which months are computed (the ledger's thirteen-month window spans two years and
 * needs no more); the year's roll-up is then of those months only, so callers that read totals
 * leave it out.
 */
export async function loadSiteYear(
  db: Db | Tx,
  organisationId: string,
  siteId: string,
  year: string,
  only?: ReadonlySet<string>,
): Promise<SiteYear | null> {
  const rows = await loadSiteYearRows(db, organisationId, siteId, year);
  if (!rows) return null;
  const { site, streams } = rows;
  // A stream no meter measures is not a missing reading: the balances give its figure.
  const active = new Set(streams.filter((s) => s.archivedAt === null && s.metered !== false).map((s) => s.id));
  const frozen = new Map<string, FrozenFacts>();
  const sources: unknown[] = [site, streams, year, only ? [...only].sort() : null];

  const runs: MonthRun[] = rows.months.filter((m) => !only || only.has(m.period)).map((m) => {
    const monthReadings = rows.readings.filter((r) => r.monthId === m.id);
    const base = {
      id: m.id,
      period: m.period,
      state: m.state,
      revision: m.revision,
      version: m.version,
      coveredThrough: m.coveredThrough,
      readings: { present: monthReadings.filter((r) => active.has(r.streamId)).length, expected: active.size },
    };
    const snapshot = isFrozenState(m.state) ? rows.snapshots.get(m.id) : undefined;
    if (snapshot) {
      const f = runOfSnapshot(snapshot);
      frozen.set(m.period, f.frozen);
      sources.push(base, snapshot.id);
      return { ...base, document: f.document, result: f.result, issues: [], frozen: true };
    }
    const input = documentInput(
      { site, month: m, streams, readings: monthReadings, analyses: rows.analyses.filter((a) => a.monthId === m.id) },
      m.period,
    );
    const key = calculationKey(input, site.closureTolerancePct);
    sources.push(base, key);
    const calc = cachedCalculation(input, site.closureTolerancePct, key);
    return { ...base, document: calc.document, result: calc.ok ? calc.result : null, issues: calc.ok ? [] : calc.issues, frozen: false };
  });
  const fingerprint = createHash("sha256").update(JSON.stringify(sources)).digest("hex");
  return { site, year, streams, runs, frozen, fingerprint };
}

/**
 * Series already built, by the year's fingerprint and the current month (the only thing of the
 * clock a series reads). The series endpoint, the overview's cards and the ledger ask for the
 * same unchanged years again and again; rolling up twelve months in Decimal is most of the work.
 * Callers treat the answer as read-only.
 */
const seriesCache = boundedCache<YearSeries>("series-by-fingerprint", 4000);

/** The series of a loaded year (see lib/ledger/series.ts). */
export function seriesOf(y: SiteYear, now = new Date()): YearSeries {
  const key = `${y.fingerprint}|${currentMonthKey(now)}`;
  const hit = seriesCache.get(key);
  if (hit) return hit;
  const series = buildSeries({
    site: y.site,
    year: y.year,
    runs: y.runs,
    streams: y.streams.map((s) => ({ key: s.key, name: s.name, meterTag: s.meterTag })),
    rollUp: rollUpRuns(y.runs, now),
    now,
  });
  seriesCache.set(key, series);
  return series;
}

/**
 * Series answered by a site's data version (sites.data_version, bumped by the database with any
 * change to the site's figures), the year and the current month, so an unchanged year costs one
 * small query instead of loading and rolling up its months (`only` as for loadSiteYear: the
 * ledger's window; such a series' totals are of those months only). Read the version first: a change
 * that commits after it only makes this entry hold newer figures than its key, and every later
 * read sees the new version and misses.
 */
const versionedSeries = boundedCache<YearSeries>("series-by-version", 4000);

export async function loadSiteSeries(
  db: Db | Tx,
  organisationId: string,
  siteId: string,
  year: string,
  now = new Date(),
  only?: ReadonlySet<string>,
): Promise<YearSeries | null> {
  const version = await siteDataVersion(db, organisationId, siteId);
  if (version === null) return null;
  const key = `${siteId}|${year}|${version}|${currentMonthKey(now)}|${only ? [...only].sort().join(",") : "all"}`;
  const hit = versionedSeries.get(key);
  if (hit) return hit;
  const y = await loadSiteYear(db, organisationId, siteId, year, only);
  if (!y) return null;
  const series = seriesOf(y, now);
  versionedSeries.set(key, series);
  return series;
}
