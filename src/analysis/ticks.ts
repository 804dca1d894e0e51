/**
 * A per-tick metric (accuracy by internal tick, METHODS.md tick-level analyses) across seeds: per
 * config, the value of every tick at one summary step in each run, then per tick the mean across
 * seeds with its Student t-interval (band `t`), the earliest tick that is as good as the best one
 * within a tolerance, the between-example binomial noise when the evaluation size is known, and a
 * per-tick Welch comparison with a baseline config, Holm-corrected across ticks.
 *
 * Conventions (each one is a choice; the report states them):
 * - Summary step of a run: the last step <= `opts.step` at which some tick has a finite value (the
 *   run's last such step when `opts.step` is null). A tick whose cell is missing at that step gives
 *   no value for that run; `n` counts the runs that gave a value per tick. `step` of a curve is the
 *   summary step when all its runs used the same one, else null.
 * - Runs with status `diverged` are left out and counted in `diverged`.
 * - Earliest good tick: the earliest tick whose mean is within `tolerance` of the best tick's mean in
 *   the goal's direction (>= best - tolerance for max, <= best + tolerance for min). Default
 *   tolerance: 1% of the range (largest minus smallest) of this config's tick means. Its interval:
 *   each run's own earliest good tick (same tolerance, against that run's best tick), then the
 *   t-interval of those ticks across runs. It describes the spread of the per-run earliest ticks and
 *   need not contain the tick found on the mean curve.
 * - Example noise: sqrt(p(1-p)/m) per tick with p the tick mean, when `opts.examples` (m) is given
 *   and every value of the config lies in [0, 1]; otherwise null.
 * - Versus baseline: two-sided Welch test per tick (config minus baseline), Holm across the ticks
 *   that have a p-value. A tick gets no p-value (verdict inconclusive) when either arm has fewer than
 *   2 values or both arms have zero variance. `better`/`worse` need adjusted p < alpha and the
 *   difference in / against the goal direction. When `opts.baseline` names no config that has this
 *   metric, every curve's `versusBaseline` is null, as the baseline's own is.
 *
 * Cost O(runs x ticks) for the curves plus one Welch test per tick per config.
 */
import type { MetricInfo, Run, TickDump, TickSeries } from '../ingest/types.js';
import { holm } from '../stats/holm.js';
import { binomialHalfWidth } from '../stats/binomialHalfWidth.js';
import { mean, variance } from '../stats/moments.js';
import { welch } from '../stats/welch.js';
import type { TickCurve, Verdict } from './results.js';
import { seedMeanInterval } from './seedMeanInterval.js';

export interface TickCurveOptions {
  readonly step: number | null;
  readonly level: number;
  readonly alpha: number;
  readonly baseline: string | null;
  readonly tolerance?: number;
  readonly examples?: number | null;
  /**
   * Examples evaluated per config (from its per-sample tick dumps), taking precedence over
   * `examples` for the configs it names.
   */
  readonly examplesByConfig?: ReadonlyMap<string, number>;
}

/** The runs of one config: each used run's tick values (NaN where missing) at its summary step. */
interface ConfigTicks {
  readonly config: string;
  readonly ticks: number;
  readonly runs: { readonly values: Float64Array; readonly step: number }[];
  diverged: number;
}

/** Index of the last step <= `step` (any step when null) at which some tick is finite, else -1. */
function summaryIndex(series: TickSeries, step: number | null): number {
  for (let i = series.steps.length - 1; i >= 0; i--) {
    if (step !== null && (series.steps[i] as number) > step) continue;
    for (const tick of series.values) if (Number.isFinite(tick[i] as number)) return i;
  }
  return -1;
}

function groupByConfig(runs: readonly Run[], metric: string, step: number | null): ConfigTicks[] {
  const groups = new Map<
    string,
    { config: string; ticks: number; runs: { values: Float64Array; step: number }[]; diverged: number }
  >();
  for (const run of runs) {
    const series = run.tickMetrics[metric];
    if (series === undefined) continue;
    let g = groups.get(run.config);
    if (g === undefined) {
      g = { config: run.config, ticks: 0, runs: [], diverged: 0 };
      groups.set(run.config, g);
    }
    g.ticks = Math.max(g.ticks, series.values.length);
    if (run.status === 'diverged') {
      g.diverged++;
      continue;
    }
    const i = summaryIndex(series, step);
    if (i < 0) continue;
    g.runs.push({
      values: Float64Array.from(series.values, (tick) => tick[i] as number),
      step: series.steps[i] as number,
    });
  }
  return [...groups.values()];
}

/** Finite values of tick k across a config's runs. */
function tickValues(g: ConfigTicks, k: number): number[] {
  const out: number[] = [];
  for (const r of g.runs) {
    const v = r.values[k];
    if (v !== undefined && Number.isFinite(v)) out.push(v);
  }
  return out;
}

/** Earliest index whose value is within `tolerance` of the best in the goal's direction; -1 if none. */
function earliestWithin(values: readonly (number | null)[], goal: 'max' | 'min', tolerance: number): number {
  let best: number | null = null;
  for (const v of values) if (v !== null && (best === null || (goal === 'max' ? v > best : v < best))) best = v;
  if (best === null) return -1;
  const bar = best;
  return values.findIndex((v) => v !== null && (goal === 'max' ? v >= bar - tolerance : v <= bar + tolerance));
}

function earliestGood(
  g: ConfigTicks,
  means: readonly (number | null)[],
  goal: 'max' | 'min',
  level: number,
  tolerance: number | undefined,
): TickCurve['earliestGood'] {
  const present = means.filter((m): m is number => m !== null);
  if (present.length === 0) return null;
  const tol = tolerance ?? 0.01 * (Math.max(...present) - Math.min(...present));
  const tick = earliestWithin(means, goal, tol);
  const perRun: number[] = [];
  for (const r of g.runs) {
    const k = earliestWithin(
      Array.from(r.values, (v) => (Number.isFinite(v) ? v : null)),
      goal,
      tol,
    );
    if (k >= 0) perRun.push(k);
  }
  const spread = seedMeanInterval(perRun, level);
  return { tick, low: spread.low, high: spread.high, tolerance: tol };
}

function exampleNoise(
  g: ConfigTicks,
  means: readonly (number | null)[],
  examples: number | null | undefined,
): (number | null)[] | null {
  if (examples === null || examples === undefined) return null;
  let any = false;
  for (const r of g.runs) {
    for (const v of r.values) {
      if (!Number.isFinite(v)) continue;
      if (v < 0 || v > 1) return null;
      any = true;
    }
  }
  if (!any) return null;
  return means.map((m) => (m === null ? null : binomialHalfWidth(m, examples)));
}

function versusBaseline(
  g: ConfigTicks,
  base: ConfigTicks,
  goal: 'max' | 'min',
  alpha: number,
): NonNullable<TickCurve['versusBaseline']> {
  const ticks = Math.max(g.ticks, base.ticks);
  const rows: { tick: number; difference: number | null; p: number | null }[] = [];
  for (let k = 0; k < ticks; k++) {
    const x = tickValues(g, k);
    const y = tickValues(base, k);
    const difference = x.length > 0 && y.length > 0 ? mean(x) - mean(y) : null;
    const testable = x.length >= 2 && y.length >= 2 && !(variance(x) === 0 && variance(y) === 0);
    rows.push({ tick: k, difference, p: testable ? welch(x, y).p : null });
  }
  const tested = rows.filter((r) => r.p !== null);
  const adjusted = holm(tested.map((r) => r.p as number));
  const adjustedOf = new Map(tested.map((r, i) => [r.tick, adjusted[i] as number]));
  return rows.map((r) => {
    const pAdjusted = adjustedOf.get(r.tick) ?? null;
    let verdict: Verdict = 'inconclusive';
    if (pAdjusted !== null && r.difference !== null && pAdjusted < alpha && r.difference !== 0) {
      verdict = r.difference > 0 === (goal === 'max') ? 'better' : 'worse';
    }
    return { tick: r.tick, difference: r.difference, pAdjusted, verdict };
  });
}

/**
 * Per-tick curves of one tick metric, one per config (in order of first appearance in `runs`).
 * Cost O(runs x ticks) plus a Welch test per tick. Throws a RangeError when `alpha` is not in
 * (0, 1), when `tolerance` is negative or not finite, or when `examples` is not a positive integer.
 * Example: `tickCurves(runs, valAcc, { step: null, level: 0.95, alpha: 0.05, baseline: 'ticks=8' })`.
 */
export function tickCurves(runs: readonly Run[], metric: MetricInfo, opts: TickCurveOptions): TickCurve[] {
  if (!(opts.alpha > 0 && opts.alpha < 1))
    throw new RangeError(`tickCurves: alpha must lie in (0, 1), got ${opts.alpha}`);
  if (opts.tolerance !== undefined && !(opts.tolerance >= 0 && Number.isFinite(opts.tolerance))) {
    throw new RangeError(`tickCurves: tolerance must be a finite number >= 0, got ${opts.tolerance}`);
  }
  const examples = opts.examples;
  if (examples !== undefined && examples !== null && !(Number.isInteger(examples) && examples >= 1)) {
    throw new RangeError(`tickCurves: examples must be a positive integer, got ${examples}`);
  }
  const groups = groupByConfig(runs, metric.name, opts.step);
  const base = opts.baseline === null ? undefined : groups.find((g) => g.config === opts.baseline);
  return groups.map((g) => {
    const ticks = Array.from({ length: g.ticks }, (_, k) => k);
    const cells = ticks.map((k) => {
      const values = tickValues(g, k);
      return { n: values.length, ...seedMeanInterval(values, opts.level) };
    });
    const means = cells.map((c) => c.mean);
    const steps = new Set(g.runs.map((r) => r.step));
    return {
      metric: metric.name,
      config: g.config,
      step: steps.size === 1 ? ([...steps][0] as number) : null,
      ticks,
      mean: means,
      low: cells.map((c) => c.low),
      high: cells.map((c) => c.high),
      n: cells.map((c) => c.n),
      band: 't',
      exampleHalfWidth: exampleNoise(g, means, opts.examplesByConfig?.get(g.config) ?? examples),
      earliestGood: earliestGood(g, means, metric.goal ?? 'max', opts.level, opts.tolerance),
      versusBaseline:
        base === undefined || base === g ? null : versusBaseline(g, base, metric.goal ?? 'max', opts.alpha),
      diverged: g.diverged,
    };
  });
}

/** A tick metric whose name reads as a share of correct examples (acc, accuracy, correct). */
export const ACCURACY_NAME = /acc|correct/i;

/**
 * The number of examples each config's evaluation used, as its per-sample tick dumps show it: the
 * fewest samples in any of its dumps (a smaller m gives the wider between-example band).
 * Cost O(dumps). Never throws.
 * Example: dumps of 300 and 280 samples for config a → `Map { 'a' => 280 }`.
 */
export function examplesFromDumps(dumps: readonly TickDump[]): Map<string, number> {
  const out = new Map<string, number>();
  for (const d of dumps) if (d.samples > 0) out.set(d.config, Math.min(out.get(d.config) ?? d.samples, d.samples));
  return out;
}
