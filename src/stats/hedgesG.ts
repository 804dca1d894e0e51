/**
 * Standardized mean difference: Cohen's d with the pooled standard deviation, Hedges' g (d times
 * the exact small-sample correction J; Hedges 1981, "Distribution theory for Glass's estimator of
 * effect size and related estimators", Journal of Educational Statistics 6:107-128; details from
 * memory), and the noncentral-t confidence interval for the population effect delta (Steiger &
 * Fouladi 1997; see noncentralT.ts).
 */
import gammaln from '@stdlib/math-base-special-gammaln';
import { mean, variance, type Numbers } from './moments.js';
import { noncentralTNcpInterval } from './noncentralT.js';

export interface HedgesGResult {
  /** Cohen's d: (mean(x) - mean(y)) / pooled sd */
  readonly d: number;
  /** Hedges' exact correction J = Gamma(v/2) / (sqrt(v/2) Gamma((v-1)/2)), v = n1 + n2 - 2 */
  readonly j: number;
  /** Hedges' g = J d */
  readonly g: number;
  /** J * dLow */
  readonly low: number;
  /** J * dHigh */
  readonly high: number;
  /** noncentral-t confidence limits for delta on the d scale */
  readonly dLow: number;
  readonly dHigh: number;
}

/**
 * Cohen's d, Hedges' g and their noncentral-t interval for mean(x) - mean(y) in pooled-sd units.
 * - d = (mean(x) - mean(y)) / s_p, s_p^2 = ((n1-1) s_x^2 + (n2-1) s_y^2) / (n1 + n2 - 2).
 * - J = Gamma(v/2) / (sqrt(v/2) Gamma((v-1)/2)) with v = n1 + n2 - 2, computed exactly through
 *   log-gamma (not the approximation 1 - 3/(4v - 1)); g = J d.
 * - The pooled t = d sqrt(n1 n2 / (n1 + n2)) follows a noncentral t with v df and ncp
 *   delta sqrt(n1 n2 / (n1 + n2)); the ncp limits (`noncentralTNcpInterval`) divided by that
 *   factor are dLow and dHigh; low and high are the same limits times J.
 *
 * Cost O(n1 + n2) plus about 120 noncentral t CDF evaluations. The inputs are not changed.
 * Throws a RangeError when a group has fewer than 2 values, when both groups have zero variance
 * (d is undefined), when level is not in (0, 1), or when the pooled t is beyond about 10^5 (the
 * noncentral t series limit; such a d means the runs barely vary at all).
 * Example: for METHODS.md's A and B, `hedgesG(A, B).g` is 1.341293840469836.
 */
export function hedgesG(x: Numbers, y: Numbers, level = 0.95): HedgesGResult {
  const n1 = x.length;
  const n2 = y.length;
  if (n1 < 2 || n2 < 2) throw new RangeError(`hedgesG requires at least 2 values per group, got ${n1} and ${n2}`);
  if (!(level > 0 && level < 1)) throw new RangeError(`hedgesG: level must be in (0, 1), got ${level}`);
  const v = n1 + n2 - 2;
  const pooledVariance = ((n1 - 1) * variance(x) + (n2 - 1) * variance(y)) / v;
  if (pooledVariance === 0) throw new RangeError('hedgesG: both groups have zero variance');
  const d = (mean(x) - mean(y)) / Math.sqrt(pooledVariance);
  const j = Math.exp(gammaln(v / 2) - gammaln((v - 1) / 2)) / Math.sqrt(v / 2);
  const scale = Math.sqrt((n1 * n2) / (n1 + n2));
  const ncp = noncentralTNcpInterval(d * scale, v, level);
  const dLow = ncp.low / scale;
  const dHigh = ncp.high / scale;
  return { d, j, g: j * d, low: j * dLow, high: j * dHigh, dLow, dHigh };
}
