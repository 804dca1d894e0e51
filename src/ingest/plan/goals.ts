/**
 * Whether higher or lower is better for a metric (DESIGN "Inputs"): `--metric name:max|min` when
 * given, else guessed from the name and shown so that a wrong guess is visible.
 *
 * The guess: a metric is to be minimised when one of the words of its name (nameWords in
 * columns.ts: split at non-alphanumerics and lower-to-upper case changes) is exactly one of
 * `loss, error, err, perplexity, wer, regret`; otherwise it is maximised. So `val_loss`,
 * `top1_err`, `trainLoss` and `word_error_rate` are minimised; `ppl`, `nll`, `losses` and `cer`
 * are not in the list and are maximised (say `--metric ppl:min`). A per-tick metric is named by
 * its base (`val_loss@3` is `val_loss`).
 */
import { problem, type Problem } from '../../problems.js';
import { nameWords } from './columns.js';
import type { Goal, IngestOptions, MetricInfo, Run } from '../types.js';

/** Name words that mark a metric to minimise (DESIGN "Inputs"). */
export const MIN_WORDS = ['loss', 'error', 'err', 'perplexity', 'wer', 'regret'] as const;

/**
 * The goal guessed from a metric's name (see the module comment). Pure, O(length).
 * Example: `inferGoal('top1_err')` is `'min'`; `inferGoal('val_acc')` is `'max'`.
 */
export function inferGoal(name: string): Goal {
  return nameWords(name).some((w) => (MIN_WORDS as readonly string[]).includes(w)) ? 'min' : 'max';
}

/**
 * The goal of a metric and where it came from: the `--metric` option, else the name.
 * Pure. Example: `metricGoal('val_acc', { metricGoals: { val_acc: 'min' } })` is
 * `{ goal: 'min', goalSource: 'option' }`.
 */
export function metricGoal(
  name: string,
  options: Pick<IngestOptions, 'metricGoals'>,
): { goal: Goal; goalSource: 'option' | 'inferred' } {
  const given = Object.hasOwn(options.metricGoals, name) ? options.metricGoals[name] : undefined;
  return given === undefined
    ? { goal: inferGoal(name), goalSource: 'inferred' }
    : { goal: given, goalSource: 'option' };
}

/**
 * Metrics found in the runs, in first-seen order (scalars and per-tick metrics separately, a name
 * may be both), with their goals; a `goal-inferred` note for each name whose goal was guessed.
 * Pure. Example: runs with `val_loss` give
 * `{ name: 'val_loss', goal: 'min', goalSource: 'inferred', kind: 'scalar', ticks: 0 }`.
 */
export function metricInfos(
  runs: readonly Run[],
  options: Pick<IngestOptions, 'metricGoals'>,
): { metrics: MetricInfo[]; problems: Problem[] } {
  const scalars = new Set<string>();
  const ticks = new Map<string, number>();
  for (const run of runs) {
    for (const name of Object.keys(run.metrics)) scalars.add(name);
    for (const [name, t] of Object.entries(run.tickMetrics))
      ticks.set(name, Math.max(ticks.get(name) ?? 0, t.values.length));
  }
  const metrics: MetricInfo[] = [
    ...[...scalars].map((name) => ({ name, ...metricGoal(name, options), kind: 'scalar' as const, ticks: 0 })),
    ...[...ticks].map(([name, count]) => ({ name, ...metricGoal(name, options), kind: 'tick' as const, ticks: count })),
  ];
  const inferred = [...new Set(metrics.filter((m) => m.goalSource === 'inferred').map((m) => m.name))];
  const problems = inferred.map((name) => {
    const goal = (metrics.find((m) => m.name === name) as MetricInfo).goal;
    return problem(
      'goal-inferred',
      `${name}: ${goal === 'min' ? 'lower' : 'higher'} is taken to be better (from its name); say --metric ` +
        `${name}:${goal === 'min' ? 'max' : 'min'} if that is wrong`,
    );
  });
  return { metrics, problems };
}
