/**
 * The statistics of one comparison of per-run values (every summary but `reach:VALUE`),
 * METHODS.md "Defaults":
 * - Primary test: Welch's two-sided t-test; under `--paired`, the paired t-test on the seeds present
 *   in both arms (Wilcoxon's signed-rank test beside it). When both arms have zero spread and
 *   their values differ, Welch is undefined and the exact permutation test decides (a caution says
 *   so). Beside the primary: the permutation test on the difference of means (seeded per
 *   comparison from `deriveSeed(seed, label)`) and Mann-Whitney U.
 * - Interval of the difference (candidate - baseline, metric units): the Welch t-interval at every
 *   n, at `level` (1 - alpha: unadjusted); the paired t-interval under `--paired`. Under
 *   `--interval bca` the headline is the BCa two-sample bootstrap from 4 runs per arm. From
 *   `bootstrapFrom` (10) runs per arm the BCa interval is also given beside (labelled; it never
 *   decides). Simultaneous (Bonferroni) bounds are added once the family's size is known
 *   (`simultaneousBounds`).
 * - Effects, all candidate minus baseline in the metric's own direction: Hedges' g with its
 *   noncentral-t interval, Cliff's delta with its interval; the probability of improvement is
 *   goal-oriented (P(candidate better)).
 * - Detectable: the between-seed sd pooled within the two configs and the smallest difference
 *   detectable with 80% power at the current seed counts and alpha. No post-hoc power.
 * - Non-inferiority under `--margin`: one-sided at alpha/2, Welch's, or the paired t under `--paired`.
 * Nothing here throws on data: a test that cannot run leaves its fields null with a reason.
 */
import type { Goal } from '../ingest/types.js';
import { bootstrapMeanDifference } from '../stats/bootstrap.js';
import { cliffsDelta } from '../stats/cliffsDelta.js';
import { hedgesG } from '../stats/hedgesG.js';
import { mannWhitney } from '../stats/mannWhitney.js';
import { mean, variance } from '../stats/moments.js';
import { pairedNonInferiority } from '../stats/pairedNonInferiority.js';
import { pairedT } from '../stats/pairedT.js';
import { permutationTest } from '../stats/permutation.js';
import { minimumDetectableEffect } from '../stats/power.js';
import { createRandom, deriveSeed } from '../stats/random.js';
import { welch, welchNonInferiority } from '../stats/welch.js';
import { wilcoxonSignedRank } from '../stats/wilcoxon.js';
import type { Arm } from './arms.js';
import { attempt, finiteOrNull } from './attempt.js';
import { formatNumber } from './cautions.js';
import type { Comparison, Difference } from './comparisonTypes.js';
import { pairedArms } from './pairedArms.js';
import type { IntervalChoice } from './results.js';

/** The settings the statistics read (a `ResolvedOptions` has them all). */
export interface TwoSampleSettings {
  readonly alpha: number;
  readonly level: number;
  readonly seed: number;
  readonly paired: boolean;
  readonly margin: number | null;
  readonly interval: IntervalChoice;
  readonly resamples: number;
  readonly bootstrapFrom: number;
}

/** Memo of `minimumDetectableEffect` by seed counts and alpha. */
export type PowerCache = Map<string, number>;

type Mutable<T> = { -readonly [K in keyof T]: T[K] };

export interface TwoSampleDraft {
  readonly tests: Comparison['tests'];
  readonly primary: Comparison['primary'];
  readonly p: number | null;
  /** Sign of the estimated difference, in the metric's own direction (candidate - baseline). */
  readonly direction: number;
  readonly difference: Difference;
  readonly effect: Comparison['effect'];
  readonly detectable: Comparison['detectable'];
  /** One-sided non-inferiority p (paired t when `pairedBounds`, else Welch); null without a margin. */
  readonly nonInferiorityP: number | null;
  /** Both arms have zero spread and differ: the permutation test decided. */
  readonly zeroSpread: boolean;
  readonly reasons: readonly string[];
  /** The values the simultaneous bounds are computed from: candidate and baseline (paired when paired). */
  readonly x: Float64Array;
  readonly y: Float64Array;
  readonly pairedBounds: boolean;
}

/** Compute everything of one comparison but what depends on the family. */
export function twoSampleDraft(
  base: Arm,
  cand: Arm,
  goal: Goal,
  label: string,
  s: TwoSampleSettings,
  cache: PowerCache,
): TwoSampleDraft {
  const reasons: string[] = [];
  const x = cand.values;
  const y = base.values;
  const nx = x.length;
  const ny = y.length;
  const few = nx < 2 || ny < 2;
  const flat = !few && variance(x) === 0 && variance(y) === 0;
  const estimate = mean(x) - mean(y);
  const zeroSpread = flat && estimate !== 0;
  if (few) reasons.push(`no t-test, effect size or interval with fewer than 2 seeds in an arm (${nx} v ${ny})`);
  if (zeroSpread)
    reasons.push(
      "every run gave the same value within each arm and the arms differ (zero spread in both): Welch's t, " +
        "Hedges' g and the t-interval are undefined, so the exact permutation test decides",
    );
  else if (flat) reasons.push('every run of both arms gave the same value: there is no difference to test');

  const w = few || flat ? null : attempt(() => welch(x, y, { level: s.level }), "Welch's test", reasons);
  const perm = attempt(
    () => permutationTest(x, y, createRandom(deriveSeed(s.seed, label))),
    'the permutation test',
    reasons,
  );
  const mw = attempt(() => mannWhitney(x, y), 'the Mann-Whitney test', reasons);
  const tests: Mutable<Comparison['tests']> = {
    welch: { statistic: w?.statistic ?? null, df: w?.df ?? null, p: finiteOrNull(w?.p) },
    permutation: { p: finiteOrNull(perm?.p), exact: perm?.exact ?? false },
    mannWhitney: { u: mw?.u ?? null, p: finiteOrNull(mw?.p), exact: mw?.exact ?? false },
  };
  let primary: Comparison['primary'] = zeroSpread ? 'permutation' : 'welch';
  let p = zeroSpread ? tests.permutation.p : tests.welch.p;
  let difference: Difference = headline(x, y, w, s, label, reasons);
  let bx = x;
  let by = y;
  let pairedBounds = false;
  if (s.paired) {
    const paired = pairedArms(base, cand);
    const canPair = paired.x.length >= 2;
    if (!canPair)
      reasons.push(
        `--paired: only ${paired.x.length} seed${paired.x.length === 1 ? '' : 's'} present in both arms; the ` +
          `paired tests need 2`,
      );
    const pt = canPair
      ? attempt(() => pairedT(paired.x, paired.y, { level: s.level }), 'the paired t-test', reasons)
      : null;
    const wx = canPair
      ? attempt(() => wilcoxonSignedRank(paired.x, paired.y), 'the Wilcoxon signed-rank test', reasons)
      : null;
    tests.paired = {
      t: finiteOrNull(pt?.statistic),
      df: pt?.df ?? null,
      p: finiteOrNull(pt?.p),
      wilcoxonP: finiteOrNull(wx?.p),
      pairs: paired.x.length,
    };
    primary = 'paired-t';
    p = tests.paired.p;
    const pairedEstimate = paired.x.length > 0 ? mean(paired.x) - mean(paired.y) : estimate;
    difference = {
      estimate: pt?.difference ?? pairedEstimate,
      low: pt?.low ?? null,
      high: pt?.high ?? null,
      level: s.level,
      method: pt === null ? 'none' : 't',
      simultaneous: null,
      bca: null,
    };
    bx = paired.x;
    by = paired.y;
    pairedBounds = true;
  }
  // Non-inferiority at alpha/2 (the verdict compares): paired t on the pairs under --paired, else Welch.
  let nonInferiorityP: number | null = null;
  const margin = s.margin;
  if (margin !== null && (pairedBounds ? bx.length >= 2 : !few && !flat)) {
    const test = () =>
      pairedBounds ? pairedNonInferiority(bx, by, margin, goal) : welchNonInferiority(x, y, margin, goal);
    nonInferiorityP = finiteOrNull(attempt(test, 'the non-inferiority test', reasons)?.p);
  }
  return {
    tests,
    primary,
    p,
    direction: Math.sign(difference.estimate ?? 0),
    difference,
    effect: effectOf(x, y, goal, s.level, few, flat, reasons),
    detectable: detectableOf(x, y, s.alpha, cache),
    nonInferiorityP,
    zeroSpread,
    reasons,
    x: bx,
    y: by,
    pairedBounds,
  };
}

/**
 * Simultaneous (Bonferroni) bounds at 1 - alpha/m for a family of m: the Welch (or paired) t-interval
 * at that level, or null when it cannot be computed. Example: m = 5, alpha 0.05 gives the 99% interval.
 */
export function simultaneousBounds(d: TwoSampleDraft, alpha: number, m: number): Difference['simultaneous'] {
  if (d.difference.low === null || m < 1) return null;
  const level = 1 - alpha / m;
  try {
    const r = d.pairedBounds ? pairedT(d.x, d.y, { level }) : welch(d.x, d.y, { level });
    return Number.isFinite(r.low) && Number.isFinite(r.high) ? { low: r.low, high: r.high, level } : null;
  } catch (error) {
    if (!(error instanceof RangeError)) throw error;
    return null;
  }
}

/**
 * The headline interval (Welch, or BCa under `--interval bca` from 4 runs per arm) and BCa beside from `bootstrapFrom`.
 */
function headline(
  x: Float64Array,
  y: Float64Array,
  w: { difference: number; low: number; high: number } | null,
  s: TwoSampleSettings,
  label: string,
  reasons: string[],
): Difference {
  const estimate = mean(x) - mean(y);
  const smaller = Math.min(x.length, y.length);
  const wantBca = (s.interval === 'bca' && smaller >= 4) || smaller >= s.bootstrapFrom;
  if (s.interval === 'bca' && smaller >= 2 && smaller <= 3) {
    reasons.push(
      `no bootstrap interval with ${smaller} seeds in an arm: a percentile bootstrap interval of ${smaller} ` +
        `values covers at most ${formatNumber(100 * (1 - 2 * 0.5 ** smaller))}% (METHODS.md); the interval ` +
        `shown is Welch's t`,
    );
  }
  let bca: Difference['bca'] = null;
  if (wantBca) {
    const boot = attempt(
      () =>
        bootstrapMeanDifference(x, y, createRandom(deriveSeed(s.seed, `bootstrap|${label}`)), {
          method: 'bca',
          resamples: s.resamples,
          level: s.level,
        }),
      'the BCa bootstrap interval',
      reasons,
    );
    if (boot !== null && Number.isFinite(boot.low) && Number.isFinite(boot.high))
      bca = { low: boot.low, high: boot.high, level: s.level };
  }
  if (s.interval === 'bca' && bca !== null)
    return { estimate, low: bca.low, high: bca.high, level: s.level, method: 'bca', simultaneous: null, bca };
  if (w === null) return { estimate, low: null, high: null, level: s.level, method: 'none', simultaneous: null, bca };
  return { estimate, low: w.low, high: w.high, level: s.level, method: 'welch-t', simultaneous: null, bca };
}

function effectOf(
  x: Float64Array,
  y: Float64Array,
  goal: Goal,
  level: number,
  few: boolean,
  flat: boolean,
  reasons: string[],
): Comparison['effect'] {
  const g = few || flat ? null : attempt(() => hedgesG(x, y, level), "Hedges' g", reasons);
  const c = few ? null : attempt(() => cliffsDelta(x, y, level), "Cliff's delta", reasons);
  const up = finiteOrNull(c?.probabilityOfImprovement);
  return {
    hedgesG: finiteOrNull(g?.g),
    hedgesGLow: finiteOrNull(g?.low),
    hedgesGHigh: finiteOrNull(g?.high),
    probabilityOfImprovement: up === null ? null : goal === 'max' ? up : 1 - up,
    cliffsDelta: finiteOrNull(c?.delta),
    cliffsDeltaLow: finiteOrNull(c?.low),
    cliffsDeltaHigh: finiteOrNull(c?.high),
  };
}

/** Between-seed sd pooled within the two configs and the smallest difference detectable with 80% power. */
function detectableOf(x: Float64Array, y: Float64Array, alpha: number, cache: PowerCache): Comparison['detectable'] {
  const df = x.length + y.length - 2;
  if (df < 1) return { sd: null, minimumEffect: null };
  const ss = (x.length > 1 ? (x.length - 1) * variance(x) : 0) + (y.length > 1 ? (y.length - 1) * variance(y) : 0);
  const sd = Math.sqrt(ss / df);
  if (!(sd > 0) || x.length < 2 || y.length < 2) return { sd, minimumEffect: null };
  const key = `${x.length},${y.length},${alpha}`;
  let d = cache.get(key);
  if (d === undefined) {
    try {
      d = minimumDetectableEffect(x.length, y.length, alpha, 0.8);
    } catch (error) {
      if (!(error instanceof RangeError)) throw error;
      d = Number.NaN; // no finite difference reaches 80% power at these counts and alpha
    }
    cache.set(key, d);
  }
  return { sd, minimumEffect: Number.isFinite(d) ? d * sd : null };
}
