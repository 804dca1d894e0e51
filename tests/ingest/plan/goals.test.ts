import { describe, expect, it } from 'vitest';
import { inferGoal, metricGoal } from '../../../src/ingest/plan/goals.js';

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
    ['certainty', 'max'],
    ['ppl', 'max'], // not in the list: say --metric ppl:min
    ['losses', 'max'], // whole words only
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
    expect(metricGoal('toString', { metricGoals: {} })).toEqual({ goal: 'max', goalSource: 'inferred' });
  });
});
