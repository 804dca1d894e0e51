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
import { releaseResults, type Engine } from './duckdb.js';
import type { FileHeader } from '../plan/header.js';
import { columnsToRead, dropRejects, readBatch } from './readBatch.js';

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
    done += b.items.length;
    onBatch(done);
  }
  const data = items.flatMap((item) => {
    const d = byFile.get(item);
    return d === undefined ? [] : [d];
  });
  const failedOrdered = items.flatMap((item) => failed.filter((f) => f.header === item.header));
  return { data, failed: failedOrdered };
}
