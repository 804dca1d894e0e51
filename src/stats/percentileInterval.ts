/**
 * Percentile bootstrap intervals: the type-7 quantiles of the resampled statistics at (1 - level)/2
 * and (1 + level)/2, and Hesterberg's expanded tail (see `bootstrap.ts`).
 */
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import type { Numbers } from './moments.js';
import { type Ordered, sortedOrder } from './orderStatistics.js';
import { quantileAt } from './quantile.js';
import { studentTQuantile } from './studentTQuantile.js';

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

/** Throws a RangeError naming `who` unless 0 < level < 1. */
export function checkLevel(level: number, who: string): void {
  if (!(level > 0 && level < 1)) throw new RangeError(`${who}: level must be in (0, 1), got ${level}`);
}

/** A sorted copy of resampled statistics; throws a RangeError naming `who` when empty or when one is NaN. */
export function sortedStatistics(statistics: Numbers, who: string): Float64Array {
  const sorted = Float64Array.from(statistics);
  if (sorted.length === 0) throw new RangeError(`${who} requires at least 1 resampled statistic`);
  for (let i = 0; i < sorted.length; i++)
    if (Number.isNaN(sorted[i])) throw new RangeError(`${who}: statistic ${i} is NaN`);
  return sorted.sort();
}

/** Quantiles at tail and 1 - tail of the statistics. */
export function tailInterval(stats: Ordered, tail: number): { low: number; high: number } {
  return { low: quantileOf(stats, tail), high: quantileOf(stats, 1 - tail) };
}

/** The type-7 p-quantile of the statistics. */
export function quantileOf(stats: Ordered, p: number): number {
  return quantileAt(stats.values.length, p, (k) => stats.at(k));
}

/** The smallest and the largest statistic. */
export function extremes(stats: Ordered): { min: number; max: number } {
  return { min: stats.at(0), max: stats.at(stats.values.length - 1) };
}

/** Hesterberg's expanded tail probability Phi(sqrt(ratio) t_{alpha/2, df}), for variance ratio `ratio`. */
export function expandedTail(level: number, ratio: number, df: number): number {
  return normalCdf(Math.sqrt(ratio) * studentTQuantile((1 - level) / 2, df), 0, 1);
}
