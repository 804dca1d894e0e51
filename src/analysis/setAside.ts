/**
 * Which numeric columns are metrics. A log holds bookkeeping beside its metrics (wall-clock time,
 * time stamps, epoch counters, preemption counts, learning-rate schedules, cumulative counts); a
 * comparison of those is noise at best and a false verdict at worst. Two rules set a column aside
 * (not compared by default; listed, with how to include it):
 *
 * - **its name marks bookkeeping** (`MetricInfo.bookkeeping`, decided in ingest by
 *   `bookkeepingName`, src/ingest/goals.ts): a word such as `time`, `timestamp`, `elapsed`,
 *   `epoch`, `preemptions`, `lr`, and no metric word (`epoch_loss` is compared);
 * - **it counts**: no name rule gives it a goal, and in every run with two or more points its
 *   values never decrease (cumulative time, epoch, total samples seen), with at least one run of
 *   three or more points; a column constant within every run is set aside the same way.
 *
 * A goal given with `--metric NAME:max|min`, or naming the column in `--metrics` or `--as-metric`,
 * makes it a metric again. Score tables (one value per run) are judged by name only. Tick metrics
 * are never set aside. Pure; cost O(total points of the scalar metrics).
 */
import type { MetricInfo, RunSet } from '../ingest/types.js';

export interface SetAsideColumn {
  readonly name: string;
  /** `name`: its name marks bookkeeping; `counter`: its values never decrease; `constant`: they never change. */
  readonly reason: 'name' | 'counter' | 'constant';
  /** Why, in words, and how to compare it anyway. */
  readonly message: string;
}

/**
 * The scalar metrics set aside as bookkeeping (see the module comment), in metric order. `wanted`
 * are names the user asked to compare (`--metrics`, `--as-metric`): never set aside.
 * Example: a run set with `val_acc` and a `wall_time` column gives one entry, `wall_time` (name).
 */
export function setAsideColumns(runSet: RunSet, wanted: readonly string[] = []): SetAsideColumn[] {
  const out: SetAsideColumn[] = [];
  for (const info of runSet.metrics) {
    if (info.kind !== 'scalar' || info.goalSource === 'option' || wanted.includes(info.name)) continue;
    const reason = info.bookkeeping === true ? 'name' : runSet.mode === 'logs' ? counting(runSet, info) : null;
    if (reason === null) continue;
    const why =
      reason === 'name'
        ? 'its name marks bookkeeping (time, epoch, counts, schedule)'
        : reason === 'counter'
          ? 'its values never decrease within a run (a counter or cumulative total)'
          : 'its value never changes within a run';
    out.push({
      name: info.name,
      reason,
      message:
        `${info.name}: not compared, ${why}; to compare it, say --as-metric ${info.name} (or ` +
        `--metric ${info.name}:max|min)`,
    });
  }
  return out;
}

function counting(runSet: RunSet, info: MetricInfo): 'counter' | 'constant' | null {
  if (info.goal !== null) return null;
  let long = false;
  let rises = false;
  for (const run of runSet.runs) {
    const values = run.metrics[info.name]?.values;
    if (values === undefined || values.length < 2) continue;
    if (values.length >= 3) long = true;
    for (let i = 1; i < values.length; i++) {
      const step = (values[i] as number) - (values[i - 1] as number);
      if (step < 0) return null;
      if (step > 0) rises = true;
    }
  }
  if (!long) return null;
  return rises ? 'counter' : 'constant';
}

/**
 * Problems without the goal notes (`goal-inferred`, `goal-unknown`) of metrics that are not
 * compared (set aside, or left out by `--metrics`): their goal does not matter.
 */
export function withoutUncomparedGoals<P extends { readonly code: string; readonly message: string }>(
  problems: readonly P[],
  compared: readonly string[],
): P[] {
  return problems.filter(
    (p) =>
      (p.code !== 'goal-unknown' && p.code !== 'goal-inferred') ||
      compared.some((name) => p.message.startsWith(`${name}: `)),
  );
}
