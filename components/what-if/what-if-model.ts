/**
 * What-if on a copy of stored plant-month documents: the changes are applied to copies, the
 * copies run through the same engine as the ledger, and the result is compared with the recorded
 * figures. Pure: nothing here can reach the database, and nothing is kept after the page closes.
 */
import { Dec, num } from "@/lib/balance/decimal";
import { rollUpYear, type YearResult } from "@/lib/emissions/year";
import { calculateDocuments } from "@/lib/ledger/year";

export interface WhatIfChanges {
  /** "year" or one month "YYYY-MM". */
  scope: string;
  /** Extra CO2 sent to storage each month instead of being vented, t. */
  storageT: string;
  /** Change of fuel gas, % (negative: less fuel). */
  fuelPct: string;
  /** Change of feed gas, %. */
  feedPct: string;
  factorSet: string;
  method: string;
  gwp: string;
}

export const DECIMAL = /^-?\d+(\.\d+)?$/;

type Doc = Record<string, unknown>;
type Stream = { id: string; kind: string; quantity: string; unit: string; [k: string]: unknown };

const scale = (q: string, pct: string) => new Dec(q).times(new Dec(100).plus(pct).div(100)).toFixed();

/** Changes that are not numbers are named, not guessed: the comparison waits until they are. */
export interface WhatIfProblem {
  field: "storageT" | "fuelPct" | "feedPct";
  message: string;
}

/** What is wrong with the changes typed, each in words naming the field; empty when they can be tried. */
export function whatIfProblems(c: WhatIfChanges): WhatIfProblem[] {
  const out: WhatIfProblem[] = [];
  if (!DECIMAL.test(c.storageT)) out.push({ field: "storageT", message: `More CO2 to storage: "${c.storageT}" is not a number; write tonnes with a dot for decimals, e.g. 1500` });
  else if (new Dec(c.storageT).isNegative()) out.push({ field: "storageT", message: "More CO2 to storage cannot be below 0 t" });
  for (const [field, name] of [["fuelPct", "Fuel gas change"], ["feedPct", "Feed gas change"]] as const) {
    const v = c[field];
    if (!DECIMAL.test(v)) out.push({ field, message: `${name}: "${v}" is not a number; write a percentage such as -5 or 2.5` });
    else if (new Dec(v).lt(-100)) out.push({ field, message: `${name} of ${v} % would leave less than no gas; use -100 % (none at all) or more` });
  }
  return out;
}

/** One document with the changes applied (a new object; the input is not touched). */
export function applyChanges(doc: Doc, c: WhatIfChanges): Doc {
  let streams: Stream[] = (doc.streams as Stream[]).map((s): Stream => {
    if (s.kind === "fuel-gas" && c.fuelPct !== "0") return { ...s, quantity: scale(s.quantity, c.fuelPct) };
    if (s.kind === "feed-gas" && c.feedPct !== "0") return { ...s, quantity: scale(s.quantity, c.feedPct) };
    return { ...s };
  });
  const storage = new Dec(c.storageT);
  if (storage.gt(0)) {
    // The captured CO2 no longer leaves through the vent: take it off the vent meters (in tonnes) first.
    let left = storage;
    streams = streams.map((s) => {
      if (s.kind !== "co2-vent" || s.unit !== "t" || left.lte(0)) return s;
      const q = new Dec(s.quantity);
      const take = Dec.min(q, left);
      left = left.minus(take);
      return { ...s, quantity: q.minus(take).toFixed() };
    });
    streams.push({ id: "what-if-storage", kind: "co2-export", destination: "storage", quantity: storage.toFixed(), unit: "t" });
  }
  const method = doc.method as Record<string, string>;
  return { ...doc, streams, method: { emissions: c.method || method.emissions, factor_set: c.factorSet || method.factor_set, gwp: c.gwp || method.gwp } };
}

export interface Figures {
  ammonia_t: string | null;
  co2_t: string | null;
  deducted_co2_t: string | null;
  net_co2_t: string | null;
  co2e_t: string | null;
  net_co2e_t: string | null;
  co2e_t_per_t_nh3: string | null;
  net_co2e_t_per_t_nh3: string | null;
  gj_lhv_per_t_nh3: string | null;
}

function figures(y: YearResult | null): Figures {
  return {
    ammonia_t: num(y?.ammonia_t),
    co2_t: num(y?.co2.gross_t),
    deducted_co2_t: num(y?.co2.deductible_t),
    net_co2_t: num(y?.co2.net_t),
    co2e_t: num(y?.emissions.co2e_t),
    net_co2e_t: num(y?.emissions.net_co2e_t),
    co2e_t_per_t_nh3: num(y?.intensity.co2e_t_per_t_nh3),
    net_co2e_t_per_t_nh3: num(y?.intensity.net_co2e_t_per_t_nh3),
    gj_lhv_per_t_nh3: num(y?.intensity.gj_lhv_per_t_nh3),
  };
}

function totals(docs: Doc[], tolerance: string) {
  // Reconciliation is left out: it neither changes emissions nor intensities, and it is the slow part.
  const runs = calculateDocuments(docs, tolerance, false);
  const ok = runs.flatMap((r) => (r.result ? [{ month: r.month, input: r.result.emissions.input, result: r.result.emissions.detail }] : []));
  return {
    figures: figures(ok.length ? rollUpYear(ok) : null),
    problems: runs.filter((r) => !r.result).map((r) => `${r.month}: ${r.issues.map((i) => `${i.path} ${i.reason}`).join("; ")}`),
  };
}

export interface WhatIfOutcome {
  months: string[];
  recorded: Figures;
  whatIf: Figures;
  problems: string[];
}

export function runWhatIf(documents: readonly Doc[], c: WhatIfChanges, tolerance: string): WhatIfOutcome {
  const chosen = c.scope === "year" ? [...documents] : documents.filter((d) => d.month === c.scope);
  const recorded = totals(chosen, tolerance);
  const changed = totals(chosen.map((d) => applyChanges(d, c)), tolerance);
  return { months: chosen.map((d) => String(d.month)), recorded: recorded.figures, whatIf: changed.figures, problems: changed.problems };
}

/** what-if − recorded, as a decimal string; null where either side has no value. */
export function difference(a: string | null, b: string | null): string | null {
  return a === null || b === null ? null : num(new Dec(b).minus(a));
}

