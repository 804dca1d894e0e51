import { describe, expect, it } from 'vitest';
import { bookkeepingName, inferGoal, metricGoal } from '../../../src/ingest/plan/goals.js';

// The rule: DESIGN.md "Inputs" (loss, error, err, perplexity, wer, regret -> min; otherwise max),
// matched as whole words of the name (src/ingest/plan/goals.ts documents the word split).
describe('inferGoal', () => {
  it.each([
    ['val_loss', 'min'],
    ['train_loss', 'min'],
    ['top1_err', 'min'],
    ['error_rate', 'min'],
    ['trainLoss', 'min'],
    ['perplexity', 'min'],
    ['test_wer', 'min'],
    ['cum_regret', 'min'],
    ['val_acc', 'max'],
    ['certainty', null], // no rule knows it: goal unknown, comparisons show the direction only
    ['ppl', null], // not in the list: say --metric ppl:min
    ['losses', null], // whole words only
    ['score', null], // a score may be elapsed time (issue 14): no rule
    ['val_acc', 'max'],
    ['acc_loss', 'min'], // a min word wins over a max word
    ['bleu', 'max'],
  ] as const)('%s -> %s', (name, goal) => {
    expect(inferGoal(name)).toBe(goal);
  });
});

describe('metricGoal', () => {
  it('--metric wins over the name', () => {
    expect(metricGoal('ppl', { metricGoals: { ppl: 'min' } })).toEqual({ goal: 'min', goalSource: 'option' });
    expect(metricGoal('val_loss', { metricGoals: {} })).toEqual({ goal: 'min', goalSource: 'inferred' });
  });
  it('does not read inherited properties as options', () => {
    expect(metricGoal('toString', { metricGoals: {} })).toEqual({ goal: null, goalSource: 'unknown' });
  });
});

describe('bookkeepingName', () => {
  it.each([
    ['wall_time', true],
    ['timestamp', true],
    ['elapsed_sec', true],
    ['epoch', true],
    ['preemptions', true],
    ['learning_rate', true],
    ['lr', true],
    ['epoch_loss', false], // a metric word wins
    ['val_acc', false],
    ['score', false], // no bookkeeping word: judged by its values (analysis/setAside.ts)
  ] as const)('%s -> %s', (name, expected) => {
    expect(bookkeepingName(name)).toBe(expected);
  });
});
