/**
 * The ingest stage: from the PATHs on the command line (or a score table) to a `RunSet`.
 *
 *   1. locate   find the files and what their paths say (config, seed)          locate.ts
 *   2. headers  read each file's column names; recognise the columns           loadHeader.ts, columns.ts
 *   3. load     read the rows with DuckDB, one call per batch of same-shaped files   loadFiles.ts
 *   4. runs     split files into runs, apply the messy-log policies, build dumps     runs.ts
 *   5. report   metrics and goals, file records, problems with exact lines     goals.ts, loadRefs.ts
 *   6. digests  when digests were among the files (found in step 1 by their marker): read them   digestRead.ts
 *               and merge them with the runs read from logs                      mergeRunSets.ts
 *
 * One DuckDB instance per call (default threads), closed at the end whatever happens. A file
 * that cannot be used is listed with a problem and ingest goes on; only what the user typed
 * (a missing PATH, a bad option) throws a SeedsiftError.
 */
import { problem, type Problem } from '../problems.js';
import type { ProgressHook } from '../progress.js';
import { planColumns, type ColumnPlan } from './columns.js';
import { findDigests, readDigest } from './digestRead.js';
import { closeEngine, openEngine, type Engine } from './duckdb.js';
import { bookkeepingName, metricGoal } from './goals.js';
import { checkGoalNames, checkLayoutMatched, checkNamedColumns } from './namedColumns.js';
import { locate, type Located } from './locate.js';
import { fileDrafts, headerDrift, notNumericDrafts } from './loadChecks.js';
import { loadFiles, type FileData, type FileToRead } from './loadFiles.js';
import { readHeader, type HeaderResult } from './loadHeader.js';
import { mapPool } from './mapPool.js';
import { draft, finishDrafts, type Draft } from './loadRefs.js';
import { numericNames } from './loadRows.js';
import { mergeRunSets, type RunSetPart } from './mergeRunSets.js';
import { assembleRuns } from './runs.js';
import { readScores } from './scores.js';
import type { FileRecord, IngestOptions, MetricInfo, Run, RunSet, RunSource } from './types.js';

/**
 * Metrics found in the runs, in first-seen order (scalars and per-tick metrics separately, a name
 * may be both), with their goals; a `goal-inferred` note for each name whose goal a name rule gave, a
 * `goal-unknown` note for each name no rule knows.
 * Pure. Example: runs with `val_loss` give `{ name: 'val_loss', goal: 'min', goalSource: 'inferred', kind: 'scalar', ticks: 0 }`.
 */
export function metricInfos(
  runs: readonly Run[],
  options: Pick<IngestOptions, 'metricGoals'>,
): { metrics: MetricInfo[]; problems: Problem[] } {
  const scalars = new Set<string>();
  const ticks = new Map<string, number>();
  for (const run of runs) {
    for (const name of Object.keys(run.metrics)) scalars.add(name);
    for (const [name, t] of Object.entries(run.tickMetrics))
      ticks.set(name, Math.max(ticks.get(name) ?? 0, t.values.length));
  }
  const metrics: MetricInfo[] = [
    ...[...scalars].map((name) => ({
      name,
      ...metricGoal(name, options),
      bookkeeping: bookkeepingName(name),
      kind: 'scalar' as const,
      ticks: 0,
    })),
    ...[...ticks].map(([name, count]) => ({
      name,
      ...metricGoal(name, options),
      bookkeeping: false,
      kind: 'tick' as const,
      ticks: count,
    })),
  ];
  const inferred = [...new Set(metrics.filter((m) => m.goalSource === 'inferred').map((m) => m.name))];
  const problems = inferred.map((name) => {
    const goal = (metrics.find((m) => m.name === name) as MetricInfo).goal;
    return problem(
      'goal-inferred',
      `${name}: ${goal === 'min' ? 'lower' : 'higher'} is taken to be better (from its name); say --metric ${name}:${goal === 'min' ? 'max' : 'min'} if that is wrong`,
    );
  });
  for (const name of new Set(metrics.filter((m) => m.goalSource === 'unknown').map((m) => m.name)))
    problems.push(
      problem(
        'goal-unknown',
        `${name}: no name rule says whether higher or lower is better; its comparisons show the direction only (say --metric ${name}:max or ${name}:min)`,
      ),
    );
  return { metrics, problems };
}

/** Step 6: read the digests and merge them with the runs read from logs, parts in the order their first file was found. */
async function withDigests(
  engine: Engine,
  found: Located,
  logs: RunSet,
  digests: ReadonlyMap<string, string>,
  options: IngestOptions,
): Promise<RunSet> {
  const order = new Map(found.sources.map((s, k) => [s.file, k]));
  const parts: { at: number; part: RunSetPart }[] = [
    { at: found.sources.findIndex((s) => !digests.has(s.file)), part: { digest: null, runSet: logs } },
  ];
  for (const file of digests.keys())
    parts.push({ at: order.get(file) ?? -1, part: { digest: file, runSet: await readDigest(engine, file) } });
  parts.sort((a, b) => a.at - b.at);
  return await mergeRunSets(
    parts.map((p) => p.part),
    options,
  );
}

/** Files whose heads are read at the same time (text files; Parquet ones go one by one through the one DuckDB connection). */
const HEAD_READS = 8;

/** Step 2's reading: every source's header, in source order. */
async function readHeaders(
  sources: readonly RunSource[],
  options: IngestOptions,
  engine: Engine,
  progress: (stage: 'headers', done: number, total: number) => void,
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

async function ingestScores(engine: Engine, options: IngestOptions): Promise<RunSet> {
  const table = await readScores(engine, options);
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

/**
 * Read every run under `paths` (or the `--scores` table) into a RunSet (see the module comment).
 * Throws SeedsiftError('usage' | 'input') only for what the user typed or supplied (from locate,
 * or options, or a digest that cannot be used: digestRead.ts, mergeRunSets.ts). Cost: dominated
 * by DuckDB parsing the files (measured on a shared 2-core machine: 500 runs x 20,000 rows x 4
 * columns, 315 MB of CSV, in 5 to 9 s with a peak RSS of 0.6 to 0.7 GB);
 * memory about 8 bytes per number kept, plus one batch of DuckDB results.
 * Example: `await ingest(['runs'], options)` with runs/ticks=8/seed=1/log.csv gives one run `ticks=8,seed=1`.
 */
/** Optional observers of a long ingest (the command line shows progress on a terminal). */
export interface IngestHooks {
  /** Called as work advances: `stage` is 'headers' or 'reading', with files done of total. */
  readonly progress?: ProgressHook;
}

export async function ingest(
  paths: readonly string[],
  options: IngestOptions,
  hooks: IngestHooks = {},
): Promise<RunSet> {
  const progress = hooks.progress ?? ((): void => undefined);
  const engine = await openEngine();
  try {
    if (options.scores !== null) return await ingestScores(engine, options);
    // 1. locate (digests are set aside for step 6)
    const found = await locate(paths, options);
    checkLayoutMatched(options, found.sources, found.problems);
    const digests = await findDigests(
      engine,
      found.sources.filter((s) => s.format === 'parquet' && !s.gzip).map((s) => s.file),
    );
    const located: Located =
      digests.size === 0
        ? found
        : {
            sources: found.sources.filter((s) => !digests.has(s.file)),
            files: found.files,
            problems: found.problems.filter((p) => p.file === undefined || !digests.has(p.file)),
          };
    const drafts: Draft[] = [];
    const records: FileRecord[] = [...located.files];
    const failed: RunSource[] = [];
    const record = (source: RunSource, status: FileRecord['status'], kind: FileRecord['kind']): void => {
      records.push({ file: source.file, status, rows: 0, rejectedRows: 0, runs: [], kind });
    };
    // 2. headers and column plans
    const toRead: FileToRead[] = [];
    const seen = new Set<string>();
    const headers = await readHeaders(located.sources, options, engine, progress);
    for (const [i, source] of located.sources.entries()) {
      const header = headers[i] as HeaderResult;
      if (!header.ok) {
        drafts.push(
          draft(
            header.code,
            header.code === 'file-empty'
              ? `${header.reason}; no run is built from it`
              : `cannot be read: ${header.reason}`,
            { file: source.file },
          ),
        );
        record(source, header.code === 'file-empty' ? 'skipped' : 'unreadable', 'unknown');
        if (header.code === 'file-unreadable') failed.push(source);
        continue;
      }
      const plan: ColumnPlan = planColumns(header.header.names, options);
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
        record(source, 'skipped', 'log');
        failed.push(source);
        continue;
      }
      toRead.push({ header: header.header, plan });
    }
    checkNamedColumns(options, seen);
    drafts.push(...headerDrift(toRead));
    // 3. load
    const loaded = await loadFiles(engine, toRead, undefined, (done) => progress('reading', done, toRead.length));
    for (const f of loaded.failed) {
      drafts.push(draft('file-unreadable', `cannot be read: ${f.reason}`, { file: f.header.source.file }));
      record(f.header.source, 'unreadable', 'unknown');
      failed.push(f.header.source);
    }
    const empty = (d: FileData): boolean => d.rows === 0 && d.rejects.length === 0 && d.malformed.length === 0;
    for (const d of loaded.data) drafts.push(...fileDrafts(d));
    const used = loaded.data.filter((d) => !empty(d));
    const { numeric, notNumeric } = numericNames(used);
    drafts.push(...notNumericDrafts(notNumeric));
    // 4. runs
    const assembly = assembleRuns({
      sources: located.sources,
      data: used,
      failed,
      numeric,
      dumpStep: options.step ?? 'step',
    });
    drafts.push(...assembly.drafts);
    for (const d of loaded.data) {
      const rejectedRows = d.rejects.length + d.malformed.length;
      records.push({
        file: d.header.source.file,
        status: 'read',
        rows: d.rows,
        rejectedRows,
        runs: assembly.fileRuns.get(d.header.source.file) ?? [],
        kind: d.plan.kind,
      });
    }
    // 5. report
    const { metrics, problems } = metricInfos(assembly.runs, options);
    const lineProblems = await finishDrafts(drafts);
    const order = new Map(located.sources.map((s, k) => [s.file, k]));
    const files = [
      ...located.files,
      ...records.slice(located.files.length).sort((a, b) => (order.get(a.file) ?? 0) - (order.get(b.file) ?? 0)),
    ];
    const logs: RunSet = {
      mode: 'logs',
      keys: assembly.keys,
      runs: assembly.runs,
      metrics,
      tickDumps: assembly.dumps,
      files,
      problems: [...located.problems, ...lineProblems, ...problems],
    };
    // 6. digests
    const runSet = digests.size === 0 ? logs : await withDigests(engine, found, logs, digests, options);
    checkGoalNames(options, runSet);
    return runSet;
  } finally {
    closeEngine(engine);
  }
}
