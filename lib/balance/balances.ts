// Element balances across the site boundary, exactly as the plant-month format defines them.
// Carbon: in = feed + fuel carbon; out = co2-export + co2-vent + stack-co2 + carbon in purge
// leaving the site. Purge gas with fate "fuel" is burnt in the site's own furnaces: its carbon
// came in with the feed and leaves again as stack CO2, so it is internal to the carbon balance
// (counting it would count that carbon twice). Nitrogen and hydrogen are drawn around the
// process (synthesis) side, so every measured purge leaves them whatever its fate.
import { Dec, HUNDRED, ZERO, dec } from "./decimal";
import type { StreamFlow } from "./streams";
import type { Flag } from "./types";

export type BalanceName = "carbon" | "nitrogen" | "hydrogen";
export const BALANCE_NAMES: readonly BalanceName[] = ["carbon", "nitrogen", "hydrogen"];
export type Side = "in" | "out";
export type BalanceTerms = Partial<Record<BalanceName, { side: Side; perUnit: Dec }>>;

const HALF = dec("0.5");
const termsOfFlow = new WeakMap<StreamFlow, BalanceTerms>();

/** kmol of C / N2 / H2-equivalents per unit of the stream's quantity, and which side it counts on. */
export function balanceTerms(flow: StreamFlow): BalanceTerms {
  // A flow is never changed once built; its terms are asked for by every balance and the reconciliation.
  let t = termsOfFlow.get(flow);
  if (t === undefined) termsOfFlow.set(flow, (t = workBalanceTerms(flow)));
  return t;
}

function workBalanceTerms(flow: StreamFlow): BalanceTerms {
  const { stream: s, gas, kmolPerUnit: k } = flow;
  if (!gas || !k) return {};
  const C = k.times(gas.atoms.C);
  const N2 = k.times(gas.n2PerMol);
  const H = k.times(gas.h2EquivalentsPerMol);
  switch (s.kind) {
    case "feed-gas":
      return { carbon: { side: "in", perUnit: C }, nitrogen: { side: "in", perUnit: N2 }, hydrogen: { side: "in", perUnit: H } };
    case "fuel-gas":
      return { carbon: { side: "in", perUnit: C } };
    case "process-air": // O2 in air burns 2 H2 per mole: its H2-equivalents are −2 per mol O2
      return { nitrogen: { side: "in", perUnit: N2 }, hydrogen: { side: "in", perUnit: H } };
    case "purge-gas":
      return {
        ...(s.fate === "fuel" ? {} : { carbon: { side: "out" as const, perUnit: C } }),
        nitrogen: { side: "out", perUnit: N2 },
        hydrogen: { side: "out", perUnit: H },
      };
    case "ammonia":
      return { nitrogen: { side: "out", perUnit: k.times(HALF) }, hydrogen: { side: "out", perUnit: k.times(dec("1.5")) } };
    case "co2-export":
    case "co2-vent":
    case "stack-co2":
      return { carbon: { side: "out", perUnit: C } };
    default:
      return {};
  }
}

export interface BalanceFigures {
  in_kmol: Dec;
  out_kmol: Dec;
  closure_pct: Dec | null;
}

export interface ElementBalances {
  carbon: BalanceFigures;
  nitrogen: BalanceFigures;
  hydrogen: BalanceFigures; // in = H2-equivalents available, out = used
  h2n2Ratio: Dec | null;
  /** Balances that can be checked (a measured stream leaves on the out side): the reconciliation constraints. */
  closable: Record<BalanceName, boolean>;
}

/** Does a stream count as a measured carbon outlet for the closure (format: co2-vent, stack-co2 or purge)? */
function closesCarbon(f: StreamFlow): boolean {
  return f.stream.kind === "co2-vent" || f.stream.kind === "stack-co2" || (f.stream.kind === "purge-gas" && f.stream.fate !== "fuel");
}

export function closure(inKmol: Dec, outKmol: Dec): Dec {
  return outKmol.minus(inKmol).div(inKmol).times(HUNDRED);
}

/** Element balances for quantities `q` (default: the quantities as measured). */
export function elementBalances(flows: StreamFlow[], q: (f: StreamFlow) => Dec = (f) => f.stream.quantity): ElementBalances {
  const totals = Object.fromEntries(BALANCE_NAMES.map((b) => [b, { in: ZERO, out: ZERO }])) as Record<BalanceName, { in: Dec; out: Dec }>;
  const hasOut: Record<BalanceName, boolean> = { carbon: false, nitrogen: false, hydrogen: false };
  for (const f of flows) {
    const terms = balanceTerms(f);
    for (const b of BALANCE_NAMES) {
      const t = terms[b];
      if (!t) continue;
      totals[b][t.side] = totals[b][t.side].plus(t.perUnit.times(q(f)));
      if (t.side === "out" && (b !== "carbon" || closesCarbon(f))) hasOut[b] = true;
    }
  }
  const closable = {} as Record<BalanceName, boolean>;
  const fig = (b: BalanceName): BalanceFigures => {
    const { in: i, out: o } = totals[b];
    closable[b] = hasOut[b] && i.gt(0);
    return { in_kmol: i, out_kmol: o, closure_pct: closable[b] ? closure(i, o) : null };
  };
  const carbon = fig("carbon");
  const nitrogen = fig("nitrogen");
  const hydrogen = fig("hydrogen");
  return {
    carbon,
    nitrogen,
    hydrogen,
    h2n2Ratio: nitrogen.in_kmol.gt(0) ? hydrogen.in_kmol.div(nitrogen.in_kmol) : null,
    closable,
  };
}

export interface BalanceOptions {
  /** Closure tolerance, % (default 2; a site may set its own). */
  closureTolerancePct?: Dec;
  /** Accepted H2:N2 range (default 2.9–3.1). */
  ratioRange?: [Dec, Dec];
}

export function balanceFlags(flows: StreamFlow[], bal: ElementBalances, opts: BalanceOptions = {}): Flag[] {
  const tol = opts.closureTolerancePct ?? dec(2);
  const [lo, hi] = opts.ratioRange ?? [dec("2.9"), dec("3.1")];
  const flags: Flag[] = [];
  const has = (kind: string) => flows.some((f) => f.stream.kind === kind);
  if (!has("feed-gas")) flags.push({ code: "missing-feed", severity: "error", message: "no feed-gas stream: carbon, nitrogen and hydrogen inputs are incomplete" });
  if (!has("ammonia")) flags.push({ code: "missing-ammonia", severity: "error", message: "no ammonia stream: nothing to close the nitrogen and hydrogen balances or to divide intensities by" });
  if (!has("process-air")) flags.push({ code: "missing-process-air", severity: "warning", message: "no process-air stream: nitrogen comes only from the feed gas" });
  if (!has("fuel-gas")) flags.push({ code: "missing-fuel", severity: "info", message: "no fuel-gas stream: energy and carbon inputs are feed only" });
  if (bal.carbon.closure_pct === null)
    flags.push({ code: "carbon-closure-open", severity: "info", message: "no co2-vent, stack-co2 or purge leaving the site is measured: only the emission itself closes the carbon balance, so no closure is stated" });
  else if (has("fuel-gas") && !has("stack-co2"))
    flags.push({ code: "carbon-outlet-unmeasured", severity: "warning", message: "fuel gas is burnt but no stack-co2 is measured: flue-gas carbon is missing from the carbon outlet" });
  for (const b of BALANCE_NAMES) {
    const c = bal[b].closure_pct;
    if (b !== "carbon" && c === null)
      flags.push({ code: `${b}-closure-open`, severity: "info", message: `the ${b} balance has no measured inlet or outlet: no closure stated` });
    if (c !== null && c.abs().gt(tol))
      flags.push({ code: `${b}-closure-out-of-tolerance`, severity: "warning", message: `${b} balance closes at ${c.toFixed(2)} %, beyond ±${tol.toFixed()} %` });
  }
  const r = bal.h2n2Ratio;
  if (r !== null && (r.lt(lo) || r.gt(hi)))
    flags.push({ code: "h2-n2-ratio-out-of-range", severity: "warning", message: `implied H2:N2 ratio ${r.toFixed(3)} is outside ${lo.toFixed()}–${hi.toFixed()}` });
  return flags;
}
