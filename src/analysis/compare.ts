/**
 * Comparisons between two configurations on per-run summary values (METHODS.md, "Defaults"), for
 * every pair of one metric and summary, over all tasks.
 *
 * 1. arms       each pair's runs at its own step (`runValues.ts`), failures counted and left out
 *               or scored worst (`arms.ts`), Fisher's exact test on the failure counts
 * 2. statistics per pair: Welch (or paired t, or the permutation test at zero spread) with its
 *               checks, intervals and effects (`twoSample.ts`); for `reach:VALUE` the log-rank
 *               test with Kaplan-Meier summaries (`timeToEventDraft.ts`)
 * 3. family     p-values adjusted across the family (`--family study`: every comparison of the
 *               metric and summary over all tasks; `task`: each task alone), Holm by default; the
 *               simultaneous (Bonferroni) bounds at 1 - alpha/m for the family's size m
 * 4. verdict    better / worse / inconclusive (`verdict.ts`), and the caution lines (`cautions.ts`)
 *
 * A pair whose arm has no run with a value is not compared (a 'few-seeds' problem says so).
 * Nothing here throws on data.
 */
import type { Goal } from '../ingest/types.js';
import { problem, type Problem } from '../problems.js';
import { mean, variance } from '../stats/moments.js';
import { type Arm, buildArms } from './arms.js';
import { comparisonCautions } from './cautions.js';
import type { Comparison } from './comparisonTypes.js';
import type { Correction, FailedPolicy, FamilyScope } from './results.js';
import type { RunOutcome } from './runValues.js';
import { timeToEventDraft, type TimeToEventDraft } from './timeToEventDraft.js';
import {
  simultaneousBounds,
  twoSampleDraft,
  type PowerCache,
  type TwoSampleDraft,
  type TwoSampleSettings,
} from './twoSample.js';
import { adjustFamily, decideVerdict } from './verdict.js';

export type { PowerCache } from './twoSample.js';

/** The settings a comparison reads (a `ResolvedOptions` has them all). */
export interface CompareSettings extends TwoSampleSettings {
  readonly correction: Correction;
  readonly family: FamilyScope;
  readonly failed: FailedPolicy;
}

export interface ComparisonRequest {
  readonly metric: string;
  /** Direction of the compared values (the summary's goal: `min` for reach:VALUE). */
  readonly goal: Goal;
  readonly goalInferred: boolean;
  readonly summary: string;
  /** The VALUE of a reach:VALUE summary (a time-to-event comparison), else null. */
  readonly reachValue: number | null;
  readonly task: string | null;
  readonly baseline: string;
  readonly candidate: string;
  /** The comparison's step (null for score tables). */
  readonly step: number | null;
  readonly baselineRuns: readonly RunOutcome[];
  readonly candidateRuns: readonly RunOutcome[];
}

interface Draft {
  readonly request: ComparisonRequest;
  readonly base: Arm;
  readonly cand: Arm;
  readonly arms: ReturnType<typeof buildArms>;
  readonly values: TwoSampleDraft | null;
  readonly time: TimeToEventDraft | null;
  readonly p: number | null;
}

/**
 * Compare every pair of one metric and summary (all tasks) and decide the verdicts.
 * Cost per comparison: the permutation test (exact up to 200,000 splits, else 100,000
 * relabelings) dominates, plus 10,000 bootstrap resamples from 10 runs per arm.
 * Example: `compareMetric([request], settings).comparisons[0].verdict`.
 */
export function compareMetric(
  requests: readonly ComparisonRequest[],
  settings: CompareSettings,
  cache: PowerCache = new Map(),
): { comparisons: Comparison[]; problems: Problem[] } {
  const problems: Problem[] = [];
  const drafts: Draft[] = [];
  for (const request of requests) {
    const draft = draftComparison(request, settings, cache);
    if (draft === null) {
      problems.push(
        problem('few-seeds', `${where(request)}: an arm has no run with a value (failed or missing); not compared`),
      );
    } else drafts.push(draft);
  }
  const familyOf = (d: Draft): string => (settings.family === 'task' ? JSON.stringify(d.request.task) : '');
  const families = new Map<string, number[]>();
  drafts.forEach((d, i) => {
    families.set(familyOf(d), [...(families.get(familyOf(d)) ?? []), i]);
  });
  const pAdjusted: (number | null)[] = drafts.map(() => null);
  const niAdjusted: (number | null)[] = drafts.map(() => null);
  const size: number[] = drafts.map(() => 0);
  for (const members of families.values()) {
    const adjusted = adjustFamily(
      members.map((i) => (drafts[i] as Draft).p),
      settings.correction,
    );
    const ni = adjustFamily(
      members.map((i) => (drafts[i] as Draft).values?.nonInferiorityP ?? null),
      settings.correction,
    );
    const m = members.filter((i) => (drafts[i] as Draft).p !== null).length;
    members.forEach((i, k) => {
      pAdjusted[i] = adjusted[k] ?? null;
      niAdjusted[i] = ni[k] ?? null;
      size[i] = m;
    });
  }
  const comparisons = drafts.map((d, i) => {
    const out = finish(d, pAdjusted[i] ?? null, niAdjusted[i] ?? null, size[i] ?? 0, settings);
    problems.push(...out.problems);
    return out.comparison;
  });
  return { comparisons, problems };
}

function where(r: ComparisonRequest): string {
  return `${r.metric} (${r.summary}${r.task === null ? '' : `, task ${r.task}`}), ${r.candidate} v ${r.baseline}`;
}

function draftComparison(r: ComparisonRequest, s: CompareSettings, cache: PowerCache): Draft | null {
  const timeToEvent = r.reachValue !== null;
  const arms = buildArms(r.baselineRuns, r.candidateRuns, r.goal, s.failed, timeToEvent, r.step);
  const { base, cand } = arms;
  if (base.values.length === 0 || cand.values.length === 0) return null;
  const label = `${r.metric}|${r.baseline}|${r.candidate}${r.task === null ? '' : `|${r.task}`}`;
  if (timeToEvent) {
    const time = timeToEventDraft(base, cand, label, s.seed, s.level);
    return { request: r, base, cand, arms, values: null, time, p: time.p };
  }
  const values = twoSampleDraft(base, cand, r.goal, label, s, cache);
  return { request: r, base, cand, arms, values, time: null, p: values.p };
}

function finish(
  d: Draft,
  pAdjusted: number | null,
  niP: number | null,
  size: number,
  s: CompareSettings,
): { comparison: Comparison; problems: Problem[] } {
  const r = d.request;
  const v = d.values;
  const direction = v?.direction ?? d.time?.direction ?? 0;
  const verdict = decideVerdict(pAdjusted, direction, r.goal, s.alpha);
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
    failures: d.arms.failures,
    failedPolicy: s.failed,
    noValue: { baseline: d.base.noValue, candidate: d.cand.noValue },
    alpha: s.alpha,
    p:
      v === null
        ? { welch: null, permutation: null, mannWhitney: null }
        : { welch: v.tests.welch.p, permutation: v.tests.permutation.p, mannWhitney: v.tests.mannWhitney.p },
    zeroSpread: v?.zeroSpread ?? false,
    verdict,
    reasons: v?.reasons ?? d.time?.reasons ?? [],
  });
  const difference =
    v === null
      ? (d.time as TimeToEventDraft).difference
      : { ...v.difference, simultaneous: simultaneousBounds(v, s.alpha, size) };
  const timeToEvent = v === null;
  const comparison: Comparison = {
    metric: r.metric,
    goal: r.goal,
    summary: r.summary,
    task: r.task,
    baseline: r.baseline,
    candidate: r.candidate,
    step: r.step,
    n: { baseline: d.base.values.length, candidate: d.cand.values.length },
    mean: timeToEvent
      ? { baseline: null, candidate: null }
      : { baseline: mean(d.base.values), candidate: mean(d.cand.values) },
    sd: timeToEvent
      ? { baseline: null, candidate: null }
      : { baseline: sdOrNull(d.base.values), candidate: sdOrNull(d.cand.values) },
    diverged: { baseline: d.base.diverged, candidate: d.cand.diverged },
    failures: d.arms.failures,
    difference,
    tests: v?.tests ?? {
      welch: { statistic: null, df: null, p: null },
      permutation: { p: null, exact: false },
      mannWhitney: { u: null, p: null, exact: false },
    },
    primary: v?.primary ?? 'log-rank',
    p: d.p,
    pAdjusted,
    family: { scope: s.family, correction: s.correction, size },
    verdict,
    nonInferiority:
      s.margin === null || v === null
        ? null
        : {
            margin: s.margin,
            test: v.pairedBounds ? 'paired-t' : 'welch',
            p: niP,
            holds: niP !== null && niP < s.alpha / 2,
          },
    effect: v?.effect ?? {
      hedgesG: null,
      hedgesGLow: null,
      hedgesGHigh: null,
      probabilityOfImprovement: null,
      cliffsDelta: null,
      cliffsDeltaLow: null,
      cliffsDeltaHigh: null,
    },
    timeToEvent: d.time?.result ?? null,
    detectable: v?.detectable ?? { sd: null, minimumEffect: null },
    runs: d.arms.uses,
    cautions: cautions.lines,
    cautionKinds: cautions.kinds,
  };
  return { comparison, problems: cautions.problems };
}

function sdOrNull(x: Float64Array): number | null {
  return x.length < 2 ? null : Math.sqrt(variance(x));
}
