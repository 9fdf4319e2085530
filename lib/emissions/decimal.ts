import DecimalBase from "decimal.js";

/**
 * Our own Decimal constructor at 34 significant digits, the engine's precision (lib/balance/decimal.ts says why). It is kept local to lib/emissions so this
 * module does not depend on lib/balance's configuration; values arriving from lib/balance (built
 * with another clone) are re-read through `dec()` so every operation here runs at our precision.
 */
export const D = DecimalBase.clone({ precision: 34, rounding: DecimalBase.ROUND_HALF_EVEN });
export type Decimal = DecimalBase;

export const ZERO = new D(0);
export const ONE = new D(1);

/** Read a Decimal, a decimal string or an integer into our clone without a float round-trip. */
export function dec(x: DecimalBase.Value): Decimal {
  return new D(x);
}

export function sum(values: Iterable<Decimal>): Decimal {
  let total: Decimal = ZERO;
  for (const v of values) total = total.plus(v);
  return total;
}

/** Coverage factor for a 95 % interval of a normal distribution (GUM, Annex G). */
export const K95 = new D("1.96");

/** Parse "44/12" or "3.664" style strings into a Decimal; fractions stay exact until divided here. */
export function parseRatio(numerator: string, denominator: string): Decimal {
  return new D(numerator).div(new D(denominator));
}

/**
 * √x, faster than Decimal#sqrt (which rounds the last of its 34 digits correctly, a guarantee
 * nothing here prints). One Newton step in Decimal from a binary-float first guess: the guess is
 * good to ~16 digits and the step squares its relative error, so the root is good to ~31
 * significant digits, sixteen more than any figure is published with (the golden test holds every
 * published digit); the float never reaches a figure. Used where a square root is taken for every
 * meter of every month (test statistics, root sums of squares).
 */
export function sqrtOf<T extends DecimalBase>(x: T): T {
  if (x.isZero() || x.isNegative()) return x.sqrt() as T;
  const guess = Math.sqrt(x.toNumber());
  if (!Number.isFinite(guess) || guess === 0) return x.sqrt() as T;
  const Ctor = x.constructor as typeof DecimalBase;
  const y = new Ctor(guess);
  return y.plus(x.div(y)).times(HALF) as T;
}

const HALF = new D("0.5");
