/**
 * Write a digest: a `RunSet` saved exactly, as one Parquet file (ZSTD), so that the expensive part
 * of ingest (finding, parsing, sniffing and de-duplicating text logs) runs once, where the logs
 * live, and `report`/`scan` later read the digest instead (digestRead.ts).
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
 * Writing (measured, see README "Scaling out"): rows go through an appender into a staging table
 * of one row per series with list columns, and `COPY ... unnest(...)` writes the long table. That
 * staging cost about 0.25-0.3 s of CPU per million numbers; appending the long rows directly
 * (2,048 rows per native call) cost about 2.5x more, since each appended chunk has a fixed native
 * cost. DuckDB's Parquet writer (ZSTD) then takes about as long again.
 */
import { DOUBLE, DuckDBDataChunk, DuckDBListValue, INTEGER, LIST, UTINYINT, VARCHAR, type DuckDBAppender, type DuckDBValue, type DuckDBVector } from '@duckdb/node-api';
import type { Problem } from '../problems.js';
import { closeEngine, openEngine, sqlString } from './duckdb.js';
import type { FileRecord, IdentitySource, MetricInfo, RunSet, RunStatus } from './types.js';

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
  readonly metrics: readonly { readonly name: string; readonly points: number; readonly divergedAt: number | null; readonly missing: number }[];
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
 * Example: a RunSet of one run with `loss` at 3 steps gives `runs[0].metrics` `[{ name: 'loss', points: 3, ... }]` and `points: 3`.
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
    return { id: r.id, config: r.config, params: r.params, seed: r.seed, info: r.info, files: r.files, identity: r.identity, status: r.status, lastStep: r.lastStep, divergedAt: r.divergedAt, metrics, tickMetrics };
  });
  const tickDumps = runSet.tickDumps.map((d): DigestDump => {
    points += d.samples * d.ticks * (d.confidence === null ? 2 : 3);
    return { run: d.run, config: d.config, seed: d.seed, file: d.file, step: d.step, samples: d.samples, ticks: d.ticks, confidence: d.confidence !== null };
  });
  return { format: DIGEST_KEY, version: DIGEST_VERSION, mode: runSet.mode, keys: runSet.keys, runs, metrics: runSet.metrics, tickDumps, files: runSet.files, problems: runSet.problems, points };
}

/**
 * Parquet settings, measured on the benchmark digest (4.8 million values, 48 MB of CSV): ZSTD
 * level 6 gave 25 MB for the CPU of level 3 (33 MB); 9 saved 2% more for 40% more CPU. Row groups
 * of 1 Mi rows (DuckDB's default is 122,880) let ZSTD see long runs of similar numbers: 17 MB.
 */
const ZSTD_LEVEL = 6;
const ROW_GROUP_ROWS = 1 << 20;

const STAGE_COLUMNS = [UTINYINT, INTEGER, INTEGER, INTEGER, LIST(DOUBLE), LIST(DOUBLE), VARCHAR];
/** Staging rows per appended chunk, and numbers per chunk (bounds the memory of one chunk). */
const CHUNK_ROWS = 2048;
const CHUNK_NUMBERS = 1 << 20;

interface StageRow {
  readonly kind: number;
  readonly run: number;
  readonly item: number;
  readonly tick: number;
  readonly steps: Float64Array;
  readonly values: Float64Array;
  readonly text: string | null;
}

/** Appends staging rows in chunks of list columns (see the module comment). */
class Stage {
  private rows: StageRow[] = [];
  private numbers = 0;
  constructor(private readonly appender: DuckDBAppender) {}

  add(row: StageRow): void {
    this.rows.push(row);
    this.numbers += row.steps.length;
    if (this.rows.length >= CHUNK_ROWS || this.numbers >= CHUNK_NUMBERS) this.flush();
  }

  flush(): void {
    if (this.rows.length === 0) return;
    const chunk = DuckDBDataChunk.create(STAGE_COLUMNS, this.rows.length);
    const vectors = STAGE_COLUMNS.map((_, j) => chunk.getColumnVector(j));
    const set = (j: number, i: number, value: DuckDBValue): void => (vectors[j] as DuckDBVector).setItem(i, value);
    this.rows.forEach((row, i) => {
      set(0, i, row.kind);
      set(1, i, row.run);
      set(2, i, row.item);
      set(3, i, row.tick);
      // A list value takes a plain array; Array.from copies the doubles once (no per-number objects).
      set(4, i, new DuckDBListValue(Array.from(row.steps)));
      set(5, i, new DuckDBListValue(Array.from(row.values)));
      set(6, i, row.text);
    });
    for (const v of vectors) v.flush();
    this.appender.appendDataChunk(chunk);
    this.rows = [];
    this.numbers = 0;
  }
}

/** One array of a dump (sample-major, `samples x ticks`) as per-tick rows: sample index, value. */
function dumpRows(stage: Stage, kind: number, run: number, item: number, samples: number, ticks: number, cell: (k: number) => number): void {
  const index = new Float64Array(samples);
  for (let s = 0; s < samples; s++) index[s] = s;
  for (let t = 0; t < ticks; t++) {
    const values = new Float64Array(samples);
    for (let s = 0; s < samples; s++) values[s] = cell(s * ticks + t);
    stage.add({ kind, run, item, tick: t, steps: index, values, text: null });
  }
}

/**
 * Write `runSet` to `file` as a digest (see the module comment); `file` is overwritten when it
 * exists (the command line writes to a temporary name and renames). The RunSet is kept exactly:
 * `readDigest(file)` gives back a RunSet whose every field and number equals this one.
 * Cost: one DuckDB instance; about 16 bytes of staging per number plus DuckDB's Parquet writer;
 * the file holds about 3.5 bytes per point (step and value) on the benchmark, where noisy values
 * take nearly all of it and steps almost nothing.
 * Throws what DuckDB throws when the file cannot be written (a missing folder, no permission).
 * Example: `await writeDigest(await ingest(['runs'], options), 'shard-1.parquet')`.
 */
export async function writeDigest(runSet: RunSet, file: string): Promise<void> {
  const header = digestHeader(runSet);
  const engine = await openEngine();
  try {
    const { connection } = engine;
    await connection.run('CREATE TEMP TABLE digest_stage (kind UTINYINT, run INTEGER, item INTEGER, tick INTEGER, steps DOUBLE[], "values" DOUBLE[], text VARCHAR)');
    const appender = await connection.createAppender('digest_stage');
    const stage = new Stage(appender);
    const nan = Float64Array.of(NaN);
    stage.add({ kind: DIGEST_KIND.header, run: -1, item: -1, tick: 0, steps: nan, values: nan, text: JSON.stringify(header) });
    runSet.runs.forEach((r, i) => {
      Object.values(r.metrics).forEach((s, j) => stage.add({ kind: DIGEST_KIND.metric, run: i, item: j, tick: 0, steps: s.steps, values: s.values, text: null }));
    });
    runSet.runs.forEach((r, i) => {
      Object.values(r.tickMetrics).forEach((t, j) => {
        if (t.values.length === 0) stage.add({ kind: DIGEST_KIND.tick, run: i, item: j, tick: -1, steps: t.steps, values: new Float64Array(t.steps.length).fill(NaN), text: null });
        t.values.forEach((v, k) => stage.add({ kind: DIGEST_KIND.tick, run: i, item: j, tick: k, steps: t.steps, values: v, text: null }));
      });
    });
    const runIndex = new Map(runSet.runs.map((r, i) => [r.id, i]));
    runSet.tickDumps.forEach((d, j) => {
      const run = runIndex.get(d.run) ?? -1;
      dumpRows(stage, DIGEST_KIND.correct, run, j, d.samples, d.ticks, (k) => d.correct[k] as number);
      dumpRows(stage, DIGEST_KIND.certainty, run, j, d.samples, d.ticks, (k) => d.certainty[k] as number);
      const confidence = d.confidence;
      if (confidence !== null) dumpRows(stage, DIGEST_KIND.confidence, run, j, d.samples, d.ticks, (k) => confidence[k] as number);
    });
    stage.flush();
    appender.closeSync();
    await connection.run(
      `COPY (SELECT kind, run, item, tick, unnest(steps) AS step, unnest("values") AS value, text FROM digest_stage) TO ${sqlString(file)} (FORMAT parquet, COMPRESSION zstd, COMPRESSION_LEVEL ${ZSTD_LEVEL}, ROW_GROUP_SIZE ${ROW_GROUP_ROWS}, KV_METADATA {${sqlString(DIGEST_KEY)}: ${sqlString(String(DIGEST_VERSION))}})`,
    );
  } finally {
    closeEngine(engine);
  }
}
