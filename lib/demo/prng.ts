// Deterministic pseudo-random numbers for the demo (no Math.random): mulberry32 on a
// 32-bit seed, returned as exact Decimals so no binary fraction leaks into the figures.
import { Dec } from "../balance/decimal";

export function seedOf(text: string): number {
  // FNV-1a 32-bit hash of the text
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h;
}

export interface Rng {
  /** Uniform in [0, 1) as an exact Decimal (k / 2³²). */
  next(): Dec;
  /** Uniform in [lo, hi). */
  between(lo: string, hi: string): Dec;
}

export function rng(seed: number): Rng {
  let a = seed >>> 0;
  const nextInt = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return (t ^ (t >>> 14)) >>> 0;
  };
  const next = () => new Dec(nextInt()).div(4294967296);
  return { next, between: (lo, hi) => new Dec(lo).plus(new Dec(hi).minus(lo).times(next())) };
}
