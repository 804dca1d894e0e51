/**
 * Build one run from the parts of the files that hold it: stack their rows (rows.ts), apply the
 * messy-log policies to each metric (messy.ts, ticks.ts), and record a problem draft for each
 * policy applied (duplicated or unsorted steps, missing cells, empty metrics, divergence, several
 * files for one run); the run's status is `diverged`, `rejected` or `ok` here (`short` is decided
 * later over the config, markShort.ts).
 */
import { draft, type Draft, type RowRef } from '../lines/drafts.js';
import { LISTED_ROWS, type Part } from './parts.js';
import { refOf, runRows, type RunRows } from './rows.js';
import { cleanSeries, stepOrder } from './messy.js';
import { longTickSeries, wideTickSeries, type CleanedTicks } from './ticks.js';
import type { Run, RunSource, RunStatus, Series, TickSeries } from '../types.js';

/** The parts of one run, grouped by config and seed. */
export interface Group {
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

/**
 * Build one run from its group (see the module comment); problems go to `drafts`. Pure apart from
 * `drafts`; O(rows x metrics), plus a sort when steps are not increasing.
 */
export function buildRun(
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
        `${logFiles.length} files claim this config and seed: ${logFiles.join(', ')}; their rows were merged in ` +
          `that order (later rows win on repeated steps)`,
        { run: id, file: logFiles[1] as string },
      ),
    );
  if (found.duplicateSteps.size > 0) {
    let first = Infinity;
    for (const s of found.duplicateSteps) first = Math.min(first, s);
    drafts.push(
      draft(
        'steps-duplicated',
        `${found.duplicateSteps.size} step(s) logged more than once (first: step ${first}); the last row in file ` +
          `order was kept for each`,
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
