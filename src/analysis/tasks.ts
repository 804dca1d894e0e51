/**
 * Aggregates across tasks or evaluation sets (`--task-key`), after Agarwal, Schwarzer, Castro,
 * Courville & Bellemare (2021), "Deep reinforcement learning at the edge of the statistical
 * precipice" (NeurIPS):
 * - the interquartile mean (IQM) of all task x run scores of a config, with a stratified
 *   percentile bootstrap interval (runs resampled within each task, `stratifiedBootstrap`);
 * - the probability of improvement over the config's baseline (its counterpart under `--baseline`),
 *   P(X > Y) + P(X = Y)/2 in the goal's direction, computed per task and averaged over the tasks
 *   where both have scores;
 * - the performance profile: the fraction of the config's task x run scores better than each of a
 *   shared grid of thresholds (`> t` for a goal of max, `< t` for min), 41 thresholds evenly spaced
 *   from the smallest to the largest score of the metric.
 * Scores are first normalised per task (`normaliseTaskScores`, METHODS.md): min-max over all runs
 * of that task, so a task scored in hundreds and one scored in fractions weigh alike; only tasks
 * every compared group has a score on are aggregated, and the others are named (`leftOut`).
 * Cost per config: `resamples` x O(scores log scores).
 */
import type { Goal } from '../ingest/types.js';
import { interquartileMean } from '../stats/interquartileMean.js';
import { createRandom, deriveSeed } from '../stats/random.js';
import { stratifiedBootstrap } from '../stats/stratifiedBootstrap.js';
import type { TaskAggregate } from './results.js';

/** One run's score on one task (values used in the tests only). */
export interface TaskScore {
  readonly task: string;
  /** Config id without the task key (the comparison group). */
  readonly group: string;
  readonly value: number;
}

export interface TaskSettings {
  readonly level: number;
  readonly resamples: number;
  readonly seed: number;
  /** Tasks left out before these scores (set when the scores were normalised by `normaliseTaskScores`). */
  readonly leftOut?: readonly string[];
}

/**
 * Per-task min-max normalisation (METHODS.md, "Several tasks"): each score becomes
 * (value - min) / (max - min) over all scores of its task (0 when the task's scores are all equal),
 * keeping only tasks on which every group in `groups` has at least one score. For a goal of `min`
 * the scale keeps its direction (lower is still better). Returns the kept scores and the tasks
 * left out, in first-seen order.
 * Cost O(scores). Never throws.
 * Example: task a scores 10 and 30 → 0 and 1; task b held by one group of two → left out.
 */
export function normaliseTaskScores(
  scores: readonly TaskScore[],
  groups: readonly string[],
): { readonly scores: TaskScore[]; readonly leftOut: string[] } {
  const byTask = new Map<string, { groups: Set<string>; low: number; high: number }>();
  for (const s of scores) {
    const t = byTask.get(s.task) ?? { groups: new Set<string>(), low: Infinity, high: -Infinity };
    t.groups.add(s.group);
    t.low = Math.min(t.low, s.value);
    t.high = Math.max(t.high, s.value);
    byTask.set(s.task, t);
  }
  const leftOut = [...byTask].filter(([, t]) => groups.some((g) => !t.groups.has(g))).map(([task]) => task);
  const out: TaskScore[] = [];
  for (const s of scores) {
    const t = byTask.get(s.task);
    if (t === undefined || leftOut.includes(s.task)) continue;
    out.push({ ...s, value: t.high > t.low ? (s.value - t.low) / (t.high - t.low) : 0 });
  }
  return { scores: out, leftOut };
}

/** Thresholds of the performance profile. */
export const PROFILE_POINTS = 41;

/**
 * The task aggregates of one metric, one per group in the given order (groups without any score
 * are left out). `baselineOf` maps a group to its baseline group (absent: no probability of improvement).
 * Example: two groups over three tasks give two records, each with `tasks: 3`.
 */
export function taskAggregates(
  metric: string,
  goal: Goal,
  groups: readonly string[],
  scores: readonly TaskScore[],
  baselineOf: ReadonlyMap<string, string>,
  settings: TaskSettings,
): TaskAggregate[] {
  const byGroup = new Map<string, Map<string, number[]>>();
  let lowest = Infinity;
  let highest = -Infinity;
  for (const s of scores) {
    const tasks = byGroup.get(s.group) ?? new Map<string, number[]>();
    const list = tasks.get(s.task) ?? [];
    list.push(s.value);
    tasks.set(s.task, list);
    byGroup.set(s.group, tasks);
    lowest = Math.min(lowest, s.value);
    highest = Math.max(highest, s.value);
  }
  const thresholds = profileThresholds(lowest, highest);
  const extra = { normalisation: 'min-max per task' as const, leftOut: [...(settings.leftOut ?? [])] };
  const out: TaskAggregate[] = [];
  for (const group of groups) {
    const tasks = byGroup.get(group);
    if (tasks === undefined) continue;
    const strata = [...tasks.values()].map((v) => Float64Array.from(v));
    const all = Float64Array.from(strata.flatMap((s) => [...s]));
    const iqm = interquartileMean(all);
    let low: number | null = null;
    let high: number | null = null;
    if (all.length >= 2) {
      const random = createRandom(deriveSeed(settings.seed, `tasks|${metric}|${group}`));
      try {
        const boot = stratifiedBootstrap(strata, (resampled) => interquartileMean(concat(resampled)), random, {
          resamples: settings.resamples,
          level: settings.level,
        });
        low = boot.low;
        high = boot.high;
      } catch (error) {
        if (!(error instanceof RangeError)) throw error; // no interval; the IQM stands alone
      }
    }
    const baseline = baselineOf.get(group) ?? null;
    out.push({
      metric,
      config: group,
      interquartileMean: iqm,
      low,
      high,
      tasks: tasks.size,
      probabilityOfImprovement: baseline === null ? null : averageImprovement(tasks, byGroup.get(baseline), goal),
      baseline,
      profile: { thresholds, fraction: thresholds.map((t) => fractionBetter(all, t, goal)) },
      ...(settings.leftOut === undefined ? {} : extra),
    });
  }
  return out;
}

function profileThresholds(lowest: number, highest: number): number[] {
  if (!Number.isFinite(lowest)) return [];
  if (highest === lowest) return [lowest];
  const out: number[] = [];
  for (let i = 0; i < PROFILE_POINTS; i++) out.push(lowest + ((highest - lowest) * i) / (PROFILE_POINTS - 1));
  return out;
}

function fractionBetter(x: Float64Array, threshold: number, goal: Goal): number {
  let k = 0;
  for (let i = 0; i < x.length; i++) {
    const v = x[i] as number;
    if (goal === 'max' ? v > threshold : v < threshold) k++;
  }
  return k / x.length;
}

/** P(X better than Y) + P(X = Y)/2 by counting all pairs (Mann-Whitney U / (n1 n2)), oriented to the goal. */
export function probabilityOfImprovement(x: ArrayLike<number>, y: ArrayLike<number>, goal: Goal): number {
  let score = 0;
  for (let i = 0; i < x.length; i++) {
    for (let j = 0; j < y.length; j++) {
      const a = x[i] as number;
      const b = y[j] as number;
      if (a === b) score += 0.5;
      else if (goal === 'max' ? a > b : a < b) score += 1;
    }
  }
  return score / (x.length * y.length);
}

function averageImprovement(
  tasks: ReadonlyMap<string, number[]>,
  baseline: ReadonlyMap<string, number[]> | undefined,
  goal: Goal,
): number | null {
  if (baseline === undefined) return null;
  let total = 0;
  let count = 0;
  for (const [task, values] of tasks) {
    const other = baseline.get(task);
    if (other === undefined || other.length === 0 || values.length === 0) continue;
    total += probabilityOfImprovement(values, other, goal);
    count++;
  }
  return count === 0 ? null : total / count;
}

function concat(parts: readonly Float64Array[]): Float64Array {
  let n = 0;
  for (const p of parts) n += p.length;
  const out = new Float64Array(n);
  let k = 0;
  for (const p of parts) {
    out.set(p, k);
    k += p.length;
  }
  return out;
}
