// The small dense linear algebra the reconciliation needs, in Decimal. Matrices are arrays
// of rows. Sizes here are tiny (a handful of balances × a dozen meters), so plain Gaussian
// elimination with partial pivoting is exact enough at 34 digits and easy to audit.
import { Dec, ZERO, ONE } from "./decimal";

export type Vector = Dec[];
export type Matrix = Dec[][];

export const zeros = (r: number, c: number): Matrix => Array.from({ length: r }, () => Array.from({ length: c }, () => ZERO));
export const identity = (n: number): Matrix => zeros(n, n).map((row, i) => row.map((_, j) => (i === j ? ONE : ZERO)));
export const transpose = (m: Matrix, cols = m[0]?.length ?? 0): Matrix =>
  Array.from({ length: cols }, (_, j) => m.map((row) => row[j]));

// Plain loops rather than map/reduce: these run for every month and the closures cost more than
// the arithmetic at these sizes. Sums run left to right from zero either way.
export function multiply(a: Matrix, b: Matrix, bCols = b[0]?.length ?? 0): Matrix {
  const out: Matrix = new Array(a.length);
  for (let i = 0; i < a.length; i++) {
    const row = a[i];
    const r = new Array<Dec>(bCols);
    for (let j = 0; j < bCols; j++) {
      let s = ZERO;
      for (let k = 0; k < row.length; k++) if (!row[k].isZero()) s = s.plus(row[k].times(b[k][j]));
      r[j] = s;
    }
    out[i] = r;
  }
  return out;
}

// Balance matrices are mostly zeros (a stream sits in one to three balances): zero terms are skipped.
export function matVec(a: Matrix, v: Vector): Vector {
  const out = new Array<Dec>(a.length);
  for (let i = 0; i < a.length; i++) out[i] = dot(a[i], v);
  return out;
}
export function dot(u: Vector, v: Vector): Dec {
  let s = ZERO;
  for (let k = 0; k < u.length; k++) if (!u[k].isZero() && !v[k].isZero()) s = s.plus(u[k].times(v[k]));
  return s;
}

/** Largest absolute entry, for scale-aware zero tests. */
export function maxAbs(m: Matrix): Dec {
  let best = ZERO;
  for (const row of m) for (const x of row) if (!x.isZero() && x.abs().gt(best)) best = x.abs();
  return best;
}

/** Relative tolerance under which a pivot counts as zero: far above 34-digit rounding, far below any physics. */
export const RELATIVE_TOLERANCE = new Dec("1e-26");

export interface Echelon {
  rref: Matrix;
  pivots: number[]; // pivot column of each nonzero row, in order
}

/** Reduced row echelon form with partial pivoting; entries below tol × max|m| are zero. */
export function rowReduce(m: Matrix, cols = m[0]?.length ?? 0): Echelon {
  const a = m.map((row) => row.slice());
  const tol = maxAbs(a).times(RELATIVE_TOLERANCE);
  const pivots: number[] = [];
  let r = 0;
  for (let c = 0; c < cols && r < a.length; c++) {
    let best = r;
    for (let i = r + 1; i < a.length; i++) if (a[i][c].abs().gt(a[best][c].abs())) best = i;
    if (a[best][c].abs().lte(tol)) continue;
    [a[r], a[best]] = [a[best], a[r]];
    // One division for the pivot, then products: the row is scaled by the pivot's reciprocal.
    const p = a[r][c];
    const inv = ONE.div(p);
    const pivotRow = a[r].map((x, j) => (j === c ? ONE : x.isZero() ? x : x.times(inv)));
    a[r] = pivotRow;
    for (let i = 0; i < a.length; i++) {
      if (i === r || a[i][c].isZero()) continue;
      const f = a[i][c];
      const row = a[i];
      for (let j = 0; j < row.length; j++) if (!pivotRow[j].isZero()) row[j] = j === c ? ZERO : row[j].minus(f.times(pivotRow[j]));
    }
    pivots.push(c);
    r++;
  }
  return { rref: a, pivots };
}

export const rank = (m: Matrix, cols?: number): number => rowReduce(m, cols).pivots.length;

/** Basis (as rows) of the null space of m: vectors x with m·x = 0. */
export function nullSpace(m: Matrix, cols: number): Matrix {
  const { rref, pivots } = rowReduce(m, cols);
  const free = Array.from({ length: cols }, (_, j) => j).filter((j) => !pivots.includes(j));
  return free.map((f) => {
    const x = Array.from({ length: cols }, (_, j) => (j === f ? ONE : ZERO));
    pivots.forEach((pc, i) => (x[pc] = rref[i][f].neg()));
    return x;
  });
}

/** Rows P spanning the left null space of b (P·b = 0), so P eliminates the unmeasured flows. */
export function leftNullSpace(b: Matrix, rows: number, cols: number): Matrix {
  if (cols === 0) return identity(rows);
  return nullSpace(transpose(b, cols), rows);
}

/** Indices of a maximal set of linearly independent rows of m. */
export const independentRows = (m: Matrix, cols: number): number[] => rowReduce(transpose(m, cols), m.length).pivots;

/** Solves a·x = b for square nonsingular a (Gaussian elimination, partial pivoting). */
export function solve(a: Matrix, b: Vector): Vector {
  const n = a.length;
  const aug = a.map((row, i) => [...row, b[i]]);
  const { rref, pivots } = rowReduce(aug, n);
  if (pivots.length < n) throw new Error("singular matrix");
  return rref.map((row) => row[n]);
}

export function inverse(a: Matrix): Matrix {
  const n = a.length;
  const { rref, pivots } = rowReduce(a.map((row, i) => [...row, ...identity(n)[i]]), n);
  if (pivots.length < n) throw new Error("singular matrix");
  return rref.map((row) => row.slice(n));
}
