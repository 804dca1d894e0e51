/**
 * The mean of per-run values across seeds with its t-interval, in the null-not-NaN shape that
 * `Results` uses: no values gives all nulls, one value gives the mean with a null interval (one seed
 * says nothing about seed noise), two or more give the Student t-interval of the mean (`tInterval`).
 */
import type { Numbers } from '../stats/moments.js';
import { mean } from '../stats/moments.js';
import { tInterval } from '../stats/tInterval.js';

export interface MeanInterval {
  readonly mean: number | null;
  readonly low: number | null;
  readonly high: number | null;
}

/**
 * Mean and `level` t-interval of finite per-run values (callers drop missing values first).
 * Cost O(n). Throws only what `tInterval` throws for a bad level.
 * Example: `seedMeanInterval([1], 0.95)` is `{ mean: 1, low: null, high: null }`.
 */
export function seedMeanInterval(values: Numbers, level: number): MeanInterval {
  if (values.length === 0) return { mean: null, low: null, high: null };
  if (values.length === 1) return { mean: mean(values), low: null, high: null };
  const t = tInterval(values, level);
  return { mean: t.estimate, low: t.low, high: t.high };
}
