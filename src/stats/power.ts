/**
 * Power of the two-sided two-sample t-test, and the two planning questions built on it: the
 * smallest effect detectable with given seed counts, and the seeds per arm needed for an effect
 * (Cohen 1988, "Statistical power analysis for the behavioral sciences", ch. 2; for training runs,
 * Colas, Sigaud & Oudeyer 2018, "How many random seeds?").
 *
 * Power uses the noncentral t: under an effect d (in standard deviations) the two-sample t has
 * df = n1 + n2 - 2 and noncentrality ncp = d sqrt(n1 n2 / (n1 + n2)), and
 * power = P(T > t_c) + P(T < -t_c) with t_c = t_{1 - alpha/2, df} (both tails counted).
 * This is the equal-variance planning formula (as in R's `pwr.t.test` and G*Power); the test run
 * on the data is Welch's, whose df is at most n1 + n2 - 2, so with unequal variances the real
 * power can be a little lower.
 */
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import normalQuantile from '@stdlib/stats-base-dists-normal-quantile';
import { noncentralTCdf } from './noncentralT.js';
import { studentTQuantile } from './studentTQuantile.js';

function checkAlpha(alpha: number, who: string): void {
  if (!(alpha > 0 && alpha < 1)) throw new RangeError(`${who}: alpha must be in (0, 1), got ${alpha}`);
}

/**
 * The two-sided critical value t_{1 - alpha/2, df}. Below alpha/2 = 1e-6 it is computed as
 * -t_{alpha/2, df}: 1 - alpha/2 is rounded to the nearest double, which at alpha 1e-11 moves the
 * quantile by 4e-8 relative and below alpha 2.2e-16 makes it 1 exactly (quantile Infinity). Above,
 * the two forms differ only in the last bits, and the upper form is kept so that results do not
 * move. Infinity when alpha/2 underflows to 0.
 */
function criticalT(alpha: number, df: number): number {
  return alpha / 2 < 1e-6 ? -studentTQuantile(alpha / 2, df) : studentTQuantile(1 - alpha / 2, df);
}

function checkArm(n: number, who: string): void {
  if (!(Number.isInteger(n) && n >= 2)) throw new RangeError(`${who}: seeds per arm must be an integer >= 2, got ${n}`);
}

/**
 * Power of the two-sided two-sample t-test at level alpha for a true effect of `effect` pooled
 * standard deviations (Cohen's d), with n1 and n2 runs (see the file comment for the formula).
 * The sign of the effect does not matter.
 *
 * Cost: one t quantile and two noncentral t CDFs. Throws a RangeError when effect is not finite,
 * n1 or n2 is not an integer >= 2, or alpha is not in (0, 1).
 * Example: `welchPower(1, 5, 5)` is 0.2863 (to 4 decimals).
 */
export function welchPower(effect: number, n1: number, n2: number, alpha = 0.05): number {
  if (!Number.isFinite(effect)) throw new RangeError(`welchPower: effect must be finite, got ${effect}`);
  checkArm(n1, 'welchPower');
  checkArm(n2, 'welchPower');
  checkAlpha(alpha, 'welchPower');
  const df = n1 + n2 - 2;
  const ncp = effect * Math.sqrt((n1 * n2) / (n1 + n2));
  const critical = criticalT(alpha, df);
  if (critical === Infinity) return 0;
  return 1 - noncentralTCdf(critical, df, ncp) + noncentralTCdf(-critical, df, ncp);
}

/**
 * The smallest effect (Cohen's d, positive) that the two-sided two-sample t-test detects with the
 * given power at level alpha with n1 and n2 runs: the root of welchPower(d, n1, n2, alpha) = power,
 * bracketed by doubling from d = 1 and found by bisection to 1e-12 relative (about 45 power
 * evaluations).
 *
 * It is 0 when power <= alpha (the test has power alpha already at d = 0), and Infinity when alpha
 * is so small that the critical value overflows (alpha/2 below the smallest double). Any other
 * alpha in (0, 1) gives a finite effect: at 2 v 2 and alpha 1e-11 it is about 4e5 (the noncentral
 * t CDF switches to its integral form there, see `noncentralTCdf`).
 *
 * Throws a RangeError when n1 or n2 is not an integer >= 2, alpha is not in (0, 1), or power is
 * not in (0, 1).
 * Example: `minimumDetectableEffect(10, 10)` is 1.32494739257... (R pwr.t.test: 1.324947).
 */
export function minimumDetectableEffect(n1: number, n2: number, alpha = 0.05, power = 0.8): number {
  checkArm(n1, 'minimumDetectableEffect');
  checkArm(n2, 'minimumDetectableEffect');
  checkAlpha(alpha, 'minimumDetectableEffect');
  if (!(power > 0 && power < 1)) throw new RangeError(`minimumDetectableEffect: power must be in (0, 1), got ${power}`);
  if (power <= alpha) return 0;
  if (criticalT(alpha, n1 + n2 - 2) === Infinity) return Infinity;
  let lo = 0;
  let hi = 1;
  while (welchPower(hi, n1, n2, alpha) < power) {
    lo = hi;
    hi *= 2;
    // A finite critical value is reached by a finite effect (at most about 1e162 at the smallest alpha).
    if (hi > 1e300) throw new RangeError('minimumDetectableEffect: no effect below 1e300 reaches that power');
  }
  // Invariant: power(lo) < target <= power(hi).
  for (let i = 0; i < 200 && hi - lo > 1e-12 * hi; i++) {
    const mid = lo + (hi - lo) / 2;
    if (welchPower(mid, n1, n2, alpha) < power) lo = mid;
    else hi = mid;
  }
  return hi;
}

/** Above this many runs per arm, `seedsPerArm` uses the large-sample formula. */
const EXACT_SEARCH_LIMIT = 2 ** 20;

/**
 * The smallest number of runs per arm (equal arms) for which the two-sided two-sample t-test at
 * level alpha detects an effect of `effect` pooled standard deviations with at least the given
 * power. Search: doubling from n = 2, then bisection over integers (power increases with n).
 * Beyond 2^20 runs per arm it uses the large-sample answer ceil(n_z + z_{1-alpha/2}^2 / 4): n_z
 * solves the normal-test power Phi(d sqrt(n/2) - z) + Phi(-d sqrt(n/2) - z) = power (both tails,
 * z = z_{1-alpha/2}), and z^2/4 is Guenther's correction from the normal to the t-test (Guenther
 * 1981, "Sample size formulas for normal theory t tests", The American Statistician 35:243-244;
 * from memory). The formula gives the exact t answer at d = 0.0039, 0.002 and 0.001 (checked
 * against a 30-digit integral). Returns Infinity for effect 0 (no finite n suffices) and when n
 * overflows (effects below about 1e-154). The sign of the effect does not matter.
 *
 * When power <= alpha every n has enough power (even at effect 0), so the answer is 2, the
 * smallest arm.
 *
 * Cost: at most about 45 power evaluations. Throws a RangeError when effect is not finite, alpha
 * is not in (0, 1), or power is not in (0, 1).
 * Example: `seedsPerArm(0.5)` is 64 (METHODS.md check value).
 */
export function seedsPerArm(effect: number, alpha = 0.05, power = 0.8): number {
  if (!Number.isFinite(effect)) throw new RangeError(`seedsPerArm: effect must be finite, got ${effect}`);
  checkAlpha(alpha, 'seedsPerArm');
  if (!(power > 0 && power < 1)) throw new RangeError(`seedsPerArm: power must be in (0, 1), got ${power}`);
  if (power <= alpha) return 2;
  if (effect === 0) return Infinity;
  const enough = (n: number): boolean => welchPower(effect, n, n, alpha) >= power;
  if (enough(2)) return 2;
  let lo = 2;
  let hi = 4;
  while (!enough(hi)) {
    lo = hi;
    hi *= 2;
    if (hi > EXACT_SEARCH_LIMIT) return Math.max(EXACT_SEARCH_LIMIT + 1, largeSampleSeeds(effect, alpha, power));
  }
  // Invariant: not enough(lo), enough(hi).
  while (hi - lo > 1) {
    const mid = Math.floor((lo + hi) / 2);
    if (enough(mid)) hi = mid;
    else lo = mid;
  }
  return hi;
}

/** ceil(n_z + z^2/4), n_z solving the two-tailed normal-test power (see `seedsPerArm`). */
function largeSampleSeeds(effect: number, alpha: number, power: number): number {
  const z = alpha / 2 < 1e-6 ? -normalQuantile(alpha / 2, 0, 1) : normalQuantile(1 - alpha / 2, 0, 1);
  const normalPower = (n: number): number => {
    const shift = Math.abs(effect) * Math.sqrt(n / 2);
    return normalCdf(shift - z, 0, 1) + normalCdf(-shift - z, 0, 1);
  };
  // One tail alone reaches the target at n1 = 2 (z + z_power)^2 / d^2; the other tail only adds power.
  let hi = (2 * (z + normalQuantile(power, 0, 1)) ** 2) / (effect * effect);
  let lo = hi / 2;
  if (!Number.isFinite(hi)) return Infinity;
  for (let i = 0; i < 200 && hi - lo > 1e-13 * hi; i++) {
    const mid = lo + (hi - lo) / 2;
    if (normalPower(mid) >= power) hi = mid;
    else lo = mid;
  }
  return Math.ceil(hi + (z * z) / 4);
}
