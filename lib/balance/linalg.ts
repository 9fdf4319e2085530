// The small dense linear algebra the reconciliation needs, in Decimal. Matrices are arrays
// of rows. Sizes here are tiny (a handful of balances × a dozen meters), so plain Gaussian
// elimination with partial pivoting is exact enough at 50 digits and easy to audit.
import { Dec, ZERO, ONE } from "./decimal";

export type Vector = Dec[];
export type Matrix = Dec[][];

export const zeros = (r: number, c: number): Matrix => Array.from({ length: r }, () => Array.from({ length: c }, () => ZERO));
export const identity = (n: number): Matrix => zeros(n, n).map((row, i) => row.map((_, j) => (i === j ? ONE : ZERO)));
export const transpose = (m: Matrix, cols = m[0]?.length ?? 0): Matrix =>
  Array.from({ length: cols }, (_, j) => m.map((row) => row[j]));

export function multiply(a: Matrix, b: Matrix, bCols = b[0]?.length ?? 0): Matrix {
  return a.map((row) =>
    Array.from({ length: bCols }, (_, j) => row.reduce((s, aik, k) => (aik.isZero() ? s : s.plus(aik.times(b[k][j]))), ZERO)),
  );
}

// Balance matrices are mostly zeros (a stream sits in one to three balances): zero terms are skipped.
export const matVec = (a: Matrix, v: Vector): Vector => a.map((row) => dot(row, v));
export const dot = (u: Vector, v: Vector): Dec => u.reduce((s, x, k) => (x.isZero() || v[k].isZero() ? s : s.plus(x.times(v[k]))), ZERO);

/** Largest absolute entry, for scale-aware zero tests. */
export const maxAbs = (m: Matrix): Dec => m.flat().reduce((s, x) => (x.abs().gt(s) ? x.abs() : s), ZERO);

/** Relative tolerance under which a pivot counts as zero: far above 50-digit rounding, far below any physics. */
export const RELATIVE_TOLERANCE = new Dec("1e-30");

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
    const p = a[r][c];
    a[r] = a[r].map((x) => x.div(p));
    for (let i = 0; i < a.length; i++) {
      if (i === r || a[i][c].isZero()) continue;
      const f = a[i][c];
      const pivotRow = a[r];
      a[i] = a[i].map((x, j) => (pivotRow[j].isZero() ? x : x.minus(f.times(pivotRow[j]))));
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
