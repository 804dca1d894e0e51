/**
 * The BCa (bias-corrected and accelerated) bootstrap interval (Efron 1987, JASA 82:171-185; Efron &
 * Tibshirani 1993, ch. 14). The acceleration comes from `jackknifeAcceleration`.
 */
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import normalQuantile from '@stdlib/stats-base-dists-normal-quantile';
import type { Numbers } from './moments.js';
import { type Ordered, sortedOrder } from './orderStatistics.js';
import { checkLevel, extremes, quantileOf, sortedStatistics } from './percentileInterval.js';

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

/** BCa needs spread: throws when every resampled statistic is equal. */
export function requireSpread(stats: Ordered): void {
  const { min, max } = extremes(stats);
  if (min === max) throw new RangeError('bca: every resampled statistic is equal, so there is no spread to correct');
}

/** Tolerance for ties with theta = 0 on the centred scale: 1e-9 of the largest |theta* - theta|. */
export function tieTolerance(centred: Ordered): number {
  const { min, max } = extremes(centred);
  return 1e-9 * Math.max(Math.abs(min), Math.abs(max));
}

/** The BCa bounds of `bcaInterval` from statistics in any order (their order statistics read through `stats`). */
export function bcaBounds(
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
