/**
 * Comparisons between two configurations on per-run summary values (METHODS.md, "Defaults").
 *
 * For each pair (candidate v baseline) of one family (one metric, one summary, one task):
 * - Values: the runs' summary values. Diverged runs are left out by default and counted; under
 *   `--diverged worst` each takes the worst value observed among the non-diverged runs of this
 *   comparison (the smallest for a goal of max, the largest for min). Runs with no value
 *   (censored, missing) are left out and counted.
 * - Primary test: Welch's two-sided t-test (under `--paired`: the paired t-test on the seeds present
 *   in both arms, with Wilcoxon's signed-rank test beside it). Beside it: the exact permutation test
 *   on the difference of means (seeded per comparison from `deriveSeed(seed, metric|baseline|candidate)`,
 *   so results do not depend on the order of comparisons) and Mann-Whitney U.
 * - Difference (candidate - baseline, metric units): Welch t-interval while either arm has fewer
 *   than `bootstrapFrom` (20) runs, BCa two-sample bootstrap at or above (never with 3 or fewer runs
 *   in an arm); no interval with fewer than 2 runs in an arm. Under `--paired`, the paired t-interval.
 * - Effect: Hedges' g (candidate - baseline, so its sign is the difference's) with its
 *   noncentral-t interval; Cliff's delta and the probability of improvement oriented to the goal
 *   (P > 0.5 and delta > 0 mean the candidate tends to be better).
 * - Detectable: pooled between-seed sd, the smallest difference detectable with 80% power at the
 *   current seed counts (Cohen's d from `minimumDetectableEffect` times the pooled sd), and the seeds
 *   per arm to detect the observed difference with 80% power (`seedsPerArm`, noncentral t).
 * - `--margin`: one-sided Welch non-inferiority test.
 * Then p-values are adjusted across the family and verdicts decided (`verdict.ts`), and cautions
 * written (`cautions.ts`). A test that cannot run leaves its fields null with a reason; nothing
 * here throws on data.
 */
import type { Goal } from '../ingest/types.js';
import { problem, type Problem } from '../problems.js';
import { bootstrapMeanDifference } from '../stats/bootstrap.js';
import { cliffsDelta } from '../stats/cliffsDelta.js';
import { hedgesG } from '../stats/hedgesG.js';
import { mannWhitney } from '../stats/mannWhitney.js';
import { mean, variance } from '../stats/moments.js';
import { pairedT } from '../stats/pairedT.js';
import { permutationTest } from '../stats/permutation.js';
import { minimumDetectableEffect, seedsPerArm } from '../stats/power.js';
import { createRandom, deriveSeed } from '../stats/random.js';
import { welch, welchNonInferiority } from '../stats/welch.js';
import { wilcoxonSignedRank } from '../stats/wilcoxon.js';
import { comparisonCautions, formatNumber } from './cautions.js';
import type { Comparison, Correction, Difference, DivergedPolicy } from './results.js';
import { adjustFamily, decideVerdict } from './verdict.js';

/** The settings a comparison reads (a `ResolvedOptions` has them all). */
export interface CompareSettings {
  readonly alpha: number;
  readonly level: number;
  readonly seed: number;
  readonly correction: Correction;
  readonly paired: boolean;
  readonly margin: number | null;
  readonly diverged: DivergedPolicy;
  readonly resamples: number;
  readonly bootstrapFrom: number;
}

/** One run's summary value as a comparison sees it. */
export interface ArmRun {
  readonly run: string;
  readonly seed: string;
  readonly value: number | null;
  readonly diverged: boolean;
}

export interface ComparisonRequest {
  readonly metric: string;
  /** Direction of the compared values (the summary's goal: `min` for reach:VALUE). */
  readonly goal: Goal;
  readonly goalInferred: boolean;
  readonly summary: string;
  /** The VALUE of a reach:VALUE summary, else null. */
  readonly reachValue: number | null;
  readonly task: string | null;
  readonly baseline: string;
  readonly candidate: string;
  readonly baselineRuns: readonly ArmRun[];
  readonly candidateRuns: readonly ArmRun[];
}

/** Memo of `minimumDetectableEffect` by seed counts (it only depends on n1, n2 and alpha). */
export type PowerCache = Map<string, number>;

interface Arm {
  readonly values: Float64Array;
  readonly seeds: readonly string[];
  readonly diverged: number;
  readonly noValue: number;
}

type Mutable<T> = { -readonly [K in keyof T]: T[K] };

interface Draft {
  readonly request: ComparisonRequest;
  readonly base: Arm;
  readonly cand: Arm;
  readonly tests: Mutable<Comparison['tests']>;
  readonly p: number | null;
  readonly difference: Difference;
  readonly effect: Comparison['effect'];
  readonly detectable: Comparison['detectable'];
  readonly nonInferiorityP: number | null;
  readonly reasons: readonly string[];
}

/**
 * Compare every pair of one family and decide the verdicts. Requests whose arm has no value at all
 * are not compared; each gives a 'few-seeds' problem instead. Problems from cautions are returned
 * beside the comparisons (not deduplicated). Cost per comparison: the permutation test (exact up to
 * 200,000 splits, else 100,000 relabelings) dominates, plus 10,000 bootstrap resamples at 20+ runs.
 * Example: `compareFamily([request], settings).comparisons[0].verdict`.
 */
export function compareFamily(
  requests: readonly ComparisonRequest[],
  settings: CompareSettings,
  cache: PowerCache = new Map(),
): { comparisons: Comparison[]; problems: Problem[] } {
  const problems: Problem[] = [];
  const drafts: Draft[] = [];
  for (const request of requests) {
    const draft = draftComparison(request, settings, cache);
    if (draft === null) {
      const where = `${request.metric} (${request.summary}${request.task === null ? '' : `, task ${request.task}`}), ${request.candidate} v ${request.baseline}`;
      problems.push(
        problem('few-seeds', `${where}: an arm has no run with a value (diverged, censored or missing); not compared`),
      );
    } else drafts.push(draft);
  }
  const adjusted = adjustFamily(
    drafts.map((d) => d.p),
    settings.correction,
  );
  const niAdjusted = adjustFamily(
    drafts.map((d) => d.nonInferiorityP),
    settings.correction,
  );
  const comparisons = drafts.map((d, i) => {
    const pAdjusted = adjusted[i] ?? null;
    const verdict = decideVerdict(pAdjusted, d.difference.estimate, d.request.goal, settings.alpha);
    const r = d.request;
    const cautions = comparisonCautions({
      metric: r.metric,
      summary: r.summary,
      task: r.task,
      baseline: r.baseline,
      candidate: r.candidate,
      goal: r.goal,
      goalInferred: r.goalInferred,
      reachValue: r.reachValue,
      baselineValues: d.base.values,
      candidateValues: d.cand.values,
      diverged: { baseline: d.base.diverged, candidate: d.cand.diverged },
      divergedPolicy: settings.diverged,
      noValue: { baseline: d.base.noValue, candidate: d.cand.noValue },
      alpha: settings.alpha,
      p: { welch: d.tests.welch.p, permutation: d.tests.permutation.p, mannWhitney: d.tests.mannWhitney.p },
      verdict,
      reasons: d.reasons,
    });
    problems.push(...cautions.problems);
    const niP = niAdjusted[i] ?? null;
    const comparison: Comparison = {
      metric: r.metric,
      goal: r.goal,
      summary: r.summary,
      task: r.task,
      baseline: r.baseline,
      candidate: r.candidate,
      n: { baseline: d.base.values.length, candidate: d.cand.values.length },
      mean: { baseline: meanOrNull(d.base.values), candidate: meanOrNull(d.cand.values) },
      sd: { baseline: sdOrNull(d.base.values), candidate: sdOrNull(d.cand.values) },
      diverged: { baseline: d.base.diverged, candidate: d.cand.diverged },
      difference: d.difference,
      tests: d.tests,
      p: d.p,
      pAdjusted,
      verdict,
      nonInferiority:
        settings.margin === null
          ? null
          : { margin: settings.margin, p: niP, holds: niP !== null && niP < settings.alpha },
      effect: d.effect,
      detectable: d.detectable,
      cautions: cautions.lines,
    };
    return comparison;
  });
  return { comparisons, problems };
}

function draftComparison(r: ComparisonRequest, s: CompareSettings, cache: PowerCache): Draft | null {
  const worst = s.diverged === 'worst' ? worstValue(r) : null;
  const base = armOf(r.baselineRuns, s.diverged, worst);
  const cand = armOf(r.candidateRuns, s.diverged, worst);
  if (base.values.length === 0 || cand.values.length === 0) return null;
  const reasons: string[] = [];
  const label = `${r.metric}|${r.baseline}|${r.candidate}${r.task === null ? '' : `|${r.task}`}`;
  const x = cand.values;
  const y = base.values;
  const nx = x.length;
  const ny = y.length;
  const few = nx < 2 || ny < 2;
  const flat = !few && variance(x) === 0 && variance(y) === 0;
  if (few) reasons.push(`no t-test, effect size or interval with fewer than 2 seeds in an arm (${nx} v ${ny})`);
  if (flat)
    reasons.push(
      "every run gave the same value within each arm (zero variance in both): Welch's t, Hedges' g and the t-interval are undefined",
    );

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

  let p = tests.welch.p;
  let difference: Difference;
  if (s.paired) {
    const paired = pairedArms(base, cand);
    const canPair = paired.x.length >= 2;
    if (!canPair)
      reasons.push(
        `--paired: only ${paired.x.length} seed${paired.x.length === 1 ? '' : 's'} present in both arms; the paired tests need 2`,
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
    p = tests.paired.p;
    const estimate = paired.x.length > 0 ? mean(paired.x) - mean(paired.y) : mean(x) - mean(y);
    difference =
      pt === null
        ? { estimate, low: null, high: null, level: s.level, method: 'none' }
        : { estimate: pt.difference, low: pt.low, high: pt.high, level: s.level, method: 't' };
  } else {
    difference = welchDifference(x, y, w, s, label, reasons);
  }

  let nonInferiorityP: number | null = null;
  if (s.margin !== null && !few && !flat) {
    const margin = s.margin;
    nonInferiorityP = finiteOrNull(
      attempt(() => welchNonInferiority(x, y, margin, r.goal), 'the non-inferiority test', reasons)?.p,
    );
  }
  return {
    request: r,
    base,
    cand,
    tests,
    p,
    difference,
    effect: effectOf(x, y, r.goal, s.level, few, flat, reasons),
    detectable: detectableOf(x, y, difference.estimate, s.alpha, cache),
    nonInferiorityP,
    reasons,
  };
}

/** Welch t-interval below `bootstrapFrom` runs per arm, BCa bootstrap at or above (never at 3 or fewer). */
function welchDifference(
  x: Float64Array,
  y: Float64Array,
  w: { difference: number; low: number; high: number } | null,
  s: CompareSettings,
  label: string,
  reasons: string[],
): Difference {
  const estimate = mean(x) - mean(y);
  const smaller = Math.min(x.length, y.length);
  if (smaller >= 2 && smaller <= 3) {
    reasons.push(
      `no resampling interval with ${smaller} seeds in an arm: a percentile bootstrap interval of ${smaller} values covers at most ${formatNumber(100 * (1 - 2 * 0.5 ** smaller))}% (METHODS.md); the interval shown is Welch's t`,
    );
  }
  if (smaller >= s.bootstrapFrom) {
    if (smaller > 3) {
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
      if (boot !== null && Number.isFinite(boot.low) && Number.isFinite(boot.high)) {
        return { estimate, low: boot.low, high: boot.high, level: s.level, method: 'bca' };
      }
    }
  }
  if (w === null) return { estimate, low: null, high: null, level: s.level, method: 'none' };
  return { estimate, low: w.low, high: w.high, level: s.level, method: 'welch-t' };
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
  const [better, worse] = goal === 'max' ? [x, y] : [y, x];
  const c = few ? null : attempt(() => cliffsDelta(better, worse, level), "Cliff's delta", reasons);
  return {
    hedgesG: finiteOrNull(g?.g),
    hedgesGLow: finiteOrNull(g?.low),
    hedgesGHigh: finiteOrNull(g?.high),
    probabilityOfImprovement: finiteOrNull(c?.probabilityOfImprovement),
    cliffsDelta: finiteOrNull(c?.delta),
    cliffsDeltaLow: finiteOrNull(c?.low),
    cliffsDeltaHigh: finiteOrNull(c?.high),
  };
}

/** Pooled sd, minimum detectable difference at 80% power, seeds per arm for the observed difference. */
function detectableOf(
  x: Float64Array,
  y: Float64Array,
  estimate: number,
  alpha: number,
  cache: PowerCache,
): Comparison['detectable'] {
  const df = x.length + y.length - 2;
  if (df < 1) return { sd: null, minimumEffect: null, seedsFor80: null };
  const ss = (x.length > 1 ? (x.length - 1) * variance(x) : 0) + (y.length > 1 ? (y.length - 1) * variance(y) : 0);
  const sd = Math.sqrt(ss / df);
  if (!(sd > 0)) return { sd, minimumEffect: null, seedsFor80: null };
  let minimumEffect: number | null = null;
  if (x.length >= 2 && y.length >= 2) {
    const key = `${x.length},${y.length},${alpha}`;
    let d = cache.get(key);
    if (d === undefined) {
      d = minimumDetectableEffect(x.length, y.length, alpha, 0.8);
      cache.set(key, d);
    }
    minimumEffect = Number.isFinite(d) ? d * sd : null;
  }
  const effect = Math.abs(estimate) / sd;
  let seeds = Infinity;
  try {
    if (effect > 0) seeds = seedsPerArm(effect, alpha, 0.8);
  } catch (error) {
    if (!(error instanceof RangeError)) throw error; // more than 2^40 seeds per arm: as good as never
  }
  return { sd, minimumEffect, seedsFor80: Number.isFinite(seeds) ? seeds : null };
}

function worstValue(r: ComparisonRequest): number | null {
  let worst: number | null = null;
  for (const run of [...r.baselineRuns, ...r.candidateRuns]) {
    if (run.diverged || run.value === null) continue;
    if (worst === null || (r.goal === 'max' ? run.value < worst : run.value > worst)) worst = run.value;
  }
  return worst;
}

function armOf(runs: readonly ArmRun[], policy: DivergedPolicy, worst: number | null): Arm {
  const values: number[] = [];
  const seeds: string[] = [];
  let diverged = 0;
  let noValue = 0;
  for (const run of runs) {
    if (run.diverged) {
      diverged++;
      if (policy === 'worst' && worst !== null) {
        values.push(worst);
        seeds.push(run.seed);
      }
    } else if (run.value === null) noValue++;
    else {
      values.push(run.value);
      seeds.push(run.seed);
    }
  }
  return { values: Float64Array.from(values), seeds, diverged, noValue };
}

/** Values of the seeds present in both arms, in the candidate's order: x candidate, y baseline. */
function pairedArms(base: Arm, cand: Arm): { x: Float64Array; y: Float64Array } {
  const bySeed = new Map<string, number>();
  base.seeds.forEach((seed, i) => bySeed.set(seed, base.values[i] as number));
  const x: number[] = [];
  const y: number[] = [];
  cand.seeds.forEach((seed, i) => {
    const b = bySeed.get(seed);
    if (b !== undefined) {
      x.push(cand.values[i] as number);
      y.push(b);
    }
  });
  return { x: Float64Array.from(x), y: Float64Array.from(y) };
}

/** Run a statistic; on a RangeError (input it cannot use) record why and give null. */
function attempt<T>(f: () => T, what: string, reasons: string[]): T | null {
  try {
    return f();
  } catch (error) {
    if (!(error instanceof RangeError)) throw error;
    reasons.push(`${what} could not run: ${error.message}`);
    return null;
  }
}

function finiteOrNull(v: number | null | undefined): number | null {
  return v === null || v === undefined || !Number.isFinite(v) ? null : v;
}

function meanOrNull(x: Float64Array): number | null {
  return x.length === 0 ? null : mean(x);
}

function sdOrNull(x: Float64Array): number | null {
  return x.length < 2 ? null : Math.sqrt(variance(x));
}
