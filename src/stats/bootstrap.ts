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
 */
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import normalQuantile from '@stdlib/stats-base-dists-normal-quantile';
import { mean, variance, type Numbers } from './moments.js';
import { OrderStatistics, sortedOrder, type Ordered } from './orderStatistics.js';
import { quantileAt } from './quantile.js';
import type { Random } from './random.js';
import { studentTQuantile } from './studentTQuantile.js';

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
  const { method, resamples, level } = resolveOptions(opts, 'bootstrapMean');
  const group = centredGroup(x, 'bootstrapMean', 'x');
  const n = group.values.length;
  const buffer = new Float64Array(n);
  const stats = new Float64Array(resamples);
  for (let b = 0; b < resamples; b++)
    stats[b] = resampledStatistic(group.values, buffer, resampleMean(group.values, buffer, random), method);
  return meanInterval(group, stats, method, level, resamples);
}

/**
 * B bootstrap resamples of n values as counts: row b (`counts[b * n]` .. `counts[b * n + n - 1]`)
 * says how many times each value is drawn in resample b, the draws made with `random.int(n)` in the
 * order `bootstrapMean` makes them (so the resamples are the ones `bootstrapMean` would use). With
 * one such table a whole curve's bins can be resampled alike (the seeds resampled as whole curves)
 * for the price of one bin's draws: see `bootstrapMeanFromCounts`.
 * Cost O(B n) draws; memory 8 B n bytes. Throws a RangeError for n < 1 or B < 1.
 * Example: `resampleCounts(createRandom(1), 5, 2000)` has 10,000 entries, each row summing to 5.
 */
export function resampleCounts(random: Random, n: number, resamples: number): Float64Array {
  if (!(Number.isInteger(n) && n >= 1)) throw new RangeError(`resampleCounts: n must be a whole number >= 1, got ${n}`);
  if (!(Number.isInteger(resamples) && resamples >= 1))
    throw new RangeError(`resampleCounts: resamples must be a whole number >= 1, got ${resamples}`);
  const counts = new Float64Array(n * resamples);
  for (let b = 0; b < resamples; b++) {
    const row = b * n;
    for (let i = 0; i < n; i++) {
      const k = row + random.int(n);
      counts[k] = (counts[k] as number) + 1;
    }
  }
  return counts;
}

/**
 * `bootstrapMean` with the resamples given as counts (`resampleCounts(random, x.length, B)`): each
 * resample's mean is sum_j counts[b][j] x_j / n, a dot product instead of n random look-ups, so
 * the interval equals `bootstrapMean`'s with a generator in the same state up to rounding in the
 * sums (relative differences near 1e-15). B is `counts.length / x.length`.
 * Cost O(B n) plus O(B), no random draws. Throws as `bootstrapMean`, and a RangeError when
 * `counts` is not a whole number of resamples of x or a row does not sum to n.
 * Example: `bootstrapMeanFromCounts(x, resampleCounts(createRandom(1), x.length, 2000), { method: 'bca' })`.
 */
export function bootstrapMeanFromCounts(
  x: Numbers,
  counts: Float64Array,
  opts: Omit<BootstrapOptions, 'resamples'> = {},
): BootstrapInterval {
  const group = centredGroup(x, 'bootstrapMeanFromCounts', 'x');
  const values = group.values;
  const n = values.length;
  const resamples = counts.length / n;
  if (!Number.isInteger(resamples) || resamples < 1)
    throw new RangeError(
      `bootstrapMeanFromCounts: ${counts.length} counts are not a whole number of resamples of ${n} values`,
    );
  const { method, level } = resolveOptions({ ...opts, resamples }, 'bootstrapMeanFromCounts');
  const stats = new Float64Array(resamples);
  // Four resamples at a time: four independent sums keep the processor busy where one waits on
  // each addition (about 2x faster); each sum still adds in j order, so the numbers do not change.
  let b = 0;
  if (method !== 'bootstrap-t') for (; b + 4 <= resamples; b += 4) countedMeans4(values, counts, b, stats);
  for (; b < resamples; b++) {
    const row = b * n;
    let drawn = 0;
    let sum = 0;
    for (let j = 0; j < n; j++) {
      const c = counts[row + j] as number;
      drawn += c;
      sum += c * (values[j] as number);
    }
    if (drawn !== n) throw new RangeError(`bootstrapMeanFromCounts: resample ${b} draws ${drawn} values, not ${n}`);
    stats[b] =
      method === 'bootstrap-t' ? studentized(sum / n, countedSd(values, counts, row, sum / n) / Math.sqrt(n)) : sum / n;
  }
  return meanInterval(group, stats, method, level, resamples);
}

/** The means of resamples b..b+3 given by their counts, into stats[b..b+3]; throws when one does not draw n values. */
function countedMeans4(values: Float64Array, counts: Float64Array, b: number, stats: Float64Array): void {
  const n = values.length;
  const r0 = b * n;
  const r1 = r0 + n;
  const r2 = r1 + n;
  const r3 = r2 + n;
  let s0 = 0;
  let s1 = 0;
  let s2 = 0;
  let s3 = 0;
  let d0 = 0;
  let d1 = 0;
  let d2 = 0;
  let d3 = 0;
  for (let j = 0; j < n; j++) {
    const v = values[j] as number;
    const c0 = counts[r0 + j] as number;
    const c1 = counts[r1 + j] as number;
    const c2 = counts[r2 + j] as number;
    const c3 = counts[r3 + j] as number;
    s0 += c0 * v;
    s1 += c1 * v;
    s2 += c2 * v;
    s3 += c3 * v;
    d0 += c0;
    d1 += c1;
    d2 += c2;
    d3 += c3;
  }
  if (d0 !== n || d1 !== n || d2 !== n || d3 !== n) {
    const drawn = [d0, d1, d2, d3];
    const bad = drawn.findIndex((d) => d !== n);
    throw new RangeError(`bootstrapMeanFromCounts: resample ${b + bad} draws ${drawn[bad]} values, not ${n}`);
  }
  stats[b] = s0 / n;
  stats[b + 1] = s1 / n;
  stats[b + 2] = s2 / n;
  stats[b + 3] = s3 / n;
}

/** Sample standard deviation (n - 1) of a resample given by its counts in row `row`, around its mean m. */
function countedSd(values: Float64Array, counts: Float64Array, row: number, m: number): number {
  const n = values.length;
  let ss = 0;
  for (let j = 0; j < n; j++) {
    const d = (values[j] as number) - m;
    ss += (counts[row + j] as number) * d * d;
  }
  return Math.sqrt(ss / (n - 1));
}

/** One resample's statistic: its mean, or for bootstrap-t its studentized mean (buffer holds the resample). */
function resampledStatistic(values: Float64Array, buffer: Float64Array, m: number, method: BootstrapMethod): number {
  if (method !== 'bootstrap-t') return m;
  return studentized(m, Math.sqrt(sampleVariance(buffer, m) / values.length));
}

/** The interval of `bootstrapMean` from the resampled statistics (reordered here, in place). */
function meanInterval(
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
  const { method, resamples, level } = resolveOptions(opts, 'bootstrapMeanDifference');
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
      if (!(plugIn > 0)) return shift(tailInterval(ordered, (1 - level) / 2)); // both groups constant: every resample equal
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

/**
 * The percentile interval of resampled statistics: their type-7 quantiles at (1 - level)/2 and
 * (1 + level)/2. The input is not changed (a sorted copy is made). Cost O(B log B).
 * Throws a RangeError when the statistics are empty or hold a NaN, or level is not in (0, 1).
 * Example: `percentileInterval([1, 2, 3, 4, 5], 0.5)` is { low: 2, high: 4 }.
 */
export function percentileInterval(statistics: Numbers, level: number): { low: number; high: number } {
  checkLevel(level, 'percentileInterval');
  return tailInterval(sortedOrder(sortedStatistics(statistics, 'percentileInterval')), (1 - level) / 2);
}

/**
 * The BCa interval (Efron 1987) from resampled statistics, so that it can be checked on an ideal
 * bootstrap (every resample listed):
 * - bias correction z0 = Phi^-1((#(theta* < theta) + #(theta* = theta)/2) / B) (mid-rank
 *   convention, as scipy.stats.bootstrap), where theta* counts as equal to theta when
 *   |theta* - theta| <= tieTolerance. With the default 0 ties are exact floating-point equality
 *   (scipy's rule). Resamples that are a reordering of the sample tie with theta in exact
 *   arithmetic (n!/n^n of them: 3.8% at n = 5) but rounding scatters them to either side, so
 *   `bootstrapMean` and `bootstrapMeanDifference` pass 1e-9 times the largest |theta* - theta|;
 * - tails alpha_1,2 = Phi(z0 + (z0 + z)/(1 - a (z0 + z))) for z = Phi^-1(alpha/2), Phi^-1(1 - alpha/2);
 * - bounds: the type-7 quantiles of theta* at alpha_1 and alpha_2.
 * The input is not changed (a sorted copy is made). Cost O(B log B).
 * Throws a RangeError with the reason when every statistic is equal, when all lie on one side of
 * theta (z0 infinite), when 1 - a (z0 + z) <= 0 (acceleration too large for this level), on NaN, or
 * when level is not in (0, 1).
 * Example: on the 3125 resample means of [71.2, 69.8, 73.1, 70.4, 72.0] (left-to-right sums / 5)
 * with theta 71.3 and a = 0.019456097143550056, gives z0 = 0.026071887453559196 (1540 below, 110
 * equal in floating point; with tieTolerance 1e-9: 1523 below, 140 equal, z0 = 0.02446713291103201)
 * and bounds (70.36, 72.44) either way.
 */
export function bcaInterval(
  statistics: Numbers,
  estimate: number,
  acceleration: number,
  level: number,
  tieTolerance = 0,
): { low: number; high: number; z0: number; lowerTail: number; upperTail: number } {
  checkLevel(level, 'bcaInterval');
  if (!Number.isFinite(acceleration)) throw new RangeError(`bca: acceleration must be finite, got ${acceleration}`);
  if (!(tieTolerance >= 0)) throw new RangeError(`bca: tieTolerance must be >= 0, got ${tieTolerance}`);
  return bcaBounds(
    sortedOrder(sortedStatistics(statistics, 'bcaInterval')),
    estimate,
    acceleration,
    level,
    tieTolerance,
  );
}

/**
 * Jackknife estimate of the BCa acceleration from leave-one-out estimates, one array per sample:
 * with U_ji = (n_j - 1)(mean_i theta_(j,i) - theta_(j,i)),
 * a = (1/6) sum_j sum_i U_ji^3 / n_j^3 / (sum_j sum_i U_ji^2 / n_j^2)^(3/2)
 * (Efron & Tibshirani 1993, eq. 14.15 for one sample; the several-sample form is scipy.stats.bootstrap's).
 * A constant shift of one sample's estimates does not change a. Cost O(total n).
 * Throws a RangeError when a sample has fewer than 2 estimates, a value is not finite, or every
 * estimate within each sample is equal (a is 0/0).
 * Example: for the mean of [71.2, 69.8, 73.1, 70.4, 72.0] (estimates 71.325, 71.675, 70.85, 71.525, 71.125)
 * a is 0.019456097143550056.
 */
export function jackknifeAcceleration(jackknife: readonly Numbers[]): number {
  let numerator = 0;
  let denominator = 0;
  for (const estimates of jackknife) {
    const n = estimates.length;
    if (n < 2)
      throw new RangeError(`jackknifeAcceleration requires at least 2 leave-one-out estimates per sample, got ${n}`);
    for (let i = 0; i < n; i++) {
      if (!Number.isFinite(estimates[i])) throw new RangeError(`jackknifeAcceleration: estimate ${i} is not finite`);
    }
    const centre = mean(estimates);
    let cubes = 0;
    let squares = 0;
    for (let i = 0; i < n; i++) {
      const u = (n - 1) * (centre - (estimates[i] as number));
      squares += u * u;
      cubes += u * u * u;
    }
    numerator += cubes / n ** 3;
    denominator += squares / n ** 2;
  }
  if (!(denominator > 0))
    throw new RangeError('bca: jackknife acceleration is undefined because every leave-one-out estimate is equal');
  return numerator / (6 * denominator ** 1.5);
}

// ---------------------------------------------------------------------------------------------

function resolveOptions(
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

function checkLevel(level: number, who: string): void {
  if (!(level > 0 && level < 1)) throw new RangeError(`${who}: level must be in (0, 1), got ${level}`);
}

/** Values centred at their mean, with the mean and sample variance. */
/** A sample centred at its mean, with the mean and the sample variance of the original values. */
interface CentredGroup {
  readonly values: Float64Array;
  readonly mean: number;
  readonly variance: number;
}

function centredGroup(x: Numbers, who: string, name: string): CentredGroup {
  const n = x.length;
  if (n < 2) throw new RangeError(`${who} requires at least 2 values in ${name}, got ${n}`);
  for (let i = 0; i < n; i++) if (!Number.isFinite(x[i])) throw new RangeError(`${who}: ${name}[${i}] is not finite`);
  const m = mean(x);
  const values = new Float64Array(n);
  for (let i = 0; i < n; i++) values[i] = (x[i] as number) - m;
  return { values, mean: m, variance: variance(x) };
}

/** Draw values.length values with replacement into buffer; return their mean. */
function resampleMean(values: Float64Array, buffer: Float64Array, random: Random): number {
  const n = values.length;
  let s = 0;
  for (let i = 0; i < n; i++) {
    const v = values[random.int(n)] as number;
    buffer[i] = v;
    s += v;
  }
  return s / n;
}

/** Two-pass sample variance (n - 1) of buffer around its mean m. */
function sampleVariance(buffer: Float64Array, m: number): number {
  let ss = 0;
  for (let i = 0; i < buffer.length; i++) {
    const d = (buffer[i] as number) - m;
    ss += d * d;
  }
  return ss / (buffer.length - 1);
}

/** (theta* - theta)/se* on centred data (theta = 0): +-Infinity when se* = 0, 0 when also theta* = 0. */
function studentized(deviation: number, seStar: number): number {
  if (seStar > 0) return deviation / seStar;
  return deviation === 0 ? 0 : deviation > 0 ? Infinity : -Infinity;
}

/** Leave-one-out means minus the full mean, times sign: -(x_i - mean)/(n - 1) for centred x. */
function jackknifeMeanDeviations(centred: Float64Array, sign: 1 | -1): Float64Array {
  const n = centred.length;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = (-sign * (centred[i] as number)) / (n - 1);
  return out;
}

function sortedStatistics(statistics: Numbers, who: string): Float64Array {
  const sorted = Float64Array.from(statistics);
  if (sorted.length === 0) throw new RangeError(`${who} requires at least 1 resampled statistic`);
  for (let i = 0; i < sorted.length; i++)
    if (Number.isNaN(sorted[i])) throw new RangeError(`${who}: statistic ${i} is NaN`);
  return sorted.sort();
}

/** Quantiles at tail and 1 - tail of the statistics. */
function tailInterval(stats: Ordered, tail: number): { low: number; high: number } {
  return { low: quantileOf(stats, tail), high: quantileOf(stats, 1 - tail) };
}

/** The type-7 p-quantile of the statistics. */
function quantileOf(stats: Ordered, p: number): number {
  return quantileAt(stats.values.length, p, (k) => stats.at(k));
}

/** The smallest and the largest statistic. */
function extremes(stats: Ordered): { min: number; max: number } {
  return { min: stats.at(0), max: stats.at(stats.values.length - 1) };
}

/** Hesterberg's expanded tail probability Phi(sqrt(ratio) t_{alpha/2, df}), for variance ratio `ratio`. */
function expandedTail(level: number, ratio: number, df: number): number {
  return normalCdf(Math.sqrt(ratio) * studentTQuantile((1 - level) / 2, df), 0, 1);
}

/** BCa needs spread: throws when every resampled statistic is equal. */
function requireSpread(stats: Ordered): void {
  const { min, max } = extremes(stats);
  if (min === max) throw new RangeError('bca: every resampled statistic is equal, so there is no spread to correct');
}

/** Tolerance for ties with theta = 0 on the centred scale: 1e-9 of the largest |theta* - theta|. */
function tieTolerance(centred: Ordered): number {
  const { min, max } = extremes(centred);
  return 1e-9 * Math.max(Math.abs(min), Math.abs(max));
}

/** The BCa bounds of `bcaInterval` from statistics in any order (their order statistics read through `stats`). */
function bcaBounds(
  stats: Ordered,
  estimate: number,
  acceleration: number,
  level: number,
  tolerance: number,
): { low: number; high: number; z0: number; lowerTail: number; upperTail: number } {
  const values = stats.values;
  const count = values.length;
  requireSpread(stats);
  let below = 0;
  let equal = 0;
  for (let i = 0; i < count; i++) {
    const v = values[i] as number;
    if (v < estimate - tolerance) below++;
    else if (v <= estimate + tolerance) equal++;
  }
  const z0 = normalQuantile((below + equal / 2) / count, 0, 1);
  if (!Number.isFinite(z0))
    throw new RangeError(
      'bca: every resampled statistic lies on one side of the estimate, so the bias correction z0 is infinite',
    );
  const tail = (z: number): number => {
    const shifted = z0 + z;
    const scale = 1 - acceleration * shifted;
    if (!(scale > 0))
      throw new RangeError(`bca: acceleration ${acceleration} is too large for level ${level} (1 - a (z0 + z) <= 0)`);
    return normalCdf(z0 + shifted / scale, 0, 1);
  };
  const zLow = normalQuantile((1 - level) / 2, 0, 1);
  const lowerTail = tail(zLow);
  const upperTail = tail(-zLow);
  return { low: quantileOf(stats, lowerTail), high: quantileOf(stats, upperTail), z0, lowerTail, upperTail };
}

/** Bootstrap-t bounds on the centred scale: (-q_{1-alpha/2} se, -q_{alpha/2} se), q the sorted t*. */
function studentizedBounds(t: Ordered, se: number, level: number): { low: number; high: number } {
  const tail = (1 - level) / 2;
  const qLow = quantileWithInfinities(t, tail);
  const qHigh = quantileWithInfinities(t, 1 - tail);
  return { low: scaleBound(-qHigh, se), high: scaleBound(-qLow, se) };
}

function scaleBound(q: number, se: number): number {
  return q === 0 || se === 0 ? 0 : q * se;
}

/**
 * Type-7 quantile that also accepts +-Infinity among the sorted values: interpolating towards an
 * infinite neighbour gives that infinity (the limit), where plain arithmetic would give NaN.
 */
function quantileWithInfinities(t: Ordered, p: number): number {
  const n = t.values.length;
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const a = t.at(lo);
  const b = t.at(Math.min(lo + 1, n - 1));
  if (h === lo || a === b) return a;
  if (a === -Infinity) return -Infinity;
  if (b === Infinity) return Infinity;
  return quantileOf(t, p);
}
