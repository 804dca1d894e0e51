/**
 * Step 3 of ingest: read the rows of the planned files with DuckDB (loadFiles.ts), list the files
 * DuckDB could not read, and check what was read: rejected and malformed rows, columns a wide
 * file does not use (checks.ts), and which metric names hold a number in some file (a column
 * that holds none is not a metric, `column-not-numeric`).
 */
import type { ProgressHook } from '../../progress.js';
import { numericNames } from '../assemble/rows.js';
import { draft, type Draft } from '../lines/drafts.js';
import type { FileRecord, RunSource } from '../types.js';
import { fileDrafts, notNumericDrafts } from './checks.js';
import type { Engine } from './duckdb.js';
import { loadFiles, type FileData, type FileToRead } from './loadFiles.js';

/** What step 3 hands on. */
export interface Loaded {
  /** Every file read, in source order (its file record counts its rows). */
  readonly data: readonly FileData[];
  /** The files read that hold something (a row, a rejected or a malformed row): runs are built from these. */
  readonly used: readonly FileData[];
  /** Metric names holding a number somewhere in `used`. */
  readonly numeric: ReadonlySet<string>;
  /** Records of the files DuckDB could not read. */
  readonly records: readonly FileRecord[];
  /** Their sources (their runs are `rejected` unless another file gives rows). */
  readonly failed: readonly RunSource[];
  /** Problems, rows not yet lines. */
  readonly drafts: readonly Draft[];
}

/**
 * Load the files of `toRead` (see the module comment). Never throws for a bad file.
 * Cost: loadFiles's (one DuckDB call per batch of about 16 MiB of text), plus O(cells) checks.
 * Example: two CSV logs of one shape are read in one call and come back as two `data` entries.
 */
export async function loadPlanned(
  engine: Engine,
  toRead: readonly FileToRead[],
  progress: ProgressHook,
): Promise<Loaded> {
  const loaded = await loadFiles(engine, toRead, undefined, (done) => progress('reading', done, toRead.length));
  const drafts: Draft[] = [];
  const records: FileRecord[] = [];
  const failed: RunSource[] = [];
  for (const f of loaded.failed) {
    const source = f.header.source;
    drafts.push(draft('file-unreadable', `cannot be read: ${f.reason}`, { file: source.file }));
    records.push({ file: source.file, status: 'unreadable', rows: 0, rejectedRows: 0, runs: [], kind: 'unknown' });
    failed.push(source);
  }
  for (const d of loaded.data) drafts.push(...fileDrafts(d));
  const used = loaded.data.filter((d) => d.rows > 0 || d.rejects.length > 0 || d.malformed.length > 0);
  const { numeric, notNumeric } = numericNames(used);
  drafts.push(...notNumericDrafts(notNumeric));
  return { data: loaded.data, used, numeric, records, failed, drafts };
}
