// Weighted least-squares data reconciliation of linear balances A·x + B·u + c = 0 with
// measured x (standard deviations σ) and unmeasured u. Measurements with σ = 0 are exact:
// they are moved to the constant term and never adjusted. The unmeasured flows are
// eliminated by a projection P with P·B = 0 (Crowe's method), leaving G·x + h = 0 with
// G = P·A. Then, with Σ = diag(σ²), r = G·m + h and V = G·Σ·Gᵀ:
//   adjustment a = −Σ·Gᵀ·V⁻¹·r,  x̂ = m + a,  χ² = rᵀ·V⁻¹·r with rank(G) degrees of freedom,
//   Cov(a) = Σ·Gᵀ·V⁻¹·G·Σ; measurement test zᵢ = |aᵢ| / √Cov(a)ᵢᵢ against the two-sided normal value.
// A measurement whose column of G is zero cannot be checked (non-redundant): it keeps its value.
// Testing many meters at once: the measurement tests are read only when the global test fails,
// and each at the Šidák level c^(1/n) for the n meters tested, so the chance of naming any good
// meter in a month where all are good stays 1 − c (Šidák 1967; common practice in data
// reconciliation, no source beyond that). An unmeasured flow is observable when the balances
// fix it (every null vector of B is zero in its place); the others are reported as unknown.
import { Dec, ZERO, dec, sqrtOf } from "./decimal";
import {
  type Matrix, type Vector, RELATIVE_TOLERANCE, dot, independentRows, inverse, leftNullSpace, matVec, maxAbs, multiply, rank, rowReduce, transpose,
} from "./linalg";
import { chiSquareQuantile, normalTwoSided } from "./stats";

export interface ReconcileProblem {
  A: Matrix; // constraints × measured
  B: Matrix; // constraints × unmeasured (rows may be empty arrays)
  c: Vector; // constant term
  measured: Vector;
  sigma: Vector; // standard deviation of each measurement; 0 = exact
  confidence?: Dec; // default 0.95
}

export type Redundancy = "redundant" | "non-redundant" | "exact";

export interface ReconcileSolution {
  reconciled: Vector;
  adjustment: Vector;
  unmeasured: (Dec | null)[]; // null when not observable from the balances
  redundancy: Redundancy[];
  testStatistic: (Dec | null)[]; // null for exact and non-redundant measurements
  suspect: boolean[];
  chi2: Dec;
  dof: number;
  chi2Critical: Dec | null; // null when dof = 0
  /** Two-sided critical value of each measurement test: at the Šidák level for the meters tested. */
  zCritical: Dec;
  /** How many measurements were tested (redundant ones) and the confidence of each test. */
  tested: number;
  perTestConfidence: Dec;
  passed: boolean;
}

export function reconcile(p: ReconcileProblem): ReconcileSolution {
  const nu = p.B[0]?.length ?? 0;
  const rows = p.A.length;
  const conf = p.confidence ?? dec("0.95");
  const adj = p.sigma.map((s, i) => (s.gt(0) ? i : -1)).filter((i) => i >= 0);
  // Exact measurements join the constant term.
  const c1 = p.c.map((ci, r) => p.A[r].reduce((s, a, j) => (p.sigma[j].gt(0) ? s : s.plus(a.times(p.measured[j]))), ci));
  const Aadj = p.A.map((row) => adj.map((j) => row[j]));
  // With no unmeasured flow the projection is the identity: G is A itself.
  const P = nu === 0 ? null : leftNullSpace(p.B, rows, nu);
  let G = P ? multiply(P, Aadj, adj.length) : Aadj;
  let h = P ? matVec(P, c1) : c1;
  const sig2 = adj.map((j) => p.sigma[j].times(p.sigma[j]));
  // V = G·Σ·Gᵀ needs independent rows of G to be invertible (dependent balances add no
  // information). The usual case has them all, so V is tried first and the rows are sorted out
  // only when it turns out singular; either way the same rows are kept.
  let Vinv = G.length && adj.length ? tryInverse(covariance(G, sig2)) : null;
  if (!Vinv && G.length && adj.length) {
    const keep = independentRows(G, adj.length);
    G = keep.map((i) => G[i]);
    h = keep.map((i) => h[i]);
    Vinv = G.length ? inverse(covariance(G, sig2)) : null;
  } else if (!Vinv) {
    G = [];
    h = [];
  }
  const m = adj.map((j) => p.measured[j]);
  const dof = G.length;
  const adjustment: Vector = p.measured.map(() => ZERO);
  const testStatistic: (Dec | null)[] = p.measured.map(() => null);
  const redundancy: Redundancy[] = p.sigma.map((s) => (s.gt(0) ? "non-redundant" : "exact"));
  let chi2 = ZERO;
  if (dof > 0 && Vinv) {
    const r = G.map((row, i) => dot(row, m).plus(h[i]));
    const w = matVec(Vinv, r);
    chi2 = dot(r, w);
    const colTol = maxAbs(G).times(RELATIVE_TOLERANCE);
    adj.forEach((j, k) => {
      const gk = G.map((row) => row[k]);
      adjustment[j] = sig2[k].times(dot(gk, w)).neg();
      if (gk.every((g) => g.abs().lte(colTol))) return;
      redundancy[j] = "redundant";
      const cov = sig2[k].times(sig2[k]).times(dot(gk, matVec(Vinv!, gk)));
      testStatistic[j] = adjustment[j].abs().div(sqrtOf(cov));
    });
  }
  const reconciled = p.measured.map((x, j) => x.plus(adjustment[j]));
  const tested = testStatistic.filter((z) => z !== null).length;
  const perTestConfidence = tested > 1 ? sidakLevel(conf, tested) : conf;
  const zCritical = normalTwoSided(perTestConfidence);
  const chi2Critical = dof > 0 ? chiSquareQuantile(conf, dof) : null;
  const passed = chi2Critical === null || chi2.lte(chi2Critical);
  return {
    reconciled,
    adjustment,
    unmeasured: estimateUnmeasured(p, reconciled, nu),
    redundancy,
    testStatistic,
    suspect: testStatistic.map((z) => !passed && z !== null && z.gt(zCritical)),
    chi2,
    dof,
    chi2Critical,
    zCritical,
    tested,
    perTestConfidence,
    passed,
  };
}

const sidakCache = new Map<string, Dec>();

/** c^(1/n): a power through ln and exp costs more than the rest of a month, and n is small. */
function sidakLevel(conf: Dec, n: number): Dec {
  const key = `${conf.toString()}/${n}`;
  let level = sidakCache.get(key);
  if (level === undefined) sidakCache.set(key, (level = conf.pow(new Dec(1).div(n))));
  return level;
}

/** V = G·Σ·Gᵀ for diagonal Σ (σ² in sig2), built from its upper triangle: it is symmetric. */
function covariance(G: Matrix, sig2: Vector): Matrix {
  const n = G.length;
  const V: Matrix = Array.from({ length: n }, () => new Array<Dec>(n));
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      let v = ZERO;
      for (let k = 0; k < sig2.length; k++) {
        const a = G[i][k];
        const b = G[j][k];
        if (!a.isZero() && !b.isZero()) v = v.plus(a.times(sig2[k]).times(b));
      }
      V[i][j] = v;
      V[j][i] = v;
    }
  }
  return V;
}

function tryInverse(V: Matrix): Matrix | null {
  try {
    return inverse(V);
  } catch (e) {
    if (e instanceof Error && e.message === "singular matrix") return null;
    throw e;
  }
}

/**
 * u from B·u = −(A·x̂ + c). With B of full column rank, by least squares; otherwise each flow
 * the balances fix is read from the reduced system and the others are null (not observable).
 */
function estimateUnmeasured(p: ReconcileProblem, x: Vector, nu: number): (Dec | null)[] {
  if (nu === 0) return [];
  const rhs = p.A.map((row, i) => dot(row, x).plus(p.c[i]).neg());
  if (rank(p.B, nu) === nu) {
    const Bt = transpose(p.B, nu);
    return matVec(inverse(multiply(Bt, p.B, nu)), matVec(Bt, rhs));
  }
  // After reconciliation the system is consistent, so its reduced form gives every fixed flow.
  const { rref, pivots } = rowReduce(p.B.map((row, i) => [...row, rhs[i]]), nu);
  const free = Array.from({ length: nu }, (_, j) => j).filter((j) => !pivots.includes(j));
  const tol = maxAbs(p.B).times(RELATIVE_TOLERANCE);
  const out: (Dec | null)[] = Array.from({ length: nu }, () => null);
  pivots.forEach((pc, i) => {
    if (free.every((f) => rref[i][f].abs().lte(tol))) out[pc] = rref[i][nu];
  });
  return out;
}
