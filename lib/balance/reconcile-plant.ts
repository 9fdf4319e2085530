// Reconciliation of one plant-month: the measured stream quantities (in their own units)
// are adjusted within their stated uncertainty so the closable element balances hold.
// Choice: a stream without uncertainty_pct is EXACT (σ = 0) and is never moved — a missing
// uncertainty is not licence to shift a meter by an arbitrary amount. Fuel burnt with no
// stack-co2 monitor leaves flue-gas carbon unmeasured; it enters as an unmeasured flow and is
// eliminated by projection, which makes the carbon balance non-redundant in that case. A stream
// declared not metered ("metered": false) is an unmeasured flow too: the adjustment solves for
// it instead of moving the metered flows to absorb it.
import { BALANCE_NAMES, type BalanceName, type ElementBalances, balanceTerms, closure, elementBalances } from "./balances";
import { Dec, HUNDRED, ZERO, dec } from "./decimal";
import { reconcile, type Redundancy } from "./reconcile";
import { isUnmetered } from "./schema";
import type { StreamFlow } from "./streams";
import type { Flag } from "./types";

/** Coverage factor of a 95 % expanded uncertainty (normal distribution). */
export const COVERAGE_95 = dec("1.96");

export interface StreamReconciliation {
  id: string;
  measured: Dec;
  reconciled: Dec;
  adjustment: Dec;
  adjustment_pct: Dec | null;
  sigma: Dec;
  test_statistic: Dec | null;
  suspect: boolean;
  redundancy: Redundancy;
}

/** A flow the balances must supply: flue-gas carbon with no stack monitor, or a stream declared not metered. */
export interface UnmeasuredFlow {
  id: string;
  /** The stream, when the flow is one of the month's streams. */
  stream: string | null;
  /** The one balance it enters (flue-gas carbon); null for a stream, which may enter several. */
  balance: BalanceName | null;
  /** Solved amount, kmol (of the balance's element for flue-gas carbon; of the stream's material for a stream); null when the balances do not fix it. */
  kmol: Dec | null;
  /** Solved quantity in the stream's unit; null for flue-gas carbon or when not fixed. */
  quantity: Dec | null;
  observable: boolean;
}

export interface PlantReconciliation {
  constraints: BalanceName[];
  streams: StreamReconciliation[];
  unmeasured: UnmeasuredFlow[];
  chi2: Dec;
  dof: number;
  chi2_critical: Dec | null;
  /** Critical value of each measurement test (Šidák level for `tested` meters); read only when the global test fails. */
  z_critical: Dec;
  tested: number;
  per_test_confidence: Dec;
  passed: boolean;
  closures_after: Record<BalanceName, Dec | null>;
  flags: Flag[];
}

const sigmaPerPct = new Map<string, Dec>();

/** σ = u% ÷ 100 ÷ 1.96 × quantity; the quotient of each stated uncertainty is worked out once. */
export function sigmaOf(flow: StreamFlow): Dec {
  const u = flow.stream.uncertainty_pct;
  if (!u) return ZERO;
  const key = u.toString();
  let rel = sigmaPerPct.get(key);
  if (rel === undefined) {
    if (sigmaPerPct.size > 10_000) sigmaPerPct.clear();
    sigmaPerPct.set(key, (rel = u.div(HUNDRED).div(COVERAGE_95)));
  }
  return rel.times(flow.stream.quantity);
}

/** `measured`: the flows' element balances when the caller has them already (they are the same figures). */
export function reconcilePlant(flows: StreamFlow[], confidence = dec("0.95"), measured: ElementBalances = elementBalances(flows)): PlantReconciliation | null {
  const constraints = BALANCE_NAMES.filter((b) => measured.closable[b]);
  if (constraints.length === 0) return null;
  const terms = flows.map(balanceTerms);
  const inBalances = flows.map((_, i) => i).filter((i) => constraints.some((b) => terms[i][b]));
  const vars = inBalances.filter((i) => !isUnmetered(flows[i].stream));
  const unmetered = inBalances.filter((i) => isUnmetered(flows[i].stream));
  const coefficient = (i: number, b: BalanceName) => {
    const t = terms[i][b];
    return t ? (t.side === "out" ? t.perUnit : t.perUnit.neg()) : ZERO;
  };
  const A = constraints.map((b) => vars.map((i) => coefficient(i, b)));
  const has = (k: string) => flows.some((f) => f.stream.kind === k);
  const flueGas = constraints.includes("carbon") && has("fuel-gas") && !has("stack-co2");
  const B = constraints.map((b) => [
    ...(flueGas ? [b === "carbon" ? dec(1) : ZERO] : []),
    ...unmetered.map((i) => coefficient(i, b)),
  ]);
  const sigma = vars.map((i) => sigmaOf(flows[i]));
  const sol = reconcile({
    A, B, c: constraints.map(() => ZERO),
    measured: vars.map((i) => flows[i].stream.quantity),
    sigma,
    confidence,
  });
  const solved = flueGas ? sol.unmeasured.slice(1) : sol.unmeasured;
  const unmeasured: UnmeasuredFlow[] = [
    ...(flueGas ? [{ id: "flue-gas-carbon", stream: null, balance: "carbon" as BalanceName, kmol: sol.unmeasured[0], quantity: null, observable: sol.unmeasured[0] !== null }] : []),
    ...unmetered.map((i, j): UnmeasuredFlow => {
      const q = solved[j];
      const k = flows[i].kmolPerUnit;
      return { id: flows[i].stream.id, stream: flows[i].stream.id, balance: null, quantity: q, kmol: q && k ? q.times(k) : null, observable: q !== null };
    }),
  ];
  const streams = vars.map((i, k): StreamReconciliation => {
    const q = flows[i].stream.quantity;
    return {
      id: flows[i].stream.id,
      measured: q,
      reconciled: sol.reconciled[k],
      adjustment: sol.adjustment[k],
      adjustment_pct: q.isZero() ? null : sol.adjustment[k].div(q).times(HUNDRED),
      sigma: sigma[k],
      test_statistic: sol.testStatistic[k],
      suspect: sol.suspect[k],
      redundancy: sol.redundancy[k],
    };
  });
  const byFlow = new Map<StreamFlow, Dec>(vars.map((i, k) => [flows[i], sol.reconciled[k]]));
  unmetered.forEach((i, j) => {
    if (solved[j]) byFlow.set(flows[i], solved[j]!);
  });
  const after = elementBalances(flows, (f) => byFlow.get(f) ?? f.stream.quantity);
  const closures_after = Object.fromEntries(
    BALANCE_NAMES.map((b) => {
      if (!constraints.includes(b)) return [b, null];
      const extra = b === "carbon" && flueGas ? (sol.unmeasured[0] ?? ZERO) : ZERO;
      return [b, closure(after[b].in_kmol, after[b].out_kmol.plus(extra))];
    }),
  ) as Record<BalanceName, Dec | null>;
  return {
    constraints,
    streams,
    unmeasured,
    chi2: sol.chi2,
    dof: sol.dof,
    chi2_critical: sol.chi2Critical,
    z_critical: sol.zCritical,
    tested: sol.tested,
    per_test_confidence: sol.perTestConfidence,
    passed: sol.passed,
    closures_after,
    flags: [...reconciliationFlags(streams, sol.passed, sol.chi2, sol.chi2Critical, sol.zCritical), ...unmeteredFlags(unmeasured, flows)],
  };
}

/** Names the suspect meter; meters with the same largest statistic cannot be told apart and are named together. */
export function reconciliationFlags(streams: StreamReconciliation[], passed: boolean, chi2: Dec, crit: Dec | null, zCrit: Dec): Flag[] {
  const flags: Flag[] = [];
  if (!passed && crit)
    flags.push({ code: "reconciliation-global-test-failed", severity: "warning", message: `global test: χ² = ${chi2.toFixed(2)} exceeds ${crit.toFixed(2)} (95 %): the balances and the stated meter uncertainties disagree` });
  const suspects = streams.filter((s) => s.suspect);
  if (suspects.length) {
    const top = suspects.reduce((t, s) => (s.test_statistic!.gt(t) ? s.test_statistic! : t), suspects[0].test_statistic!);
    // Tied meters are named in the month's own stream order, not in the order of rounding dust.
    const tied = suspects.filter((s) => s.test_statistic!.minus(top).abs().lte(top.times("1e-20")));
    const pct = (s: StreamReconciliation) => `${s.id} (adjusted ${s.adjustment_pct?.toFixed(2) ?? "?"} %)`;
    const why = tied.length > 1 ? "; these meters sit in the same balances only and cannot be told apart" : "";
    flags.push({
      code: "reconciliation-suspect-meter",
      severity: "warning",
      stream: tied[0].id,
      message: `suspect meter: ${tied.map(pct).join(", ")}; measurement test ${top.toFixed(2)} > ${zCrit.toFixed(2)}${why}`,
    });
  }
  const unchecked = streams.filter((s) => s.redundancy === "non-redundant").map((s) => s.id);
  if (unchecked.length)
    flags.push({ code: "reconciliation-non-redundant", severity: "info", message: `cannot be checked by the balances (non-redundant): ${unchecked.join(", ")}` });
  return flags;
}

/** What the balances said about each stream that is not metered. */
function unmeteredFlags(unmeasured: UnmeasuredFlow[], flows: StreamFlow[]): Flag[] {
  return unmeasured.filter((u) => u.stream !== null).map((u): Flag => {
    const s = flows.find((f) => f.stream.id === u.stream)!.stream;
    if (u.quantity && u.quantity.isNegative())
      return { code: "unmetered-stream-negative", severity: "warning", stream: s.id,
        message: `${s.id} is not metered and the balances would put it below zero (${u.quantity.toSignificantDigits(6).toFixed()} ${s.unit}): the estimate ${s.quantity.toFixed()} ${s.unit} is kept; check the other meters` };
    return u.quantity
      ? { code: "unmetered-stream-solved", severity: "info", stream: s.id,
          message: `${s.id} is not metered: the balances put it at ${u.quantity.toSignificantDigits(6).toFixed()} ${s.unit}, used as its quantity (its own uncertainty, which comes from the other meters, is not carried into the emissions' uncertainty)` }
      : { code: "unmetered-stream-unknown", severity: "warning", stream: s.id,
          message: s.quantity_missing
          ? `${s.id} is not metered, the balances do not fix it and no estimate was given: it counts as 0 ${s.unit}; meter it or enter an estimate`
          : `${s.id} is not metered and the balances do not fix it: its estimate ${s.quantity.toFixed()} ${s.unit} is used; meter it or give a better estimate` };
  });
}
