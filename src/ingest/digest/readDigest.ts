/**
 * Read digests (the Parquet files `seedsift digest` writes; the format is in digest/writeDigest.ts):
 * recognise them among the Parquet files found under the PATHs by the marker in their key-value
 * metadata, and turn one back into the exact `RunSet` it was written from.
 *
 * The RunSet read back lists the digest's own file first among its file records (status `read`,
 * kind `log`, its runs), then the records of the raw files the digest was made from. File names
 * inside a digest (run files, file records, problems) are as they were where it was made.
 */
import type { DuckDBBlobValue } from '@duckdb/node-api';
import { SeedsiftError } from '../../problems.js';
import { releaseResults, resultColumns, sqlPath, sqlString, type Engine } from '../load/duckdb.js';
import { DIGEST_KEY, DIGEST_KIND, DIGEST_VERSION, ROW_GROUP_ROWS, type DigestHeader } from './digestFormat.js';
import type { FileRecord, Run, RunSet, Series, TickDump, TickSeries } from '../types.js';

const blobText = (value: unknown): string => Buffer.from((value as DuckDBBlobValue).bytes).toString('utf8');

/** Marker values by file, for the files among `files` that have the marker (one query for all). */
async function markers(engine: Engine, files: readonly string[]): Promise<Map<string, string>> {
  const list = `[${files.map(sqlPath).join(', ')}]`;
  const result = await engine.connection.runAndReadAll(
    `SELECT file_name, value FROM parquet_kv_metadata(${list}) WHERE key = encode(${sqlString(DIGEST_KEY)})`,
  );
  return new Map(result.getRows().map((row) => [String(row[0]), blobText(row[1])]));
}

/**
 * Which of `files` (Parquet files) are digests: their names, with the marker's value (the format
 * version, `'1'` for this format). A file whose metadata cannot be read is taken as not a digest
 * (the log reader then reports it as unreadable). Cost: one metadata query over all files (file
 * by file when one of them cannot be read); reads only the Parquet footers.
 * Example: `await findDigests(engine, ['a.parquet', 'log.parquet'])` is `Map { 'a.parquet' => '1' }`.
 */
export async function findDigests(engine: Engine, files: readonly string[]): Promise<Map<string, string>> {
  if (files.length === 0) return new Map();
  try {
    return await markers(engine, files);
  } catch {
    const found = new Map<string, string>();
    for (const file of files) {
      try {
        for (const [name, value] of await markers(engine, [file])) found.set(name, value);
      } catch {
        // Not a readable Parquet file: not a digest.
      }
    }
    return found;
  }
}

const bad = (file: string, what: string): SeedsiftError =>
  new SeedsiftError('input', `${file}: not a usable seedsift digest: ${what}`, { file });

/** The header of a digest, checked against the marker and the format version. */
async function readHeader(engine: Engine, file: string): Promise<DigestHeader> {
  let marker: string | undefined;
  try {
    marker = (await markers(engine, [file])).get(file);
  } catch (error) {
    throw bad(file, `cannot read it as Parquet (${(error as Error).message})`);
  }
  if (marker === undefined)
    throw bad(
      file,
      `expected the key ${DIGEST_KEY} in its Parquet metadata, got none (it is an ordinary Parquet file, which ` +
        `seedsift reads as a log)`,
    );
  if (marker !== String(DIGEST_VERSION))
    throw bad(
      file,
      `expected format version ${DIGEST_VERSION}, got ${JSON.stringify(marker)} ` +
        '(make the digest again with this seedsift)',
    );
  let header: DigestHeader;
  try {
    const rows = (
      await engine.connection.runAndReadAll(
        `SELECT text FROM read_parquet(${sqlPath(file)}, hive_partitioning = false) WHERE kind = ${DIGEST_KIND.header}`,
      )
    ).getRows();
    if (rows.length !== 1) throw new Error(`expected one header row, got ${rows.length}`);
    header = JSON.parse(String(rows[0]?.[0])) as DigestHeader;
  } catch (error) {
    throw bad(file, `its header cannot be read (${(error as Error).message})`);
  }
  const arrays = ['keys', 'runs', 'metrics', 'tickDumps', 'files', 'problems'] as const;
  if (
    header === null ||
    typeof header !== 'object' ||
    header.format !== DIGEST_KEY ||
    header.version !== DIGEST_VERSION ||
    arrays.some((k) => !Array.isArray(header[k])) ||
    typeof header.points !== 'number'
  ) {
    throw bad(
      file,
      `expected a ${DIGEST_KEY} version ${DIGEST_VERSION} header, got ${JSON.stringify(header).slice(0, 80)}`,
    );
  }
  return header;
}

/**
 * Cuts the long columns into series, in the order they were written. Values are views into the
 * one values column; steps are copied out, and a run's series with the same steps share one copy
 * (as a run's metrics read from one log share its step column), so the long steps column, which
 * repeats the steps for every metric and every tick, is not kept.
 */
class Cursor {
  private at = 0;
  constructor(
    private readonly steps: Float64Array,
    private readonly values: Float64Array,
  ) {}
  /**
   * The next `n` rows: their values (a view) and steps, the steps shared with an equal array of
   * `pool` (the run's step arrays so far), or copied and added to it; a view when `pool` is null
   * (for rows whose steps are not kept).
   */
  take(n: number, pool: Float64Array[] | null): { steps: Float64Array; values: Float64Array } {
    const from = this.at;
    this.at += n;
    if (this.at > this.steps.length)
      throw new RangeError(`expected at least ${this.at} rows, got ${this.steps.length}`);
    const values = this.values.subarray(from, this.at);
    const steps = this.steps.subarray(from, this.at);
    if (pool === null) return { steps, values };
    let shared = pool.find((s) => sameNumbers(s, steps));
    if (shared === undefined) {
      shared = steps.slice();
      pool.push(shared);
    }
    return { steps: shared, values };
  }
  /** One dump array (`samples x ticks`, sample-major) from its per-tick rows. */
  dump<T extends Float64Array | Uint8Array>(out: T, samples: number, ticks: number): T {
    for (let t = 0; t < ticks; t++) {
      const { values } = this.take(samples, null);
      for (let s = 0; s < samples; s++) out[s * ticks + t] = values[s] as number;
    }
    return out;
  }
  get position(): number {
    return this.at;
  }
}

/** The same numbers in the same order, bit for bit (Object.is: -0 is not 0). */
function sameNumbers(a: Float64Array, b: Float64Array): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (!Object.is(a[i], b[i])) return false;
  return true;
}

/**
 * The step and value columns of a digest's number rows, in file order, read a slice of rows at a
 * time (the file's row number picks the slice, and DuckDB reads only the row groups it needs;
 * rows come in file order, as from any scan while DuckDB preserves insertion order):
 * one query for the whole file held two copies of every number at once, which on the large
 * benchmark set read from five digests left about 0.4 GB more memory in use than the raw logs.
 * `points` (from the header) sizes the arrays; more rows than that is an error.
 */
async function readNumbers(engine: Engine, file: string, points: number): Promise<[Float64Array, Float64Array]> {
  const steps = new Float64Array(points);
  const values = new Float64Array(points);
  let filled = 0;
  for (let from = 0; from <= points; from += ROW_GROUP_ROWS) {
    const sql =
      `SELECT step, value FROM read_parquet(${sqlPath(file)}, hive_partitioning = false, file_row_number = true) ` +
      `WHERE kind > ${DIGEST_KIND.header} ` +
      `AND file_row_number >= ${from} AND file_row_number < ${from + ROW_GROUP_ROWS}`;
    const [s, v] = resultColumns(await engine.connection.run(sql)) as [Float64Array, Float64Array];
    if (filled + s.length > points) throw new RangeError(`expected ${points} rows of numbers, got more`);
    steps.set(s, filled);
    values.set(v, filled);
    filled += s.length;
    releaseResults(engine);
  }
  if (filled !== points) throw new RangeError(`expected ${points} rows of numbers, got ${filled}`);
  return [steps, values];
}

/**
 * Read the digest `file` back into the RunSet it was written from (see the module comment): every
 * run, series, tick series, dump, metric info, file record and problem equal to the written ones,
 * numbers bit for bit; series are views into two arrays holding all of the digest's points.
 * Cost: one scan of the file's step and value columns (about 16 bytes of memory per number).
 * Throws SeedsiftError('input') naming the file when it is not a digest, has another format
 * version, or its header or rows do not fit together.
 * Example: `await readDigest(engine, 'digests/3.parquet')` gives the runs of shard 3.
 */
export async function readDigest(engine: Engine, file: string): Promise<RunSet> {
  const header = await readHeader(engine, file);
  let steps: Float64Array;
  let values: Float64Array;
  try {
    [steps, values] = await readNumbers(engine, file, header.points);
  } catch (error) {
    throw bad(file, `its rows cannot be read (${(error as Error).message})`);
  }
  const cursor = new Cursor(steps, values);
  try {
    const pools = header.runs.map((): Float64Array[] => []);
    const metrics = header.runs.map((r, i) => {
      const out: Record<string, Series> = {};
      for (const m of r.metrics)
        out[m.name] = {
          ...cursor.take(m.points, pools[i] as Float64Array[]),
          divergedAt: m.divergedAt,
          missing: m.missing,
        };
      return out;
    });
    const ticks = header.runs.map((r, i) => {
      const out: Record<string, TickSeries> = {};
      for (const t of r.tickMetrics) {
        const blocks = Array.from({ length: Math.max(1, t.ticks) }, () =>
          cursor.take(t.steps, pools[i] as Float64Array[]),
        );
        out[t.name] = {
          steps: (blocks[0] as { steps: Float64Array }).steps,
          values: t.ticks === 0 ? [] : blocks.map((b) => b.values),
        };
      }
      return out;
    });
    const runs: Run[] = header.runs.map((r, i) => ({
      id: r.id,
      config: r.config,
      params: r.params,
      seed: r.seed,
      info: r.info,
      files: r.files,
      identity: r.identity,
      metrics: metrics[i] as Record<string, Series>,
      tickMetrics: ticks[i] as Record<string, TickSeries>,
      status: r.status,
      lastStep: r.lastStep,
      divergedAt: r.divergedAt,
    }));
    const tickDumps: TickDump[] = header.tickDumps.map((d) => {
      const size = d.samples * d.ticks;
      const correct = cursor.dump(new Uint8Array(size), d.samples, d.ticks);
      const certainty = cursor.dump(new Float64Array(size), d.samples, d.ticks);
      const confidence = d.confidence ? cursor.dump(new Float64Array(size), d.samples, d.ticks) : null;
      return {
        run: d.run,
        config: d.config,
        seed: d.seed,
        file: d.file,
        step: d.step,
        samples: d.samples,
        ticks: d.ticks,
        correct,
        certainty,
        confidence,
      };
    });
    if (cursor.position !== steps.length) throw new RangeError(`expected ${cursor.position} rows, got ${steps.length}`);
    const own: FileRecord = {
      file,
      status: 'read',
      rows: steps.length,
      rejectedRows: 0,
      runs: runs.map((r) => r.id),
      kind: 'log',
    };
    return {
      mode: header.mode,
      keys: header.keys,
      runs,
      metrics: header.metrics,
      tickDumps,
      files: [own, ...header.files],
      problems: header.problems,
    };
  } catch (error) {
    throw bad(file, `its header and rows do not fit together (${(error as Error).message})`);
  }
}
