/**
 * Stratified bootstrap (Efron & Tibshirani 1993, sec. 8.4 and problem 8.5; Davison & Hinkley 1997,
 * sec. 3.2): when scores come in strata (tasks or evaluation sets, each with its own runs), each
 * resample draws, within every stratum, as many values as it holds, with replacement, so every
 * resample keeps the design's stratum sizes and no run moves between tasks. This is the interval
 * Agarwal et al. (2021), "Deep RL at the edge of the statistical precipice", use for aggregate
 * scores such as the interquartile mean over all task x run scores.
 */
import type { Numbers } from './moments.js';
import { quantileSorted } from './quantile.js';
import type { Random } from './random.js';

export interface StratifiedBootstrapOptions {
  /** Number of resamples B (default 10,000). */
  readonly resamples?: number;
  /** Confidence level (default 0.95). */
  readonly level?: number;
}

export interface StratifiedBootstrapResult {
  readonly estimate: number;
  readonly low: number;
  readonly high: number;
  readonly level: number;
}

/**
 * Percentile interval of `statistic` under the stratified bootstrap: the type-7 quantiles at
 * (1 - level)/2 and (1 + level)/2 of the statistic over B stratified resamples; `estimate` is the
 * statistic on the data as given.
 *
 * `statistic` receives one Float64Array per stratum (in the order of `strata`). The arrays are
 * buffers allocated once per call and refilled for every resample: the statistic may read or
 * reorder them (e.g. sort in place) but must not keep them. Draws: for each resample, stratum by
 * stratum, value by value, `random.int(n_h)`.
 *
 * Cost O(B (sum of n_h + cost of statistic)) time, O(B + sum of n_h) memory; the input is not changed.
 * Throws a RangeError when there is no stratum, a stratum is empty or holds a non-finite value,
 * an option is invalid, or the statistic returns a non-finite value.
 * Example: `stratifiedBootstrap([[0.2, 0.4, 0.9], [0.5, 0.7]], (s) => (mean(s[0]!) + mean(s[1]!)) / 2,
 * createRandom(1))` gives { estimate: 0.55, low, high, level: 0.95 } with 0.35 <= low <= 0.55 <= high <= 0.8.
 */
export function stratifiedBootstrap(
  strata: readonly Numbers[],
  statistic: (strata: readonly Float64Array[]) => number,
  random: Random,
  opts: StratifiedBootstrapOptions = {},
): StratifiedBootstrapResult {
  const resamples = opts.resamples ?? 10_000;
  const level = opts.level ?? 0.95;
  if (!Number.isInteger(resamples) || resamples < 1)
    throw new RangeError(`stratifiedBootstrap: resamples must be a positive integer, got ${resamples}`);
  if (!(level > 0 && level < 1)) throw new RangeError(`stratifiedBootstrap: level must be in (0, 1), got ${level}`);
  if (strata.length === 0) throw new RangeError('stratifiedBootstrap requires at least 1 stratum');
  const originals = strata.map((stratum, h) => {
    if (stratum.length === 0) throw new RangeError(`stratifiedBootstrap: stratum ${h} is empty`);
    const copy = Float64Array.from(stratum);
    for (let i = 0; i < copy.length; i++) {
      if (!Number.isFinite(copy[i])) throw new RangeError(`stratifiedBootstrap: stratum ${h} value ${i} is not finite`);
    }
    return copy;
  });

  const buffers = originals.map((o) => Float64Array.from(o));
  const estimate = checked(statistic(buffers), 'the data');
  const stats = new Float64Array(resamples);
  for (let b = 0; b < resamples; b++) {
    for (let h = 0; h < originals.length; h++) {
      const source = originals[h] as Float64Array;
      const target = buffers[h] as Float64Array;
      const n = source.length;
      for (let i = 0; i < n; i++) target[i] = source[random.int(n)] as number;
    }
    stats[b] = checked(statistic(buffers), `resample ${b}`);
  }
  stats.sort();
  const tail = (1 - level) / 2;
  return { estimate, low: quantileSorted(stats, tail), high: quantileSorted(stats, 1 - tail), level };
}

function checked(value: number, where: string): number {
  if (!Number.isFinite(value)) throw new RangeError(`stratifiedBootstrap: statistic returned ${value} on ${where}`);
  return value;
}
