/**
 * Every comparison of one scalar metric (all pairs, all tasks), each at its own step
 * (`comparisonStep.ts`): the runs of both arms are summarised at that step (`runValues.ts`), the
 * step-related problems are recorded ('step-early' when one arm's runs all stop well before the
 * other's, 'value-stale' when a value was logged more than one typical logging interval before
 * the step, 'step-beyond-run' when `step:N` lies past a run's end), then `compareMetric` tests,
 * adjusts across the family and decides. A metric whose goal is unknown is summarised and
 * compared as if higher were better, and its comparisons say the direction only (`directionOnly.ts`).
 * Pure.
 */
import type { MetricInfo, Run } from '../ingest/types.js';
import { problem, type Problem } from '../problems.js';
import { compareMetric, type ComparisonRequest, type PowerCache } from './compare.js';
import { comparisonStep } from './comparisonStep.js';
import type { Comparison } from './comparisonTypes.js';
import { directionOnly } from './directionOnly.js';
import type { ResolvedOptions } from './options.js';
import type { Pairing } from './pairing.js';
import { runOutcome } from './runValues.js';
import { summaryGoal } from './summarySpec.js';

/** Share of the longest non-failed run's span below which a comparison's step is flagged (as for `run-short`). */
export const EARLY_STEP_SHARE = 0.9;

/**
 * The comparisons of one metric and the problems about their steps.
 * Example: with a baseline whose runs all stop at step 1 and candidates at 1000, that pair is
 * compared at step 1 (flagged 'step-early') and every other pair keeps its own step.
 */
export function metricComparisons(
  info: MetricInfo,
  runsByConfig: ReadonlyMap<string, readonly Run[]>,
  pairing: Pairing,
  options: ResolvedOptions,
  mode: 'logs' | 'scores',
  cache: PowerCache,
): { comparisons: Comparison[]; problems: Problem[] } {
  const problems: Problem[] = [];
  const spec = options.summary;
  // A metric whose goal is unknown is summarised and compared as "higher" (direction only).
  const direction = info.goal ?? 'max';
  const goal = summaryGoal(spec, direction);
  const requests: ComparisonRequest[] = [];
  for (const p of pairing.pairs) {
    const baseRuns = runsByConfig.get(p.baselineConfig) ?? [];
    const candRuns = runsByConfig.get(p.candidateConfig) ?? [];
    const step = comparisonStep([...baseRuns, ...candRuns], info.name, spec, mode);
    const window = { horizon: step.step, firstStep: step.firstStep };
    const outcome = (run: Run) => runOutcome(run, info.name, direction, spec, window, mode);
    const request: ComparisonRequest = {
      metric: info.name,
      goal,
      goalInferred: info.goalSource === 'inferred',
      summary: options.summaryText,
      reachValue: spec.kind === 'reach' ? spec.value : null,
      task: p.task,
      baseline: p.baseline,
      candidate: p.candidate,
      step: step.step,
      baselineRuns: baseRuns.map(outcome),
      candidateRuns: candRuns.map(outcome),
    };
    requests.push(request);
    const where =
      `${info.name} (${options.summaryText}${p.task === null ? '' : `, task ${p.task}`}), ` +
      `${p.candidate} v ${p.baseline}`;
    if (
      spec.kind !== 'step' &&
      step.step !== null &&
      step.longest !== null &&
      step.firstStep !== null &&
      step.step - step.firstStep < EARLY_STEP_SHARE * (step.longest - step.firstStep)
    ) {
      problems.push(
        problem(
          'step-early',
          `${where}: compared at step ${step.step}, where ${step.setBy} stops, while the longest run of the two ` +
            `arms reaches step ${step.longest}; only this comparison uses that step`,
        ),
      );
    }
    const all = [...request.baselineRuns, ...request.candidateRuns];
    const stale = all.filter((o) => o.stale);
    if (stale.length > 0) {
      problems.push(
        problem(
          'value-stale',
          `${where}: ${stale.length} run${stale.length === 1 ? '' : 's'} logged ${info.name} more than one ` +
            `typical logging interval before the comparison's step ${step.step} ` +
            `(${stale.map((o) => `${o.run} at step ${o.loggedAt}`).join('; ')})`,
        ),
      );
    }
    if (spec.kind === 'step') {
      const ingestShort = new Set([...baseRuns, ...candRuns].filter((r) => r.status === 'short').map((r) => r.id));
      const beyond = all.filter((o) => o.failed === 'short' && !ingestShort.has(o.run));
      if (beyond.length > 0) {
        problems.push(
          problem(
            'step-beyond-run',
            `${where}: ${beyond.length} run${beyond.length === 1 ? ' ends' : 's end'} before step ${spec.step} ` +
              `(${beyond.map((o) => o.run).join('; ')}); short for this comparison, counted as failures of their arm`,
          ),
        );
      }
    }
  }
  const result = compareMetric(requests, options, cache);
  const comparisons = info.goal === null ? result.comparisons.map(directionOnly) : result.comparisons;
  return { comparisons, problems: [...problems, ...result.problems] };
}
