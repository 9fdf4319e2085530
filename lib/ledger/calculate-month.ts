/**
 * Runs the engine on what the database holds for a site-month: rows → plant-month document →
 * the same parse and calculate the CLI and POST /api/v1/calculate use.
 */
import { calculate, CalculationInputError, type CalculationResult } from "@/lib/balance/calculate";
import { Dec } from "@/lib/balance/decimal";
import { parsePlantMonth, type InputIssue } from "@/lib/balance/schema";
import { monthDocument, type MonthDocumentInput } from "./month-document";

export type MonthCalculation =
  | { ok: true; document: Record<string, unknown>; result: CalculationResult }
  | { ok: false; document: Record<string, unknown>; issues: InputIssue[] };

export function calculateMonth(input: MonthDocumentInput, closureTolerancePct: string): MonthCalculation {
  const document = monthDocument(input);
  const parsed = parsePlantMonth(document);
  if (!parsed.ok) return { ok: false, document, issues: parsed.issues };
  try {
    const result = calculate(parsed.doc, { closureTolerancePct: new Dec(closureTolerancePct) });
    return { ok: true, document, result };
  } catch (err) {
    if (err instanceof CalculationInputError) return { ok: false, document, issues: [{ path: err.path, reason: err.reason }] };
    throw err;
  }
}
