/**
 * Whether higher or lower is better for a metric (DESIGN "Inputs"): `--metric name:max|min` when
 * given, else guessed from the name and shown so that a wrong guess is visible.
 *
 * The name rules: a metric is to be minimised when one of the words of its name (nameWords in
 * columns.ts: split at non-alphanumerics and lower-to-upper case changes) is exactly one of
 * `loss, error, err, perplexity, wer, regret`, and maximised when one is one of `MAX_WORDS`
 * (`acc`, `accuracy`, `f1`, `auc`, `reward`, ...; common practice). So `val_loss`, `top1_err`,
 * `trainLoss` and `word_error_rate` are minimised and `val_acc` maximised. A name no rule knows
 * (`ppl`, `nll`, `score`, `certainty`) has goal null, source `unknown`: its comparisons show the
 * direction only (METHODS.md "Verdict") until the user says `--metric ppl:min`. A min word wins
 * over a max word (`acc_loss` is minimised). A per-tick metric is named by its base (`val_loss@3`
 * is `val_loss`).
 */
import { problem, type Problem } from '../../problems.js';
import type { Goal, IngestOptions, MetricInfo, Run } from '../types.js';
import { nameWords } from './columns.js';

/** Name words that mark a metric to minimise (DESIGN "Inputs"). */
export const MIN_WORDS = ['loss', 'error', 'err', 'perplexity', 'wer', 'regret'] as const;

/** Name words that mark a metric to maximise (common practice for these measures). */
export const MAX_WORDS = [
  'acc',
  'accuracy',
  'top1',
  'top5',
  'f1',
  'auc',
  'auroc',
  'precision',
  'recall',
  'reward',
  'return',
  'bleu',
  'rouge',
  'iou',
  'miou',
  'map',
  'success',
] as const;

/**
 * The goal a name rule gives a metric (see the module comment), or null when no rule knows the
 * name. Pure, O(length).
 * Example: `inferGoal('top1_err')` is `'min'`; `inferGoal('val_acc')` is `'max'`; `inferGoal('ppl')` is null.
 */
export function inferGoal(name: string): Goal | null {
  const words = nameWords(name);
  if (words.some((w) => (MIN_WORDS as readonly string[]).includes(w))) return 'min';
  return words.some((w) => (MAX_WORDS as readonly string[]).includes(w)) ? 'max' : null;
}

/**
 * The goal of a metric and where it came from: the `--metric` option, else a name rule, else
 * null (`unknown`).
 * Pure. Example: `metricGoal('val_acc', { metricGoals: { val_acc: 'min' } })` is
 * `{ goal: 'min', goalSource: 'option' }`.
 */
export function metricGoal(
  name: string,
  options: Pick<IngestOptions, 'metricGoals'>,
): Pick<MetricInfo, 'goal' | 'goalSource'> {
  const given = Object.hasOwn(options.metricGoals, name) ? options.metricGoals[name] : undefined;
  if (given !== undefined) return { goal: given, goalSource: 'option' };
  const goal = inferGoal(name);
  return goal === null ? { goal, goalSource: 'unknown' } : { goal, goalSource: 'inferred' };
}

/** Name words that mark a bookkeeping column (common practice in training logs). */
export const BOOKKEEPING_WORDS = [
  'time',
  'times',
  'timestamp',
  'walltime',
  'wallclock',
  'clock',
  'elapsed',
  'duration',
  'seconds',
  'secs',
  'sec',
  'minutes',
  'hours',
  'date',
  'datetime',
  'epoch',
  'epochs',
  'preemption',
  'preemptions',
  'preempted',
  'restarts',
  'lr',
  'throughput',
] as const;

/** Whether a name marks bookkeeping: a bookkeeping word and no metric word. */
export function bookkeepingName(name: string): boolean {
  const words = nameWords(name);
  const metricWord = words.some(
    (w) => (MIN_WORDS as readonly string[]).includes(w) || (MAX_WORDS as readonly string[]).includes(w),
  );
  const learningRate = words.some((w, i) => w === 'learning' && words[i + 1] === 'rate');
  return !metricWord && (learningRate || words.some((w) => (BOOKKEEPING_WORDS as readonly string[]).includes(w)));
}

/**
 * Metrics found in the runs, in first-seen order (scalars and per-tick metrics separately, a name
 * may be both), with their goals; a `goal-inferred` note for each name whose goal a name rule gave,
 * a `goal-unknown` note for each name no rule knows.
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
    ...[...scalars].map((name) => ({
      name,
      ...metricGoal(name, options),
      bookkeeping: bookkeepingName(name),
      kind: 'scalar' as const,
      ticks: 0,
    })),
    ...[...ticks].map(([name, count]) => ({
      name,
      ...metricGoal(name, options),
      bookkeeping: false,
      kind: 'tick' as const,
      ticks: count,
    })),
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
  for (const name of new Set(metrics.filter((m) => m.goalSource === 'unknown').map((m) => m.name)))
    problems.push(
      problem(
        'goal-unknown',
        `${name}: no name rule says whether higher or lower is better; its comparisons show the direction only ` +
          `(say --metric ${name}:max or ${name}:min)`,
      ),
    );
  return { metrics, problems };
}
