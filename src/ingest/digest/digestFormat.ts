/**
 * The digest format (written by writeDigest.ts, read by readDigest.ts): a `RunSet` saved exactly
 * as one Parquet file.
 *
 * The file is one long table, one number per row:
 *
 *   kind  UTINYINT  0 header, 1 metric point, 2 tick-metric point, 3/4/5 tick-dump correct/certainty/confidence
 *   run   INTEGER   index into the header's runs (-1 for the header, or for a dump whose run has no log)
 *   item  INTEGER   metric / tick metric index within the run; dump index for kinds 3-5; -1 for the header
 *   tick  INTEGER   tick k (kind 2; -1 for the steps of a tick metric with no ticks), tick t (kinds 3-5), else 0
 *   step  DOUBLE    the step (kinds 1, 2); the sample index (kinds 3-5)
 *   value DOUBLE    the number (NaN where a tick cell is missing)
 *   text  VARCHAR   the header as JSON (kind 0), NULL otherwise
 *
 * Rows are in the header's order: every run's metrics, then every run's tick metrics (tick by
 * tick), then the dumps (tick by tick, sample by sample). The header (`DigestHeader`) holds
 * everything that is not a long array: mode, keys, run identity and status, per-series point
 * counts, divergence and missing counts, metric infos, dump shapes, file records and problems.
 * Numbers in the table are DOUBLEs (exact); numbers in the JSON header are finite doubles, which
 * JSON writes in the shortest form that reads back to the same double.
 *
 * The Parquet key-value metadata carries the marker `seedsift-digest` = `1` (the format version);
 * an ordinary Parquet log has no such key and is read as a log.
 *
 */
import type { Problem } from '../../problems.js';
import type { FileRecord, IdentitySource, MetricInfo, RunSet, RunStatus } from '../types.js';

/** The Parquet key-value metadata key that marks a digest; its value is the format version. */
export const DIGEST_KEY = 'seedsift-digest';
/** The digest format version this seedsift writes and reads. */
export const DIGEST_VERSION = 1;

/** Row kinds of the long table (see the module comment). */
export const DIGEST_KIND = { header: 0, metric: 1, tick: 2, correct: 3, certainty: 4, confidence: 5 } as const;

/** A run in the header: its identity and status, and the shape of its series. */
export interface DigestRun {
  readonly id: string;
  readonly config: string;
  readonly params: Readonly<Record<string, string>>;
  readonly seed: string;
  readonly info: Readonly<Record<string, string>>;
  readonly files: readonly string[];
  readonly identity: IdentitySource;
  readonly status: RunStatus;
  readonly lastStep: number;
  readonly divergedAt: number | null;
  /** Scalar metrics in the run's key order: name, number of points, divergence, missing cells. */
  readonly metrics: readonly {
    readonly name: string;
    readonly points: number;
    readonly divergedAt: number | null;
    readonly missing: number;
  }[];
  /** Tick metrics in the run's key order: name, number of steps, number of ticks. */
  readonly tickMetrics: readonly { readonly name: string; readonly steps: number; readonly ticks: number }[];
}

/** A tick dump in the header: everything but its arrays. */
export interface DigestDump {
  readonly run: string;
  readonly config: string;
  readonly seed: string;
  readonly file: string;
  readonly step: number | null;
  readonly samples: number;
  readonly ticks: number;
  readonly confidence: boolean;
}

/** The JSON header of a digest (row kind 0). */
export interface DigestHeader {
  readonly format: typeof DIGEST_KEY;
  readonly version: typeof DIGEST_VERSION;
  readonly mode: RunSet['mode'];
  readonly keys: readonly string[];
  readonly runs: readonly DigestRun[];
  readonly metrics: readonly MetricInfo[];
  readonly tickDumps: readonly DigestDump[];
  readonly files: readonly FileRecord[];
  readonly problems: readonly Problem[];
  /** Rows of kinds 1-5 (a check on reading). */
  readonly points: number;
}

/**
 * The header of a digest of `runSet`: everything but the long arrays, and how many rows of numbers
 * follow (see the module comment). Pure, O(runs + metrics + dumps + problems); never throws.
 * Example: a RunSet of one run with `loss` at 3 steps gives `runs[0].metrics`
 * `[{ name: 'loss', points: 3, ... }]` and `points: 3`.
 */
export function digestHeader(runSet: RunSet): DigestHeader {
  let points = 0;
  const runs = runSet.runs.map((r): DigestRun => {
    const metrics = Object.entries(r.metrics).map(([name, s]) => {
      points += s.steps.length;
      return { name, points: s.steps.length, divergedAt: s.divergedAt, missing: s.missing };
    });
    const tickMetrics = Object.entries(r.tickMetrics).map(([name, t]) => {
      points += t.steps.length * Math.max(1, t.values.length);
      return { name, steps: t.steps.length, ticks: t.values.length };
    });
    return {
      id: r.id,
      config: r.config,
      params: r.params,
      seed: r.seed,
      info: r.info,
      files: r.files,
      identity: r.identity,
      status: r.status,
      lastStep: r.lastStep,
      divergedAt: r.divergedAt,
      metrics,
      tickMetrics,
    };
  });
  const tickDumps = runSet.tickDumps.map((d): DigestDump => {
    points += d.samples * d.ticks * (d.confidence === null ? 2 : 3);
    return {
      run: d.run,
      config: d.config,
      seed: d.seed,
      file: d.file,
      step: d.step,
      samples: d.samples,
      ticks: d.ticks,
      confidence: d.confidence !== null,
    };
  });
  return {
    format: DIGEST_KEY,
    version: DIGEST_VERSION,
    mode: runSet.mode,
    keys: runSet.keys,
    runs,
    metrics: runSet.metrics,
    tickDumps,
    files: runSet.files,
    problems: runSet.problems,
    points,
  };
}

/**
 * Rows per Parquet row group of a digest (1 Mi rows, see writeDigest.ts); the reader reads this many rows per query.
 */
export const ROW_GROUP_ROWS = 1 << 20;
