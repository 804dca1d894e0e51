/**
 * Paired t-test (Student 1908): a one-sample t-test on the differences x_i - y_i. Same results as
 * scipy.stats.ttest_rel(x, y) and R's t.test(x, y, paired = TRUE).
 */
import { checkAlternative, studentTPValue, type Alternative } from './alternative.js';
import { mean, standardDeviation, type Numbers } from './moments.js';
import { studentTBounds } from './tInterval.js';

export interface PairedTResult {
  readonly statistic: number;
  readonly df: number;
  readonly p: number;
  /** mean of x_i - y_i */
  readonly difference: number;
  readonly low: number;
  readonly high: number;
  readonly level: number;
}

/**
 * Paired t-test of H0: mean(x_i - y_i) = 0. With d_i = x_i - y_i and n pairs,
 * t = mean(d) / (sd(d) / sqrt(n)), df = n - 1; the interval for mean(d) matches the alternative
 * (two-sided, or a one-sided bound with the other end infinite).
 *
 * Cost O(n), one Float64Array of differences; the inputs are not changed. Throws a RangeError when
 * x and y differ in length, when there are fewer than 2 pairs, when all differences are equal (zero
 * variance: t would be 0/0 or +-Infinity), or when level or alternative is invalid.
 * Example: on Student's sleep data (R `datasets::sleep`) `pairedT(group1, group2).statistic` is -4.062127683382037.
 */
export function pairedT(
  x: Numbers,
  y: Numbers,
  opts: { alternative?: Alternative; level?: number } = {},
): PairedTResult {
  const alternative = checkAlternative(opts.alternative ?? 'two-sided', 'pairedT');
  const level = opts.level ?? 0.95;
  if (!(level > 0 && level < 1)) throw new RangeError(`pairedT: level must be in (0, 1), got ${level}`);
  const n = x.length;
  if (y.length !== n) throw new RangeError(`pairedT requires paired values of equal length, got ${n} and ${y.length}`);
  if (n < 2) throw new RangeError(`pairedT requires at least 2 pairs, got ${n}`);
  const d = new Float64Array(n);
  for (let i = 0; i < n; i++) d[i] = (x[i] as number) - (y[i] as number);
  const difference = mean(d);
  const se = standardDeviation(d) / Math.sqrt(n);
  if (se === 0) throw new RangeError('pairedT: the differences have zero variance');
  const df = n - 1;
  const statistic = difference / se;
  const p = studentTPValue(statistic, df, alternative);
  const { low, high } = studentTBounds(difference, se, df, level, alternative);
  return { statistic, df, p, difference, low, high, level };
}
