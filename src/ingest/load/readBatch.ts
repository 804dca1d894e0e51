/**
 * One DuckDB call over a batch of same-shaped files (loadFiles.ts makes the batches): the rows of
 * every file, the rows DuckDB rejected, and, in whitespace-separated files, the rows with the
 * wrong number of fields. The result's columns are cut into one view per file (rows arrive
 * grouped by file), copied only when DuckDB interleaved the files or rows were dropped.
 */
import type { DuckDBConnection } from '@duckdb/node-api';
import type { ColumnPlan } from '../plan/columns.js';
import { resultColumns } from './duckdb.js';
import type { FileData, FileToRead, Reject } from './loadFiles.js';
import { batchSql, rawColumns, REJECTS_SCAN, REJECTS_SQL, REJECTS_TABLE, seedValuesSql } from './query.js';

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

/** Drop DuckDB's reject tables (before a read, and after it whatever happened). */
export async function dropRejects(connection: DuckDBConnection): Promise<void> {
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

/** The first error of each rejected row (a row is reported once however many columns failed). */
function onePerRow(rejects: readonly Reject[]): Reject[] {
  const seen = new Set<number>();
  return rejects.filter((r) => {
    if (seen.has(r.record)) return false;
    seen.add(r.record);
    return true;
  });
}

/**
 * Read one batch (see the module comment); files with CAST rejects are named in `cast` (by their
 * position in `items`) with the columns at fault. Throws what DuckDB throws for a file it cannot
 * read; the caller retries file by file. Cost: one DuckDB call (two with a seed column).
 */
export async function readBatch(
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
