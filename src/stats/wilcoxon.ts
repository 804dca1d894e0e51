/**
 * The Wilcoxon signed-rank test (Wilcoxon 1945) for paired values, such as two configurations
 * trained on the same seeds: do the differences d_i = x_i - y_i tend to be positive or negative?
 *
 * Zero differences are dropped before ranking (Wilcoxon's original "wilcox" rule, scipy's
 * default zero_method='wilcox', and what R's wilcox.test does); `pairs` counts the pairs kept.
 * The remaining |d_i| get mid-ranks; the statistic is W+ = sum of the ranks of positive d_i
 * (R's V; scipy reports W+ for one-sided alternatives and min(W+, W-) for two-sided).
 */
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import { checkAlternative, type Alternative } from './alternative.js';
import type { Numbers } from './moments.js';
import { midRanks } from './ranks.js';

export interface WilcoxonResult {
  /** W+ = sum of the mid-ranks of the positive differences. */
  readonly statistic: number;
  readonly p: number;
  readonly exact: boolean;
  /** Pairs used: pairs with a non-zero difference. */
  readonly pairs: number;
}

/** Largest number of non-zero pairs for the exact distribution (as scipy). */
const MAX_EXACT_PAIRS = 50;

/**
 * Wilcoxon signed-rank test of H0: the differences x - y are symmetric about 0.
 *
 * - Exact (when at most 50 pairs remain, no difference was zero and no |d| is tied): the null
 *   distribution of W+ over all 2^n sign patterns, counted by the subset-sum recursion on ranks
 *   1..n (integers below 2^53, so exact). Two-sided p = 2 min(P(W >= W+), P(W <= W+)), capped at 1.
 * - Otherwise the normal approximation with mean n(n+1)/4 and the tie-corrected variance
 *   n(n+1)(2n+1)/24 - sum(t^3 - t)/48, without continuity correction (scipy.stats.wilcoxon's
 *   defaults, method='approx', correction=False). Two-sided p = 2 P(Z >= |z|).
 * 'greater' is the alternative that x tends to exceed y.
 *
 * Cost O(n log n + n^3) exact (n <= 50), O(n log n) otherwise.
 * Throws a RangeError when x and y differ in length, a value is not finite, or every difference is
 * zero (nothing left to rank).
 * Example: `wilcoxonSignedRank([6, 8, 14, 16, 23, 24, 28, 29, 41, -48, 49, 56, 60, -67, 75], new Array(15).fill(0))`
 * is { statistic: 96, p: 0.041259765625, exact: true, pairs: 15 } (scipy's documentation example).
 */
export function wilcoxonSignedRank(
  x: Numbers,
  y: Numbers,
  opts: { readonly alternative?: Alternative } = {},
): WilcoxonResult {
  const alternative = checkAlternative(opts.alternative ?? 'two-sided', 'wilcoxonSignedRank');
  if (x.length !== y.length)
    throw new RangeError(`wilcoxonSignedRank: paired samples must have equal length, got ${x.length} and ${y.length}`);
  const diffs: number[] = [];
  for (let i = 0; i < x.length; i++) {
    const d = (x[i] as number) - (y[i] as number);
    if (!Number.isFinite(d)) throw new RangeError(`wilcoxonSignedRank: pair ${i} has a non-finite difference`);
    if (d !== 0) diffs.push(d);
  }
  const n = diffs.length;
  if (n === 0)
    throw new RangeError(`wilcoxonSignedRank requires at least 1 non-zero difference, got ${x.length} pairs, all zero`);
  const zeros = x.length - n;
  const { ranks, tieTerm, hasTies } = midRanks(diffs.map(Math.abs));
  let wPlus = 0;
  for (let i = 0; i < n; i++) if ((diffs[i] as number) > 0) wPlus += ranks[i] as number;

  if (n <= MAX_EXACT_PAIRS && zeros === 0 && !hasTies) {
    const counts = signedRankCounts(n);
    const all = 2 ** n;
    let atLeast = 0;
    let atMost = 0;
    for (let w = 0; w < counts.length; w++) {
      if (w >= wPlus) atLeast += counts[w] as number;
      if (w <= wPlus) atMost += counts[w] as number;
    }
    const upper = atLeast / all;
    const lower = atMost / all;
    const p =
      alternative === 'greater' ? upper : alternative === 'less' ? lower : Math.min(1, 2 * Math.min(upper, lower));
    return { statistic: wPlus, p, exact: true, pairs: n };
  }

  const mu = (n * (n + 1)) / 4;
  const variance = (n * (n + 1) * (2 * n + 1)) / 24 - tieTerm / 48;
  const z = (wPlus - mu) / Math.sqrt(variance);
  const p =
    alternative === 'greater'
      ? normalCdf(-z, 0, 1)
      : alternative === 'less'
        ? normalCdf(z, 0, 1)
        : Math.min(1, 2 * normalCdf(-Math.abs(z), 0, 1));
  return { statistic: wPlus, p, exact: false, pairs: n };
}

/**
 * counts[w] = number of subsets of {1, ..., n} with sum w, w = 0..n(n+1)/2: the null frequencies
 * of W+ without ties or zeros (each of the 2^n sign patterns equally likely). Cost O(n^3).
 */
function signedRankCounts(n: number): Float64Array {
  const max = (n * (n + 1)) / 2;
  const counts = new Float64Array(max + 1);
  counts[0] = 1;
  let reach = 0;
  for (let r = 1; r <= n; r++) {
    reach += r;
    for (let w = reach; w >= r; w--) counts[w] = (counts[w] as number) + (counts[w - r] as number);
  }
  return counts;
}
