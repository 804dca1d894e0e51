/**
 * Test helpers shared by the bootstrap tests: METHODS.md's sample A and the ideal bootstrap of its
 * mean (every one of the 5^5 resamples), the reference behind METHODS.md's bootstrap check values.
 */
import { expect } from 'vitest';
import { mean } from '../../src/stats/moments.js';

export function expectRelative(actual: number, expected: number, tolerance = 1e-10): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tolerance * Math.abs(expected));
}

// METHODS.md inputs, frozen to prove the functions do not mutate them.
export const A = Object.freeze([71.2, 69.8, 73.1, 70.4, 72.0]);
export const B = Object.freeze([68.9, 70.1, 69.5, 71.0, 67.8, 70.6, 69.2]);

/** Plain left-to-right sum / n, the order numpy uses for 5 values (so floating ties match METHODS.md). */
export const plainMean = (v: ArrayLike<number>): number => {
  let s = 0;
  for (let i = 0; i < v.length; i++) s += v[i] as number;
  return s / v.length;
};

/** Ideal bootstrap: the statistic on every one of the n^n resamples (test-only helper). */
export function idealBootstrapMeans(x: readonly number[]): Float64Array {
  const n = x.length;
  const out = new Float64Array(n ** n);
  const pick = new Array<number>(n).fill(0);
  for (let r = 0; r < out.length; r++) {
    let code = r;
    for (let i = n - 1; i >= 0; i--) {
      pick[i] = x[code % n] as number;
      code = Math.floor(code / n);
    }
    out[r] = plainMean(pick);
  }
  return out;
}

/** Leave-one-out means of x. */
export const leaveOneOutMeans = (x: readonly number[]): number[] => x.map((_, i) => mean(x.filter((__, j) => j !== i)));
