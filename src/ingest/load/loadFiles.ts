/**
 * Read the rows of many log files with DuckDB: files with the same shape (format, compression,
 * delimiter, header and column names; see load/query.ts) are read together, one table function
 * call over the file list, in batches of about `budget` bytes of text so that memory stays
 * bounded (16 MiB: the 315 MB benchmark of 500 runs x 20,000 rows is about 20 calls; 64 MiB was
 * 5-10% faster there but used 0.3 GB more memory). A batch that fails is retried file by file, so
 * one broken file costs only itself (`file-unreadable` with DuckDB's reason).
 *
 * Each file's columns come back as encoded `Float64Array`s (load/query.ts), views into one array
 * per batch column: no per-row JS objects and no copy for the common case.
 */
import type { DuckDBConnection } from '@duckdb/node-api';
import type { ColumnPlan } from '../plan/columns.js';
import { releaseResults, resultColumns, type Engine } from './duckdb.js';
import type { FileHeader } from '../plan/header.js';
import { batchSql, rawColumns, REJECTS_SCAN, REJECTS_SQL, REJECTS_TABLE, seedValuesSql } from './query.js';

/** A row DuckDB rejected: its record number (DuckDB's `line`, see lines/records.ts) and why. */
export interface Reject {
  readonly record: number;
  readonly message: string;
  /** DuckDB's error type (`CAST`, `MISSING COLUMNS`, ...). */
  readonly type: string;
  /** Index of the column at fault, when DuckDB names one. */
  readonly column: number | null;
}

/** The rows of one file, as DuckDB read them. */
export interface FileData {
  readonly header: FileHeader;
  readonly plan: ColumnPlan;
  /** Rows kept (accepted by DuckDB, well formed). */
  readonly rows: number;
  /** Encoded cells (load/query.ts) by column index, one per kept row, in file order. */
  readonly cells: ReadonlyMap<number, Float64Array>;
  /** `--seed-column`: per row, the 1-based position of its seed in `seedValues` (0 for an empty cell). */
  readonly seedCodes: Float64Array | null;
  readonly seedValues: readonly string[];
  /** Data-row index of each kept row (rows DuckDB accepted, counted from 0); null when row i is data row i. */
  readonly rowIds: Int32Array | null;
  /** Rows DuckDB rejected (delimited files). */
  readonly rejects: readonly Reject[];
  /** Whitespace-separated files: data rows with the wrong number of fields (not kept). */
  readonly malformed: readonly number[];
}

/** A file to read: its header and column plan. */
export interface FileToRead {
  readonly header: FileHeader;
  readonly plan: ColumnPlan;
}

/** Files read, and files that could not be read with DuckDB's reason. */
export interface LoadedFiles {
  readonly data: FileData[];
  readonly failed: { readonly header: FileHeader; readonly reason: string }[];
}

/** Default text bytes per DuckDB call (gzip counted 5x, Parquet 3x). */
export const BATCH_BYTES = 16 * 1024 * 1024;

/**
 * The columns of a file that are read: for a log its step, tick, metric, per-tick and per-seed
 * columns; for a tick dump every column (its seed column aside, read as seed codes). Pure.
 * Example: for `['step', 'loss', 'note']` (a log) it is `[0, 1, 2]`.
 */
export function columnsToRead(plan: ColumnPlan): number[] {
  if (plan.kind === 'tick-dump') return plan.names.map((_, k) => k).filter((k) => k !== plan.seed);
  const set = new Set<number>();
  for (const k of [plan.step, plan.tick]) if (k !== null) set.add(k);
  for (const k of plan.scalars) set.add(k);
  for (const t of plan.wideTicks) set.add(t.index);
  for (const s of plan.perSeed) set.add(s.index);
  return [...set];
}

function shapeKey(item: FileToRead): string {
  const h = item.header;
  return JSON.stringify([
    h.text === null,
    h.source.gzip,
    h.text?.delimiter ?? null,
    h.text?.header ?? null,
    h.text?.skip ?? 0,
    h.names,
    h.parquetTypes,
  ]);
}

function weight(h: FileHeader): number {
  return h.bytes * (h.text === null ? 3 : h.source.gzip ? 5 : 1);
}

async function dropRejects(connection: DuckDBConnection): Promise<void> {
  await connection.run(`DROP TABLE IF EXISTS ${REJECTS_TABLE}`);
  await connection.run(`DROP TABLE IF EXISTS ${REJECTS_SCAN}`);
}

/** Rejected rows by file, one entry per error (a row can fail on several columns). */
async function readRejects(connection: DuckDBConnection): Promise<Map<string, Reject[]>> {
  const out = new Map<string, Reject[]>();
  let rows: unknown[][];
  try {
    rows = (await connection.runAndReadAll(REJECTS_SQL)).getRowsJS();
  } catch {
    return out; // no reject table: nothing was rejected (Parquet, or a clean read)
  }
  for (const [file, line, columnName, type, message] of rows) {
    const list = out.get(String(file)) ?? [];
    const named = /^c(\d+)$/.exec(String(columnName));
    list.push({
      record: Number(line),
      message: String(message).split('\n')[0] as string,
      type: String(type),
      column: named === null ? null : Number(named[1]),
    });
    out.set(String(file), list);
  }
  return out;
}

/** Positions of the rows of each file in the batch result (rows arrive grouped by file, in order). */
function rowRanges(fileIndex: Float64Array, files: number): { order: Int32Array | null; start: Int32Array } {
  const count = new Int32Array(files + 1);
  let sorted = true;
  for (let i = 0; i < fileIndex.length; i++) {
    const f = fileIndex[i] as number;
    count[f + 1] = (count[f + 1] as number) + 1;
    if (i > 0 && f < (fileIndex[i - 1] as number)) sorted = false;
  }
  for (let f = 0; f < files; f++) count[f + 1] = (count[f + 1] as number) + (count[f] as number);
  if (sorted) return { order: null, start: count };
  const next = Int32Array.from(count);
  const order = new Int32Array(fileIndex.length);
  for (let i = 0; i < fileIndex.length; i++) {
    const f = fileIndex[i] as number;
    order[next[f] as number] = i;
    next[f] = (next[f] as number) + 1;
  }
  return { order, start: count };
}

function slice(column: Float64Array, order: Int32Array | null, from: number, to: number): Float64Array {
  if (order === null) return column.subarray(from, to);
  const out = new Float64Array(to - from);
  for (let i = from; i < to; i++) out[i - from] = column[order[i] as number] as number;
  return out;
}

function keep(column: Float64Array, rows: Int32Array): Float64Array {
  const out = new Float64Array(rows.length);
  for (let i = 0; i < rows.length; i++) out[i] = column[rows[i] as number] as number;
  return out;
}

/** Read one batch; files with CAST rejects are named in `cast` with the columns at fault. */
async function readBatch(
  connection: DuckDBConnection,
  items: readonly FileToRead[],
  doubles: ReadonlySet<number>,
): Promise<{ data: FileData[]; cast: Map<number, Set<number>> }> {
  const first = items[0] as FileToRead;
  const headers = items.map((i) => i.header);
  const columns = columnsToRead(first.plan);
  let seed: { index: number; values: string[] } | null = null;
  if (first.plan.seed !== null) {
    const values = (await connection.runAndReadAll(seedValuesSql(headers, first.plan.seed)))
      .getRowsJS()
      .map((r) => String(r[0]));
    seed = { index: first.plan.seed, values };
  }
  await dropRejects(connection);
  const spec = { headers, columns, seed, doubles };
  const out = resultColumns(await connection.run(batchSql(spec)), rawColumns(spec));
  const rejects = await readRejects(connection);
  await dropRejects(connection);
  const whitespace = first.header.text !== null && first.header.text.delimiter === null;
  const { order, start } = rowRanges(out[0] as Float64Array, items.length);
  const cast = new Map<number, Set<number>>();
  items.forEach((item, f) => {
    for (const r of rejects.get(item.header.source.file) ?? []) {
      if (r.type !== 'CAST') continue;
      const set = cast.get(f) ?? new Set<number>();
      if (r.column !== null) set.add(r.column);
      cast.set(f, set);
    }
  });
  const data = items.map((item, f) => {
    const from = start[f] as number;
    const to = start[f + 1] as number;
    let cells = new Map(columns.map((k, j) => [k, slice(out[j + 1] as Float64Array, order, from, to)] as const));
    let seedCodes = seed === null ? null : slice(out[columns.length + 1] as Float64Array, order, from, to);
    let rowIds: Int32Array | null = null;
    const malformed: number[] = [];
    if (whitespace) {
      const flags = slice(out[out.length - 1] as Float64Array, order, from, to);
      const kept: number[] = [];
      for (let i = 0; i < flags.length; i++) (flags[i] === 1 ? malformed : kept).push(i);
      if (malformed.length > 0) {
        rowIds = Int32Array.from(kept);
        const ids = rowIds;
        cells = new Map([...cells].map(([k, v]) => [k, keep(v, ids)] as const));
        if (seedCodes !== null) seedCodes = keep(seedCodes, ids);
      }
    }
    return {
      header: item.header,
      plan: item.plan,
      rows: rowIds === null ? to - from : rowIds.length,
      cells,
      seedCodes,
      seedValues: seed?.values ?? [],
      rowIds,
      rejects: onePerRow(rejects.get(item.header.source.file) ?? []),
      malformed,
    };
  });
  return { data, cast };
}

/**
 * Columns the CSV reader may parse as DOUBLE at first: every column read of a delimited text
 * file except the seed column and the columns whose first cells hold text (plan/header.ts), so
 * that a label column does not make every row of a batch a CAST reject (whitespace files and
 * Parquet: none).
 */
function initialDoubles(item: FileToRead): Set<number> {
  const text = item.header.text;
  if (text === null || text.delimiter === null) return new Set();
  return new Set(columnsToRead(item.plan).filter((k) => k !== item.plan.seed && !item.header.textLike.includes(k)));
}

/** The first error of each rejected row (a row is reported once however many columns failed). */
function onePerRow(rejects: readonly Reject[]): Reject[] {
  const seen = new Set<number>();
  return rejects.filter((r) => (seen.has(r.record) ? false : (seen.add(r.record), true)));
}

function firstLine(error: unknown): string {
  return String((error as { message?: string }).message ?? error).split('\n')[0] as string;
}

/**
 * Read many files (see the module comment). Files are grouped by shape in the order given and
 * results come back in the order given. Never throws for a bad file: it is listed in `failed`.
 * Cost: one DuckDB call per batch (plus one per batch for the seed list with `--seed-column`),
 * memory O(cells read).
 * `onBatch` is told how many files are read so far after each batch (for a progress display).
 * Example: `await loadFiles(engine, [{ header, plan }])`.
 */
export async function loadFiles(
  engine: Engine,
  items: readonly FileToRead[],
  budget: number = BATCH_BYTES,
  onBatch: (filesDone: number) => void = () => undefined,
): Promise<LoadedFiles> {
  const groups = new Map<string, FileToRead[]>();
  for (const item of items) {
    const key = shapeKey(item);
    const list = groups.get(key) ?? [];
    list.push(item);
    groups.set(key, list);
  }
  // Per shape: the columns still read as DOUBLE; a CAST reject turns its column to VARCHAR for
  // the files that had it (read again) and for the shape's later batches.
  const batches: { items: FileToRead[]; doubles: Set<number> }[] = [];
  for (const group of groups.values()) {
    const doubles = initialDoubles(group[0] as FileToRead);
    let batch: FileToRead[] = [];
    let size = 0;
    for (const item of group) {
      if (batch.length > 0 && size + weight(item.header) > budget) {
        batches.push({ items: batch, doubles });
        [batch, size] = [[], 0];
      }
      batch.push(item);
      size += weight(item.header);
    }
    if (batch.length > 0) batches.push({ items: batch, doubles });
  }
  const byFile = new Map<FileToRead, FileData>();
  const failed: { header: FileHeader; reason: string }[] = [];
  const readSafely = async (
    connection: DuckDBConnection,
    batch: readonly FileToRead[],
    doubles: Set<number>,
  ): Promise<void> => {
    let pending = batch;
    try {
      while (pending.length > 0) {
        const used = new Set(doubles);
        const { data, cast } = await readBatch(connection, pending, used);
        const again: FileToRead[] = [];
        data.forEach((d, k) => {
          const turned = [...(cast.get(k) ?? [])].filter((c) => used.has(c));
          if (turned.length === 0) byFile.set(pending[k] as FileToRead, d);
          else again.push(pending[k] as FileToRead);
          for (const c of turned) doubles.delete(c);
        });
        pending = again;
      }
    } catch (error) {
      await dropRejects(connection).catch(() => undefined);
      if (pending.length > 1) for (const item of pending) await readSafely(connection, [item], doubles);
      else failed.push({ header: (pending[0] as FileToRead).header, reason: firstLine(error) });
    }
  };
  let done = 0;
  for (const b of batches) {
    await readSafely(engine.connection, b.items, b.doubles);
    releaseResults(engine);
    onBatch((done += b.items.length));
  }
  const data = items.flatMap((item) => {
    const d = byFile.get(item);
    return d === undefined ? [] : [d];
  });
  const failedOrdered = items.flatMap((item) => failed.filter((f) => f.header === item.header));
  return { data, failed: failedOrdered };
}
