/**
 * Per-run summary values. Two uses:
 * - `runOutcome`: one run's value for one comparison, at that comparison's step, with the step the
 *   value was logged at, whether the run is a failure of its arm (diverged, short, or `step:N`
 *   beyond its end), whether it is censored (`reach:VALUE`), and whether the value is stale
 *   (logged more than one of the run's typical logging intervals before the step);
 * - `metricValues`: every run's value for one metric (the `values` of `Results`), each config at
 *   its own step (the last step all its non-failed runs reached), with the problems that belong to
 *   the metric as a whole: censored `reach:VALUE` runs ('summary-censored') and the optimism of
 *   `best` ('summary-optimistic', once per metric).
 *
 * A failed run gets no value of its own: under `--failed exclude` it is left out, under `worst`
 * each comparison scores it as the worst value observed in that comparison (the note says so).
 * Pure; cost O(runs x log points).
 */
import type { Goal, Run } from '../ingest/types.js';
import { problem, type Problem } from '../problems.js';
import { comparisonStep, runFailure, typicalInterval, type Failure } from './comparisonStep.js';
import type { FailedPolicy, RunValue, SummarySpec } from './results.js';
import { summarizeSeries, type SummaryWindow } from './summaries.js';
import { SUMMARY_KINDS } from './summaryKinds.js';

/** One run's value for one comparison. */
export interface RunOutcome {
  readonly run: string;
  readonly seed: string;
  readonly config: string;
  /** The summary value (for `reach:VALUE`: steps to reach, or the censoring step); null for a failure or no value. */
  readonly value: number | null;
  /** Step of the last logged point the value uses. */
  readonly loggedAt: number | null;
  readonly failed: Failure | null;
  /** `reach:VALUE` not reached by the comparison's step. */
  readonly censored: boolean;
  /** Logged more than one typical logging interval before the comparison's step. */
  readonly stale: boolean;
  readonly note: string | null;
}

/**
 * The value of one run at a comparison's step.
 * Example: a series ending at step 300 under `step:1000` gives `{ value: null, failed: 'short', ... }`.
 */
export function runOutcome(
  run: Run,
  metric: string,
  goal: Goal,
  spec: SummarySpec,
  window: SummaryWindow,
  mode: 'logs' | 'scores',
): RunOutcome {
  const base = { run: run.id, seed: run.seed, config: run.config };
  const empty = { value: null, loggedAt: null, censored: false, stale: false };
  const series = run.metrics[metric];
  if (series === undefined || series.steps.length === 0) {
    return {
      ...base,
      ...empty,
      failed: null,
      note: mode === 'scores' ? 'no score (empty cell)' : 'no finite value for this metric',
    };
  }
  const failure = mode === 'logs' ? runFailure(run, metric) : null;
  if (failure === 'diverged') {
    const at = series.divergedAt ?? run.divergedAt;
    return { ...base, ...empty, failed: failure, note: at === null ? 'diverged' : `diverged at step ${at}` };
  }
  if (failure === 'short') {
    return { ...base, ...empty, failed: failure, note: `short: stopped at step ${run.lastStep}` };
  }
  const s = summarizeSeries(series, spec, goal, window);
  const interval = typicalInterval(series);
  const stale =
    mode === 'logs' &&
    !SUMMARY_KINDS[spec.kind].timeToEvent &&
    s.loggedAt !== null &&
    window.horizon !== null &&
    interval !== null &&
    window.horizon - s.loggedAt > interval;
  return {
    ...base,
    value: s.value,
    loggedAt: s.loggedAt,
    failed: s.short ? 'short' : null,
    censored: s.censored,
    stale,
    note: s.note,
  };
}

export interface MetricValues {
  readonly values: readonly RunValue[];
  /** Per run id: its value (null when none) and whether it failed. */
  readonly byRun: ReadonlyMap<string, { readonly value: number | null; readonly failed: boolean }>;
  readonly problems: readonly Problem[];
}

/**
 * Summarise every run (in the order given) for one metric, each config at its own step.
 * `compared` holds the config ids that take part in at least one comparison.
 * Example: `metricValues(runs, 'val_acc', 'max', { kind: 'final' }, 'final', 'exclude', compared, 'logs')`.
 */
export function metricValues(
  runs: readonly Run[],
  metric: string,
  goal: Goal,
  spec: SummarySpec,
  summary: string,
  policy: FailedPolicy,
  compared: ReadonlySet<string>,
  mode: 'logs' | 'scores',
): MetricValues {
  const byConfig = new Map<string, Run[]>();
  for (const run of runs) byConfig.set(run.config, [...(byConfig.get(run.config) ?? []), run]);
  const windows = new Map<string, SummaryWindow>();
  for (const [config, list] of byConfig) {
    const step = comparisonStep(list, metric, spec, mode);
    windows.set(config, { horizon: step.step, firstStep: step.firstStep });
  }
  const values: RunValue[] = [];
  const byRun = new Map<string, { value: number | null; failed: boolean }>();
  let censored = 0;
  let summarised = 0;
  for (const run of runs) {
    const window = windows.get(run.config) ?? { horizon: null, firstStep: null };
    const o = runOutcome(run, metric, goal, spec, window, mode);
    const inComparison = compared.has(run.config);
    let note = o.note;
    if (o.failed !== null)
      note =
        `${o.note ?? o.failed}: ` +
        (policy === 'exclude' ? 'left out of the tests' : 'counted as the worst value of each comparison');
    else if (o.value !== null) {
      summarised++;
      if (o.censored) censored++;
    }
    values.push({
      metric,
      summary,
      run: run.id,
      config: run.config,
      seed: run.seed,
      value: o.failed === null ? o.value : null,
      step: window.horizon,
      loggedAt: o.failed === null ? o.loggedAt : null,
      note,
      usedInTests: inComparison && (o.failed === null ? o.value !== null : policy === 'worst'),
    });
    byRun.set(run.id, { value: o.failed === null ? o.value : null, failed: o.failed !== null });
  }
  const problems: Problem[] = [];
  if (mode === 'logs' && spec.kind === 'reach' && censored > 0) {
    problems.push(
      problem(
        'summary-censored',
        `${metric} (${summary}): ${censored} of ${summarised} runs had not reached ${spec.value} by their ` +
          `comparison's step; they are censored there and kept in the log-rank test (never dropped)`,
      ),
    );
  }
  if (mode === 'logs' && spec.kind === 'best' && summarised > 0) {
    problems.push(
      problem(
        'summary-optimistic',
        `${metric} (best): the best checkpoint is chosen on the same evaluation it is scored on, so it is ` +
          `optimistic; prefer final or last:P% for claims`,
      ),
    );
  }
  return { values, byRun, problems };
}
