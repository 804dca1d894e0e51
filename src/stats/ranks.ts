/**
 * Mid-ranks ("average" ranks): the rank-based tests (Mann-Whitney U, Wilcoxon signed-rank) give
 * tied values the mean of the ranks they occupy, so ties split their ranks evenly. This is R's
 * `rank(ties.method = "average")` and scipy's `rankdata(method='average')` (common practice).
 */
import type { Numbers } from './moments.js';

export interface MidRanks {
  /** 1-based mid-rank of each input value, in input order. Always a multiple of 0.5. */
  readonly ranks: Float64Array;
  /** Sum over tie groups of t^3 - t, where t is the size of the group (0 when there are no ties). */
  readonly tieTerm: number;
  /** Whether any two values are equal. */
  readonly hasTies: boolean;
}

/**
 * Mid-ranks of x and the tie term sum(t^3 - t) used by the tie-corrected variance of rank
 * statistics. Cost O(n log n) time, O(n) memory; the input is not changed.
 * Throws a RangeError when a value is NaN (it has no place in the order).
 * Example: `midRanks([10, 20, 20, 30]).ranks` is [1, 2.5, 2.5, 4] and its tieTerm is 6.
 */
export function midRanks(x: Numbers): MidRanks {
  const n = x.length;
  const order = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    if (Number.isNaN(x[i])) throw new RangeError(`midRanks: value ${i} is NaN`);
    order[i] = i;
  }
  order.sort((a, b) => compare(x[a] as number, x[b] as number));
  const ranks = new Float64Array(n);
  let tieTerm = 0;
  let start = 0;
  while (start < n) {
    let end = start + 1;
    const value = x[order[start] as number] as number;
    while (end < n && x[order[end] as number] === value) end++;
    // Positions start..end-1 (0-based) hold ranks start+1..end; their mean is (start + 1 + end) / 2.
    const rank = (start + 1 + end) / 2;
    for (let k = start; k < end; k++) ranks[order[k] as number] = rank;
    const t = end - start;
    tieTerm += t * t * t - t;
    start = end;
  }
  return { ranks, tieTerm, hasTies: tieTerm > 0 };
}

/** Total order on non-NaN numbers that also handles infinities (a - b would give NaN for Inf - Inf). */
function compare(a: number, b: number): number {
  return a < b ? -1 : a > b ? 1 : 0;
}
