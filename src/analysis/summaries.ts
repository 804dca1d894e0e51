/**
 * Per-run summary values: one number per run and metric, from its series (steps sorted, finite
 * values only), as `--summary` asks (grammar in `summarySpec.ts`). Everything that compares runs
 * does so at a common horizon (`horizon.ts`), so that a longer run gets no extra chances.
 *
 * - `final`: the last value at or before the horizon.
 * - `last:P%`: the mean of the values logged in the last P% of [first step, horizon], where the
 *   first step is the metric's first step across the compared runs (one window for every run).
 * - `best`: the best value up to the horizon in the goal's direction. Optimistic: choosing the best
 *   checkpoint on the evaluation data selects on noise (the caller records 'summary-optimistic').
 * - `auc`: trapezoid area of the curve from the run's first step to the horizon (linearly
 *   interpolated at the horizon when it falls between two logged steps), divided by that span:
 *   the curve's average height.
 * - `reach:VALUE`: the first logged step at or before the horizon whose value reaches VALUE in
 *   the goal's direction; a run that never does is censored (value null).
 * - `step:N`: the value at the last logged step <= N (the horizon is not used).
 *
 * A score table has one point per run; its value is that point whatever the summary.
 * Cost O(log n) for final and step, O(n) otherwise; no allocation.
 */
import type { Goal, Series } from '../ingest/types.js';
import type { SummarySpec } from './results.js';

export interface SummaryValue {
  readonly value: number | null;
  /** Why there is no value, or how it was obtained. */
  readonly note: string | null;
  /** `reach:VALUE` never reached by the horizon. */
  readonly censored: boolean;
}

/** Where the summaries look: the common horizon and the metric's first step (null for score tables). */
export interface SummaryWindow {
  readonly horizon: number | null;
  readonly firstStep: number | null;
}

/**
 * Summarise one run's series of a metric. Never throws on data: a run without a value in the
 * window gets `value: null` and a note saying why.
 * Example: steps [0, 10, 20], values [1, 2, 4], horizon 20 → final 4, last:50% 3, best (max) 4, auc 2.25.
 */
export function summarizeSeries(series: Series, spec: SummarySpec, goal: Goal, window: SummaryWindow): SummaryValue {
  const { steps, values } = series;
  const n = steps.length;
  if (n === 0) return none('no finite value for this metric');
  const horizon = window.horizon;
  if (horizon === null) return ok(values[n - 1] as number);
  if (spec.kind === 'step') {
    const i = lastIndexAtOrBefore(steps, spec.step);
    if (i < 0) return none(`no value logged at or before step ${spec.step} (first step ${steps[0]})`);
    const last = steps[n - 1] as number;
    return {
      value: values[i] as number,
      note: last < spec.step ? `run ends at step ${last}, before step ${spec.step}` : null,
      censored: false,
    };
  }
  const end = lastIndexAtOrBefore(steps, horizon);
  if (end < 0) return none(`no value logged at or before the horizon (step ${horizon})`);
  switch (spec.kind) {
    case 'final':
      return ok(values[end] as number);
    case 'best':
      return ok(bestUpTo(values, end, goal));
    case 'auc':
      return ok(averageHeight(steps, values, end, horizon));
    case 'last':
      return lastPercent(steps, values, end, horizon, window.firstStep ?? (steps[0] as number), spec.percent);
    case 'reach': {
      for (let i = 0; i <= end; i++) {
        const v = values[i] as number;
        if (goal === 'max' ? v >= spec.value : v <= spec.value) return ok(steps[i] as number);
      }
      return { value: null, note: `never reached ${spec.value} by step ${horizon} (censored)`, censored: true };
    }
  }
}

/** Index of the last step <= limit in sorted steps, or -1 (binary search). */
export function lastIndexAtOrBefore(steps: Float64Array, limit: number): number {
  let lo = 0;
  let hi = steps.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if ((steps[mid] as number) <= limit) lo = mid + 1;
    else hi = mid;
  }
  return lo - 1;
}

function ok(value: number): SummaryValue {
  return { value, note: null, censored: false };
}

function none(note: string): SummaryValue {
  return { value: null, note, censored: false };
}

function bestUpTo(values: Float64Array, end: number, goal: Goal): number {
  let best = values[0] as number;
  for (let i = 1; i <= end; i++) {
    const v = values[i] as number;
    if (goal === 'max' ? v > best : v < best) best = v;
  }
  return best;
}

function averageHeight(steps: Float64Array, values: Float64Array, end: number, horizon: number): number {
  const start = steps[0] as number;
  if (horizon <= start) return values[0] as number;
  let area = 0;
  for (let i = 1; i <= end; i++) {
    area +=
      (((values[i - 1] as number) + (values[i] as number)) / 2) * ((steps[i] as number) - (steps[i - 1] as number));
  }
  const lastStep = steps[end] as number;
  if (lastStep < horizon && end + 1 < steps.length) {
    const s1 = steps[end + 1] as number;
    const v0 = values[end] as number;
    const atHorizon = v0 + (((values[end + 1] as number) - v0) * (horizon - lastStep)) / (s1 - lastStep);
    area += ((v0 + atHorizon) / 2) * (horizon - lastStep);
    return area / (horizon - start);
  }
  return area / (lastStep - start || 1);
}

function lastPercent(
  steps: Float64Array,
  values: Float64Array,
  end: number,
  horizon: number,
  first: number,
  percent: number,
): SummaryValue {
  const from = horizon - (percent / 100) * (horizon - first);
  let total = 0;
  let count = 0;
  for (let i = end; i >= 0 && (steps[i] as number) >= from; i--) {
    total += values[i] as number;
    count++;
  }
  if (count === 0) {
    return {
      value: values[end] as number,
      note: `no step logged in the last ${percent}% (from step ${from}); used the last value before the horizon`,
      censored: false,
    };
  }
  return ok(total / count);
}
