import fc from "fast-check";
import { create, all, type MathJsInstance } from "mathjs";
import { describe, expect, it } from "vitest";
import { Dec, dec } from "../../../lib/balance/decimal";
import {
  dot, identity, independentRows, inverse, leftNullSpace, matVec, multiply, nullSpace, rank, rowReduce, solve, transpose, zeros, maxAbs,
} from "../../../lib/balance/linalg";
import { reconcile } from "../../../lib/balance/reconcile";
import { chiSquareCdf, chiSquareQuantile, gammaHalfInteger, normalTwoSided, regularizedLowerGamma } from "../../../lib/balance/stats";

const math = create(all) as MathJsInstance;
const D = (rows: (string | number)[][]) => rows.map((r) => r.map((x) => new Dec(String(x))));
// Tolerances are set by the engine's 34 significant digits (values here are below ~1000).
const near = (x: Dec, expected: Dec | string, tol: string) => expect(x.minus(expected).abs().lte(tol), `${x} vs ${expected}`).toBe(true);

describe("linear algebra in Decimal (hand-checked small cases)", () => {
  it("multiply, transpose, matVec, dot, identity, zeros, maxAbs", () => {
    const a = D([[1, 2], [3, 4]]);
    expect(multiply(a, a).flat().map(String)).toEqual(["7", "10", "15", "22"]);
    expect(transpose(a).flat().map(String)).toEqual(["1", "3", "2", "4"]);
    expect(matVec(a, [dec(1), dec(1)]).map(String)).toEqual(["3", "7"]);
    expect(dot([dec(2)], [dec(3)]).toFixed()).toBe("6");
    expect(multiply(identity(2), a)).toEqual(a);
    expect(zeros(1, 2).flat().map(String)).toEqual(["0", "0"]);
    expect(maxAbs(D([[1, -5]])).toFixed()).toBe("5");
  });
  it("solve and inverse: [[2,1],[1,3]] x = [3,5] → x = [0.8, 1.4]", () => {
    expect(solve(D([[2, 1], [1, 3]]), [dec(3), dec(5)]).map((x) => x.toFixed())).toEqual(["0.8", "1.4"]);
    expect(inverse(D([[2, 0], [0, 4]])).flat().map(String)).toEqual(["0.5", "0", "0", "0.25"]);
    expect(() => solve(D([[1, 2], [2, 4]]), [dec(1), dec(2)])).toThrow(/singular/);
  });
  it("rank, null spaces and independent rows", () => {
    const m = D([[1, 2, 3], [2, 4, 6], [1, 0, 1]]);
    expect(rank(m)).toBe(2);
    expect(rowReduce(m).pivots).toEqual([0, 1]);
    const ns = nullSpace(m, 3);
    expect(ns.length).toBe(1);
    expect(matVec(m, ns[0]).every((x) => x.isZero())).toBe(true);
    const b = D([[1], [1], [0]]);
    const p = leftNullSpace(b, 3, 1);
    expect(multiply(p, b).flat().every((x) => x.isZero())).toBe(true);
    expect(independentRows(m, 3)).toEqual([0, 2]);
  });
});

describe("critical values in Decimal", () => {
  it("χ²₀.₉₅ for 1, 2, 3 dof: 3.841459, 5.991465, 7.814728 (statistical tables, from memory)", () => {
    near(chiSquareQuantile(dec("0.95"), 1), "3.8414588206941", "1e-12");
    near(chiSquareQuantile(dec("0.95"), 3), "7.8147279032512", "1e-12");
  });
  it("χ²₀.₉₅(2) = 2 ln 20 exactly (closed form for 2 dof)", () => near(chiSquareQuantile(dec("0.95"), 2), dec(20).ln().times(2), "1e-28"));
  it("two-sided normal 95 %: 1.959963984540054 (tables, from memory)", () => near(normalTwoSided(dec("0.95")), "1.959963984540054", "1e-14"));
  it("Γ(1/2) = √π, Γ(5) = 24; P(1, x) = 1 − e^−x; χ² cdf of 2 dof = 1 − e^(−x/2)", () => {
    near(gammaHalfInteger(dec("0.5")), Dec.acos(-1).sqrt(), "1e-32");
    expect(gammaHalfInteger(dec(5)).toFixed()).toBe("24");
    near(regularizedLowerGamma(dec(1), dec("0.7")), dec(1).minus(dec("-0.7").exp()), "1e-29");
    near(chiSquareCdf(dec(3), 2), dec(1).minus(dec("-1.5").exp()), "1e-29");
  });
});

describe("reconciliation: splitter/mixer network (textbook-style, own numbers, hand calc with exact fractions)", () => {
  // F1 → splitter → F2 + F3 → mixer → F4: F1 − F2 − F3 = 0, F2 + F3 − F4 = 0.
  // m = 100.1, 64.2, 36.5, 99.5; σ = 1, 0.7, 0.4, 1. By hand (exact fractions):
  // x̂ = 11522/115, 73389/1150, 41831/1150, 11522/115; χ² = 1017/1150.
  const A = D([[1, -1, -1, 0], [0, 1, 1, -1]]);
  const sol = reconcile({ A, B: [[], []], c: [dec(0), dec(0)], measured: D([[100.1, 64.2, 36.5, 99.5]])[0], sigma: D([[1, 0.7, 0.4, 1]])[0] });
  it("reconciled flows and χ² equal the hand solution", () => {
    const expected = [dec(11522).div(115), dec(73389).div(1150), dec(41831).div(1150), dec(11522).div(115)];
    sol.reconciled.forEach((x, i) => near(x, expected[i], "1e-29"));
    near(sol.chi2, dec(1017).div(1150), "1e-29");
    expect(sol.dof).toBe(2);
    expect(sol.passed).toBe(true);
  });
  it("measurement tests 0.1078, 0.8393, 0.8393, 0.8162 (hand calc); none suspect", () => {
    ["0.10779867049", "0.83925432742", "0.83925432742", "0.81618993372"].forEach((z, i) => near(sol.testStatistic[i]!, z, "1e-10"));
    expect(sol.suspect.some(Boolean)).toBe(false);
  });
  it("F3 unmeasured: F1 = F4 = 99.8 (equal weights), F3 = 99.8 − 64.2 = 35.6, F2 non-redundant (hand calc)", () => {
    const s = reconcile({
      A: D([[1, -1, 0], [0, 1, -1]]), B: D([[-1], [1]]), c: [dec(0), dec(0)],
      measured: D([[100.1, 64.2, 99.5]])[0], sigma: D([[1, 0.7, 1]])[0],
    });
    near(s.reconciled[0], "99.8", "1e-29");
    near(s.reconciled[2], "99.8", "1e-29");
    near(s.unmeasured[0]!, "35.6", "1e-29");
    expect(s.redundancy).toEqual(["redundant", "non-redundant", "redundant"]);
    expect(s.testStatistic[1]).toBeNull();
  });
  it("an exact (σ = 0) measurement is never moved", () => {
    const s = reconcile({ A, B: [[], []], c: [dec(0), dec(0)], measured: D([[100.1, 64.2, 36.5, 99.5]])[0], sigma: D([[0, 0.7, 0.4, 1]])[0] });
    expect(s.reconciled[0].toFixed()).toBe("100.1");
    expect(s.redundancy[0]).toBe("exact");
    near(s.reconciled[3], "100.1", "1e-29");
  });
  it("a gross error is named: F4 reads 110", () => {
    const s = reconcile({ A, B: [[], []], c: [dec(0), dec(0)], measured: D([[100.1, 64.2, 36.5, 110]])[0], sigma: D([[1, 0.7, 0.4, 1]])[0] });
    expect(s.passed).toBe(false);
    const top = s.testStatistic.map((z, i) => [z!.toNumber(), i]).sort((a, b) => b[0] - a[0])[0][1];
    expect(top).toBe(3);
  });
});

describe("reconciliation cross-checked against mathjs (floating point, KKT system, 1e-9 relative)", () => {
  const system = fc.record({
    n: fc.integer({ min: 3, max: 7 }),
    seed: fc.array(fc.integer({ min: -9, max: 9 }), { minLength: 80, maxLength: 80 }),
    nu: fc.integer({ min: 0, max: 1 }),
  });
  it("random systems: same x̂, û and χ²; constraints hold to 1e-20; exact stays", () => {
    fc.assert(
      fc.property(system, ({ n, seed, nu }) => {
        const m = 2;
        let k = 0;
        const next = () => seed[k++ % seed.length];
        const A = Array.from({ length: m }, () => Array.from({ length: n }, () => next()));
        const B = Array.from({ length: m }, () => Array.from({ length: nu }, () => next() || 1));
        const meas = Array.from({ length: n }, (_, i) => 50 + next() * 3 + i);
        const sig = Array.from({ length: n }, (_, i) => (i === 0 ? 0 : 1 + Math.abs(next()) / 4));
        const Ad = A.map((r) => r.map((x) => dec(x)));
        const Bd = B.map((r) => r.map((x) => dec(x)));
        const md = meas.map((x) => dec(x));
        const sd = sig.map((x) => dec(String(x)));
        const Dmat = Ad.map((r, i) => [...r, ...Bd[i]]);
        fc.pre(rank(Dmat, n + nu) === m && (nu === 0 || rank(Bd, nu) === nu));
        const adjCols = Array.from({ length: n }, (_, j) => j).filter((j) => sig[j] > 0);
        const P = leftNullSpace(Bd, m, nu);
        fc.pre(rank(multiply(P, Ad.map((r) => adjCols.map((j) => r[j])), adjCols.length), adjCols.length) === P.length);
        const s = reconcile({ A: Ad, B: Bd, c: [dec(0), dec(0)], measured: md, sigma: sd });
        // Residuals in Decimal
        Ad.forEach((row, i) => {
          const res = dot(row, s.reconciled).plus(dot(Bd[i], s.unmeasured as Dec[]));
          expect(res.abs().lte("1e-20")).toBe(true);
        });
        expect(s.reconciled[0].eq(md[0])).toBe(true);
        // KKT in mathjs: minimise Σ (x−m)²/σ² over adjustable x with x0 fixed, s.t. A x + B u = 0
        const na = adjCols.length;
        const size = na + nu + m;
        const rhs = new Array(size).fill(0);
        const Kr = Array.from({ length: size }, () => new Array(size).fill(0));
        adjCols.forEach((j, a) => {
          Kr[a][a] = 1 / sig[j] ** 2;
          rhs[a] = meas[j] / sig[j] ** 2;
        });
        for (let i = 0; i < m; i++) {
          adjCols.forEach((j, a) => {
            Kr[na + nu + i][a] = A[i][j];
            Kr[a][na + nu + i] = A[i][j];
          });
          for (let u = 0; u < nu; u++) {
            Kr[na + nu + i][na + u] = B[i][u];
            Kr[na + u][na + nu + i] = B[i][u];
          }
          rhs[na + nu + i] = -A[i][0] * meas[0];
        }
        const sol = math.lusolve(Kr, rhs) as number[][];
        adjCols.forEach((j, a) => {
          const f = sol[a][0];
          expect(Math.abs(s.reconciled[j].toNumber() - f)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(f)));
        });
        // χ² equals the weighted objective Σ (x̂ − m)² / σ² at the optimum
        const obj = adjCols.reduce((acc, j, a) => acc + (sol[a][0] - meas[j]) ** 2 / sig[j] ** 2, 0);
        expect(Math.abs(s.chi2.toNumber() - obj)).toBeLessThanOrEqual(1e-9 * Math.max(1, obj));
        for (let u = 0; u < nu; u++) {
          const f = sol[na + u][0];
          expect(Math.abs(s.unmeasured[u]!.toNumber() - f)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(f)));
        }
      }),
      { numRuns: 60, seed: 20260 },
    );
  });
});
