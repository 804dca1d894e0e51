/**
 * Score tables (`--scores FILE`, DESIGN "Inputs"): one row per run with final numbers only.
 *
 * - Columns: the seed column (`--seed-column`, else `seed`); config columns: those named by
 *   `--by`, else every column holding text; metric columns: the other columns whose cells are
 *   all numbers or empty (`nan`/`inf` count as numbers). A column with no cell at all is not used
 *   (`column-not-numeric`); so is a text column that `--by` leaves out.
 * - Each metric becomes a one-point series at step 0. An empty cell means that run has no value
 *   for that metric (`score-missing`, with the line); a `nan`/`inf` cell is `cells-missing`; the
 *   metric is then absent from that run.
 * - A row without a seed gets `auto-N` (`seed-missing`). Two rows with one config and seed:
 *   `run-duplicate`, the later row's values win.
 * - The file is read like a log (same formats, same malformed-row handling); a score table that
 *   does not exist is a usage error, one that cannot be read or is empty gives a RunSet with no
 *   runs and the problem.
 */
import { stat } from 'node:fs/promises';
import { basename } from 'node:path';
import { SeedsiftError } from '../../problems.js';
import { planColumns, type ColumnPlan } from '../plan/columns.js';
import type { Engine } from '../load/duckdb.js';
import { fileFormat } from '../locate/fileFormat.js';
import { loadFiles, type FileData } from '../load/loadFiles.js';
import { readHeader } from '../plan/header.js';
import { REJECTS_SCAN, REJECTS_TABLE, textSql } from '../load/query.js';
import { draft, finishDrafts, type Draft } from '../lines/drafts.js';
import { metricInfos } from '../plan/goals.js';
import { configId, runId } from '../assemble/runIds.js';
import type { ReadingMode } from '../readingMode.js';
import type { FileRecord, IngestOptions, Run, RunSet, RunSource, Series } from '../types.js';

/** The score-table reading mode. */
type ScoresMode = Extract<ReadingMode, { kind: 'scores' }>;

/** What a score table gives: keys, runs, its file record and problems (rows not yet lines). */
export interface ScoreTable {
  readonly keys: readonly string[];
  readonly runs: readonly Run[];
  readonly files: readonly FileRecord[];
  readonly drafts: readonly Draft[];
}

type Role = 'seed' | 'config' | 'metric' | 'unused';

/** Role of each column (see the module comment). */
function roles(data: FileData, options: ScoresMode, plan: ColumnPlan): Role[] {
  const seedName = options.seedColumn;
  for (const name of options.by ?? []) {
    if (!plan.names.includes(name))
      throw new SeedsiftError(
        'usage',
        `--by: expected a column of the score table, got ${name} (columns: ${plan.names.join(', ')})`,
        { file: data.header.source.file },
      );
  }
  return plan.names.map((name, k) => {
    if (name === seedName) return 'seed';
    if (options.by?.includes(name) === true) return 'config';
    const cells = data.cells.get(k) as Float64Array;
    let numbers = 0;
    let text = 0;
    for (let i = 0; i < cells.length; i++) {
      const c = cells[i] as number;
      if (c === -Infinity) text++;
      else if (!Number.isNaN(c)) numbers++;
    }
    if (text > 0) return options.by === null ? 'config' : 'unused';
    return numbers > 0 ? 'metric' : 'unused';
  });
}

async function textColumns(engine: Engine, data: FileData, columns: readonly number[]): Promise<(string | null)[][]> {
  try {
    const rows = (await engine.connection.runAndReadAll(textSql(data.header, columns))).getRowsJS();
    const kept =
      data.header.text !== null && data.header.text.delimiter === null
        ? rows.filter((r) => r[r.length - 1] !== true)
        : rows;
    return kept.map((r) => columns.map((_, j) => (r[j] === null || r[j] === undefined ? null : String(r[j]))));
  } finally {
    await engine.connection.run(`DROP TABLE IF EXISTS ${REJECTS_TABLE}`);
    await engine.connection.run(`DROP TABLE IF EXISTS ${REJECTS_SCAN}`);
  }
}

/**
 * Read a score table (see the module comment) with the given engine. Throws SeedsiftError('usage')
 * when the file does not exist, has no log extension, or `--by` names a missing column.
 * Cost: two DuckDB reads of the table. Example: a table `method,seed,acc` with rows `a,1,0.9` and
 * `b,1,0.8` gives runs `method=a,seed=1` and `method=b,seed=1`, each with acc at step 0.
 */
export async function readScores(
  engine: Engine,
  mode: ScoresMode,
  options: Pick<IngestOptions, 'columns'>,
): Promise<ScoreTable> {
  const file = mode.file;
  const kind = fileFormat(file);
  if (kind === null)
    throw new SeedsiftError(
      'usage',
      `--scores: expected a .csv, .tsv, .txt or .parquet file (optionally .gz), got ${file}`,
    );
  try {
    await stat(file);
  } catch {
    throw new SeedsiftError('usage', `--scores: expected an existing file, got ${file}`);
  }
  const source: RunSource = {
    file,
    relPath: basename(file),
    ...kind,
    params: {},
    info: {},
    seed: null,
    identity: 'scores',
  };
  const record = (
    status: FileRecord['status'],
    rows: number,
    rejectedRows: number,
    runs: readonly string[],
  ): FileRecord => ({ file, status, rows, rejectedRows, runs, kind: 'scores' });
  const header = await readHeader(source, options.columns, engine);
  if (!header.ok)
    return {
      keys: [],
      runs: [],
      files: [record(header.code === 'file-empty' ? 'skipped' : 'unreadable', 0, 0, [])],
      drafts: [draft(header.code, `score table: ${header.reason}`, { file })],
    };
  const base = planColumns(header.header.names, { step: null, mode });
  const plan: ColumnPlan = {
    ...base,
    kind: 'log',
    step: null,
    seed: null,
    tick: null,
    scalars: base.names.map((_, k) => k),
    wideTicks: [],
    perSeed: [],
    aggregates: [],
    unmatched: [],
  };
  const loaded = await loadFiles(engine, [{ header: header.header, plan }]);
  const data = loaded.data[0];
  if (data === undefined)
    return {
      keys: [],
      runs: [],
      files: [record('unreadable', 0, 0, [])],
      drafts: [draft('file-unreadable', `score table: ${loaded.failed[0]?.reason ?? 'could not be read'}`, { file })],
    };
  const role = roles(data, mode, plan);
  const at = (r: Role): number[] => role.flatMap((x, k) => (x === r ? [k] : []));
  const configCols = at('config');
  const seedCol = at('seed')[0];
  const metricCols = at('metric');
  const textCols = [...configCols, ...(seedCol === undefined ? [] : [seedCol])];
  // A table of numbers only (no config or seed column) has no text to fetch.
  const text = textCols.length === 0 ? [] : await textColumns(engine, data, textCols);
  const keys = configCols.map((k) => plan.names[k] as string);
  const drafts: Draft[] = [];
  for (const k of at('unused'))
    drafts.push(
      draft(
        'column-not-numeric',
        `score table column ${plan.names[k] as string} ` +
          `${mode.by === null ? 'is empty' : 'holds text and is not named by --by'}; not used`,
        { file },
      ),
    );
  const runs = new Map<string, { run: Run; metrics: Record<string, Series> }>();
  let auto = 0;
  for (let i = 0; i < data.rows; i++) {
    const row = text[i] ?? [];
    const params: Record<string, string> = {};
    keys.forEach((key, j) => {
      params[key] = row[j] ?? '';
    });
    const ref = [{ data, kind: 'row' as const, n: i }];
    let seed = seedCol === undefined ? null : (row[configCols.length] ?? null);
    if (seed === null) {
      seed = `auto-${++auto}`;
      drafts.push(draft('seed-missing', `score table row has no seed; given the seed ${seed}`, { file, rows: ref }));
    }
    const config = configId(params, keys);
    const id = runId(config, seed);
    const previous = runs.get(id);
    if (previous !== undefined)
      drafts.push(
        draft('run-duplicate', `score table rows repeat config and seed ${id}; the later row's values win`, {
          file,
          run: id,
          rows: ref,
        }),
      );
    const metrics: Record<string, Series> = previous?.metrics ?? {};
    for (const k of metricCols) {
      const name = plan.names[k] as string;
      const c = (data.cells.get(k) as Float64Array)[i] as number;
      if (Number.isFinite(c))
        metrics[name] = { steps: Float64Array.of(0), values: Float64Array.of(c), divergedAt: null, missing: 0 };
      else if (Number.isNaN(c))
        drafts.push(draft('score-missing', `${name} is empty for this run`, { file, run: id, rows: ref }));
      else
        drafts.push(
          draft(
            'cells-missing',
            `${name} is ${c === Infinity ? 'nan or inf' : 'not a number'} for this run; treated as missing`,
            { file, run: id, rows: ref },
          ),
        );
    }
    const run: Run = {
      id,
      config,
      params,
      seed,
      info: {},
      files: [file],
      identity: 'scores',
      metrics,
      tickMetrics: {},
      status: 'ok',
      lastStep: 0,
      divergedAt: null,
    };
    runs.set(id, { run, metrics });
  }
  const out = [...runs.values()].map(({ run, metrics }) => ({
    ...run,
    metrics,
    status: Object.keys(metrics).length > 0 ? ('ok' as const) : ('rejected' as const),
  }));
  const files = [
    record(
      'read',
      data.rows,
      data.rejects.length + data.malformed.length,
      out.map((r) => r.id),
    ),
  ];
  return { keys, runs: out, files, drafts };
}

/**
 * The RunSet of a score table: `readScores`, its drafts given lines, its metrics their goals.
 * Throws what `readScores` throws. Example: the table of `readScores`'s example gives two runs and
 * the metric `acc` (goal inferred: max).
 */
export async function scoreRunSet(
  engine: Engine,
  mode: ScoresMode,
  options: Pick<IngestOptions, 'columns' | 'metricGoals'>,
): Promise<RunSet> {
  const table = await readScores(engine, mode, options);
  const { metrics, problems } = metricInfos(table.runs, options);
  return {
    mode: 'scores',
    keys: table.keys,
    runs: table.runs,
    metrics,
    tickDumps: [],
    files: table.files,
    problems: [...(await finishDrafts(table.drafts)), ...problems],
  };
}
