/**
 * Interquartile mean (IQM): the mean of the middle half of the values, with fractional weights at
 * the 25% and 75% cuts, as recommended for aggregate scores over several tasks and runs by Agarwal
 * et al. (2021), "Deep reinforcement learning at the edge of the statistical precipice", NeurIPS.
 */
import type { Numbers } from './moments.js';
import { sortedCopy } from './quantile.js';

/**
 * Interquartile mean with fractional weights. Sort the n values and treat value i (0-based) as
 * covering [i, i + 1] on a line of length n; the IQM is the average over the middle stretch
 * [n/4, 3n/4], so each value is weighted by its overlap with that stretch, divided by n/2. When n
 * is a multiple of 4 this is the ordinary 25%-trimmed mean; otherwise the values at the cuts count
 * in part (a trimmed mean that drops whole values, such as scipy's `trim_mean(x, 0.25)`, differs:
 * for 10 values it drops 2 per end where this drops 2.5).
 *
 * Cost O(n log n) time (one sorted copy), O(n) memory; the input is not changed.
 * Throws a RangeError when x is empty or holds a NaN.
 * Example: `interquartileMean([0.05, 0.31, 0.42, 0.48, 0.55, 0.61, 0.77, 0.93, 1.2, 2.5])` is 0.617.
 */
export function interquartileMean(x: Numbers): number {
  const n = x.length;
  if (n === 0) throw new RangeError('interquartileMean requires at least 1 value');
  const sorted = sortedCopy(x, 'interquartileMean');
  const lowCut = n / 4;
  const highCut = (3 * n) / 4;
  let total = 0;
  let comp = 0;
  for (let i = Math.floor(lowCut); i < Math.ceil(highCut); i++) {
    const weight = Math.min(i + 1, highCut) - Math.max(i, lowCut);
    if (weight <= 0) continue;
    // Neumaier compensated accumulation, as in moments.sum.
    const term = weight * (sorted[i] as number);
    const t = total + term;
    comp += Math.abs(total) >= Math.abs(term) ? total - t + term : term - t + total;
    total = t;
  }
  return (total + comp) / (n / 2);
}
