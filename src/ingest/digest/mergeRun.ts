/**
 * Two runs with one id, from two parts of a merge (mergeRunSets.ts), made one: series merged step
 * by step, the later part's value winning on a step both have (as raw logs stacked in file order);
 * a divergence taken from the part whose series reaches further, and dropped if a finite value of
 * the other part comes after it; missing counts added; status `diverged`, `rejected` or `ok` again
 * (`short` is decided after the merge, over the config).
 */
import type { Run, RunStatus, Series, TickSeries } from '../types.js';

/** A run while merging (its status is decided again afterwards). */
export type MergedRun = Omit<Run, 'status'> & { status: RunStatus };

/**
 * Union of two sorted step lists; at a step both have, `b` wins. Returns the source of each step
 * (>= 0: index in a; < 0: -1 - index in b).
 */
function mergeSteps(a: Float64Array, b: Float64Array): { steps: Float64Array; from: Int32Array } {
  const steps = new Float64Array(a.length + b.length);
  const from = new Int32Array(a.length + b.length);
  let i = 0;
  let j = 0;
  let k = 0;
  while (i < a.length || j < b.length) {
    const sa = a[i] as number;
    const sb = b[j] as number;
    if (j < b.length && (i >= a.length || sb <= sa)) {
      if (i < a.length && sa === sb) i++;
      steps[k] = sb;
      from[k++] = -1 - j++;
    } else {
      steps[k] = sa;
      from[k++] = i++;
    }
  }
  return { steps: steps.slice(0, k), from: from.slice(0, k) };
}

function lastOf(steps: Float64Array): number {
  return steps.length === 0 ? -Infinity : (steps[steps.length - 1] as number);
}

function mergeSeries(a: Series, b: Series): Series {
  const { steps, from } = mergeSteps(a.steps, b.steps);
  const values = new Float64Array(steps.length);
  for (let k = 0; k < from.length; k++) {
    const f = from[k] as number;
    values[k] = (f >= 0 ? a.values[f] : b.values[-1 - f]) as number;
  }
  const end = (s: Series): number => Math.max(lastOf(s.steps), s.divergedAt ?? -Infinity);
  let divergedAt = (end(b) >= end(a) ? b : a).divergedAt;
  if (divergedAt !== null && lastOf(steps) >= divergedAt) divergedAt = null;
  return { steps, values, divergedAt, missing: a.missing + b.missing };
}

function mergeTicks(a: TickSeries, b: TickSeries): TickSeries {
  const { steps, from } = mergeSteps(a.steps, b.steps);
  const ticks = Math.max(a.values.length, b.values.length);
  const values = Array.from({ length: ticks }, (_, t) => {
    const out = new Float64Array(steps.length);
    for (let k = 0; k < from.length; k++) {
      const f = from[k] as number;
      const column = f >= 0 ? a.values[t] : b.values[t];
      out[k] = column === undefined ? NaN : (column[f >= 0 ? f : -1 - f] as number);
    }
    return out;
  });
  return { steps, values };
}

function mergeRecords<T>(
  a: Readonly<Record<string, T>>,
  b: Readonly<Record<string, T>>,
  both: (x: T, y: T) => T,
): Record<string, T> {
  const out: Record<string, T> = { ...a };
  for (const [name, y] of Object.entries(b)) {
    const x = out[name];
    out[name] = x === undefined ? y : both(x, y);
  }
  return out;
}

/** Largest step with a finite value of any metric (types.ts `Run.lastStep`), null when none. */
function lastFinite(run: Pick<Run, 'metrics' | 'tickMetrics'>): number | null {
  let last = -Infinity;
  for (const s of Object.values(run.metrics)) last = Math.max(last, lastOf(s.steps));
  for (const t of Object.values(run.tickMetrics)) {
    for (let i = t.steps.length - 1; i >= 0 && (t.steps[i] as number) > last; i--) {
      if (t.values.some((v) => Number.isFinite(v[i] as number))) last = t.steps[i] as number;
    }
  }
  return last === -Infinity ? null : last;
}

/** Two runs with one id merged (see the module comment). */
export function mergeRun(a: MergedRun, b: Run): MergedRun {
  const metrics = mergeRecords(a.metrics, b.metrics, mergeSeries);
  const tickMetrics = mergeRecords(a.tickMetrics, b.tickMetrics, mergeTicks);
  let divergedAt: number | null = null;
  for (const s of Object.values(metrics))
    if (s.divergedAt !== null && (divergedAt === null || s.divergedAt < divergedAt)) divergedAt = s.divergedAt;
  const last = lastFinite({ metrics, tickMetrics });
  const status: RunStatus = divergedAt !== null ? 'diverged' : last === null ? 'rejected' : 'ok';
  return {
    ...a,
    files: [...new Set([...a.files, ...b.files])],
    metrics,
    tickMetrics,
    status,
    lastStep: last ?? 0,
    divergedAt,
  };
}
