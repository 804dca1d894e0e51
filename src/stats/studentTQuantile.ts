/**
 * The Student t quantile of @stdlib (inverse regularized incomplete beta), remembered by
 * probability and degrees of freedom. The curves and the per-tick bands ask for the same few
 * quantiles thousands of times (one per bin, same level and seed count), and each @stdlib call costs
 * tens of microseconds; a remembered value is the very number @stdlib returned, so results do not
 * change by a bit.
 */
import tQuantile from '@stdlib/stats-base-dists-t-quantile';

/** Entries kept before the memo starts over (Welch's fractional df would otherwise grow it without bound). */
const LIMIT = 4096;

const memo = new Map<number, Map<number, number>>();
let entries = 0;

/**
 * The p-quantile of Student's t with `df` degrees of freedom, exactly @stdlib's
 * `stats-base-dists-t-quantile(p, df)` (NaN for p outside [0, 1] or df <= 0, as @stdlib gives).
 * Cost: one @stdlib call (tens of microseconds) the first time a (p, df) pair is asked for, a map
 * look-up after that; at most 4,096 pairs are remembered (then the memo is cleared). Never throws.
 * Example: `studentTQuantile(0.975, 10)` is 2.2281388519862744.
 */
export function studentTQuantile(p: number, df: number): number {
  const known = memo.get(p)?.get(df);
  if (known !== undefined) return known;
  const q = tQuantile(p, df);
  if (entries >= LIMIT) {
    memo.clear();
    entries = 0;
  }
  let byDf = memo.get(p);
  if (byDf === undefined) {
    byDf = new Map();
    memo.set(p, byDf);
  }
  byDf.set(df, q);
  entries++;
  return q;
}
