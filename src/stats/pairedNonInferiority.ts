/**
 * Paired t-test of non-inferiority: the shifted one-sided test of non-inferiority trials (common
 * practice) on paired differences d_i = x_i - y_i, candidate x and baseline y matched by seed.
 * - goal 'max' (higher is better): H0 mean(d) <= -margin against H1 mean(d) > -margin;
 *   t = (mean(d) + margin) / (sd(d) / sqrt(n)), p = P(T >= t), df = n - 1.
 * - goal 'min' (lower is better): H0 mean(d) >= +margin against H1 mean(d) < +margin;
 *   t = (mean(d) - margin) / (sd(d) / sqrt(n)), p = P(T <= t).
 * This equals the paired t-test's 'greater' test of x + margin against y (goal 'max') and 'less'
 * test of x - margin against y (goal 'min'): scipy.stats.ttest_rel(x + margin, y, alternative='greater').
 *
 * Cost O(n). Throws a RangeError when margin is negative or not finite, when goal is not 'max' or
 * 'min', or on whatever `pairedT` rejects (unequal lengths, fewer than 2 pairs, equal differences).
 * Example: `pairedNonInferiority(x, y, 0, 'max').p` equals `pairedT(x, y, { alternative: 'greater' }).p`.
 */
import type { Numbers } from './moments.js';
import { pairedT } from './pairedT.js';
import type { NonInferiorityResult } from './welch.js';

export function pairedNonInferiority(
  x: Numbers,
  y: Numbers,
  margin: number,
  goal: 'max' | 'min',
): NonInferiorityResult {
  if (!(Number.isFinite(margin) && margin >= 0))
    throw new RangeError(`pairedNonInferiority: margin must be a finite number >= 0, got ${margin}`);
  if (goal !== 'max' && goal !== 'min')
    throw new RangeError(`pairedNonInferiority: goal must be max or min, got ${String(goal)}`);
  const shift = goal === 'max' ? margin : -margin;
  const shifted = Float64Array.from(x, (v) => v + shift);
  const r = pairedT(shifted, y, { alternative: goal === 'max' ? 'greater' : 'less' });
  return { statistic: r.statistic, df: r.df, p: r.p, margin };
}
