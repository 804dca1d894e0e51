/**
 * Write a digest: a `RunSet` saved exactly, as one Parquet file (ZSTD), so that the expensive part
 * of ingest (finding, parsing, sniffing and de-duplicating text logs) runs once, where the logs
 * live, and `report`/`scan` later read the digest instead (digest/readDigest.ts).
 *
 * The format (one long table, one number per row, and a JSON header) is in digestFormat.ts.
 *
 * Writing (measured on the medium benchmark set, 40 runs, 11.2 million rows): `COPY` reads the rows
 * from a table function (`seedsift_digest_rows`) that fills DuckDB's data chunks straight from the
 * RunSet's typed arrays, one native copy per column per 2,048 rows, so nothing is staged: peak
 * 355-475 MiB and 8-9.5 s for `seedsift digest`. Staging the rows first cost far more memory:
 * appending DuckDB list values built number by number, 1.7-1.9 GB and 9 s; a staging table of
 * lists filled by native copies, 1.4-1.8 GB and 6-7 s (its `COPY ... unnest(...)` held the whole
 * output of one staging row group at once); a long staging table, 1.5 GB. The table function runs
 * on one thread so that rows reach the file in order, which leaves the ZSTD compression to one
 * thread too (level 6 against level 1: about 2 s of the 8).
 */
import { DOUBLE, DuckDBTableFunction, INTEGER, UTINYINT, VARCHAR, type DuckDBDataChunk } from '@duckdb/node-api';
import bindings from '@duckdb/node-bindings';
import { closeEngine, openEngine, sqlString } from '../load/duckdb.js';
import type { RunSet } from '../types.js';
import {
  DIGEST_KEY,
  DIGEST_KIND,
  DIGEST_VERSION,
  digestHeader,
  ROW_GROUP_ROWS,
  type DigestHeader,
} from './digestFormat.js';

/**
 * Parquet settings, measured on the benchmark digest (4.8 million values, 48 MB of CSV): ZSTD
 * level 6 gave 25 MB for the CPU of level 3 (33 MB); 9 saved 2% more for 40% more CPU. Row groups
 * of 1 Mi rows (DuckDB's default is 122,880) let ZSTD see long runs of similar numbers: 17 MB.
 */
const ZSTD_LEVEL = 6;

/** The long table's columns: what the table function gives and the file holds. */
const TABLE_COLUMNS = [
  ['kind', UTINYINT],
  ['run', INTEGER],
  ['item', INTEGER],
  ['tick', INTEGER],
  ['step', DOUBLE],
  ['value', DOUBLE],
  ['text', VARCHAR],
] as const;

/** One array of numbers and where it goes: a series, one tick of a tick metric, one array of a dump, or the header. */
interface Piece {
  readonly kind: number;
  readonly run: number;
  readonly item: number;
  readonly tick: number;
  readonly steps: Float64Array;
  readonly values: Float64Array;
  readonly text: string | null;
}

/**
 * The pieces of a digest in the file's row order (see the module comment); a dump's per-tick arrays are made as they
 * are reached.
 */
function* pieces(runSet: RunSet, header: DigestHeader): Generator<Piece> {
  const nan = Float64Array.of(NaN);
  yield { kind: DIGEST_KIND.header, run: -1, item: -1, tick: 0, steps: nan, values: nan, text: JSON.stringify(header) };
  for (const [i, r] of runSet.runs.entries()) {
    for (const [j, s] of Object.values(r.metrics).entries())
      yield { kind: DIGEST_KIND.metric, run: i, item: j, tick: 0, steps: s.steps, values: s.values, text: null };
  }
  for (const [i, r] of runSet.runs.entries()) {
    for (const [j, t] of Object.values(r.tickMetrics).entries()) {
      if (t.values.length === 0)
        yield {
          kind: DIGEST_KIND.tick,
          run: i,
          item: j,
          tick: -1,
          steps: t.steps,
          values: new Float64Array(t.steps.length).fill(NaN),
          text: null,
        };
      for (const [k, v] of t.values.entries())
        yield { kind: DIGEST_KIND.tick, run: i, item: j, tick: k, steps: t.steps, values: v, text: null };
    }
  }
  const runIndex = new Map(runSet.runs.map((r, i) => [r.id, i]));
  for (const [j, d] of runSet.tickDumps.entries()) {
    const run = runIndex.get(d.run) ?? -1;
    yield* dumpPieces(DIGEST_KIND.correct, run, j, d.samples, d.ticks, (k) => d.correct[k] as number);
    yield* dumpPieces(DIGEST_KIND.certainty, run, j, d.samples, d.ticks, (k) => d.certainty[k] as number);
    const confidence = d.confidence;
    if (confidence !== null)
      yield* dumpPieces(DIGEST_KIND.confidence, run, j, d.samples, d.ticks, (k) => confidence[k] as number);
  }
}

/** One array of a dump (sample-major, `samples x ticks`) as per-tick pieces: sample index, value. */
function* dumpPieces(
  kind: number,
  run: number,
  item: number,
  samples: number,
  ticks: number,
  cell: (k: number) => number,
): Generator<Piece> {
  const index = new Float64Array(samples);
  for (let s = 0; s < samples; s++) index[s] = s;
  for (let t = 0; t < ticks; t++) {
    const values = new Float64Array(samples);
    for (let s = 0; s < samples; s++) values[s] = cell(s * ticks + t);
    yield { kind, run, item, tick: t, steps: index, values, text: null };
  }
}

/**
 * The long table's rows, a data chunk at a time, for a DuckDB table function to hand to `COPY`:
 * each column is filled in a typed array, then copied into the chunk's vector in one native call.
 * Nothing is staged: no DuckDB value is made per number and no table is filled, so memory stays at
 * the Parquet writer's row group (see the module comment for what staging cost).
 */
class RowSource {
  private readonly size = bindings.vector_size();
  private readonly kind = new Uint8Array(this.size);
  private readonly run = new Int32Array(this.size);
  private readonly item = new Int32Array(this.size);
  private readonly tick = new Int32Array(this.size);
  private readonly step = new Float64Array(this.size);
  private readonly value = new Float64Array(this.size);
  private piece: Piece | null = null;
  /** Rows of `piece` already given. */
  private from = 0;
  constructor(private readonly source: Iterator<Piece>) {}

  /**
   * Fill `chunk` with the next rows (none when all were given). Only the header piece (one row) has a text; every other
   * row's is NULL.
   */
  fill(chunk: DuckDBDataChunk): void {
    let rows = 0;
    let text: { at: number; value: string } | null = null;
    while (rows < this.size) {
      if (this.piece === null || this.from === this.piece.steps.length) {
        const next = this.source.next();
        if (next.done === true) break;
        [this.piece, this.from] = [next.value, 0];
      }
      const p = this.piece;
      if (p.text !== null && this.from === 0) text = { at: rows, value: p.text };
      const count = Math.min(p.steps.length - this.from, this.size - rows);
      this.kind.fill(p.kind, rows, rows + count);
      this.run.fill(p.run, rows, rows + count);
      this.item.fill(p.item, rows, rows + count);
      this.tick.fill(p.tick, rows, rows + count);
      this.step.set(p.steps.subarray(this.from, this.from + count), rows);
      this.value.set(p.values.subarray(this.from, this.from + count), rows);
      rows += count;
      this.from += count;
    }
    chunk.rowCount = rows;
    if (rows === 0) return;
    const vector = (j: number): bindings.Vector => bindings.data_chunk_get_vector(chunk.chunk, j);
    copyInto(vector(0), this.kind.subarray(0, rows));
    copyInto(vector(1), this.run.subarray(0, rows));
    copyInto(vector(2), this.item.subarray(0, rows));
    copyInto(vector(3), this.tick.subarray(0, rows));
    copyInto(vector(4), this.step.subarray(0, rows));
    copyInto(vector(5), this.value.subarray(0, rows));
    const textVector = vector(6);
    const valid = new Uint8Array(Math.ceil(rows / 64) * 8);
    if (text !== null) {
      bindings.vector_assign_string_element(textVector, text.at, text.value);
      valid[text.at >> 3] = 1 << (text.at & 7);
    }
    bindings.vector_ensure_validity_writable(textVector);
    bindings.copy_data_to_vector_validity(textVector, 0, valid.buffer, 0, valid.byteLength);
  }
}

/** Copy a typed array into a fixed-width vector from its first row. */
function copyInto(vector: bindings.Vector, data: ArrayBufferView): void {
  bindings.copy_data_to_vector(vector, 0, data.buffer as ArrayBuffer, data.byteOffset, data.byteLength);
}

/**
 * Write `runSet` to `file` as a digest (see the module comment); `file` is overwritten when it
 * exists (the command line writes to a temporary name and renames). The RunSet is kept exactly:
 * `readDigest(file)` gives back a RunSet whose every field and number equals this one.
 * Cost: one DuckDB instance and one row group of DuckDB's Parquet writer (1 Mi rows), nothing
 * per number beyond the RunSet itself; the file holds about 3.5 bytes per point (step and value) on the benchmark,
 * where noisy values take nearly all of it and steps almost nothing.
 * Throws what DuckDB throws when the file cannot be written (a missing folder, no permission).
 * Example: `await writeDigest(await ingest(['runs'], options), 'shard-1.parquet')`.
 */
export async function writeDigest(runSet: RunSet, file: string): Promise<void> {
  const rows = new RowSource(pieces(runSet, digestHeader(runSet)));
  const engine = await openEngine();
  try {
    const { connection } = engine;
    connection.registerTableFunction(
      DuckDBTableFunction.create({
        name: 'seedsift_digest_rows',
        bindFunction: (bind) => {
          for (const [name, type] of TABLE_COLUMNS) bind.addResultColumn(name, type);
        },
        // One thread: the rows must reach the file in the order they are made.
        initFunction: (init) => init.setMaxThreads(1),
        mainFunction: (_, chunk) => rows.fill(chunk),
      }),
    );
    await connection.run(
      `COPY (SELECT * FROM seedsift_digest_rows()) TO ${sqlString(file)} (FORMAT parquet, COMPRESSION zstd, ` +
        `COMPRESSION_LEVEL ${ZSTD_LEVEL}, ROW_GROUP_SIZE ${ROW_GROUP_ROWS}, KV_METADATA {${sqlString(DIGEST_KEY)}: ` +
        `${sqlString(String(DIGEST_VERSION))}})`,
    );
  } finally {
    closeEngine(engine);
  }
}
