/**
 * Bootstrap confidence intervals for a mean and for a difference of two means (Efron 1979;
 * Efron & Tibshirani 1993, "An introduction to the bootstrap", chapters 12-14 and 22).
 *
 * Four interval methods, all from the same B resampled statistics theta*_1..B (quantiles by
 * Hyndman-Fan type 7, `quantileSorted`):
 * - 'percentile': the alpha/2 and 1 - alpha/2 quantiles of theta*.
 * - 'expanded-percentile' (Hesterberg 2015, "What teachers should know about the bootstrap",
 *   The American Statistician 69:371-386): the same quantiles at the tail probability
 *   alpha'/2 = Phi(sqrt(n/(n-1)) t_{alpha/2, n-1}) instead of alpha/2 (wider, and far better
 *   covering at small n; METHODS.md).
 * - 'bca' (Efron 1987, JASA 82:171-185): bias-corrected and accelerated, see `bcaInterval`.
 * - 'bootstrap-t' (studentized; Efron & Tibshirani 1993, ch. 12.5): t* = (theta* - theta)/se*,
 *   se* from each resample's own sample standard deviation(s); interval
 *   (theta - t*_{1-alpha/2} se, theta - t*_{alpha/2} se). A resample with zero spread has
 *   t* = +-Infinity (0 when theta* = theta), so with very few values the bounds can be infinite:
 *   that is the honest answer (METHODS.md: infinite in 99.7% of cases at n = 3).
 *
 * Resampling: each of the B resamples draws n values with replacement (for two samples, n1 from x
 * then n2 from y, resampling within each group), with `random.int`. Statistics are computed on values
 * centred at their group mean, then shifted back, so that large offsets cost no digits. Buffers
 * are allocated once per call. Randomness only from the passed-in `Random`.
 *
 * Files: this one (options, `bootstrapMean`, `bootstrapMeanDifference`); resampling primitives in
 * `resampleMean.ts`; the interval methods in `percentileInterval.ts` (percentile and expanded
 * percentile), `bcaInterval.ts`, `jackknifeAcceleration.ts` and `studentizedBounds.ts` (bootstrap-t);
 * resamples as count tables, for whole curves, in `bootstrapMeanFromCounts.ts`.
 */
import type { Numbers } from './moments.js';
import { OrderStatistics } from './orderStatistics.js';
import { bcaBounds, requireSpread, tieTolerance } from './bcaInterval.js';
import { jackknifeAcceleration, jackknifeMeanDeviations } from './jackknifeAcceleration.js';
import { checkLevel, expandedTail, tailInterval } from './percentileInterval.js';
import type { Random } from './random.js';
import { type CentredGroup, centredGroup, resampleMean, sampleVariance } from './resampleMean.js';
import { studentized, studentizedBounds } from './studentizedBounds.js';

/** Every bootstrap interval method, in the order the module comment describes them. */
export const BOOTSTRAP_METHODS = ['percentile', 'expanded-percentile', 'bca', 'bootstrap-t'] as const;
export type BootstrapMethod = (typeof BOOTSTRAP_METHODS)[number];

export interface BootstrapOptions {
  /** Interval method (default 'bca'). */
  readonly method?: BootstrapMethod;
  /** Number of resamples B (default 10,000). */
  readonly resamples?: number;
  /** Confidence level (default 0.95). */
  readonly level?: number;
}

export interface BootstrapInterval {
  readonly estimate: number;
  readonly low: number;
  readonly high: number;
  readonly level: number;
  readonly method: BootstrapMethod;
  readonly resamples: number;
}

/** The interval from bounds given as deviations from the estimate (the resampled statistics are centred). */
function intervalAround(
  estimate: number,
  level: number,
  method: BootstrapMethod,
  resamples: number,
): (bounds: { low: number; high: number }) => BootstrapInterval {
  return (bounds) => ({ estimate, low: estimate + bounds.low, high: estimate + bounds.high, level, method, resamples });
}

/**
 * Bootstrap confidence interval for the mean of x (method as in the module comment; default BCa
 * with 10,000 resamples at level 0.95). The BCa acceleration is the jackknife one.
 *
 * Cost O(B n) time plus O(B) to find the few order statistics an interval needs (`OrderStatistics`,
 * no sort); memory O(B + n). Throws a RangeError when x has fewer
 * than 2 values or a non-finite value, an option is invalid, or BCa cannot be computed
 * (see `bcaInterval`; e.g. all values equal).
 * Example: `bootstrapMean([71.2, 69.8, 73.1, 70.4, 72.0], createRandom(1), { method: 'percentile' })`
 * gives an interval close to the ideal bootstrap's (70.32, 72.34).
 */
export function bootstrapMean(x: Numbers, random: Random, opts: BootstrapOptions = {}): BootstrapInterval {
  const { method, resamples, level } = resolveBootstrapOptions(opts, 'bootstrapMean');
  const group = centredGroup(x, 'bootstrapMean', 'x');
  const n = group.values.length;
  const buffer = new Float64Array(n);
  const stats = new Float64Array(resamples);
  for (let b = 0; b < resamples; b++)
    stats[b] = resampledStatistic(group.values, buffer, resampleMean(group.values, buffer, random), method);
  return meanInterval(group, stats, method, level, resamples);
}

/** One resample's statistic: its mean, or for bootstrap-t its studentized mean (buffer holds the resample). */
function resampledStatistic(values: Float64Array, buffer: Float64Array, m: number, method: BootstrapMethod): number {
  if (method !== 'bootstrap-t') return m;
  return studentized(m, Math.sqrt(sampleVariance(buffer, m) / values.length));
}

/** The interval of `bootstrapMean` from the resampled statistics (reordered here, in place). */
export function meanInterval(
  group: CentredGroup,
  statistics: Float64Array,
  method: BootstrapMethod,
  level: number,
  resamples: number,
): BootstrapInterval {
  const n = group.values.length;
  const se = Math.sqrt(group.variance / n);
  const stats = new OrderStatistics(statistics);
  const shift = intervalAround(group.mean, level, method, resamples);
  switch (method) {
    case 'percentile':
      return shift(tailInterval(stats, (1 - level) / 2));
    case 'expanded-percentile':
      return shift(tailInterval(stats, expandedTail(level, n / (n - 1), n - 1)));
    case 'bca': {
      requireSpread(stats);
      const jackknife = jackknifeMeanDeviations(group.values, 1);
      return shift(bcaBounds(stats, 0, jackknifeAcceleration([jackknife]), level, tieTolerance(stats)));
    }
    case 'bootstrap-t':
      return shift(studentizedBounds(stats, se, level));
  }
}

/**
 * Bootstrap confidence interval for mean(x) - mean(y), resampling within each group (two-sample
 * bootstrap). BCa uses the two-sample jackknife acceleration (`jackknifeAcceleration` with one
 * group of leave-one-out estimates per sample, as scipy.stats.bootstrap). Bootstrap-t uses the
 * Welch standard error sqrt(s1^2/n1 + s2^2/n2) of each resample. The expanded percentile uses our
 * two-sample form of Hesterberg's adjustment: sqrt(n/(n-1)) becomes the ratio of the unbiased to
 * the plug-in standard error of the difference and n - 1 the Welch-Satterthwaite degrees of
 * freedom (both reduce to Hesterberg's one-sample values when one group is a constant).
 *
 * Cost O(B (n1 + n2)) time plus O(B); memory O(B + n1 + n2). Throws a RangeError when a group
 * has fewer than 2 values or a non-finite value, an option is invalid, or BCa cannot be computed.
 * Example: `bootstrapMeanDifference(a, b, createRandom(1), { method: 'percentile' }).estimate` is mean(a) - mean(b).
 */
export function bootstrapMeanDifference(
  x: Numbers,
  y: Numbers,
  random: Random,
  opts: BootstrapOptions = {},
): BootstrapInterval {
  const { method, resamples, level } = resolveBootstrapOptions(opts, 'bootstrapMeanDifference');
  const gx = centredGroup(x, 'bootstrapMeanDifference', 'x');
  const gy = centredGroup(y, 'bootstrapMeanDifference', 'y');
  const n1 = gx.values.length;
  const n2 = gy.values.length;
  const estimate = gx.mean - gy.mean;
  const studentize = method === 'bootstrap-t';
  const stats = new Float64Array(resamples);
  const bufferX = new Float64Array(n1);
  const bufferY = new Float64Array(n2);
  for (let b = 0; b < resamples; b++) {
    const mx = resampleMean(gx.values, bufferX, random);
    const my = resampleMean(gy.values, bufferY, random);
    if (studentize) {
      const seStar = Math.sqrt(sampleVariance(bufferX, mx) / n1 + sampleVariance(bufferY, my) / n2);
      stats[b] = studentized(mx - my, seStar);
    } else {
      stats[b] = mx - my;
    }
  }
  const ordered = new OrderStatistics(stats);
  const vx = gx.variance / n1;
  const vy = gy.variance / n2;
  const shift = intervalAround(estimate, level, method, resamples);
  switch (method) {
    case 'percentile':
      return shift(tailInterval(ordered, (1 - level) / 2));
    case 'expanded-percentile': {
      const plugIn = (vx * (n1 - 1)) / n1 + (vy * (n2 - 1)) / n2;
      // Both groups constant: every resample is equal, so there is no spread to expand.
      if (!(plugIn > 0)) return shift(tailInterval(ordered, (1 - level) / 2));
      const df = (vx + vy) ** 2 / ((vx * vx) / (n1 - 1) + (vy * vy) / (n2 - 1));
      return shift(tailInterval(ordered, expandedTail(level, (vx + vy) / plugIn, df)));
    }
    case 'bca': {
      requireSpread(ordered);
      const jx = jackknifeMeanDeviations(gx.values, 1);
      const jy = jackknifeMeanDeviations(gy.values, -1);
      return shift(bcaBounds(ordered, 0, jackknifeAcceleration([jx, jy]), level, tieTolerance(ordered)));
    }
    case 'bootstrap-t':
      return shift(studentizedBounds(ordered, Math.sqrt(vx + vy), level));
  }
}

/** The options of a bootstrap interval with their defaults (method 'bca', 10,000 resamples, level 0.95), checked. */
export function resolveBootstrapOptions(
  opts: BootstrapOptions,
  who: string,
): { method: BootstrapMethod; resamples: number; level: number } {
  const method = opts.method ?? 'bca';
  if (!(BOOTSTRAP_METHODS as readonly string[]).includes(method)) {
    throw new RangeError(`${who}: method must be one of ${BOOTSTRAP_METHODS.join(', ')}, got ${String(method)}`);
  }
  const resamples = opts.resamples ?? 10_000;
  if (!Number.isInteger(resamples) || resamples < 1)
    throw new RangeError(`${who}: resamples must be a positive integer, got ${resamples}`);
  const level = opts.level ?? 0.95;
  checkLevel(level, who);
  return { method, resamples, level };
}
