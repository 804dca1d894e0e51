/**
 * The records that ingest hands to analysis. Numbers live in typed arrays, never in per-row
 * objects: a run's metric is two parallel Float64Arrays (steps, values), sorted by step, one value
 * per step, missing cells already removed (and counted in problems).
 */
import type { Problem } from '../problems.js';
import type { ReadingMode } from './readingMode.js';

export type Goal = 'max' | 'min';
export type GoalSource = 'option' | 'inferred' | 'unknown';
export type FileFormat = 'csv' | 'tsv' | 'txt' | 'parquet';

/** Where a run's identity (config and seed) came from. */
export type IdentitySource = 'hive' | 'layout' | 'manifest' | 'seed-column' | 'seed-columns' | 'scores' | 'none';

/**
 * One file to read, with what its location says about it (the output of `locate`).
 * `seed` is null when the seed comes from inside the file (--seed-column, --seed-columns).
 */
export interface RunSource {
  /** Path as seedsift will open it (relative to the working directory when the user gave a relative path). */
  readonly file: string;
  /** Path relative to the root PATH given on the command line (what --layout is matched against). */
  readonly relPath: string;
  readonly format: FileFormat;
  readonly gzip: boolean;
  /** Config parameters (key order as found). Never contains `seed` or `_`-prefixed fields. */
  readonly params: Readonly<Record<string, string>>;
  /** Information fields (`_`-prefixed layout fields), kept but not part of the config. */
  readonly info: Readonly<Record<string, string>>;
  readonly seed: string | null;
  readonly identity: IdentitySource;
}

/** One metric of one run: parallel arrays sorted by step, finite values only. */
export interface Series {
  readonly steps: Float64Array;
  readonly values: Float64Array;
  /** Step at which the metric went non-finite and stayed so (divergence), else null. */
  readonly divergedAt: number | null;
  /** Number of cells that were missing (empty, nan, inf, not a number) for this metric. */
  readonly missing: number;
}

/**
 * A per-tick metric of one run: `values[k]` is the series of tick k (k = 0..ticks-1), all on the
 * same `steps` (NaN where a tick's cell was missing at that step).
 */
export interface TickSeries {
  readonly steps: Float64Array;
  readonly values: readonly Float64Array[];
}

export type RunStatus = 'ok' | 'diverged' | 'short' | 'rejected';

/** One training run: one config, one seed. */
export interface Run {
  /** Stable id: the config then the seed, e.g. `ticks=8,memory=4,seed=3`. */
  readonly id: string;
  /** Config id: `key=value` pairs joined by commas in the key order of `RunSet.keys`. */
  readonly config: string;
  readonly params: Readonly<Record<string, string>>;
  readonly seed: string;
  readonly info: Readonly<Record<string, string>>;
  readonly files: readonly string[];
  readonly identity: IdentitySource;
  /** Scalar metrics by name. For a score table each series has one point at step 0. */
  readonly metrics: Readonly<Record<string, Series>>;
  /** Per-tick metrics by base name (`val_acc@3` → `val_acc`, tick 3). */
  readonly tickMetrics: Readonly<Record<string, TickSeries>>;
  readonly status: RunStatus;
  /** Largest step with any finite metric value (0 for score tables). */
  readonly lastStep: number;
  /** First step at which some metric diverged, else null. */
  readonly divergedAt: number | null;
}

/**
 * A per-sample tick dump of one run at one checkpoint: samples x ticks, sample-major
 * (`correct[s * ticks + t]`). Columns: sample, tick, correct, certainty, optional confidence, step;
 * or per-class probability columns from which certainty and confidence are computed.
 */
export interface TickDump {
  readonly run: string;
  readonly config: string;
  readonly seed: string;
  readonly file: string;
  readonly step: number | null;
  readonly samples: number;
  readonly ticks: number;
  /** 1 correct, 0 wrong. */
  readonly correct: Uint8Array;
  /** Normalised certainty 1 - H(p)/ln(C), in [0, 1]. */
  readonly certainty: Float64Array;
  /** Top-class probability, when known. */
  readonly confidence: Float64Array | null;
}

export interface MetricInfo {
  readonly name: string;
  /** Whether higher or lower is better; null when neither the user nor a name rule says. */
  readonly goal: Goal | null;
  /** `option` when given by --metric, `inferred` from a name rule, `unknown` when no rule knows the name. */
  readonly goalSource: GoalSource;
  /**
   * Its name marks a bookkeeping column (wall time, epoch, ...: `bookkeepingName` in plan/goals.ts);
   * analysis sets it aside.
   */
  readonly bookkeeping: boolean;
  /** Scalar metric, or a per-tick metric (name without the `@k`). */
  readonly kind: 'scalar' | 'tick';
  /** Number of ticks for a tick metric, else 0. */
  readonly ticks: number;
}

export interface FileRecord {
  readonly file: string;
  readonly status: 'read' | 'skipped' | 'unreadable';
  /** Data rows read (after rejects), 0 when not read. */
  readonly rows: number;
  readonly rejectedRows: number;
  readonly runs: readonly string[];
  readonly kind: 'log' | 'tick-dump' | 'scores' | 'unknown';
}

/** Everything read from the inputs. */
export interface RunSet {
  readonly mode: 'logs' | 'scores';
  /** Config keys in display order (first seen), without `seed`. */
  readonly keys: readonly string[];
  readonly runs: readonly Run[];
  readonly metrics: readonly MetricInfo[];
  readonly tickDumps: readonly TickDump[];
  readonly files: readonly FileRecord[];
  readonly problems: readonly Problem[];
}

/** Ingest options, resolved once at the edge (every field set). */
export interface IngestOptions {
  /** How runs are named: from paths, a seed column, per-seed columns, a manifest, a score table. */
  readonly mode: ReadingMode;
  /** `--step`: the step column's name; null to take the first of the usual names. */
  readonly step: string | null;
  /** `--columns`: the column names of headerless files. */
  readonly columns: readonly string[] | null;
  readonly metricGoals: Readonly<Record<string, Goal>>;
}
