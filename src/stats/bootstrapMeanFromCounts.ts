/**
 * Bootstrap resamples of a mean as a table of counts: one table, drawn once, resamples every bin of
 * a learning curve alike (the seeds resampled as whole curves) for the price of one bin's draws.
 * The interval methods are those of `bootstrap.ts`.
 */
import { type BootstrapInterval, type BootstrapOptions, meanInterval, resolveBootstrapOptions } from './bootstrap.js';
import type { Numbers } from './moments.js';
import type { Random } from './random.js';
import { centredGroup } from './resampleMean.js';
import { studentized } from './studentizedBounds.js';

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
  const { method, level } = resolveBootstrapOptions({ ...opts, resamples }, 'bootstrapMeanFromCounts');
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
