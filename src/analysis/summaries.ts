/**
 * Per-run summary values: one number per run and metric, from its series (steps sorted, finite
 * values only), as `--summary` asks. Each kind's rule lives in `summaryKinds.ts` (one table keyed
 * by kind); this file holds the dispatch and the numeric helpers the rules share.
 *
 * Everything that compares runs does so at the comparison's step (`comparisonStep.ts`), passed
 * here as `window.horizon`, so that a longer run gets no extra chances. Besides the value, each
 * result keeps the step the value was logged at (`loggedAt`), so a value logged long before the
 * comparison's step can be flagged, and says whether the run is short for this comparison
 * (`step:N` beyond its last step) or censored (`reach:VALUE` not reached).
 *
 * A score table has one point per run; its value is that point whatever the summary.
 * Cost O(log n) for final and step, O(n) otherwise; no allocation.
 */
import type { Goal, Series } from '../ingest/types.js';
import type { SummarySpec } from './results.js';
import { kindOf } from './summaryKinds.js';

export interface SummaryValue {
  /** The run's value; for `reach:VALUE` the steps to reach, or the censoring step when `censored`. */
  readonly value: number | null;
  /** Step of the last logged point the value uses (null when there is no value). */
  readonly loggedAt: number | null;
  /** Why there is no value, or how it was obtained. */
  readonly note: string | null;
  /** `reach:VALUE` not reached by the comparison's step: `value` is the censoring step. */
  readonly censored: boolean;
  /** `step:N` beyond the run's last step: the run is short for this comparison. */
  readonly short: boolean;
}

/** Where the summaries look: the comparison's step and the first step of the window (null for score tables). */
export interface SummaryWindow {
  /** The comparison's step (the end of every summary's window). */
  readonly horizon: number | null;
  /** First step of the metric across the compared runs (start of `last:P%`). */
  readonly firstStep: number | null;
}

/**
 * Summarise one run's series of a metric. Never throws on data: a run without a value in the
 * window gets `value: null` and a note saying why.
 * Example: steps [0, 10, 20], values [1, 2, 4], step 20 → final 4, last:50% 3, best (max) 4, auc 2.25.
 */
export function summarizeSeries(series: Series, spec: SummarySpec, goal: Goal, window: SummaryWindow): SummaryValue {
  const { steps, values } = series;
  const n = steps.length;
  if (n === 0) return none('no finite value for this metric');
  const horizon = window.horizon;
  if (horizon === null)
    return {
      value: values[n - 1] as number,
      loggedAt: steps[n - 1] as number,
      note: null,
      censored: false,
      short: false,
    };
  const entry = kindOf(spec) as {
    compute: (s: Series, spec: SummarySpec, g: Goal, w: { horizon: number; firstStep: number | null }) => SummaryValue;
  };
  if (spec.kind !== 'step' && lastIndexAtOrBefore(steps, horizon) < 0)
    return none(`no value logged at or before the comparison's step ${horizon}`);
  return entry.compute(series, spec, goal, { horizon, firstStep: window.firstStep });
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

function none(note: string): SummaryValue {
  return { value: null, loggedAt: null, note, censored: false, short: false };
}

/** The best of values[0..end] in the goal's direction. */
export function bestUpTo(values: Float64Array, end: number, goal: Goal): number {
  let best = values[0] as number;
  for (let i = 1; i <= end; i++) {
    const v = values[i] as number;
    if (goal === 'max' ? v > best : v < best) best = v;
  }
  return best;
}

/** Trapezoid area from the first step to `horizon` (interpolated there when it falls between steps), over the span. */
export function averageHeight(steps: Float64Array, values: Float64Array, end: number, horizon: number): number {
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

/** Mean of the values in the last `percent`% of [first, horizon]; the last value before it when none. */
export function lastPercent(
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
  const loggedAt = steps[end] as number;
  if (count === 0) {
    return {
      value: values[end] as number,
      loggedAt,
      note:
        `no step logged in the last ${percent}% (from step ${from}); used the last value before the ` +
        `comparison's step`,
      censored: false,
      short: false,
    };
  }
  return { value: total / count, loggedAt, note: null, censored: false, short: false };
}
