/**
 * Welch's unequal-variance t-test (Welch 1947, "The generalization of 'Student's' problem when
 * several different population variances are involved", Biometrika 34:28-35) with the
 * Welch-Satterthwaite degrees of freedom (Satterthwaite 1946, Biometrics Bulletin 2:110-114).
 * (Journal details from memory.) Same results as scipy.stats.ttest_ind(x, y, equal_var=False) and
 * R's t.test(x, y).
 */
import { checkAlternative, studentTPValue, type Alternative } from './alternative.js';
import { mean, variance, type Numbers } from './moments.js';
import { studentTBounds } from './tInterval.js';

export interface WelchOptions {
  readonly alternative?: Alternative;
  readonly level?: number;
  /** Not used by `welch` (it always tests a difference of 0); use `welchNonInferiority` for a margin. */
  readonly margin?: number;
}

export interface WelchResult {
  readonly statistic: number;
  readonly df: number;
  readonly p: number;
  /** mean(x) - mean(y) */
  readonly difference: number;
  readonly low: number;
  readonly high: number;
  readonly level: number;
  readonly alternative: Alternative;
  /** standard error of the difference, sqrt(var(x)/n1 + var(y)/n2) */
  readonly se: number;
}

export interface NonInferiorityResult {
  readonly statistic: number;
  readonly df: number;
  readonly p: number;
  readonly margin: number;
}

interface WelchParts {
  readonly difference: number;
  readonly se: number;
  readonly df: number;
}

/** Difference of means, its standard error and the Welch-Satterthwaite df; validates the input. */
function welchParts(x: Numbers, y: Numbers, who: string): WelchParts {
  if (x.length < 2 || y.length < 2) {
    throw new RangeError(`${who} requires at least 2 values per group, got ${x.length} and ${y.length}`);
  }
  const vx = variance(x) / x.length;
  const vy = variance(y) / y.length;
  const v = vx + vy;
  if (v === 0) throw new RangeError(`${who}: both groups have zero variance`);
  const df = (v * v) / ((vx * vx) / (x.length - 1) + (vy * vy) / (y.length - 1));
  return { difference: mean(x) - mean(y), se: Math.sqrt(v), df };
}

/**
 * Welch's t-test of H0: mean(x) - mean(y) = 0, with the matching interval for mean(x) - mean(y)
 * (two-sided; for a one-sided alternative a one-sided bound with the other end infinite).
 * t = (mean(x) - mean(y)) / se, se^2 = s_x^2/n_x + s_y^2/n_y,
 * df = se^4 / ((s_x^2/n_x)^2/(n_x-1) + (s_y^2/n_y)^2/(n_y-1)); p from Student's t with that
 * (fractional) df. `opts.margin` is ignored here (see `welchNonInferiority`).
 *
 * Cost O(n_x + n_y); the inputs are not changed. Throws a RangeError when a group has fewer than 2
 * values, when both groups have zero variance (t would be 0/0 or +-Infinity), or when level or
 * alternative is invalid. A zero variance in one group only is fine.
 * Example: `welch([71.2, 69.8, 73.1, 70.4, 72.0], [68.9, 70.1, 69.5, 71.0, 67.8, 70.6, 69.2]).p` is
 * 0.04418107272139468.
 */
export function welch(x: Numbers, y: Numbers, opts: WelchOptions = {}): WelchResult {
  const alternative = checkAlternative(opts.alternative ?? 'two-sided', 'welch');
  const level = opts.level ?? 0.95;
  if (!(level > 0 && level < 1)) throw new RangeError(`welch: level must be in (0, 1), got ${level}`);
  const { difference, se, df } = welchParts(x, y, 'welch');
  const statistic = difference / se;
  const p = studentTPValue(statistic, df, alternative);
  const { low, high } = studentTBounds(difference, se, df, level, alternative);
  return { statistic, df, p, difference, low, high, level, alternative, se };
}

/**
 * One-sided Welch test of non-inferiority: is candidate x not worse than baseline y by `margin`
 * or more? (The usual shifted one-sided test of non-inferiority trials: common practice.)
 * - goal 'max' (higher is better): H0 mean(x) - mean(y) <= -margin against H1 > -margin;
 *   t = (mean(x) - mean(y) + margin) / se, p = P(T >= t).
 * - goal 'min' (lower is better): H0 mean(x) - mean(y) >= +margin against H1 < +margin;
 *   t = (mean(x) - mean(y) - margin) / se, p = P(T <= t).
 * se and df are Welch's, as in `welch`. This equals Welch's 'greater' test of x + margin against y
 * (goal 'max') and 'less' test of x - margin against y (goal 'min').
 *
 * Cost O(n_x + n_y). Throws a RangeError when margin is negative or not finite, when goal is not
 * 'max' or 'min', when a group has fewer than 2 values, or when both groups have zero variance.
 * Example: `welchNonInferiority(a, b, 0, 'max').p` equals `welch(a, b, { alternative: 'greater' }).p`.
 */
export function welchNonInferiority(x: Numbers, y: Numbers, margin: number, goal: 'max' | 'min'): NonInferiorityResult {
  if (!(Number.isFinite(margin) && margin >= 0)) {
    throw new RangeError(`welchNonInferiority: margin must be a finite number >= 0, got ${margin}`);
  }
  if (goal !== 'max' && goal !== 'min')
    throw new RangeError(`welchNonInferiority: goal must be max or min, got ${String(goal)}`);
  const { difference, se, df } = welchParts(x, y, 'welchNonInferiority');
  if (goal === 'max') {
    const statistic = (difference + margin) / se;
    return { statistic, df, p: studentTPValue(statistic, df, 'greater'), margin };
  }
  const statistic = (difference - margin) / se;
  return { statistic, df, p: studentTPValue(statistic, df, 'less'), margin };
}
