/**
 * The alternative hypothesis of a test, and how it turns a t statistic into a p-value.
 *
 * `'greater'` is the alternative that x's location is greater than y's (for one sample: that the
 * mean is greater than the null value), `'less'` the reverse, `'two-sided'` either way. This is the
 * convention of scipy.stats and of R's `t.test`.
 */
import tCdf from '@stdlib/stats-base-dists-t-cdf';

/** Every alternative, in the order they are listed in option help. */
export const ALTERNATIVES = ['two-sided', 'greater', 'less'] as const;

export type Alternative = (typeof ALTERNATIVES)[number];

/**
 * Check that a value (for example an option read at run time) is an `Alternative`.
 * Throws a RangeError naming the caller and the value otherwise.
 * Example: `checkAlternative('less', 'welch')` is `'less'`.
 */
export function checkAlternative(value: unknown, who: string): Alternative {
  if (typeof value === 'string' && (ALTERNATIVES as readonly string[]).includes(value)) return value as Alternative;
  throw new RangeError(`${who}: alternative must be one of ${ALTERNATIVES.join(', ')}, got ${String(value)}`);
}

/**
 * The p-value of a statistic that follows Student's t distribution with `df` degrees of freedom
 * under the null hypothesis: two-sided 2 P(T >= |t|), greater P(T >= t), less P(T <= t).
 * Upper tails are computed as lower tails of -t (by symmetry), so small p-values keep their digits.
 * Uses @stdlib's t CDF (a regularized incomplete beta function). Cost O(1).
 * Throws a RangeError when df is not positive or t is NaN.
 * Example: `studentTPValue(2.2281388519862747, 10, 'two-sided')` is 0.05 (to 1e-15).
 */
export function studentTPValue(t: number, df: number, alternative: Alternative): number {
  if (!(df > 0)) throw new RangeError(`t p-value: degrees of freedom must be positive, got ${df}`);
  if (Number.isNaN(t)) throw new RangeError('t p-value: statistic is NaN');
  switch (alternative) {
    case 'two-sided':
      return Math.min(1, 2 * tCdf(-Math.abs(t), df));
    case 'greater':
      return tCdf(-t, df);
    case 'less':
      return tCdf(t, df);
  }
}
