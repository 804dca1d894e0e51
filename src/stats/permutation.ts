/**
 * Two-sample permutation test on the difference of means (Fisher 1935; Pitman 1937), for groups of
 * any sizes n1 and n2: under H0 (exchangeable labels) every split of the N = n1 + n2 pooled
 * values into groups of n1 and n2 is equally likely.
 *
 * Statistic T = mean(x) - mean(y). Counts, over the splits considered, of those "at least as
 * extreme" as the observed split:
 * - 'greater': T* >= T;  'less': T* <= T;
 * - 'two-sided': |T*| >= |T| (absolute difference of means; not twice the smaller tail).
 * Comparisons allow a tolerance of 1e-9 times the largest absolute deviation from the pooled mean,
 * so that splits whose T* equals T in exact arithmetic are not lost to rounding.
 */
import { checkAlternative, type Alternative } from './alternative.js';
import { mean, type Numbers } from './moments.js';
import type { Random } from './random.js';

export interface PermutationOptions {
  readonly alternative?: Alternative;
  /** Enumerate every split when C(N, n1) is at most this (default 200,000). */
  readonly maxExact?: number;
  /** Random relabelings when the splits are too many to enumerate (default 100,000). */
  readonly resamples?: number;
}

export interface PermutationResult {
  readonly p: number;
  /** True when every split was enumerated. */
  readonly exact: boolean;
  /** Splits evaluated: all C(N, n1) when exact, otherwise the number of random relabelings M. */
  readonly splits: number;
  /** mean(x) - mean(y). */
  readonly statistic: number;
  /**
   * Splits at least as extreme as the observed one (exact: including the observed split itself; Monte Carlo: b of M).
   */
  readonly atLeast: number;
}

const RELATIVE_TOLERANCE = 1e-9;

/**
 * Permutation test of H0: x and y are exchangeable, on T = mean(x) - mean(y).
 *
 * Exact when C(N, n1) <= maxExact: every split is counted, by meeting in the middle (the sums of
 * the subsets of each half of the pooled values, sorted, paired with two pointers; see
 * `enumerateSplits`), and p = atLeast / C(N, n1). 10 v 10 (184,756 splits) takes well under a
 * millisecond.
 * Otherwise Monte Carlo: M random relabelings (partial Fisher-Yates shuffles of one index buffer)
 * and p = (1 + b) / (1 + M), where b counts relabelings at least as extreme (Phipson & Smyth 2010,
 * "Permutation p-values should never be zero", SAGMB 9(1):39); this p is itself a valid p-value.
 *
 * Cost O(C(N, n1)) exact, O(M min(n1, n2)) Monte Carlo; memory O(N). Randomness only from `random`
 * (not used when exact). Throws a RangeError when a group is empty, a value is not finite, or an
 * option is out of range.
 * Example: `permutationTest([71.2, 69.8, 73.1, 70.4, 72.0], [68.9, 70.1, 69.5, 71.0, 67.8, 70.6, 69.2], random)`
 * is { p: 27/792, exact: true, splits: 792, statistic: 1.7142857142857..., atLeast: 27 }.
 */
export function permutationTest(
  x: Numbers,
  y: Numbers,
  random: Random,
  opts: PermutationOptions = {},
): PermutationResult {
  const alternative = checkAlternative(opts.alternative ?? 'two-sided', 'permutationTest');
  const maxExact = opts.maxExact ?? 200_000;
  const resamples = opts.resamples ?? 100_000;
  if (!(maxExact >= 0)) throw new RangeError(`permutationTest: maxExact must be >= 0, got ${maxExact}`);
  if (!Number.isInteger(resamples) || resamples < 1)
    throw new RangeError(`permutationTest: resamples must be a positive integer, got ${resamples}`);
  const n1 = x.length;
  const n2 = y.length;
  if (n1 < 1 || n2 < 1)
    throw new RangeError(`permutationTest requires at least 1 value per group, got ${n1} and ${n2}`);
  const total = n1 + n2;
  for (let i = 0; i < n1; i++)
    if (!Number.isFinite(x[i])) throw new RangeError(`permutationTest: x[${i}] is not finite`);
  for (let j = 0; j < n2; j++)
    if (!Number.isFinite(y[j])) throw new RangeError(`permutationTest: y[${j}] is not finite`);

  // Centre on the pooled mean so that sums are small and rounding is small.
  const pooledMean = (mean(x) * n1 + mean(y) * n2) / total;
  const centred = new Float64Array(total);
  for (let i = 0; i < n1; i++) centred[i] = (x[i] as number) - pooledMean;
  for (let j = 0; j < n2; j++) centred[n1 + j] = (y[j] as number) - pooledMean;
  let scale = 0;
  let centredSum = 0;
  for (let i = 0; i < total; i++) {
    const c = centred[i] as number;
    scale = Math.max(scale, Math.abs(c));
    centredSum += c;
  }

  // Walk subsets of the smaller group; T* = slope * (subset sum) + offset.
  const chooseX = n1 <= n2;
  const size = chooseX ? n1 : n2;
  const both = 1 / n1 + 1 / n2;
  const slope = chooseX ? both : -both;
  const offset = chooseX ? -centredSum / n2 : centredSum / n1;
  let observedSum = 0;
  for (let i = 0; i < size; i++) observedSum += centred[chooseX ? i : n1 + i] as number;
  const bounds = extremeSums(alternative, slope * observedSum + offset, RELATIVE_TOLERANCE * scale, slope, offset);

  const statistic = mean(x) - mean(y);
  const splitCount = countSplits(total, size, maxExact);
  if (splitCount <= maxExact) {
    const atLeast = enumerateSplits(centred, size, bounds);
    return { p: atLeast / splitCount, exact: true, splits: splitCount, statistic, atLeast };
  }
  const atLeast = sampleSplits(centred, size, bounds, resamples, random);
  return { p: (1 + atLeast) / (1 + resamples), exact: false, splits: resamples, statistic, atLeast };
}

/** A split is at least as extreme as the observed one when its subset sum s <= low or s >= high. */
interface ExtremeSums {
  readonly low: number;
  readonly high: number;
}

/**
 * Translate "T* at least as extreme as T" (with tolerance) into bounds on the subset sum s,
 * where T* = slope s + offset: t <= tLow or t >= tHigh, then solve for s (slope may be negative).
 */
function extremeSums(
  alternative: Alternative,
  observed: number,
  tolerance: number,
  slope: number,
  offset: number,
): ExtremeSums {
  let tLow: number;
  let tHigh: number;
  if (alternative === 'greater') {
    tLow = -Infinity;
    tHigh = observed - tolerance;
  } else if (alternative === 'less') {
    tLow = observed + tolerance;
    tHigh = Infinity;
  } else {
    tHigh = Math.abs(observed) - tolerance;
    tLow = -tHigh;
  }
  const sOf = (t: number): number => (t - offset) / slope;
  return slope > 0 ? { low: sOf(tLow), high: sOf(tHigh) } : { low: sOf(tHigh), high: sOf(tLow) };
}

/** C(n, k), or maxExact + 1 as soon as it is known to exceed maxExact (no overflow). */
function countSplits(n: number, k: number, maxExact: number): number {
  let c = 1;
  for (let i = 1; i <= k; i++) {
    c = (c * (n - k + i)) / i; // exact: C(n - k + i, i) is an integer at every step
    if (c > maxExact) return Math.floor(maxExact) + 1;
  }
  return c;
}

/**
 * Count extreme splits over all k-subsets of values, meeting in the middle: the values are cut in
 * two halves; for each a, the sums of the a-subsets of the first half and of the (k - a)-subsets of
 * the second are listed and sorted, and the pairs whose total is <= low or >= high are counted with
 * two pointers. About sum_a C(n/2, a) log C(n/2, a) work instead of C(n, k) (10 v 10: some 2,000
 * sums instead of 184,756 splits). A subset's sum is the sum of its two halves' sums, rounded in
 * another order than one running sum; the tolerance of the bounds (1e-9 of the scale) is far wider.
 */
function enumerateSplits(values: Float64Array, k: number, bounds: ExtremeSums): number {
  const n = values.length;
  const half = n >> 1;
  const left = subsetSums(values.subarray(0, half), k);
  const right = subsetSums(values.subarray(half), k);
  let all = 0;
  let count = 0;
  for (let a = 0; a <= k; a++) {
    const l = left[a];
    const r = right[k - a];
    if (l === undefined || r === undefined || l.length === 0 || r.length === 0) continue;
    all += l.length * r.length;
    if (bounds.low >= bounds.high) continue; // every split is extreme (counted below)
    count += pairsBelow(l, r, bounds.low, true) + l.length * r.length - pairsBelow(l, r, bounds.high, false);
  }
  return bounds.low >= bounds.high ? all : count;
}

/** Sorted sums of the subsets of `values` by size: entry a lists the sums of all a-subsets (a <= maxSize). */
function subsetSums(values: Float64Array, maxSize: number): Float64Array[] {
  let bySize: number[][] = [[0]];
  for (let i = 0; i < values.length; i++) {
    const v = values[i] as number;
    const next = bySize.map((list) => list.slice());
    for (let a = 0; a < bySize.length && a < maxSize; a++) {
      let target = next[a + 1];
      if (target === undefined) {
        target = [];
        next[a + 1] = target;
      }
      for (const s of bySize[a] as number[]) target.push(s + v);
    }
    bySize = next;
  }
  return bySize.map((list) => Float64Array.from(list).sort());
}

/** Pairs (i, j) of two ascending lists with l[i] + r[j] <= t (`inclusive`) or < t. Two pointers, O(|l| + |r|). */
function pairsBelow(l: Float64Array, r: Float64Array, t: number, inclusive: boolean): number {
  let j = r.length - 1;
  let count = 0;
  for (let i = 0; i < l.length; i++) {
    const li = l[i] as number;
    while (j >= 0 && (inclusive ? li + (r[j] as number) > t : li + (r[j] as number) >= t)) j--;
    if (j < 0) break;
    count += j + 1;
  }
  return count;
}

/** Count extreme splits among `resamples` random k-subsets (partial Fisher-Yates on one buffer). */
function sampleSplits(values: Float64Array, k: number, bounds: ExtremeSums, resamples: number, random: Random): number {
  const n = values.length;
  const order = new Int32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  let count = 0;
  for (let b = 0; b < resamples; b++) {
    let s = 0;
    for (let i = 0; i < k; i++) {
      const j = i + random.int(n - i);
      const pick = order[j] as number;
      order[j] = order[i] as number;
      order[i] = pick;
      s += values[pick] as number;
    }
    if (s <= bounds.low || s >= bounds.high) count++;
  }
  return count;
}
