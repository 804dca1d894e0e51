/**
 * The summary values of every run for one metric (the `values` of `Results`), with the problems
 * that belong to the metric as a whole: censored `reach:VALUE` runs ('summary-censored', saying
 * how many) and the optimism of `best` ('summary-optimistic', once per metric).
 *
 * A diverged run gets no value of its own: under `--diverged exclude` it is left out, under
 * `worst` each comparison counts it as the worst value observed in that comparison (the note says
 * so). `usedInTests` is true for the runs of configs that take part in a comparison and that give
 * a value to the tests (diverged runs included under `worst`). Pure; cost O(runs x log points).
 */
import type { Goal, Run } from '../ingest/types.js';
import { problem, type Problem } from '../problems.js';
import { isDiverged } from './horizon.js';
import type { DivergedPolicy, RunValue, SummarySpec } from './results.js';
import { summarizeSeries, type SummaryWindow } from './summaries.js';

export interface MetricValues {
  readonly values: readonly RunValue[];
  /** Per run id: its value (null when none) and whether it counts as diverged. */
  readonly byRun: ReadonlyMap<string, { readonly value: number | null; readonly diverged: boolean }>;
  readonly problems: readonly Problem[];
}

/**
 * Summarise every run (in the order given) for one metric.
 * `compared` holds the config ids that take part in at least one comparison.
 * Example: `metricValues(runs, 'val_acc', 'max', { kind: 'final' }, 'final', window, 'exclude', compared, 'logs')`.
 */
export function metricValues(
  runs: readonly Run[],
  metric: string,
  goal: Goal,
  spec: SummarySpec,
  summary: string,
  window: SummaryWindow,
  policy: DivergedPolicy,
  compared: ReadonlySet<string>,
  mode: 'logs' | 'scores',
): MetricValues {
  const values: RunValue[] = [];
  const byRun = new Map<string, { value: number | null; diverged: boolean }>();
  let censored = 0;
  let summarised = 0;
  for (const run of runs) {
    const series = run.metrics[metric];
    const inComparison = compared.has(run.config);
    const base = { metric, summary, run: run.id, config: run.config, seed: run.seed };
    if (series === undefined || series.steps.length === 0) {
      values.push({
        ...base,
        value: null,
        note: mode === 'scores' ? 'no score (empty cell)' : 'no finite value for this metric',
        usedInTests: false,
      });
      byRun.set(run.id, { value: null, diverged: false });
      continue;
    }
    if (mode === 'logs' && isDiverged(run, metric)) {
      const at = series.divergedAt ?? run.divergedAt;
      const where = at === null ? 'diverged' : `diverged at step ${at}`;
      const note =
        policy === 'exclude'
          ? `${where}: left out of the tests`
          : `${where}: counted as the worst value of each comparison`;
      values.push({ ...base, value: null, note, usedInTests: inComparison && policy === 'worst' });
      byRun.set(run.id, { value: null, diverged: true });
      continue;
    }
    const s = summarizeSeries(series, spec, goal, window);
    summarised++;
    if (s.censored) censored++;
    values.push({ ...base, value: s.value, note: s.note, usedInTests: inComparison && s.value !== null });
    byRun.set(run.id, { value: s.value, diverged: false });
  }
  const problems: Problem[] = [];
  if (mode === 'logs' && spec.kind === 'reach' && censored > 0) {
    problems.push(
      problem(
        'summary-censored',
        `${metric} (${summary}): ${censored} of ${summarised} runs never reached ${spec.value} by the horizon (step ${window.horizon}); they are censored and left out of the tests, which favours configs that fail more often`,
      ),
    );
  }
  if (mode === 'logs' && spec.kind === 'best' && summarised > 0) {
    problems.push(
      problem(
        'summary-optimistic',
        `${metric} (best): the best checkpoint is chosen on the same evaluation it is scored on, so it is optimistic; prefer final or last:P% for claims`,
      ),
    );
  }
  return { values, byRun, problems };
}
