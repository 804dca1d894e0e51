/**
 * What was read, as the records of the results contract: configs, runs and metric step ranges.
 * Used by `scan` (which stops here) and by `analyze` (which goes on to compare).
 */
import type { RunSet, Run } from '../ingest/types.js';
import type { ConfigRecord, MetricRecord, RunRecord } from './results.js';

export interface Inventory {
  readonly configs: readonly ConfigRecord[];
  readonly runs: readonly RunRecord[];
  readonly metrics: readonly MetricRecord[];
}

/** Compare strings with numbers inside them by value ("ticks=8" before "ticks=16"). */
export const naturalCompare = new Intl.Collator('en', { numeric: true, sensitivity: 'variant' }).compare;

/** Configs ordered by their parameter values in key order (numeric-aware), then runs by seed. */
export function orderRuns(runSet: RunSet): Run[] {
  const byParams = (a: Run, b: Run): number => {
    for (const key of runSet.keys) {
      const c = naturalCompare(a.params[key] ?? '', b.params[key] ?? '');
      if (c !== 0) return c;
    }
    return naturalCompare(a.seed, b.seed);
  };
  return [...runSet.runs].sort(byParams);
}

/** Build the inventory records of a run set (pure; runs in `orderRuns` order). */
export function inventory(runSet: RunSet): Inventory {
  const runs = orderRuns(runSet);
  const configs = new Map<string, { params: Run['params']; seeds: string[]; diverged: number; short: number }>();
  for (const run of runs) {
    const entry = configs.get(run.config) ?? { params: run.params, seeds: [], diverged: 0, short: 0 };
    entry.seeds.push(run.seed);
    if (run.status === 'diverged') entry.diverged++;
    if (run.status === 'short') entry.short++;
    configs.set(run.config, entry);
  }
  const problemsByRun = new Map<string, string[]>();
  for (const p of runSet.problems) {
    if (p.run === undefined) continue;
    const list = problemsByRun.get(p.run) ?? [];
    list.push(p.message);
    problemsByRun.set(p.run, list);
  }
  return {
    configs: [...configs].map(([id, c]) => ({
      id,
      params: c.params,
      seeds: c.seeds,
      runs: c.seeds.length,
      diverged: c.diverged,
      short: c.short,
    })),
    runs: runs.map((r) => ({
      id: r.id,
      config: r.config,
      seed: r.seed,
      params: r.params,
      info: r.info,
      files: r.files,
      identity: r.identity,
      status: r.status,
      lastStep: r.lastStep,
      divergedAt: r.divergedAt,
      problems: problemsByRun.get(r.id) ?? [],
    })),
    metrics: runSet.metrics.map((m) => {
      const range = stepRange(runs, m.name, m.kind);
      return {
        name: m.name,
        goal: m.goal,
        goalSource: m.goalSource,
        kind: m.kind,
        ticks: m.ticks,
        horizon: null,
        firstStep: range?.first ?? null,
        lastStep: range?.last ?? null,
      };
    }),
  };
}

function stepRange(
  runs: readonly Run[],
  metric: string,
  kind: 'scalar' | 'tick',
): { first: number; last: number } | null {
  let first = Infinity;
  let last = -Infinity;
  for (const run of runs) {
    const steps = kind === 'scalar' ? run.metrics[metric]?.steps : run.tickMetrics[metric]?.steps;
    if (steps === undefined || steps.length === 0) continue;
    first = Math.min(first, steps[0] as number);
    last = Math.max(last, steps[steps.length - 1] as number);
  }
  return first === Infinity ? null : { first, last };
}
