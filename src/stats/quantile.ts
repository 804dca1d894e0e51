/**
 * Sample quantiles by linear interpolation between order statistics: definition 7 of Hyndman &
 * Fan (1996), "Sample quantiles in statistical packages", The American Statistician 50:361-365
 * (details from memory). It is the default of R's `quantile` and of numpy's `quantile` (method
 * 'linear').
 *
 * For sorted x_0 <= ... <= x_{n-1} and h = (n - 1) p, the p-quantile is
 * x_floor(h) + (h - floor(h)) (x_floor(h)+1 - x_floor(h)).
 */
import type { Numbers } from './moments.js';

/**
 * The type-7 p-quantile of values already sorted in increasing order (not checked). Cost O(1).
 * Throws a RangeError when the input is empty or p is outside [0, 1].
 * Example: `quantileSorted([1, 2, 3, 4], 0.25)` is 1.75.
 */
export function quantileSorted(sorted: Numbers, p: number): number {
  return quantileAt(sorted.length, p, (k) => sorted[k] as number);
}

/**
 * The type-7 p-quantile of n values given by their order statistics: `at(k)` is the k-th smallest
 * (k from 0), read for k = floor((n - 1) p) and the next one only. Cost: two calls of `at`.
 * Throws a RangeError when n is 0 or p is outside [0, 1].
 * Example: `quantileAt(4, 0.25, (k) => [1, 2, 3, 4][k])` is 1.75.
 */
export function quantileAt(n: number, p: number, at: (k: number) => number): number {
  if (n === 0) throw new RangeError('quantile requires at least 1 value');
  if (!(p >= 0 && p <= 1)) throw new RangeError(`quantile: p must be in [0, 1], got ${p}`);
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const a = at(lo);
  if (lo >= n - 1) return a;
  const b = at(lo + 1);
  const frac = h - lo;
  return frac === 0 ? a : a + (b - a) * frac;
}

/**
 * The type-7 p-quantile of unsorted values: copies and sorts them (the input is not changed),
 * then calls `quantileSorted`. Cost O(n log n) time, O(n) memory.
 * Throws a RangeError when the input is empty, holds a NaN, or p is outside [0, 1].
 * Example: `quantile([3, 1, 4, 1, 5], 0.5)` is 3.
 */
export function quantile(x: Numbers, p: number): number {
  return quantileSorted(sortedCopy(x, 'quantile'), p);
}

/** A sorted Float64Array copy of x; throws a RangeError naming `who` when x holds a NaN. */
export function sortedCopy(x: Numbers, who: string): Float64Array {
  const copy = Float64Array.from(x);
  for (let i = 0; i < copy.length; i++) {
    if (Number.isNaN(copy[i])) throw new RangeError(`${who}: value ${i} is NaN`);
  }
  return copy.sort();
}
