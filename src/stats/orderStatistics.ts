/**
 * Order statistics of values that are not sorted, found one by one without sorting them all:
 * the k-th smallest is moved to position k by quickselect (Hoare 1961, "Algorithm 65: FIND",
 * Communications of the ACM 4:321; common practice), and every position found stays in place
 * while later ones are looked for, because a later search only reorders the values strictly
 * between two positions already found.
 *
 * An interval from B resampled statistics needs only a few of them (the smallest, the largest,
 * two on each side of each quantile): this costs O(B) per statistic asked for instead of
 * O(B log B) for a sort, and gives the same numbers, since the k-th smallest value does not depend
 * on how it is found. The order is the one `Float64Array.prototype.sort` uses: -0 before +0.
 * NaN has no place in it: callers reject NaN first.
 */

/** Values and a way to read their k-th smallest (a sorted array, or `OrderStatistics`). */
export interface Ordered {
  /** Every value, in some order. */
  readonly values: Float64Array;
  /** The k-th smallest value (k = 0 .. n - 1). */
  at(k: number): number;
}

/**
 * A sorted array as `Ordered` (its k-th smallest value is at k). Pure.
 * Example: `sortedOrder(Float64Array.of(1, 2, 3)).at(2)` is 3.
 */
export function sortedOrder(sorted: Float64Array): Ordered {
  return { values: sorted, at: (k) => sorted[k] as number };
}

/** a before b in `Float64Array.prototype.sort` order, for non-NaN values (-0 before +0). */
function before(a: number, b: number): boolean {
  return a < b || (a === 0 && b === 0 && 1 / a < 1 / b);
}

/**
 * The order statistics of `values`, found on demand. The array is reordered in place (it becomes
 * the working array); it must hold no NaN. Cost O(n) expected per statistic asked for, O(log m)
 * to find where the m statistics already found bound the search.
 * Example: `new OrderStatistics(Float64Array.of(5, 1, 4, 2, 3)).at(1)` is 2.
 */
export class OrderStatistics implements Ordered {
  /** Positions already holding their order statistic, increasing. */
  private readonly found: number[] = [];

  constructor(readonly values: Float64Array) {}

  at(k: number): number {
    const a = this.values;
    const n = a.length;
    if (!(Number.isInteger(k) && k >= 0 && k < n))
      throw new RangeError(`OrderStatistics: position ${k} is not in 0..${n - 1}`);
    // The nearest positions found on either side bound the search.
    const found = this.found;
    let lo = 0;
    let hi = found.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if ((found[mid] as number) < k) lo = mid + 1;
      else hi = mid;
    }
    if (found[lo] === k) return a[k] as number;
    const left = lo > 0 ? (found[lo - 1] as number) + 1 : 0;
    const right = lo < found.length ? (found[lo] as number) - 1 : n - 1;
    if (k === left) swap(a, k, extreme(a, left, right, true));
    else if (k === right) swap(a, k, extreme(a, left, right, false));
    else select(a, left, right, k);
    found.splice(lo, 0, k);
    return a[k] as number;
  }
}

/** Position of a smallest (or a largest) of a[left..right]: one pass, for the ends of a range. */
function extreme(a: Float64Array, left: number, right: number, smallest: boolean): number {
  let at = left;
  let best = a[left] as number;
  if (smallest) {
    for (let i = left + 1; i <= right; i++) {
      const v = a[i] as number;
      if (v < best || (v === 0 && best === 0 && 1 / v < 1 / best)) [at, best] = [i, v];
    }
  } else {
    for (let i = left + 1; i <= right; i++) {
      const v = a[i] as number;
      if (v > best || (v === 0 && best === 0 && 1 / v > 1 / best)) [at, best] = [i, v];
    }
  }
  return at;
}

/**
 * Move the k-th smallest of a[left..right] to k, smaller ones before it and larger ones after (Hoare partition, median
 * of three).
 */
function select(a: Float64Array, left: number, right: number, k: number): void {
  while (right > left) {
    const mid = (left + right) >>> 1;
    // Median of three as pivot, left at a[left] <= a[mid] <= a[right].
    if (before(a[mid] as number, a[left] as number)) swap(a, mid, left);
    if (before(a[right] as number, a[left] as number)) swap(a, right, left);
    if (before(a[right] as number, a[mid] as number)) swap(a, right, mid);
    const pivot = a[mid] as number;
    let i = left;
    let j = right;
    while (i <= j) {
      while (before(a[i] as number, pivot)) i++;
      while (before(pivot, a[j] as number)) j--;
      if (i <= j) {
        swap(a, i, j);
        i++;
        j--;
      }
    }
    // Now a[left..j] <= pivot <= a[i..right], and a[j+1..i-1] equal the pivot.
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else return;
  }
}

function swap(a: Float64Array, i: number, j: number): void {
  const t = a[i] as number;
  a[i] = a[j] as number;
  a[j] = t;
}
