/**
 * The ingest stage: from the PATHs on the command line (or a score table) to a `RunSet`, as
 * numbered steps, each handing the next a typed record:
 *
 *   1. locate    find the files and what their paths say (config, seed)    → Inputs     locate/
 *   2. plan      read each file's header and plan its columns             → Planned    plan/
 *   3. load      read the rows with DuckDB, one call per batch             → Loaded     load/
 *   4. assemble  split files into runs, apply the messy-log policies       → Assembly   assemble/
 *   5. lines     problems with exact lines, metrics and goals, file records → RunSet    lines/
 *   6. digest    digests found in step 1, read and merged with the logs     → RunSet    digest/
 *
 * A score table (`--scores`) is one step of its own (scores/). How runs are named (the reading
 * mode, readingMode.ts) was chosen and checked at the edge; `options` holds it resolved.
 *
 * One DuckDB instance per call (default threads), closed at the end whatever happens. A file
 * that cannot be used is listed with a problem and ingest goes on; only what the user typed
 * (a missing PATH, a bad option) or a digest that cannot be used throws a SeedsiftError.
 */
import type { ProgressHook } from '../progress.js';
import { assembleRuns } from './assemble/assembleRuns.js';
import { withDigests } from './digest/withDigests.js';
import { closeEngine, openEngine } from './load/duckdb.js';
import { loadPlanned } from './load/loadPlanned.js';
import { logRunSet } from './lines/logRunSet.js';
import { locateInputs } from './locate/locateInputs.js';
import { checkGoalNames } from './plan/namedColumns.js';
import { planFiles } from './plan/planFiles.js';
import { scoreRunSet } from './scores/readScores.js';
import type { IngestOptions, RunSet } from './types.js';

/** Optional observers of a long ingest (the command line shows progress on a terminal). */
export interface IngestHooks {
  /** Called as work advances: `stage` is 'headers' or 'reading', with files done of total. */
  readonly progress?: ProgressHook;
}

/**
 * Read every run under `paths` (or the `--scores` table) into a RunSet (see the module comment).
 * Throws SeedsiftError('usage' | 'input') only for what the user typed or supplied (from locate,
 * or a digest that cannot be used: digest/readDigest.ts, digest/mergeRunSets.ts). Cost: dominated
 * by DuckDB parsing the files (measured on a shared 2-core machine: 500 runs x 20,000 rows x 4
 * columns, 315 MB of CSV, in 5 to 9 s with a peak RSS of 0.6 to 0.7 GB);
 * memory about 8 bytes per number kept, plus one batch of DuckDB results.
 * Example: `await ingest(['runs'], options)` with runs/ticks=8/seed=1/log.csv gives one run `ticks=8,seed=1`.
 */
export async function ingest(
  paths: readonly string[],
  options: IngestOptions,
  hooks: IngestHooks = {},
): Promise<RunSet> {
  const progress = hooks.progress ?? ((): void => undefined);
  const engine = await openEngine();
  try {
    if (options.mode.kind === 'scores') return await scoreRunSet(engine, options.mode, options);
    // 1. locate
    const inputs = await locateInputs(engine, paths, options);
    const located = inputs.logs;
    // 2. plan
    const planned = await planFiles(engine, located.sources, options, progress);
    // 3. load
    const loaded = await loadPlanned(engine, planned.toRead, progress);
    // 4. assemble
    const assembly = assembleRuns({
      sources: located.sources,
      data: loaded.used,
      failed: [...planned.failed, ...loaded.failed],
      numeric: loaded.numeric,
      dumpStep: options.step ?? 'step',
    });
    // 5. lines
    const logs = await logRunSet({ located, planned, loaded, assembly }, options);
    // 6. digest
    const runSet = inputs.digests.size === 0 ? logs : await withDigests(engine, inputs, logs, options);
    checkGoalNames(options, runSet);
    return runSet;
  } finally {
    closeEngine(engine);
  }
}
