import "server-only";
import type { Db, Tx } from "@/db/client";
import { loadMonthBundle, methodOf, type MonthBundle } from "@/db/queries/months";
import { Dec } from "@/lib/balance/decimal";
import { toResultDocument, type ResultDocument } from "@/lib/balance/result";
import type { CalculationResult } from "@/lib/balance/calculate";
import type { InputIssue } from "@/lib/balance/schema";
import { calculateMonth } from "@/lib/ledger/calculate-month";

export type MonthRun =
  | { ok: true; bundle: MonthBundle; result: CalculationResult; doc: ResultDocument; balances: BalanceCheck[] }
  | { ok: false; bundle: MonthBundle; issues: InputIssue[] };

export interface BalanceCheck {
  element: "carbon" | "nitrogen" | "hydrogen";
  /** Decimal string, or null when the engine states no closure (nothing measured on one side). */
  closurePct: string | null;
  tolerancePct: string;
  within: boolean;
}

/** The three closures against the site's tolerance; a balance with no closure stated does not block. */
export function balanceChecks(doc: ResultDocument, tolerancePct: string): BalanceCheck[] {
  const tol = new Dec(tolerancePct);
  return (["carbon", "nitrogen", "hydrogen"] as const).map((element) => {
    const c = doc.balances[element].closure_pct;
    return { element, closurePct: c, tolerancePct, within: c === null || new Dec(c).abs().lte(tol) };
  });
}

/** Runs the engine on what is stored for the site-month now (the same path the API and CLI use). */
export async function runStoredMonth(db: Db | Tx, organisationId: string, siteId: string, period: string): Promise<MonthRun | null> {
  const bundle = await loadMonthBundle(db, organisationId, siteId, period);
  if (!bundle) return null;
  const calc = calculateMonth(
    {
      siteName: bundle.site.name,
      period,
      method: methodOf(bundle),
      streams: bundle.streams,
      readings: bundle.readings,
      analyses: bundle.analyses,
    },
    bundle.site.closureTolerancePct,
  );
  if (!calc.ok) return { ok: false, bundle, issues: calc.issues };
  const doc = toResultDocument(calc.result);
  return { ok: true, bundle, result: calc.result, doc, balances: balanceChecks(doc, bundle.site.closureTolerancePct) };
}
