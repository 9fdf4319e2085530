/**
 * The month form's values and their translation to and from what the save service takes
 * (monthFiguresSchema). Pure, so the resolver, the live balance and the tests share it.
 */
import { Dec, HUNDRED, sum } from "@/lib/balance/decimal";
import { SUM_TOLERANCE_PCT } from "@/lib/balance/gas-properties";
import type { MonthFiguresInput } from "@/lib/validations/month";

export type Source = "meter" | "estimate" | "invoice";
export const SOURCES: { value: Source; label: string }[] = [
  { value: "meter", label: "Meter" },
  { value: "estimate", label: "Estimate" },
  { value: "invoice", label: "Invoice" },
];

/** What the form knows of a stream besides its reading (fixed while the form is open). */
export interface StreamInfo {
  id: string;
  key: string;
  name: string;
  kind: string;
  unit: string;
  units: readonly string[];
  analysisKey: string | null;
  destination: string | null;
  fate: string | null;
  uncertaintyPct: string | null;
  /** False: no meter; the balances solve for the flow and a figure entered here is an estimate. */
  metered: boolean;
  systematicPct: string | null;
  calibratedOn: string | null;
  indirectFactor: string | null;
  meterTag: string | null;
  sortOrder: number;
  archived: boolean;
  /** Had a saved reading when the form was opened: emptying it means "remove". */
  hadReading: boolean;
}

export interface ReadingValue {
  stream: string;
  quantity: string;
  unit: string;
  source: Source;
  note: string;
}
export interface ComponentValue {
  component: string;
  value: string;
}
export interface AnalysisValue {
  key: string;
  components: ComponentValue[];
  sampledOn: string;
  laboratory: string;
  carbonUncertaintyPct: string;
  cvUncertaintyPct: string;
  note: string;
  /** Was saved before: an empty table cannot remove it (the service has no removal). */
  saved: boolean;
}
export interface MonthFormValues {
  readings: ReadingValue[];
  analyses: AnalysisValue[];
}

export const DECIMAL_TEXT = /^\d+(\.\d+)?$/;

/** Where each payload entry came from, to put the service's `readings[2].quantity` back on the right row. */
export interface PayloadMap {
  readings: number[];
  analyses: number[];
}

export function toFigures(values: MonthFormValues, expectedVersion: number): { figures: MonthFiguresInput; map: PayloadMap } {
  const map: PayloadMap = { readings: [], analyses: [] };
  const readings: NonNullable<MonthFiguresInput["readings"]> = [];
  const removeReadings: string[] = [];
  values.readings.forEach((r, i) => {
    const quantity = r.quantity.trim();
    if (quantity === "") {
      removeReadings.push(r.stream);
      return;
    }
    map.readings.push(i);
    readings.push({ stream: r.stream, quantity, unit: r.unit as never, source: r.source, ...(r.note.trim() ? { note: r.note.trim() } : {}) });
  });
  const analyses: NonNullable<MonthFiguresInput["analyses"]> = [];
  values.analyses.forEach((a, i) => {
    const filled = a.components.filter((c) => c.value.trim() !== "");
    if (filled.length === 0 && !a.saved) return;
    map.analyses.push(i);
    analyses.push({
      key: a.key,
      components: Object.fromEntries(filled.map((c) => [c.component, c.value.trim()])),
      ...(a.sampledOn ? { sampledOn: a.sampledOn } : {}),
      ...(a.laboratory.trim() ? { laboratory: a.laboratory.trim() } : {}),
      // Always sent: an emptied box clears the figure ("").
      carbonUncertaintyPct: a.carbonUncertaintyPct.trim(),
      cvUncertaintyPct: a.cvUncertaintyPct.trim(),
      ...(a.note.trim() ? { note: a.note.trim() } : {}),
    });
  });
  return { figures: { expectedVersion, readings, removeReadings, analyses }, map };
}

/**
 * Turns a payload path (`readings[1].quantity`, `analyses[0].components.CH4`) into the form's
 * field name (`readings.4.quantity`, `analyses.0.components.2.value`); null when it names no field.
 */
export function formPath(path: string, map: PayloadMap, values: MonthFormValues): string | null {
  const m = /^(readings|analyses)\[(\d+)\](?:\.(.+))?$/.exec(path);
  if (!m) return null;
  const [, list, idx, rest = ""] = m;
  if (list === "readings") {
    const row = map.readings[Number(idx)];
    if (row === undefined) return null;
    return `readings.${row}.${rest === "stream" || rest === "" ? "quantity" : rest}`;
  }
  const a = map.analyses[Number(idx)];
  if (a === undefined) return null;
  const comp = /^components\.(.+)$/.exec(rest);
  if (comp) {
    const ci = values.analyses[a].components.findIndex((c) => c.component === comp[1]);
    return ci >= 0 ? `analyses.${a}.components.${ci}.value` : `analyses.${a}.total`;
  }
  if (rest === "components" || rest === "") return `analyses.${a}.total`;
  return `analyses.${a}.${rest}`;
}

export interface AnalysisSum {
  total: Dec;
  /** Empty, within the tolerance of 100 (normalised with a warning), exactly 100, or refused. */
  status: "empty" | "exact" | "normalised" | "refused";
  /** Normalised values by component, when status is "normalised". */
  normalised: Record<string, Dec>;
  hasInvalid: boolean;
}

/** The sum rule of the plant-month format: within 0.5 of 100 is normalised, beyond is refused. */
export function analysisSum(a: Pick<AnalysisValue, "components">): AnalysisSum {
  const valid = a.components.filter((c) => DECIMAL_TEXT.test(c.value.trim()));
  const hasInvalid = a.components.some((c) => c.value.trim() !== "" && !DECIMAL_TEXT.test(c.value.trim()));
  const total = sum(valid.map((c) => new Dec(c.value.trim())));
  if (valid.length === 0) return { total, status: "empty", normalised: {}, hasInvalid };
  if (total.eq(HUNDRED)) return { total, status: "exact", normalised: {}, hasInvalid };
  if (total.minus(HUNDRED).abs().gt(SUM_TOLERANCE_PCT)) return { total, status: "refused", normalised: {}, hasInvalid };
  const normalised = Object.fromEntries(valid.map((c) => [c.component, new Dec(c.value.trim()).times(HUNDRED).div(total)]));
  return { total, status: "normalised", normalised, hasInvalid };
}

export const SUM_TOLERANCE_TEXT = SUM_TOLERANCE_PCT.toFixed();
