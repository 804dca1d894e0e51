/**
 * Step 2 of ingest: read the head of every located file (header.ts) and plan its columns
 * (columns.ts). A file that cannot be read, is empty, or (a log) has no step column is set aside
 * here with its file record and a problem; the others go on to loading, and their headers are
 * compared for drift (load/checks.ts `headerDrift`). A `--step` or `--seed-column` that is a
 * column of no file, or a `--seed-columns` pattern matching no column of any file, stops the command
 * (namedColumns.ts).
 *
 * Checks that look at a file's columns alone belong here, after `planColumns` (for example: a
 * metric asked for that no file has).
 */
import type { ProgressHook } from '../../progress.js';
import { draft, type Draft } from '../lines/drafts.js';
import { headerDrift } from '../load/checks.js';
import type { Engine } from '../load/duckdb.js';
import type { FileToRead } from '../load/loadFiles.js';
import type { FileRecord, IngestOptions, RunSource } from '../types.js';
import { planColumns } from './columns.js';
import { readHeader, type HeaderResult } from './header.js';
import { mapPool } from './mapPool.js';
import { checkNamedColumns } from './namedColumns.js';

/** What step 2 hands on. */
export interface Planned {
  /** Files to load, in source order, each with its header and column plan. */
  readonly toRead: readonly FileToRead[];
  /** Records of the files set aside (skipped or unreadable), in source order. */
  readonly records: readonly FileRecord[];
  /** Log sources of which nothing can be used (their runs are `rejected` unless another file gives rows). */
  readonly failed: readonly RunSource[];
  /** Problems, rows not yet lines. */
  readonly drafts: readonly Draft[];
}

/**
 * Files whose heads are read at the same time (text files; Parquet ones go one by one through the one DuckDB
 * connection).
 */
const HEAD_READS = 8;

/** Every source's header, in source order. */
async function readHeaders(
  sources: readonly RunSource[],
  options: Pick<IngestOptions, 'columns'>,
  engine: Engine,
  progress: ProgressHook,
): Promise<HeaderResult[]> {
  let done = 0;
  const read = async (source: RunSource): Promise<HeaderResult> => {
    const header = await readHeader(source, options.columns, engine);
    progress('headers', ++done, sources.length);
    return header;
  };
  const text = await mapPool(sources, HEAD_READS, async (source) =>
    source.format === 'parquet' ? null : await read(source),
  );
  const out: HeaderResult[] = [];
  for (const [i, source] of sources.entries()) out.push(text[i] ?? (await read(source)));
  return out;
}

function record(source: RunSource, status: FileRecord['status'], kind: FileRecord['kind']): FileRecord {
  return { file: source.file, status, rows: 0, rejectedRows: 0, runs: [], kind };
}

/**
 * Plan the files of `sources` (see the module comment). Never throws for a bad file; throws
 * SeedsiftError('usage') for a column named by an option that no file has.
 * Cost: one read of each file's head (8 text files at a time), O(columns) per plan.
 * Example: a source whose header is `step,loss` gives one `toRead` entry with `plan.step` 0.
 */
export async function planFiles(
  engine: Engine,
  sources: readonly RunSource[],
  options: IngestOptions,
  progress: ProgressHook,
): Promise<Planned> {
  const headers = await readHeaders(sources, options, engine, progress);
  const toRead: FileToRead[] = [];
  const records: FileRecord[] = [];
  const failed: RunSource[] = [];
  const drafts: Draft[] = [];
  const seen = new Set<string>();
  for (const [i, source] of sources.entries()) {
    const header = headers[i] as HeaderResult;
    if (!header.ok) {
      const empty = header.code === 'file-empty';
      const text = empty ? `${header.reason}; no run is built from it` : `cannot be read: ${header.reason}`;
      drafts.push(draft(header.code, text, { file: source.file }));
      records.push(record(source, empty ? 'skipped' : 'unreadable', 'unknown'));
      if (!empty) failed.push(source);
      continue;
    }
    const plan = planColumns(header.header.names, options);
    for (const name of plan.names) seen.add(name);
    if (plan.kind === 'log' && plan.step === null) {
      const wanted =
        options.step === null
          ? 'none of step, global_step, iteration, iter, epoch, timestep, frame'
          : `no column ${options.step}`;
      drafts.push(
        draft(
          'step-column-missing',
          `no step column (${wanted}; columns: ${plan.names.join(', ')}); the file was skipped`,
          { file: source.file },
        ),
      );
      records.push(record(source, 'skipped', 'log'));
      failed.push(source);
      continue;
    }
    toRead.push({ header: header.header, plan });
  }
  checkNamedColumns(options, seen);
  drafts.push(...headerDrift(toRead));
  return { toRead, records, failed, drafts };
}
