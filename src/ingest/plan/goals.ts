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
import { nameWords } from './columns.js';
import type { Goal, IngestOptions } from '../types.js';

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
 * Pure. Example: `metricGoal('val_acc', { metricGoals: { val_acc: 'min' } })` is `{ goal: 'min', goalSource: 'option' }`.
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
