import "server-only";
import type { InstallationIdentity } from "@/lib/validations/installation";
/**
 * The one home of "run a stored month through the engine". A month that is Open or Balanced is
 * computed from what the database holds now (rows → plant-month document → engine, cached by the
 * exact document). A month In review, Signed or Submitted is read from the snapshot its revision
 * was frozen into when it was sent for review: the document, the result and the engine's full
 * calculation as they were, whatever has changed in the site's settings since. Nothing here
 * computes a frozen month again.
 */
import { createHash } from "node:crypto";
import type { Db, Tx } from "@/db/client";
import { loadMonthBundle, type MonthBundle } from "@/db/queries/months";
import { latestSnapshot, type NewSnapshot } from "@/db/queries/snapshots";
import type { MonthSnapshotRow } from "@/db/schema";
import type { CalculationResult } from "@/lib/balance/calculate";
import { Dec } from "@/lib/balance/decimal";
import { toResultDocument, type ResultDocument } from "@/lib/balance/result";
import type { InputIssue } from "@/lib/balance/schema";
import { ENGINE_VERSION } from "@/lib/balance/version";
import type { StreamFacts } from "@/reports/build-model";
import { calculateMonth, type MonthCalculation } from "./calculate-month";
import { canonicalJson, freezeCalculation, sha256Of, thawCalculation } from "./freeze";
import type { MonthDocumentInput } from "./month-document";
import { FROZEN_MONTH_STATES } from "@/lib/month-states";
import { boundedCache } from "@/lib/memo";

export const isFrozenState = (state: string | null | undefined): boolean => (FROZEN_MONTH_STATES as readonly string[]).includes(state ?? "");

/** What the statement prints beside the figures, as it was when the month was frozen. */
export interface SnapshotContext {
  site: {
    name: string;
    code: string;
    meteringReference: string;
    closureTolerancePct: string;
    /** The installation identity as it stood when the revision was frozen (absent in records frozen before it was kept). */
    installation?: InstallationIdentity | null;
  };
  streams: StreamFacts[];
  analyses: { key: string; sampledOn: string | null; laboratory: string | null }[];
  /** Explanations of the revision's flags, as written before it was frozen. */
  flagNotes?: FlagNoteFact[];
}

export interface FlagNoteFact {
  code: string;
  stream: string;
  text: string;
  /** "Name, role". */
  by: string;
}

export interface FrozenFacts {
  snapshotId: string;
  seq: number;
  engineVersion: string;
  documentSha256: string;
  resultSha256: string;
  frozenAt: Date;
  context: SnapshotContext;
}

export interface BalanceCheck {
  element: "carbon" | "nitrogen" | "hydrogen";
  /** Decimal string, or null when the engine states no closure (nothing measured on one side). */
  closurePct: string | null;
  tolerancePct: string;
  within: boolean;
}

/** The three closures against a tolerance; a balance with no closure stated does not block. */
export function balanceChecks(doc: ResultDocument, tolerancePct: string): BalanceCheck[] {
  const tol = new Dec(tolerancePct);
  return (["carbon", "nitrogen", "hydrogen"] as const).map((element) => {
    const c = doc.balances[element].closure_pct;
    return { element, closurePct: c, tolerancePct, within: c === null || new Dec(c).abs().lte(tol) };
  });
}

export type StoredMonthRun =
  | {
      ok: true;
      bundle: MonthBundle;
      document: Record<string, unknown>;
      result: CalculationResult;
      doc: ResultDocument;
      balances: BalanceCheck[];
      /** Set when the figures come from the revision's snapshot. */
      frozen: FrozenFacts | null;
    }
  | { ok: false; bundle: MonthBundle; document: Record<string, unknown>; issues: InputIssue[]; frozen: null };

// ── live months ────────────────────────────────────────────────────────────────────────────

/**
 * Engine runs kept in memory, keyed by a hash of the exact document and tolerance the engine
 * reads: a saved figure, a changed stream setting or a new method gives a new key, so a stale
 * result can never be served, while a page that reads twelve unchanged months twice does not
 * compute them twice. Bounded so a long-running server does not grow without end.
 */
// 8 000 runs cover the thirteen-month ledger of a 500-site organisation with room to spare; the
// bench reports the server's resident memory after loading that fleet (bench/results.md).
const cache = boundedCache<MonthCalculation>("runs", 8000);

/** The key of a run in the cache: the hash of everything the engine reads. */
export function calculationKey(input: MonthDocumentInput, tolerance: string): string {
  return createHash("sha256").update(JSON.stringify([input, tolerance])).digest("hex");
}

export function cachedCalculation(input: MonthDocumentInput, tolerance: string, key = calculationKey(input, tolerance)): MonthCalculation {
  const hit = cache.get(key);
  if (hit) return hit;
  const calc = calculateMonth(input, tolerance);
  cache.set(key, calc);
  return calc;
}

/** What monthDocument and calculateMonth need, from a loaded site-month. */
export function documentInput(b: Pick<MonthBundle, "site" | "month" | "streams" | "readings" | "analyses">, period: string): MonthDocumentInput {
  const method = b.month
    ? { emissions: b.month.emissionsMethod, factor_set: b.month.factorSet, gwp: b.month.gwp }
    : { emissions: b.site.emissionsMethod, factor_set: b.site.factorSet, gwp: b.site.gwp };
  return {
    siteName: b.site.name,
    period,
    method,
    streams: b.streams,
    readings: b.readings.map((r) => ({ streamId: r.streamId, quantity: r.quantity, unit: r.unit, note: r.note })),
    analyses: b.analyses.map((a) => ({ key: a.key, components: a.components, carbonUncertaintyPct: a.carbonUncertaintyPct, cvUncertaintyPct: a.cvUncertaintyPct, note: a.note })),
  };
}

/** Stream facts for the statement's input table: names, meters and how each figure was obtained. */
export function streamFacts(bundle: Pick<MonthBundle, "streams" | "readings">): StreamFacts[] {
  const readingOf = new Map(bundle.readings.map((r) => [r.streamId, r]));
  return bundle.streams.map((s) => ({
    key: s.key,
    name: s.name,
    kind: s.kind,
    meterTag: s.meterTag,
    calibratedOn: s.calibratedOn,
    source: readingOf.get(s.id)?.source ?? null,
    note: readingOf.get(s.id)?.note ?? null,
    uncertaintyPct: s.uncertaintyPct,
    calibrationIntervalMonths: s.calibrationIntervalMonths,
  }));
}

function contextOf(bundle: MonthBundle, flagNotes: FlagNoteFact[]): SnapshotContext {
  return {
    flagNotes,
    site: {
      name: bundle.site.name,
      code: bundle.site.code,
      meteringReference: bundle.site.meteringReference,
      closureTolerancePct: bundle.site.closureTolerancePct,
      installation: bundle.site.installation ?? null,
    },
    streams: streamFacts(bundle),
    analyses: bundle.analyses.map((a) => ({ key: a.key, sampledOn: a.sampledOn, laboratory: a.laboratory })),
  };
}

// ── frozen months ──────────────────────────────────────────────────────────────────────────

/** The snapshot row of a live run that is about to go In review (lib/lifecycle writes it). */
export function snapshotOf(run: Extract<StoredMonthRun, { ok: true }>, createdBy: string | null, flagNotes: FlagNoteFact[] = []): NewSnapshot {
  const b = run.bundle;
  if (!b.month) throw new Error("a month nobody started cannot be frozen");
  const documentText = canonicalJson(run.document);
  const resultText = canonicalJson(run.doc);
  return {
    organisationId: b.site.organisationId,
    siteId: b.site.id,
    monthId: b.month.id,
    period: b.month.period,
    revision: b.month.revision,
    engineVersion: ENGINE_VERSION,
    closureTolerancePct: b.site.closureTolerancePct,
    documentText,
    documentSha256: sha256Of(documentText),
    resultText,
    resultSha256: sha256Of(resultText),
    calculationText: freezeCalculation(run.result),
    context: contextOf(b, flagNotes),
    createdBy,
  };
}

export function frozenFacts(s: MonthSnapshotRow): FrozenFacts {
  return {
    snapshotId: s.id,
    seq: s.seq,
    engineVersion: s.engineVersion,
    documentSha256: s.documentSha256,
    resultSha256: s.resultSha256,
    frozenAt: s.createdAt,
    context: s.context as SnapshotContext,
  };
}

/** A frozen month's figures, straight from its snapshot: nothing is computed. */
export function runOfSnapshot(s: MonthSnapshotRow) {
  return {
    document: JSON.parse(s.documentText) as Record<string, unknown>,
    result: thawCalculation(s.calculationText),
    doc: JSON.parse(s.resultText) as ResultDocument,
    frozen: frozenFacts(s),
  };
}

/**
 * One site-month through the engine, or from its snapshot when frozen; null when the site is
 * not the organisation's. A frozen month without a snapshot (signed before snapshots existed) is
 * computed live and says so by `frozen: null`.
 */
export async function runStoredMonth(db: Db | Tx, organisationId: string, siteId: string, period: string): Promise<StoredMonthRun | null> {
  const bundle = await loadMonthBundle(db, organisationId, siteId, period);
  if (!bundle) return null;
  return runOfBundle(db, bundle, period);
}

export async function runOfBundle(db: Db | Tx, bundle: MonthBundle, period: string): Promise<StoredMonthRun> {
  const tolerance = bundle.site.closureTolerancePct;
  if (bundle.month && isFrozenState(bundle.month.state)) {
    const snapshot = await latestSnapshot(db, bundle.month.id, bundle.month.revision);
    if (snapshot) {
      const f = runOfSnapshot(snapshot);
      return { ok: true, bundle, ...f, balances: balanceChecks(f.doc, snapshot.closureTolerancePct) };
    }
  }
  const calc = cachedCalculation(documentInput(bundle, period), tolerance);
  if (!calc.ok) return { ok: false, bundle, document: calc.document, issues: calc.issues, frozen: null };
  const doc = toResultDocument(calc.result);
  return { ok: true, bundle, document: calc.document, result: calc.result, doc, balances: balanceChecks(doc, tolerance), frozen: null };
}
