/**
 * Plain-language cautions for one comparison, and the matching `Problem` records. Each line says
 * what limits the reading of that comparison: few seeds (with the smallest p a rank or permutation
 * test can reach, 2 / C(n1 + n2, n1) two-sided, METHODS.md), skewed values at small n, unequal
 * seed counts, a goal guessed from the metric's name, tests that disagree at alpha, diverged or
 * value-less runs, tests that could not run, and a `better` verdict resting on fewer than 5 seeds
 * per arm. Pure; cost O(n).
 */
import type { Goal } from '../ingest/types.js';
import { problem, type Problem } from '../problems.js';
import type { CautionKind, FailureCounts } from './comparisonTypes.js';
import type { FailedPolicy, Verdict } from './results.js';

export interface CautionFacts {
  readonly metric: string;
  readonly summary: string;
  readonly task: string | null;
  readonly baseline: string;
  readonly candidate: string;
  /** Direction of the compared values (the summary's goal). */
  readonly goal: Goal;
  readonly goalInferred: boolean;
  /** Steps-to-reach summaries: fewer steps is better. */
  readonly reachValue: number | null;
  readonly baselineValues: ArrayLike<number>;
  readonly candidateValues: ArrayLike<number>;
  readonly failures: FailureCounts;
  readonly failedPolicy: FailedPolicy;
  /** Runs with no value (censored, missing), not counting diverged ones. */
  readonly noValue: { readonly baseline: number; readonly candidate: number };
  readonly alpha: number;
  readonly p: {
    readonly welch: number | null;
    readonly permutation: number | null;
    readonly mannWhitney: number | null;
  };
  /** Both arms have zero spread and differ: the exact permutation test decided. */
  readonly zeroSpread: boolean;
  readonly verdict: Verdict;
  /** Why a test or interval could not run, already in plain words. */
  readonly reasons: readonly string[];
}

/**
 * Sample skewness g1 = m3 / m2^(3/2) with population moments (scipy.stats.skew, bias=True); null
 * when n < 3 or all equal.
 */
export function sampleSkewness(x: ArrayLike<number>): number | null {
  const n = x.length;
  if (n < 3) return null;
  let m = 0;
  for (let i = 0; i < n; i++) m += x[i] as number;
  m /= n;
  let m2 = 0;
  let m3 = 0;
  for (let i = 0; i < n; i++) {
    const d = (x[i] as number) - m;
    m2 += d * d;
    m3 += d * d * d;
  }
  m2 /= n;
  m3 /= n;
  return m2 > 0 ? m3 / m2 ** 1.5 : null;
}

/**
 * Standard error of the sample skewness of n values from a normal distribution,
 * sqrt(6n(n-1) / ((n-2)(n+1)(n+3))) (common practice; e.g. Cramer 1997, "Basic Statistics for
 * Social Research"). "Skewness beyond twice its standard error" is the usual rule of thumb.
 * Example: `skewnessStandardError(10)` is 0.6870.
 */
export function skewnessStandardError(n: number): number {
  if (n < 3) throw new RangeError(`skewnessStandardError requires n >= 3, got ${n}`);
  return Math.sqrt((6 * n * (n - 1)) / ((n - 2) * (n + 1) * (n + 3)));
}

/**
 * Skewness of the two arms' values pooled after centring each arm on its mean (so a difference
 * between the arms is not mistaken for skew), with its standard error; null below 6 values in all.
 * Pooling is what makes skew detectable at all with 3 to 10 seeds: one arm of 5 can never show a
 * sample skewness above 1.5, less than twice its standard error.
 */
export function pooledSkewness(
  a: ArrayLike<number>,
  b: ArrayLike<number>,
): { g1: number; se: number; n: number } | null {
  const n = a.length + b.length;
  if (n < 6 || a.length < 2 || b.length < 2) return null;
  const centred = new Float64Array(n);
  let k = 0;
  for (const arm of [a, b]) {
    let m = 0;
    for (let i = 0; i < arm.length; i++) m += arm[i] as number;
    m /= arm.length;
    for (let i = 0; i < arm.length; i++) centred[k++] = (arm[i] as number) - m;
  }
  const g1 = sampleSkewness(centred);
  return g1 === null ? null : { g1, se: skewnessStandardError(n), n };
}

/**
 * Smallest two-sided p-value an exact rank or permutation test can reach with n1 and n2 distinct
 * values: 2 / C(n1 + n2, n1), capped at 1 (METHODS.md: 0.1 at 3 v 3, 0.0286 at 4 v 4, 0.0079 at 5 v 5).
 * Example: `smallestTwoSidedP(3, 3)` is 0.1.
 */
export function smallestTwoSidedP(n1: number, n2: number): number {
  let c = 1;
  const k = Math.min(n1, n2);
  for (let i = 1; i <= k; i++) c = (c * (n1 + n2 - k + i)) / i;
  return Math.min(1, 2 / c);
}

/** Numbers in caution lines: three significant digits, no trailing zeros. */
export function formatNumber(x: number): string {
  return String(Number(x.toPrecision(3)));
}

/**
 * The caution lines of one comparison and the problems to record (codes few-seeds, skewed-values,
 * unequal-seeds, goal-inferred, tests-disagree).
 * Example: 3 v 3 seeds at alpha 0.05 gives the line
 * "with 3 v 3 seeds no rank or permutation test can reach p < 0.05 (smallest two-sided p = 0.1)".
 */
export function comparisonCautions(f: CautionFacts): { lines: string[]; kinds: CautionKind[]; problems: Problem[] } {
  const lines: string[] = [];
  const kinds: CautionKind[] = [];
  const problems: Problem[] = [];
  const task = f.task === null ? '' : `, task ${f.task}`;
  const where = `${f.metric} (${f.summary}${task}), ${f.candidate} v ${f.baseline}`;
  const add = (kind: CautionKind, line: string, code?: Parameters<typeof problem>[0]): void => {
    lines.push(line);
    kinds.push(kind);
    // A guessed goal concerns the metric, not the comparison: one problem per metric (after deduplication).
    if (code !== undefined) problems.push(problem(code, `${code === 'goal-inferred' ? f.metric : where}: ${line}`));
  };
  const nb = f.baselineValues.length;
  const nc = f.candidateValues.length;

  if (f.reachValue !== null)
    add(
      'reach-summary',
      `the summary is the number of steps until ${f.metric} first reaches ${f.reachValue} (reaching sooner is ` +
        "better); runs that have not reached it are censored at the comparison's step and kept (log-rank test)",
    );
  if (f.goalInferred) {
    const flip = f.goal === 'max' ? 'min' : 'max';
    add(
      'goal-guessed',
      `${f.goal === 'max' ? 'higher' : 'lower'} is better was inferred from the name '${f.metric}'; ` +
        `say --metric ${f.metric}:${flip} if that is wrong`,
      'goal-inferred',
    );
  }
  if (nb >= 1 && nc >= 1) {
    const smallest = smallestTwoSidedP(nc, nb);
    if (smallest >= f.alpha) {
      add(
        'few-seeds',
        `with ${nc} v ${nb} seeds no rank or permutation test can reach p < ${f.alpha} ` +
          `(smallest two-sided p = ${formatNumber(smallest)})`,
        'few-seeds',
      );
    } else if (Math.min(nb, nc) < 4) {
      const arm = nb < nc ? 'baseline' : 'candidate';
      add(
        'few-seeds',
        `only ${Math.min(nb, nc)} seeds in the ${arm} arm: intervals are wide and one more seed can turn the verdict`,
        'few-seeds',
      );
    }
  }
  const skew = pooledSkewness(f.baselineValues, f.candidateValues);
  if (skew !== null && Math.abs(skew.g1) > 2 * skew.se) {
    add(
      'skewed',
      `the values are skewed within the arms (sample skewness ${formatNumber(skew.g1)} of the ${skew.n} values ` +
        `centred on their arm means, beyond ${formatNumber(2 * skew.se)}, twice its standard error under ` +
        'normality): t-based intervals may under-cover; read the rank and permutation tests beside Welch',
      'skewed-values',
    );
  }
  if (nb !== nc && nb > 0 && nc > 0)
    add('unequal-seeds', `unequal seed counts (${nc} candidate v ${nb} baseline)`, 'unequal-seeds');
  const fb = f.failures.baseline;
  const fc = f.failures.candidate;
  const failed = fb.diverged + fb.short + fc.diverged + fc.short;
  if (failed > 0) {
    const what =
      f.failedPolicy === 'exclude' ? 'left out of the values' : 'scored as the worst value observed in this comparison';
    const arm = (a: typeof fb): string => {
      const kinds = [a.diverged > 0 ? `${a.diverged} diverged` : '', a.short > 0 ? `${a.short} short` : ''];
      const which = a.diverged + a.short > 0 ? ` (${kinds.filter((k) => k !== '').join(', ')})` : '';
      return `${a.diverged + a.short} of ${a.runs} failed${which}`;
    };
    add(
      'failed-runs',
      `${failed} failed run${failed === 1 ? '' : 's'} ${what}: baseline ${arm(fb)}, candidate ${arm(fc)}; ` +
        `Fisher's exact test on the failure counts p = ${
          f.failures.fisherP === null ? '—' : formatNumber(f.failures.fisherP)
        }`,
    );
  }
  if (f.zeroSpread)
    add(
      'zero-spread',
      "zero spread in both arms and the arms differ: Welch's test is undefined, so the exact permutation test " +
        `decides (p = ${f.p.permutation === null ? '—' : formatNumber(f.p.permutation)})`,
      'zero-spread',
    );
  const nv = f.noValue.baseline + f.noValue.candidate;
  if (nv > 0) {
    add(
      'no-value',
      `${nv} run${nv === 1 ? ' has' : 's have'} no value for this summary and ${nv === 1 ? 'is' : 'are'} left out ` +
        `(baseline ${f.noValue.baseline}, candidate ${f.noValue.candidate})`,
    );
  }
  for (const reason of f.reasons) add('not-run', reason);
  const tests: [string, number | null][] = [
    ['Welch', f.p.welch],
    ['the permutation test', f.p.permutation],
    ['Mann-Whitney', f.p.mannWhitney],
  ];
  const run = tests.filter((t): t is [string, number] => t[1] !== null);
  const significant = run.filter((t) => t[1] < f.alpha);
  if (significant.length > 0 && significant.length < run.length) {
    const list = run.map(([name, p]) => `${name} p = ${formatNumber(p)}`).join(', ');
    add(
      'tests-disagree',
      `the tests disagree at alpha ${f.alpha} (${list}); treat the verdict as fragile`,
      'tests-disagree',
    );
  }
  if (f.verdict === 'better' && Math.min(nb, nc) < 5) {
    add(
      'fragile',
      `the 'better' verdict rests on ${nc} v ${nb} seeds: fragile; confirm it with more seeds before claiming it`,
    );
  }
  return { lines, kinds, problems };
}
