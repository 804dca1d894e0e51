/**
 * The common horizon of a metric: the last step that every compared run reached, so that run
 * summaries compare like with like (DESIGN.md, "runs of different lengths").
 *
 * Diverged runs never set the horizon, under either `--diverged` policy: under `exclude` they are
 * not compared, and under `worst` their value is replaced by the worst value of the comparison, so
 * the step at which they stopped says nothing about the others. Runs without a finite value for
 * the metric do not set it either (they have no value to compare). Cost O(runs).
 */
import type { Run } from '../ingest/types.js';

export interface Horizon {
  /** Last step every compared run reached, or null when no run has a value (or for score tables). */
  readonly step: number | null;
  /** The run that ends first (sets the horizon), or null. */
  readonly setBy: string | null;
  /** Metric's first step across the same runs, or null. */
  readonly firstStep: number | null;
}

/** Whether a run counts as diverged for a metric (the run as a whole, or this metric's series). */
export function isDiverged(run: Run, metric: string): boolean {
  return run.status === 'diverged' || (run.metrics[metric]?.divergedAt ?? null) !== null;
}

/**
 * The common horizon of `metric` over `runs` (the runs of the configs being compared).
 * Example: runs ending at steps 1000, 900 and 1000 give `{ step: 900, setBy: <that run>, ... }`.
 */
export function commonHorizon(runs: readonly Run[], metric: string, mode: 'logs' | 'scores'): Horizon {
  if (mode === 'scores') return { step: null, setBy: null, firstStep: null };
  let step = Infinity;
  let setBy: string | null = null;
  let first = Infinity;
  for (const run of runs) {
    const s = run.metrics[metric];
    if (s === undefined || s.steps.length === 0 || isDiverged(run, metric)) continue;
    const last = s.steps[s.steps.length - 1] as number;
    if (last < step) {
      step = last;
      setBy = run.id;
    }
    first = Math.min(first, s.steps[0] as number);
  }
  return setBy === null ? { step: null, setBy: null, firstStep: null } : { step, setBy, firstStep: first };
}
