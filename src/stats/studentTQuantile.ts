/**
 * The Student t quantile of @stdlib (inverse regularized incomplete beta function), and a cache of
 * it that one analysis run creates and owns. The curves and the per-tick bands ask for the same few
 * quantiles thousands of times (one per bin, same level and seed count: 2,072 calls for 123
 * distinct pairs on sample-runs), and each @stdlib call costs tens of microseconds; a cached value
 * is the very number @stdlib returned, so results do not change by a bit. No module state: the
 * cache lives as long as the caller keeps it.
 */
import tQuantile from '@stdlib/stats-base-dists-t-quantile';

/** A function giving the p-quantile of Student's t with df degrees of freedom. */
export type TQuantile = (p: number, df: number) => number;

/**
 * The p-quantile of Student's t with `df` degrees of freedom, exactly @stdlib's
 * `stats-base-dists-t-quantile(p, df)` (NaN for p outside [0, 1] or df <= 0, as @stdlib gives;
 * -Infinity at p = 0, Infinity at p = 1). Pure. Cost one @stdlib call (tens of microseconds).
 * Never throws.
 * Example: `studentTQuantile(0.975, 10)` is 2.2281388519862744.
 */
export function studentTQuantile(p: number, df: number): number {
  return tQuantile(p, df);
}

/** A remembered `studentTQuantile`, owned by whoever created it (`createTQuantileCache`). */
export interface TQuantileCache {
  /** Same numbers as `studentTQuantile`, looked up after the first call for a (p, df) pair. */
  readonly quantile: TQuantile;
  /** Pairs currently remembered. */
  readonly size: () => number;
}

/**
 * A new, empty cache of t quantiles, for one analysis run (or one curve). At most `limit` pairs are
 * kept (then it starts over), since Welch's fractional df would otherwise grow it without bound.
 * Cost per call: a map look-up, or one @stdlib call the first time. Throws a RangeError when limit
 * is not a positive integer.
 * Example: `createTQuantileCache().quantile(0.975, 10)` is 2.2281388519862744.
 */
export function createTQuantileCache(limit = 4096): TQuantileCache {
  if (!(Number.isInteger(limit) && limit >= 1))
    throw new RangeError(`createTQuantileCache: limit must be a positive integer, got ${limit}`);
  const memo = new Map<number, Map<number, number>>();
  let entries = 0;
  const quantile = (p: number, df: number): number => {
    const known = memo.get(p)?.get(df);
    if (known !== undefined) return known;
    const q = tQuantile(p, df);
    if (entries >= limit) {
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
  };
  return { quantile, size: () => entries };
}
