// Critical values for the reconciliation tests, computed in Decimal rather than from an
// approximation (Wilson–Hilferty is off in the third digit for 1–3 degrees of freedom,
// which is where plant balances live). The χ² quantile inverts the regularized lower
// incomplete gamma P(k/2, x/2), summed by its power series, by bisection; the two-sided
// normal value uses erf(z/√2) = P(1/2, z²/2), so z²₀.₉₇₅ = χ²₀.₉₅(1).
import { Dec, ONE, ZERO, dec } from "./decimal";

const PI = Dec.acos(-1);

/** Γ(a) for a a positive multiple of 1/2. */
export function gammaHalfInteger(a: Dec): Dec {
  if (!a.times(2).isInteger() || a.lte(0)) throw new Error("gammaHalfInteger needs a = k/2 > 0");
  let g = a.isInteger() ? ONE : PI.sqrt(); // Γ(1) or Γ(1/2)
  for (let x = a.isInteger() ? ONE : dec("0.5"); x.lt(a); x = x.plus(1)) g = g.times(x);
  return g;
}

/** Regularized lower incomplete gamma P(a, x) = x^a e^−x Σ xⁿ / Γ(a + n + 1). */
export function regularizedLowerGamma(a: Dec, x: Dec): Dec {
  if (x.lte(0)) return ZERO;
  let term = x.pow(a).times(x.neg().exp()).div(gammaHalfInteger(a.plus(1)));
  let total = term;
  const eps = new Dec("1e-36"); // below the working precision: the series is summed to its last digit
  for (let n = 1; n < 10000; n++) {
    term = term.times(x).div(a.plus(n));
    total = total.plus(term);
    if (term.lt(total.times(eps))) break;
  }
  return total.gt(ONE) ? ONE : total;
}

/** χ² cumulative distribution with k degrees of freedom. */
export const chiSquareCdf = (x: Dec, k: number): Dec => regularizedLowerGamma(new Dec(k).div(2), x.div(2));

const cache = new Map<string, Dec>();

/** χ² quantile: x with P(χ²_k ≤ x) = p, to ~1e-30 (bisection). */
export function chiSquareQuantile(p: Dec, k: number): Dec {
  const key = `${p.toString()}/${k}`;
  const hit = cache.get(key);
  if (hit) return hit;
  let lo = ZERO;
  let hi = new Dec(Math.max(k, 1) * 4 + 10);
  while (chiSquareCdf(hi, k).lt(p)) hi = hi.times(2);
  for (let i = 0; i < 110; i++) {
    const mid = lo.plus(hi).div(2);
    if (chiSquareCdf(mid, k).lt(p)) lo = mid;
    else hi = mid;
  }
  const x = lo.plus(hi).div(2);
  cache.set(key, x);
  return x;
}

/** Two-sided standard normal critical value for confidence c (e.g. 0.95 → 1.959964). */
const normalCache = new Map<string, Dec>();
export function normalTwoSided(c: Dec): Dec {
  const key = c.toString();
  let z = normalCache.get(key);
  if (z === undefined) normalCache.set(key, (z = chiSquareQuantile(c, 1).sqrt()));
  return z;
}
