/**
 * `Results`: the one hand-off between computation and rendering, and the `results.json` contract
 * (version 1). HTML, Markdown and JSON are three renderings of the same value. Numbers that do not
 * exist (an interval with one seed, a p-value that cannot be computed) are `null`, never NaN.
 * Keys never change meaning within version 1; new keys may be added.
 */
import type { Goal, GoalSource, IdentitySource, RunStatus } from '../ingest/types.js';
import type { Settings as OptionSettings } from './options.js';
import type { Problem } from '../problems.js';

export type Verdict = 'better' | 'worse' | 'inconclusive';
export type Correction = 'holm' | 'bh' | 'none';
/** What happens to failed runs (diverged, short): left out, or scored as the worst value of the comparison. */
export type FailedPolicy = 'exclude' | 'worst';
/** The family a correction runs over: one metric and summary over all tasks, or each task alone. */
export type FamilyScope = 'study' | 'task';
/** The headline interval: Welch's t at every n, or BCa bootstrap (from 4 runs per arm) by option. */
export type IntervalChoice = 'welch' | 'bca';
export type FailOn = 'worse' | 'not-better';
export type IntervalMethod = 'welch-t' | 't' | 'bca' | 'percentile' | 'expanded-percentile' | 'bootstrap-t' | 'none';
export type {
  Comparison,
  Difference,
  Family,
  FailureCounts,
  RunUse,
  TimeToEventArm,
  TimeToEventResult,
} from './comparisonTypes.js';
import type { Comparison } from './comparisonTypes.js';

/** A run summary: how one run's curve becomes one number (DESIGN.md `--summary`). */
export type SummarySpec =
  | { readonly kind: 'final' }
  | { readonly kind: 'last'; readonly percent: number }
  | { readonly kind: 'best' }
  | { readonly kind: 'auc' }
  | { readonly kind: 'reach'; readonly value: number }
  | { readonly kind: 'step'; readonly step: number };

/**
 * What ran, as the user gave it: one field per entry of the analysis options table that has a
 * `setting` (`analysisOptions.ts`), in table order, and `summaryDescription` (the summary in words,
 * for every rendering); the JSON schema's settings are checked against it.
 */
export type Settings = OptionSettings;

export interface RunRecord {
  readonly id: string;
  readonly config: string;
  readonly seed: string;
  readonly params: Readonly<Record<string, string>>;
  readonly info: Readonly<Record<string, string>>;
  readonly files: readonly string[];
  readonly identity: IdentitySource;
  readonly status: RunStatus;
  readonly lastStep: number;
  readonly divergedAt: number | null;
  /** Messages of the problems that name this run. */
  readonly problems: readonly string[];
}

export interface ConfigRecord {
  readonly id: string;
  readonly params: Readonly<Record<string, string>>;
  readonly seeds: readonly string[];
  readonly runs: number;
  readonly diverged: number;
  readonly short: number;
}

export interface MetricRecord {
  readonly name: string;
  /** Whether higher or lower is better; null when neither the user nor a name rule says (direction only). */
  readonly goal: Goal | null;
  readonly goalSource: GoalSource;
  readonly kind: 'scalar' | 'tick';
  readonly ticks: number;
  /** The step of this metric's comparisons when they all share one, else null (each comparison has its own `step`). */
  readonly horizon: number | null;
  readonly firstStep: number | null;
  readonly lastStep: number | null;
}

/** One run's summary value for one metric. `value` null when the run has none (censored, diverged, missing). */
export interface RunValue {
  readonly metric: string;
  readonly summary: string;
  readonly run: string;
  readonly config: string;
  readonly seed: string;
  readonly value: number | null;
  /**
   * The step the config's values are taken at: the last step all its non-failed runs reached (null for score tables).
   */
  readonly step: number | null;
  /** The step the value was logged at. */
  readonly loggedAt: number | null;
  /** Why there is no value, or how it was obtained (e.g. `diverged: counted as worst`). */
  readonly note: string | null;
  readonly usedInTests: boolean;
}

/** Mean across seeds of one config's per-run values, with its t-interval (BCa under `--interval bca`). */
export interface ConfigValue {
  readonly metric: string;
  readonly summary: string;
  readonly config: string;
  /** Runs with a value. */
  readonly n: number;
  /** Runs without a value (failed, missing). */
  readonly missing: number;
  readonly mean: number | null;
  readonly low: number | null;
  readonly high: number | null;
  readonly level: number;
  readonly method: IntervalMethod;
}

/** A learning curve of one config for one metric on the shared step grid. */
export interface Curve {
  readonly metric: string;
  readonly config: string;
  /** Bin centres (steps). */
  readonly steps: readonly number[];
  readonly mean: readonly (number | null)[];
  readonly low: readonly (number | null)[];
  readonly high: readonly (number | null)[];
  /** Runs contributing to each bin (no extrapolation past a run's last step). */
  readonly n: readonly number[];
  /** The band method of most bins (see `bandByBin`). */
  readonly band: IntervalMethod;
  /** Band method per bin: 't' (BCa under `--interval bca` from 4 runs), 'none' for fewer than 2 runs. */
  readonly bandByBin?: readonly IntervalMethod[];
  readonly level: number;
  /** Per-run binned values (for thin per-seed lines): run id → values per bin. */
  readonly runs: readonly {
    readonly run: string;
    readonly seed: string;
    readonly values: readonly (number | null)[];
  }[];
}

/** Aggregates across tasks (--task-key), Agarwal et al. 2021. */
export interface TaskAggregate {
  readonly metric: string;
  readonly config: string;
  readonly interquartileMean: number | null;
  readonly low: number | null;
  readonly high: number | null;
  readonly tasks: number;
  /** Average over tasks of P(config better than the baseline). Null for the baseline itself. */
  readonly probabilityOfImprovement: number | null;
  readonly baseline: string | null;
  /** Performance profile: fraction of task x run scores above each threshold. */
  readonly profile: { readonly thresholds: readonly number[]; readonly fraction: readonly number[] };
  /** How scores were put on one scale before aggregating (METHODS.md); absent in older results (raw scores). */
  readonly normalisation?: 'min-max per task';
  /** Tasks left out because some compared group has no score there. */
  readonly leftOut?: readonly string[];
}

/** Accuracy (or any per-tick metric) by tick for one config. */
export interface TickCurve {
  readonly metric: string;
  readonly config: string;
  readonly step: number | null;
  readonly ticks: readonly number[];
  readonly mean: readonly (number | null)[];
  readonly low: readonly (number | null)[];
  readonly high: readonly (number | null)[];
  readonly n: readonly number[];
  readonly band: IntervalMethod;
  /** Between-example half-width sqrt(p(1-p)/m) per tick when the number of evaluated examples m is known. */
  readonly exampleHalfWidth: readonly (number | null)[] | null;
  /** Earliest tick within the tolerance of the best tick, with its spread across seeds. */
  readonly earliestGood: {
    readonly tick: number;
    readonly low: number | null;
    readonly high: number | null;
    readonly tolerance: number;
  } | null;
  /** Per-tick comparison against the baseline config (Holm across ticks), null for the baseline. */
  readonly versusBaseline:
    | readonly {
        readonly tick: number;
        readonly difference: number | null;
        readonly pAdjusted: number | null;
        readonly verdict: Verdict;
      }[]
    | null;
  /**
   * Runs of this config left out because they diverged (status
   * `diverged`); `n` counts the runs used. Always set by `tickCurves`.
   */
  readonly diverged?: number;
}

export interface HaltingCurve {
  readonly config: string;
  readonly thresholds: readonly number[];
  /** Per threshold: mean across seeds of accuracy at exit, and interval. */
  readonly accuracy: readonly {
    readonly mean: number | null;
    readonly low: number | null;
    readonly high: number | null;
  }[];
  /** Per threshold: mean across seeds of the mean exit tick, and interval. */
  readonly exitTick: readonly {
    readonly mean: number | null;
    readonly low: number | null;
    readonly high: number | null;
  }[];
  readonly seeds: number;
  readonly samples: number;
  readonly ticks: number;
  /** Histogram of exit ticks at the reference threshold (counts summed over runs). */
  readonly exitHistogram: { readonly threshold: number; readonly counts: readonly number[] };
}

export interface CalibrationCurve {
  readonly config: string;
  readonly bins: number;
  /** Runs (one dump each, with a confidence column) behind the curve. Always set by `calibrationCurves`. */
  readonly seeds?: number;
  /** Expected calibration error per tick: mean across seeds and interval. */
  readonly ece: readonly {
    readonly tick: number;
    readonly mean: number | null;
    readonly low: number | null;
    readonly high: number | null;
  }[];
  /** Reliability diagram at the last tick: per bin, mean confidence, accuracy, count (summed over seeds). */
  readonly reliability: readonly {
    readonly low: number;
    readonly high: number;
    readonly confidence: number | null;
    readonly accuracy: number | null;
    readonly count: number;
  }[];
}

export interface Results {
  readonly format: 'seedsift-results';
  readonly version: 1;
  readonly tool: { readonly name: 'seedsift'; readonly version: string };
  /** ISO date of the report (from SOURCE_DATE_EPOCH when set). */
  readonly generated: string;
  readonly settings: Settings;
  readonly inputs: {
    readonly paths: readonly string[];
    readonly mode: 'logs' | 'scores';
    readonly files: number;
    readonly filesRead: number;
  };
  readonly configs: readonly ConfigRecord[];
  /** The metrics compared, in the order every output shows them (the primary metric first). */
  readonly metrics: readonly MetricRecord[];
  /** Numeric columns not compared because they look like bookkeeping (`column-set-aside` says how to include each). */
  readonly setAside: readonly { readonly name: string; readonly reason: 'name' | 'counter' | 'constant' }[];
  readonly runs: readonly RunRecord[];
  readonly values: readonly RunValue[];
  /** Per config and metric: mean of the per-run values with its interval. */
  readonly configValues: readonly ConfigValue[];
  readonly comparisons: readonly Comparison[];
  readonly curves: readonly Curve[];
  /**
   * Set in results.json only: curves written on a coarser grid
   * (every k-th bin, at most maxPoints), or the full grid (null).
   */
  readonly curveGrid?: { readonly maxPoints: number | null; readonly coarsened: boolean };
  readonly tasks: readonly TaskAggregate[];
  readonly ticks: readonly TickCurve[];
  readonly halting: readonly HaltingCurve[];
  readonly calibration: readonly CalibrationCurve[];
  readonly problems: readonly Problem[];
  /** Set in results.json only: problems grouped by code with their count and first three messages. */
  readonly problemCodes?: readonly {
    readonly code: string;
    readonly severity: string;
    readonly count: number;
    readonly examples: readonly string[];
  }[];
}
