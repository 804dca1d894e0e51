/**
 * The step a comparison is made at (METHODS.md, "The step a comparison is made at"): each
 * comparison has its own step, the last step that every run of both arms reached, in that task,
 * counting only runs that are neither diverged nor short. Those are failures of their arm: counted,
 * listed, and excluded or scored worst by the failure policy (`--failed`). So one crashed run
 * elsewhere in the study never moves another comparison's step, and a crashed run inside the
 * comparison does not move it either. `step:N` fixes the step at N. Score tables have no steps.
 *
 * Also here: what counts as a failure of a run for a metric, and the "typical logging interval"
 * of a series (the median gap between its logged steps) by which a value logged long before the
 * comparison's step is flagged. Pure; cost O(runs) plus O(points) for the interval.
 */
import type { Run, Series } from '../ingest/types.js';
import type { SummarySpec } from './results.js';

/** Why a run is a failure of its arm for a comparison. */
export type Failure = 'diverged' | 'short';

export interface ComparisonStep {
  /** The step, or null when no non-failed run has a value (or for score tables). */
  readonly step: number | null;
  /** The run that ends first among those counted (sets the step), or null. */
  readonly setBy: string | null;
  /** First logged step across the same runs (start of `last:P%`), or null. */
  readonly firstStep: number | null;
  /** Last step of the longest non-failed run counted, or null. */
  readonly longest: number | null;
}

/** Whether a run counts as diverged for a metric (the run as a whole, or this metric's series). */
export function isDiverged(run: Run, metric: string): boolean {
  return run.status === 'diverged' || (run.metrics[metric]?.divergedAt ?? null) !== null;
}

/** The failure of a run for a metric (diverged first), or null. Ingest marks `short` runs. */
export function runFailure(run: Run, metric: string): Failure | null {
  if (isDiverged(run, metric)) return 'diverged';
  return run.status === 'short' ? 'short' : null;
}

/**
 * The step of a comparison between the runs given (both arms of one pair in one task).
 * Example: non-failed runs ending at 1000, 900 and 1000, and a short run ending at 300, give
 * `{ step: 900, ... }`; with `step:N` the step is N.
 */
export function comparisonStep(
  runs: readonly Run[],
  metric: string,
  spec: SummarySpec,
  mode: 'logs' | 'scores',
): ComparisonStep {
  const none = { step: null, setBy: null, firstStep: null, longest: null };
  if (mode === 'scores') return none;
  let step = Infinity;
  let setBy: string | null = null;
  let first = Infinity;
  let longest = -Infinity;
  for (const run of runs) {
    const s = run.metrics[metric];
    if (s === undefined || s.steps.length === 0 || runFailure(run, metric) !== null) continue;
    const last = s.steps[s.steps.length - 1] as number;
    if (last < step) {
      step = last;
      setBy = run.id;
    }
    longest = Math.max(longest, last);
    first = Math.min(first, s.steps[0] as number);
  }
  if (setBy === null) return spec.kind === 'step' ? { ...none, step: spec.step } : none;
  if (spec.kind === 'step') return { step: spec.step, setBy: null, firstStep: first, longest };
  return { step, setBy, firstStep: first, longest };
}

/**
 * A series' typical logging interval: the median gap between consecutive logged steps, or null
 * with fewer than 2 points. Example: steps 0, 10, 20, 50 give 10.
 */
export function typicalInterval(series: Series): number | null {
  const n = series.steps.length;
  if (n < 2) return null;
  const gaps = new Float64Array(n - 1);
  for (let i = 1; i < n; i++) gaps[i - 1] = (series.steps[i] as number) - (series.steps[i - 1] as number);
  gaps.sort();
  const m = n - 1;
  return m % 2 === 1 ? (gaps[(m - 1) / 2] as number) : ((gaps[m / 2 - 1] as number) + (gaps[m / 2] as number)) / 2;
}
