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
import { splitParts, type Part } from './parts.js';
import { draft, type Draft, type RowRef } from '../lines/drafts.js';
import { buildRun, type Group } from './buildRun.js';
import { markShort } from './markShort.js';
import { configId, configKeys, runId } from './runIds.js';
import { buildDumps, planDump, type DumpColumns } from './tickDump.js';
import type { Run, RunSource, RunStatus, TickDump } from '../types.js';

/** What run assembly needs. */
export interface AssemblyInput {
  /** Every source located, in order (their params give `keys`). */
  readonly sources: readonly RunSource[];
  /** Files read: logs and tick dumps. */
  readonly data: readonly FileData[];
  /**
   * Log sources of which nothing could be used (unreadable, no step column): their runs are `rejected` unless another
   * file gives them rows.
   */
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

function dumpCells(part: Part): (k: number) => Float64Array {
  return (k) => {
    const cells = part.data.cells.get(k) as Float64Array;
    if (part.rows === null) return cells;
    const out = new Float64Array(part.rows.length);
    for (let i = 0; i < part.rows.length; i++) out[i] = cells[part.rows[i] as number] as number;
    return out;
  };
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
