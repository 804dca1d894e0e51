/**
 * The Mann-Whitney U test (Mann & Whitney 1947; Wilcoxon 1945 rank-sum test) of whether the
 * values of x tend to be larger or smaller than those of y, on mid-ranks.
 *
 * U is the U of x: #(x_i > y_j) + #(x_i = y_j)/2 = R_x - n1(n1 + 1)/2 with R_x the sum of x's
 * mid-ranks in the pooled sample. `'greater'` is the alternative that x tends to be larger.
 * Two-sided p-values are 2 min(P(U* >= U), P(U* <= U)), capped at 1 (scipy's convention; both
 * null distributions below are symmetric about n1 n2 / 2, so this equals P(|U* - n1n2/2| >= |U - n1n2/2|)).
 */
import binomcoef from '@stdlib/math-base-special-binomcoef';
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import { checkAlternative, type Alternative } from './alternative.js';
import type { Numbers } from './moments.js';
import { midRanks } from './ranks.js';

export interface MannWhitneyOptions {
  readonly alternative?: Alternative;
  readonly method?: 'auto' | 'exact' | 'asymptotic';
  readonly continuity?: boolean;
}

export interface MannWhitneyResult {
  /** U of x = #(x > y) + #(x = y)/2. */
  readonly u: number;
  readonly p: number;
  /** True for 'exact' and 'exact-conditional'. */
  readonly exact: boolean;
  readonly method: 'exact' | 'exact-conditional' | 'asymptotic';
}

/**
 * Largest C(n1 + n2, n1) for which 'auto' counts the exact conditional distribution (ties) or the exact
 * one beyond n = 50.
 */
const MAX_EXACT_SPLITS = 200_000;
/** Largest group size for which 'auto' uses the exact distribution without ties. */
const MAX_EXACT_GROUP = 50;

/**
 * Mann-Whitney U test of x against y.
 *
 * Methods ('auto' picks the first that applies):
 * - 'exact' (no ties; 'auto' when both groups have at most 50 values, or C(n1+n2, n1) <= 200,000):
 *   the permutation distribution of U without ties, by the recursion
 *   P_{i,j}(u) = i/(i+j) P_{i-1,j}(u - j) + j/(i+j) P_{i,j-1}(u) (the largest value belongs to x or
 *   to y), all additions of positive terms so it keeps full relative accuracy. Cost O(n1^2 n2^2 / 2).
 * - 'exact-conditional' (ties; 'auto' when C(n1+n2, n1) <= 200,000): the exact distribution of the
 *   mid-rank sum over all C(n1+n2, n1) equally likely splits, given the observed ties. The splits
 *   are counted by a subset-sum recursion over the doubled mid-ranks (integers), which gives the
 *   same counts as listing every split, in O(N n1 N^2) time instead of O(C(N, n1)). scipy's
 *   method='exact' ignores ties instead; this is the exact test that R's coin package calls
 *   "exact conditional" (Hollander & Wolfe 1999, sec. 4.1).
 * - 'asymptotic': normal approximation with the tie-corrected variance
 *   n1 n2 / 12 ((N + 1) - sum(t^3 - t) / (N (N - 1))) and, unless `continuity: false`, a
 *   continuity correction of 0.5 (scipy.stats.mannwhitneyu's formula).
 * `method: 'exact'` forces the exact (no ties) or exact conditional (ties) distribution whatever
 * the size; large samples then cost accordingly.
 *
 * When every value is tied there is no evidence either way and p = 1 (every split gives the same U).
 * Throws a RangeError when a group is empty or holds a NaN, or an option is invalid.
 * Example: `mannWhitney([71.2, 69.8, 73.1, 70.4, 72.0], [68.9, 70.1, 69.5, 71.0, 67.8, 70.6, 69.2])`
 * is { u: 30, p: 0.04797979797979798 (= 38/792), exact: true, method: 'exact' }.
 */
export function mannWhitney(x: Numbers, y: Numbers, opts: MannWhitneyOptions = {}): MannWhitneyResult {
  const alternative = checkAlternative(opts.alternative ?? 'two-sided', 'mannWhitney');
  const requested = opts.method ?? 'auto';
  if (requested !== 'auto' && requested !== 'exact' && requested !== 'asymptotic') {
    throw new RangeError(`mannWhitney: method must be auto, exact or asymptotic, got ${String(requested)}`);
  }
  const n1 = x.length;
  const n2 = y.length;
  if (n1 < 1 || n2 < 1) throw new RangeError(`mannWhitney requires at least 1 value per group, got ${n1} and ${n2}`);
  const pooled = new Float64Array(n1 + n2);
  for (let i = 0; i < n1; i++) pooled[i] = x[i] as number;
  for (let j = 0; j < n2; j++) pooled[n1 + j] = y[j] as number;
  for (let i = 0; i < pooled.length; i++) {
    if (Number.isNaN(pooled[i])) throw new RangeError(`mannWhitney: ${i < n1 ? `x[${i}]` : `y[${i - n1}]`} is NaN`);
  }
  const { ranks, tieTerm, hasTies } = midRanks(pooled);
  let rankSumX = 0;
  for (let i = 0; i < n1; i++) rankSumX += ranks[i] as number; // multiples of 0.5: exact
  const u = rankSumX - (n1 * (n1 + 1)) / 2;
  const splits = binomcoef(n1 + n2, n1);

  let method: MannWhitneyResult['method'];
  if (requested === 'asymptotic') method = 'asymptotic';
  else if (requested === 'exact') method = hasTies ? 'exact-conditional' : 'exact';
  else if (!hasTies && ((n1 <= MAX_EXACT_GROUP && n2 <= MAX_EXACT_GROUP) || splits <= MAX_EXACT_SPLITS))
    method = 'exact';
  else if (hasTies && splits <= MAX_EXACT_SPLITS) method = 'exact-conditional';
  else method = 'asymptotic';

  let p: number;
  if (method === 'asymptotic') {
    p = asymptoticP(u, n1, n2, tieTerm, alternative, opts.continuity ?? true);
  } else {
    const tails = method === 'exact' ? exactTails(u, n1, n2) : conditionalTails(ranks, n1, rankSumX);
    p = pFromTails(tails.atLeast, tails.atMost, alternative);
  }
  return { u, p, exact: method !== 'asymptotic', method };
}

function pFromTails(atLeast: number, atMost: number, alternative: Alternative): number {
  if (alternative === 'greater') return Math.min(1, atLeast);
  if (alternative === 'less') return Math.min(1, atMost);
  return Math.min(1, 2 * Math.min(atLeast, atMost));
}

/** P(U* >= u) and P(U* <= u) under the exact null distribution without ties. */
function exactTails(u: number, n1: number, n2: number): { atLeast: number; atMost: number } {
  const dist = exactUDistribution(n1, n2);
  let atLeast = 0;
  let atMost = 0;
  for (let k = 0; k < dist.length; k++) {
    const pk = dist[k] as number;
    if (k >= u) atLeast += pk;
    if (k <= u) atMost += pk;
  }
  return { atLeast, atMost };
}

/**
 * The exact null distribution of the Mann-Whitney U without ties (Mann & Whitney 1947): element u
 * is P(U = u), u = 0..n1 n2, when all C(n1 + n2, n1) orderings are equally likely; by the
 * recursion on the group owning the largest value (only sums of positive terms, so small tail
 * probabilities keep full relative accuracy). Cost O(n1^2 n2^2 / 2) time, O(n1 n2^2) memory.
 * Throws a RangeError when n1 or n2 is not a non-negative integer.
 * Example: `exactUDistribution(2, 1)` is [1/3, 1/3, 1/3].
 */
export function exactUDistribution(n1: number, n2: number): Float64Array {
  if (!(Number.isInteger(n1) && n1 >= 0 && Number.isInteger(n2) && n2 >= 0)) {
    throw new RangeError(`exactUDistribution: group sizes must be non-negative integers, got ${n1} and ${n2}`);
  }
  let previous: Float64Array[] = [];
  for (let j = 0; j <= n2; j++) previous.push(Float64Array.of(1)); // i = 0: U = 0 surely
  for (let i = 1; i <= n1; i++) {
    const current: Float64Array[] = [Float64Array.of(1)]; // j = 0: U = 0 surely
    for (let j = 1; j <= n2; j++) {
      const dist = new Float64Array(i * j + 1);
      const fromX = previous[j] as Float64Array; // largest value is an x: it beats all j y's
      const fromY = current[j - 1] as Float64Array; // largest value is a y: it beats no x
      const wx = i / (i + j);
      const wy = j / (i + j);
      for (let k = 0; k < fromX.length; k++) dist[k + j] = wx * (fromX[k] as number);
      for (let k = 0; k < fromY.length; k++) dist[k] = (dist[k] as number) + wy * (fromY[k] as number);
      current.push(dist);
    }
    previous = current;
  }
  return previous[n2] as Float64Array;
}

/**
 * P(R* >= R) and P(R* <= R) for the mid-rank sum of n1 values drawn without replacement from the
 * pooled mid-ranks (all C(N, n1) splits equally likely). Doubled mid-ranks are integers, so
 * counts[k][s] = number of k-subsets with doubled sum s is an exact subset-sum recursion.
 */
function conditionalTails(ranks: Float64Array, n1: number, rankSumX: number): { atLeast: number; atMost: number } {
  const total = ranks.length;
  const maxSum = total * (total + 1); // sum of doubled ranks
  const width = maxSum + 1;
  const counts = new Float64Array((n1 + 1) * width);
  counts[0] = 1;
  let reach = 0; // largest doubled sum reachable so far
  for (let i = 0; i < total; i++) {
    const r = Math.round(2 * (ranks[i] as number));
    reach += r;
    for (let k = Math.min(i + 1, n1); k >= 1; k--) {
      const row = k * width;
      const below = (k - 1) * width;
      for (let s = reach; s >= r; s--)
        counts[row + s] = (counts[row + s] as number) + (counts[below + s - r] as number);
    }
  }
  const observed = Math.round(2 * rankSumX);
  let atLeast = 0;
  let atMost = 0;
  let all = 0;
  const row = n1 * width;
  for (let s = 0; s <= maxSum; s++) {
    const c = counts[row + s] as number;
    all += c;
    if (s >= observed) atLeast += c;
    if (s <= observed) atMost += c;
  }
  return { atLeast: atLeast / all, atMost: atMost / all };
}

/** scipy.stats.mannwhitneyu's normal approximation (tie-corrected, optional continuity correction). */
function asymptoticP(
  u: number,
  n1: number,
  n2: number,
  tieTerm: number,
  alternative: Alternative,
  continuity: boolean,
): number {
  const total = n1 + n2;
  const variance = ((n1 * n2) / 12) * (total + 1 - tieTerm / (total * (total - 1)));
  if (!(variance > 0)) return 1; // every value tied: no evidence either way
  const mu = (n1 * n2) / 2;
  const u2 = n1 * n2 - u;
  const stat = alternative === 'greater' ? u : alternative === 'less' ? u2 : Math.max(u, u2);
  const z = (stat - mu - (continuity ? 0.5 : 0)) / Math.sqrt(variance);
  const upper = normalCdf(-z, 0, 1);
  return Math.min(1, alternative === 'two-sided' ? 2 * upper : upper);
}
