/**
 * The comparison records of `Results` (part of the `results.json` contract, version 1; kept apart
 * from `results.ts` for length). Sign convention for every signed effect (the difference, Hedges'
 * g, Cliff's delta): candidate minus baseline, in the metric's own direction (a positive
 * difference means the candidate's value is higher, whatever the goal). Only "probability of
 * improvement" is goal-oriented, by its name.
 */
import type { Goal } from '../ingest/types.js';
import type { Correction, FamilyScope, IntervalMethod, Verdict } from './results.js';

/** A difference with its interval: candidate - baseline, in the metric's units (unadjusted, at `level`). */
export interface Difference {
  /** Null only for `reach:VALUE` when a Kaplan-Meier median steps-to-reach is undefined. */
  readonly estimate: number | null;
  readonly low: number | null;
  readonly high: number | null;
  /** 1 - alpha unless set: the interval is unadjusted for the family. */
  readonly level: number;
  readonly method: IntervalMethod;
  /** Simultaneous (Bonferroni) bounds at level 1 - alpha/m for the family of m comparisons. */
  readonly simultaneous: { readonly low: number; readonly high: number; readonly level: number } | null;
  /** BCa bootstrap interval beside the headline one, from `bootstrapFrom` runs per arm (never decides). */
  readonly bca: { readonly low: number; readonly high: number; readonly level: number } | null;
}

/** One run as one comparison used it. */
export interface RunUse {
  readonly run: string;
  readonly arm: 'baseline' | 'candidate';
  /** The value the tests saw (a failed run scored worst shows that value; null when left out). */
  readonly value: number | null;
  /** The step its own value was logged at (null for a failed run). */
  readonly loggedAt: number | null;
  readonly failed: 'diverged' | 'short' | null;
  readonly censored: boolean;
  /** Logged more than one typical logging interval before the comparison's step. */
  readonly stale: boolean;
}

/** Failures of each arm (diverged or short runs, all counted), and Fisher's exact test on the counts. */
export interface FailureCounts {
  readonly baseline: { readonly runs: number; readonly diverged: number; readonly short: number };
  readonly candidate: { readonly runs: number; readonly diverged: number; readonly short: number };
  /** Two-sided Fisher's exact p on failed v not failed by arm; null when no run failed. */
  readonly fisherP: number | null;
}

/** The family whose p-values were adjusted together. */
export interface Family {
  readonly scope: FamilyScope;
  readonly correction: Correction;
  /** Comparisons in the family (with a p-value). */
  readonly size: number;
}

/** One arm of a time-to-event comparison (`reach:VALUE`). */
export interface TimeToEventArm {
  readonly runs: number;
  readonly reached: number;
  /** Kaplan-Meier fraction reached by the comparison's step (1 - S at the last time). */
  readonly fraction: number | null;
  /** Kaplan-Meier median steps to reach, null when fewer than half reach. */
  readonly medianSteps: number | null;
}

export interface TimeToEventResult {
  readonly baseline: TimeToEventArm;
  readonly candidate: TimeToEventArm;
  /** The log-rank test (chi-square, 1 df) and its exact permutation p at small n. */
  readonly logRank: {
    readonly statistic: number | null;
    readonly p: number | null;
    /** Candidate's observed and expected events (more observed than expected: it reaches sooner). */
    readonly observed: number | null;
    readonly expected: number | null;
    /** Whether `p` is the exact permutation p (every relabeling), else the chi-square or random relabelings. */
    readonly method: 'exact-permutation' | 'random-permutation' | 'chi-square';
  };
}

export interface Comparison {
  readonly metric: string;
  readonly goal: Goal;
  readonly summary: string;
  /** Task value when --task-key is used, else null. */
  readonly task: string | null;
  readonly baseline: string;
  readonly candidate: string;
  /** The step this comparison is made at (null for score tables). */
  readonly step: number | null;
  readonly n: { readonly baseline: number; readonly candidate: number };
  /** Null for `reach:VALUE` (see `timeToEvent`). */
  readonly mean: { readonly baseline: number | null; readonly candidate: number | null };
  readonly sd: { readonly baseline: number | null; readonly candidate: number | null };
  /** Diverged runs in each arm (excluded, or counted as worst under --failed worst). */
  readonly diverged: { readonly baseline: number; readonly candidate: number };
  readonly failures: FailureCounts;
  readonly difference: Difference;
  readonly tests: {
    readonly welch: { readonly statistic: number | null; readonly df: number | null; readonly p: number | null };
    readonly permutation: { readonly p: number | null; readonly exact: boolean };
    readonly mannWhitney: { readonly u: number | null; readonly p: number | null; readonly exact: boolean };
    /** Under --paired: paired t and Wilcoxon signed-rank on seeds present in both arms. */
    readonly paired?: {
      readonly t: number | null;
      readonly df: number | null;
      readonly p: number | null;
      readonly wilcoxonP: number | null;
      readonly pairs: number;
    };
  };
  /** The test whose p decides: Welch, paired t, the exact permutation test (zero spread) or log-rank (reach). */
  readonly primary: 'welch' | 'paired-t' | 'permutation' | 'log-rank';
  /** The primary test's p and its adjusted value. */
  readonly p: number | null;
  readonly pAdjusted: number | null;
  readonly family: Family;
  readonly verdict: Verdict;
  /**
   * Under --margin: one-sided test at alpha/2 that the candidate is not worse by more than the margin;
   * `test` is Welch's t, or the paired t on the seeds in both arms under --paired.
   */
  readonly nonInferiority: {
    readonly margin: number;
    readonly test: 'welch' | 'paired-t';
    readonly p: number | null;
    readonly holds: boolean;
  } | null;
  readonly effect: {
    /** Hedges' g of candidate minus baseline (metric's own direction). */
    readonly hedgesG: number | null;
    readonly hedgesGLow: number | null;
    readonly hedgesGHigh: number | null;
    /** P(candidate better than baseline) + ties/2, in the goal's direction. */
    readonly probabilityOfImprovement: number | null;
    /** Cliff's delta of candidate minus baseline: P(cand > base) - P(cand < base), metric's own direction. */
    readonly cliffsDelta: number | null;
    readonly cliffsDeltaLow: number | null;
    readonly cliffsDeltaHigh: number | null;
  };
  /** `reach:VALUE` only: Kaplan-Meier summaries and the log-rank test. */
  readonly timeToEvent: TimeToEventResult | null;
  readonly detectable: {
    /** Between-seed standard deviation pooled within the two configs. */
    readonly sd: number | null;
    /** Smallest difference detectable with 80% power at the current seed counts and alpha (metric units). */
    readonly minimumEffect: number | null;
  };
  /** Every run of both arms as this comparison used it. */
  readonly runs: readonly RunUse[];
  /** Plain-language caution lines (few seeds, skew, tests disagree, unequal seeds, inferred goal, ...). */
  readonly cautions: readonly string[];
  /** The kind of each caution line, index for index: what a report groups them by. */
  readonly cautionKinds: readonly CautionKind[];
}

/**
 * What a caution is about, so that a report can group the same concern over many comparisons:
 * - `reach-summary`: the summary is steps-to-reach, runs censored (log-rank);
 * - `goal-guessed`: higher or lower is better was inferred from the metric's name;
 * - `few-seeds`: too few seeds for a rank or permutation test to reach alpha, or under 4 in an arm;
 * - `skewed`: values skewed within the arms beyond twice the standard error of skewness;
 * - `unequal-seeds`: the arms have different numbers of seeds;
 * - `failed-runs`: diverged or short runs, with their handling and Fisher's test;
 * - `zero-spread`: no spread in either arm, the exact permutation test decided;
 * - `no-value`: runs without a value for this summary;
 * - `not-run`: a test or interval that could not be computed, and why;
 * - `tests-disagree`: the tests disagree about significance at alpha;
 * - `fragile`: a `better` resting on fewer than 5 seeds per arm.
 */
export type CautionKind =
  | 'reach-summary'
  | 'goal-guessed'
  | 'few-seeds'
  | 'skewed'
  | 'unequal-seeds'
  | 'failed-runs'
  | 'zero-spread'
  | 'no-value'
  | 'not-run'
  | 'tests-disagree'
  | 'fragile';
