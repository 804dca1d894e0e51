/**
 * Assemble `Run`s from the parts of the files read: group parts by config and seed, apply the
 * messy-log policies to each metric (messy.ts, ticks.ts), build the tick dumps (tickDump.ts), and
 * give each run its id and status.
 *
 * - Config id: the run's params as `key=value` in `RunSet.keys` order (keys first seen first),
 *   joined by commas; run id: config + `,seed=` + seed, or `seed=S` for an empty config.
 * - Two or more log sources with one config and seed: `run-duplicate`; their rows are stacked in
 *   source order, so on a repeated step the later file's row wins.
 * - Status: `diverged` when some metric went non-finite for good (`run-diverged`; `divergedAt`
 *   the earliest such step); else `rejected` when nothing usable was read (every file unreadable
 *   or without a step column, or every row rejected, or no finite value); else `short` when
 *   `lastStep` < 0.9 x the largest `lastStep` of the config's runs that are not rejected
 *   (`run-short`); else `ok`.
 * - `lastStep`: the largest step with a finite value of any metric (per-tick metrics included);
 *   0 when there is none.
 */
import type { FileData } from '../load/loadFiles.js';
import { LISTED_ROWS, splitParts, type Part } from './parts.js';
import { draft, type Draft, type RowRef } from '../lines/drafts.js';
import { refOf, runRows, type RunRows } from './rows.js';
import { cleanSeries, stepOrder } from './messy.js';
import { buildDumps, planDump, type DumpColumns } from './tickDump.js';
import { longTickSeries, wideTickSeries, type CleanedTicks } from './ticks.js';
import type { Run, RunSource, RunStatus, Series, TickDump, TickSeries } from '../types.js';

/** What run assembly needs. */
export interface AssemblyInput {
  /** Every source located, in order (their params give `keys`). */
  readonly sources: readonly RunSource[];
  /** Files read: logs and tick dumps. */
  readonly data: readonly FileData[];
  /** Log sources of which nothing could be used (unreadable, no step column): their runs are `rejected` unless another file gives them rows. */
  readonly failed: readonly RunSource[];
  /** Metric names holding a number somewhere (assemble/rows.ts `numericNames`). */
  readonly numeric: ReadonlySet<string>;
  /** The step column name for dumps (`--step`, else `step`). */
  readonly dumpStep: string;
}

/** What run assembly gives. */
export interface Assembly {
  readonly keys: readonly string[];
  readonly runs: readonly Run[];
  readonly dumps: readonly TickDump[];
  readonly drafts: readonly Draft[];
  /** Ids of the runs built from each file. */
  readonly fileRuns: ReadonlyMap<string, readonly string[]>;
}

/**
 * Config keys in first-seen order over the sources. Pure.
 * Example: sources with params {ticks, memory} then {ticks, lr} give `['ticks', 'memory', 'lr']`.
 */
export function configKeys(sources: readonly { readonly params: Readonly<Record<string, string>> }[]): string[] {
  const keys: string[] = [];
  for (const s of sources) for (const k of Object.keys(s.params)) if (!keys.includes(k)) keys.push(k);
  return keys;
}

/**
 * Config id of a run's params (see the module comment). Pure.
 * Example: `configId({ memory: '4', ticks: '8' }, ['ticks', 'memory'])` is `'ticks=8,memory=4'`.
 */
export function configId(params: Readonly<Record<string, string>>, keys: readonly string[]): string {
  return keys
    .filter((k) => Object.hasOwn(params, k))
    .map((k) => `${k}=${params[k] as string}`)
    .join(',');
}

/** Run id from config id and seed. Example: `runId('ticks=8', '3')` is `'ticks=8,seed=3'`. */
export function runId(config: string, seed: string): string {
  return config === '' ? `seed=${seed}` : `${config},seed=${seed}`;
}

interface Group {
  readonly source: RunSource;
  readonly seed: string;
  readonly logs: Part[];
  readonly dumps: Part[];
  readonly failed: string[];
}

interface Found {
  readonly missing: string[];
  readonly duplicateSteps: Set<number>;
  firstDuplicate: RowRef | null;
  firstUnsorted: RowRef | null;
  readonly diverged: { name: string; step: number; ref: RowRef }[];
  readonly empty: string[];
}

function missingText(name: string, c: { empty: number; nonFinite: number; text: number }): string | null {
  const total = c.empty + c.nonFinite + c.text;
  if (total === 0) return null;
  const kinds = [
    c.empty > 0 ? `${c.empty} empty` : '',
    c.nonFinite > 0 ? `${c.nonFinite} nan/inf` : '',
    c.text > 0 ? `${c.text} not a number` : '',
  ].filter((s) => s !== '');
  return `${name} ${total} (${kinds.join(', ')})`;
}

/** Keep the first row found (`row` -1: none). */
function earlier(a: RowRef | null, rows: RunRows, row: number): RowRef | null {
  return a !== null || row < 0 ? a : refOf(rows, row);
}

/** Apply the policies to one table of a run's rows; fill metrics/ticks and what was found. */
function clean(
  rows: RunRows,
  long: boolean,
  found: Found,
  metrics: Record<string, Series>,
  tickMetrics: Record<string, TickSeries>,
  drafts: Draft[],
  run: string,
): void {
  const order = stepOrder(rows.steps);
  const noteTicks = (name: string, t: CleanedTicks): void => {
    tickMetrics[name] = t.series;
    const text = missingText(`${name}@*`, t);
    if (text !== null) found.missing.push(text);
    for (const s of t.duplicateSteps) found.duplicateSteps.add(s);
    found.firstDuplicate = earlier(found.firstDuplicate, rows, t.firstDuplicateRow);
    found.firstUnsorted = earlier(found.firstUnsorted, rows, t.firstUnsortedRow);
  };
  if (long) {
    const ticks = rows.ticks as Float64Array;
    let invalid: readonly number[] = [];
    for (const [name, cells] of rows.metrics) {
      const t = longTickSeries(rows.steps, ticks, order, cells);
      invalid = t.invalidTickRows;
      noteTicks(name, t);
    }
    if (invalid.length > 0)
      drafts.push(
        draft(
          'step-invalid',
          `${invalid.length} row(s) have a tick cell that is not a whole number >= 0; those rows were not used`,
          { run, rows: invalid.slice(0, LISTED_ROWS).map((i) => refOf(rows, i)) },
        ),
      );
    return;
  }
  for (const [name, cells] of rows.metrics) {
    const c = cleanSeries(rows.steps, cells, order);
    metrics[name] = c.series;
    const text = missingText(name, c);
    if (text !== null) found.missing.push(text);
    for (const s of c.duplicateSteps) found.duplicateSteps.add(s);
    found.firstDuplicate = earlier(found.firstDuplicate, rows, c.firstDuplicateRow);
    found.firstUnsorted = earlier(found.firstUnsorted, rows, c.firstUnsortedRow);
    if (c.series.divergedAt !== null)
      found.diverged.push({ name, step: c.series.divergedAt, ref: refOf(rows, c.divergedRow) });
    else if (c.series.values.length === 0) found.empty.push(name);
  }
  for (const [base, columns] of rows.wide) noteTicks(base, wideTickSeries(rows.steps, order, columns));
}

function lastFinite(metrics: Record<string, Series>, ticks: Record<string, TickSeries>): number | null {
  let last: number | null = null;
  for (const s of Object.values(metrics))
    if (s.steps.length > 0) last = Math.max(last ?? -Infinity, s.steps[s.steps.length - 1] as number);
  for (const t of Object.values(ticks)) {
    for (let i = t.steps.length - 1; i >= 0; i--) {
      if (t.values.some((v) => Number.isFinite(v[i] as number))) {
        last = Math.max(last ?? -Infinity, t.steps[i] as number);
        break;
      }
    }
  }
  return last;
}

function dumpCells(part: Part): (k: number) => Float64Array {
  return (k) => {
    const cells = part.data.cells.get(k) as Float64Array;
    if (part.rows === null) return cells;
    const out = new Float64Array(part.rows.length);
    for (let i = 0; i < part.rows.length; i++) out[i] = cells[part.rows[i] as number] as number;
    return out;
  };
}

/** Build one run from its group; problems go to `drafts`. */
function buildRun(
  group: Group,
  id: string,
  config: string,
  numeric: ReadonlySet<string>,
  drafts: Draft[],
): Omit<Run, 'status'> & { status: RunStatus } {
  const metrics: Record<string, Series> = {};
  const tickMetrics: Record<string, TickSeries> = {};
  const found: Found = {
    missing: [],
    duplicateSteps: new Set(),
    firstDuplicate: null,
    firstUnsorted: null,
    diverged: [],
    empty: [],
  };
  const files = [...new Set([...group.logs.map((p) => p.data.header.source.file), ...group.failed])];
  const oneFile = files.length === 1 ? { file: files[0] as string } : {};
  for (const long of [false, true]) {
    const parts = group.logs.filter((p) => (p.data.plan.tick !== null) === long);
    if (parts.length === 0) continue;
    const built = runRows(parts, numeric);
    drafts.push(...built.drafts.map((d) => ({ ...d, run: id })));
    clean(built.rows, long, found, metrics, tickMetrics, drafts, id);
  }
  const logFiles = [...new Set(group.logs.map((p) => p.data.header.source.file))];
  if (logFiles.length > 1)
    drafts.push(
      draft(
        'run-duplicate',
        `${logFiles.length} files claim this config and seed: ${logFiles.join(', ')}; their rows were merged in that order (later rows win on repeated steps)`,
        { run: id, file: logFiles[1] as string },
      ),
    );
  if (found.duplicateSteps.size > 0) {
    let first = Infinity;
    for (const s of found.duplicateSteps) first = Math.min(first, s);
    drafts.push(
      draft(
        'steps-duplicated',
        `${found.duplicateSteps.size} step(s) logged more than once (first: step ${first}); the last row in file order was kept for each`,
        { run: id, ...oneFile, rows: found.firstDuplicate === null ? [] : [found.firstDuplicate] },
      ),
    );
  }
  if (found.firstUnsorted !== null)
    drafts.push(
      draft('steps-unsorted', 'steps are not in increasing order; they were sorted', {
        run: id,
        rows: [found.firstUnsorted],
      }),
    );
  if (found.missing.length > 0)
    drafts.push(
      draft('cells-missing', `cells treated as missing: ${found.missing.join('; ')}`, { run: id, ...oneFile }),
    );
  for (const name of found.empty)
    drafts.push(draft('metric-empty', `${name} has no finite value in this run`, { run: id, ...oneFile }));
  let divergedAt: number | null = null;
  if (found.diverged.length > 0) {
    const first = found.diverged.reduce((a, b) => (b.step < a.step ? b : a));
    divergedAt = first.step;
    const names = found.diverged.map((d) => `${d.name} (step ${d.step})`).join(', ');
    drafts.push(
      draft(
        'run-diverged',
        `went non-finite and stayed so: ${names}; the run is marked diverged at step ${divergedAt}`,
        { run: id, rows: [first.ref] },
      ),
    );
  }
  const last = lastFinite(metrics, tickMetrics);
  const status: RunStatus = divergedAt !== null ? 'diverged' : last === null ? 'rejected' : 'ok';
  if (status === 'rejected' && group.logs.length > 0)
    drafts.push(
      draft('metric-empty', 'no finite metric value was read for this run; it is marked rejected', {
        run: id,
        ...oneFile,
      }),
    );
  return {
    id,
    config,
    params: group.source.params,
    seed: group.seed,
    info: group.source.info,
    files,
    identity: group.source.identity,
    metrics,
    tickMetrics,
    status,
    lastStep: last ?? 0,
    divergedAt,
  };
}

/**
 * Mark runs short (see the module comment): an `ok` run whose lastStep is below 0.9 x the largest
 * lastStep of its config's runs that are not rejected becomes `short`, with a `run-short` draft.
 * Mutates the runs' status; also used after merging digests (mergeRunSets.ts). Cost O(runs).
 * Example: lastSteps 1300 and 2000 in one config mark the first short.
 */
export function markShort(runs: (Omit<Run, 'status'> & { status: RunStatus })[], drafts: Draft[]): void {
  const longest = new Map<string, number>();
  for (const r of runs)
    if (r.status !== 'rejected') longest.set(r.config, Math.max(longest.get(r.config) ?? -Infinity, r.lastStep));
  for (const r of runs) {
    const max = longest.get(r.config);
    // `< max` too: with a negative last step, 0.9 x max lies above max and the longest run itself would be short.
    if (r.status !== 'ok' || max === undefined || !(r.lastStep < max && r.lastStep < 0.9 * max)) continue;
    r.status = 'short';
    const where = r.files.length === 1 ? { run: r.id, file: r.files[0] as string } : { run: r.id };
    drafts.push(
      draft(
        'run-short',
        `the run ends at step ${r.lastStep}, below 90% of the longest run of its config (step ${max})`,
        where,
      ),
    );
  }
}

/**
 * Assemble the runs and tick dumps of the files read (see the module comment). Pure (no I/O):
 * problems come back as drafts whose rows become lines in lines/drafts.ts. Cost: O(rows x metrics),
 * plus a sort for runs whose steps are not increasing; the arrays of a clean single-file run are
 * shared with the file's, not copied.
 * Example: two files of `ticks=8/seed=1` and `ticks=8/seed=2` give runs `ticks=8,seed=1` and `ticks=8,seed=2`.
 */
export function assembleRuns(input: AssemblyInput): Assembly {
  const keys = configKeys(input.sources);
  const drafts: Draft[] = [];
  const groups = new Map<string, Group>();
  const fileRuns = new Map<string, string[]>();
  const groupOf = (source: RunSource, seed: string): { id: string; group: Group } => {
    const id = runId(configId(source.params, keys), seed);
    let group = groups.get(id);
    if (group === undefined) {
      group = { source, seed, logs: [], dumps: [], failed: [] };
      groups.set(id, group);
    }
    return { id, group };
  };
  const dumpPlans = new Map<FileData, DumpColumns>();
  for (const data of input.data) {
    const split = splitParts(data);
    drafts.push(...split.drafts);
    const ids: string[] = [];
    for (const part of split.parts) {
      const { id, group } = groupOf(data.header.source, part.seed);
      (data.plan.kind === 'tick-dump' ? group.dumps : group.logs).push(part);
      if (!ids.includes(id)) ids.push(id);
    }
    fileRuns.set(data.header.source.file, ids);
    if (data.plan.kind === 'tick-dump') {
      const plan = planDump(data.plan.names, input.dumpStep);
      if ('missing' in plan)
        drafts.push(
          draft('tick-dump-invalid', `a tick dump (it has sample and tick columns) lacks ${plan.missing}; not used`, {
            file: data.header.source.file,
          }),
        );
      else dumpPlans.set(data, plan);
    }
  }
  for (const source of input.failed) {
    if (source.seed === null) continue;
    const { id, group } = groupOf(source, source.seed);
    group.failed.push(source.file);
    fileRuns.set(source.file, [id]);
  }
  const runs: (Omit<Run, 'status'> & { status: RunStatus })[] = [];
  const dumps: TickDump[] = [];
  for (const [id, group] of groups) {
    const config = configId(group.source.params, keys);
    if (group.logs.length > 0 || group.failed.length > 0) runs.push(buildRun(group, id, config, input.numeric, drafts));
    for (const part of group.dumps) {
      const plan = dumpPlans.get(part.data);
      if (plan === undefined) continue;
      const rows = part.rows === null ? part.data.rows : part.rows.length;
      const built = buildDumps(dumpCells(part), rows, plan);
      const file = part.data.header.source.file;
      if ('invalid' in built) {
        const { row, reason } = built.invalid;
        const ref: RowRef[] =
          row < 0 ? [] : [{ data: part.data, kind: 'row', n: part.rows === null ? row : (part.rows[row] as number) }];
        drafts.push(draft('tick-dump-invalid', `tick dump not used: ${reason}`, { file, run: id, rows: ref }));
        continue;
      }
      for (const g of built.dumps) dumps.push({ run: id, config, seed: group.seed, file, ...g });
    }
  }
  markShort(runs, drafts);
  return { keys, runs, dumps, drafts, fileRuns };
}
