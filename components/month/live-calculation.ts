/**
 * Runs the engine on the month form's current values, in the browser: the same monthDocument,
 * parse and calculate the server uses for saved months, so the preview cannot drift from the
 * stored result. Only complete numbers are counted; half-typed ones are left out, not guessed.
 */
import type { CalculationResult } from "@/lib/balance/calculate";
import { calculateMonth } from "@/lib/ledger/calculate-month";
import { plainPath } from "@/lib/plain-path";
import { DECIMAL_TEXT, type MonthFormValues, type StreamInfo } from "./month-values";

export interface LiveContext {
  siteName: string;
  period: string;
  method: { emissions: string; factor_set: string; gwp: string };
  tolerancePct: string;
  streams: StreamInfo[];
}

export type LiveOutcome =
  | { status: "empty" }
  | { status: "ok"; result: CalculationResult; counted: number; skipped: string[] }
  | { status: "issues"; issues: { where: string; reason: string }[]; skipped: string[] };

export function liveCalculation(values: MonthFormValues, ctx: LiveContext): LiveOutcome {
  const skipped: string[] = [];
  const readings = values.readings.flatMap((r, i) => {
    const q = r.quantity.trim();
    if (q === "") return [];
    if (!DECIMAL_TEXT.test(q)) {
      skipped.push(ctx.streams[i]?.key ?? r.stream);
      return [];
    }
    return [{ streamId: ctx.streams[i].id, quantity: q, unit: r.unit, note: null }];
  });
  if (readings.length === 0) return { status: "empty" };
  const analyses = values.analyses.flatMap((a) => {
    const comps = a.components.filter((c) => DECIMAL_TEXT.test(c.value.trim()));
    const pct = (v: string) => (DECIMAL_TEXT.test(v.trim()) ? v.trim() : null);
    return comps.length
      ? [{ key: a.key, components: Object.fromEntries(comps.map((c) => [c.component, c.value.trim()])), carbonUncertaintyPct: pct(a.carbonUncertaintyPct), cvUncertaintyPct: pct(a.cvUncertaintyPct), note: null }]
      : [];
  });
  try {
    const calc = calculateMonth(
      { siteName: ctx.siteName, period: ctx.period, method: ctx.method, streams: ctx.streams, readings, analyses },
      ctx.tolerancePct,
    );
    if (calc.ok) return { status: "ok", result: calc.result, counted: readings.length, skipped };
    const docStreams = ((calc.document.streams as { id: string }[]) ?? []).map((s) => s.id);
    const issues = calc.issues.map((i) => ({ where: plainPath(i.path, docStreams), reason: i.reason }));
    return { status: "issues", issues, skipped };
  } catch (err) {
    // The engine refuses some inputs by throwing (e.g. a composition far from 100 %): show why.
    return { status: "issues", issues: [{ where: "figures", reason: err instanceof Error ? err.message : String(err) }], skipped };
  }
}
