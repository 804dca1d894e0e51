/**
 * Resampling primitives of the bootstrap (`bootstrap.ts`): a sample centred at its mean (statistics
 * are computed on centred values and shifted back, so large offsets cost no digits), one resample
 * drawn with replacement, and its sample variance.
 */
import { mean, type Numbers, variance } from './moments.js';
import type { Random } from './random.js';

/** A sample centred at its mean, with the mean and the sample variance of the original values. */
export interface CentredGroup {
  readonly values: Float64Array;
  readonly mean: number;
  readonly variance: number;
}

/** x centred at its mean; throws a RangeError naming `who` and `name` for fewer than 2 values or a non-finite one. */
export function centredGroup(x: Numbers, who: string, name: string): CentredGroup {
  const n = x.length;
  if (n < 2) throw new RangeError(`${who} requires at least 2 values in ${name}, got ${n}`);
  for (let i = 0; i < n; i++) if (!Number.isFinite(x[i])) throw new RangeError(`${who}: ${name}[${i}] is not finite`);
  const m = mean(x);
  const values = new Float64Array(n);
  for (let i = 0; i < n; i++) values[i] = (x[i] as number) - m;
  return { values, mean: m, variance: variance(x) };
}

/** Draw values.length values with replacement into buffer; return their mean. */
export function resampleMean(values: Float64Array, buffer: Float64Array, random: Random): number {
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
export function sampleVariance(buffer: Float64Array, m: number): number {
  let ss = 0;
  for (let i = 0; i < buffer.length; i++) {
    const d = (buffer[i] as number) - m;
    ss += d * d;
  }
  return ss / (buffer.length - 1);
}
