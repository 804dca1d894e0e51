/**
 * A sweep: a metric's summary value against one numeric config key (`sweepKeys`), one series per
 * combination of the other keys, each point the mean across seeds with its interval as
 * `Results.configValues` holds it. With a task key, each task has its own series (a config's
 * values are only comparable within its task), drawn as one panel per task with its own axis, and
 * only for studies of at most `SWEEP_TASKS` tasks. Rendered as a chart (`charts/sweepChart.ts`), in
 * the page (`cells/sweep.ts`) and as a table in summary.md. Reads `Results`; computes no statistic.
 */
import type { IntervalMethod, Results } from '../analysis/results.js';
import { taskNames } from './studyShape.js';

/** Most tasks a sweep is drawn for (one panel each); beyond, the across-task aggregates speak. */
export const SWEEP_TASKS = 6;

export interface SweepPoint {
  readonly x: number;
  readonly config: string;
  readonly mean: number;
  readonly low: number | null;
  readonly high: number | null;
  readonly n: number;
}

export interface SweepSeries {
  /** The other keys' values, `memory=4,width=128` (empty when the key is the only one), then the task's. */
  readonly label: string;
  /** The other keys' values, and the task key's when there is one. */
  readonly params: Readonly<Record<string, string>>;
  readonly points: readonly SweepPoint[];
}

export interface Sweep {
  readonly metric: string;
  readonly summary: string;
  readonly key: string;
  /** The other config keys (task key excluded), in key order. */
  readonly others: readonly string[];
  /** The task key when the series are per task (one panel each), else null. */
  readonly taskKey: string | null;
  /** The key's values, ascending. */
  readonly xs: readonly number[];
  readonly series: readonly SweepSeries[];
  /** Level and method of the points' intervals (of the last config value read). */
  readonly level: number;
  readonly method: IntervalMethod;
}

/**
 * The sweep of `metric` under `summary` against `key`, or null when no config value has a mean (or
 * the study has more than `SWEEP_TASKS` tasks). Series in the order their first config appears in
 * `Results.configs`; points by ascending key. Cost O(configs + configValues). Never throws.
 * Example: demo results, val_acc, key ticks → two series (memory=4, memory=12) of three points (8, 16, 32).
 */
export function sweepModel(results: Results, metric: string, summary: string, key: string): Sweep | null {
  const taskKey = results.settings.taskKey;
  if (taskKey !== null && taskNames(results).length > SWEEP_TASKS) return null;
  const means = new Map(
    (results.configValues ?? [])
      .filter((v) => v.metric === metric && v.summary === summary && v.mean !== null)
      .map((v) => [v.config, v]),
  );
  const others = [...new Set(results.configs.flatMap((c) => Object.keys(c.params)))].filter(
    (k) => k !== key && k !== taskKey,
  );
  const series = new Map<string, { params: Record<string, string>; points: SweepPoint[] }>();
  let level = 0.95;
  let method: IntervalMethod = 't';
  for (const c of results.configs) {
    const v = means.get(c.id);
    const raw = c.params[key];
    if (v === undefined || v.mean === null || raw === undefined) continue;
    const kept = taskKey === null ? others : [...others, taskKey];
    const params = Object.fromEntries(kept.map((k) => [k, c.params[k] ?? '']));
    const label = kept.map((k) => `${k}=${params[k]}`).join(',');
    const s = series.get(label) ?? { params, points: [] };
    s.points.push({ x: Number(raw), config: c.id, mean: v.mean, low: v.low, high: v.high, n: v.n });
    series.set(label, s);
    level = v.level;
    method = v.method;
  }
  if (series.size === 0) return null;
  const xs = [...new Set([...series.values()].flatMap((s) => s.points.map((p) => p.x)))].sort((a, b) => a - b);
  return {
    metric,
    summary,
    key,
    others,
    taskKey,
    xs,
    level,
    method,
    series: [...series].map(([label, s]) => ({
      label,
      params: s.params,
      points: [...s.points].sort((a, b) => a.x - b.x),
    })),
  };
}

/**
 * Decimals that show a sweep's points to about two significant digits of their widest interval
 * half-width (2 to 6). Cost O(points). Never throws.
 */
export function sweepDecimals(sweep: Sweep): number {
  const spread = sweep.series.flatMap((x) =>
    x.points.map((p) => (p.low === null || p.high === null ? 0 : (p.high - p.low) / 2)),
  );
  return Math.max(2, Math.min(6, 1 - Math.floor(Math.log10(Math.max(...spread, 1e-12)))));
}
