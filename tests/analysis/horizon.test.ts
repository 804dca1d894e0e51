import { describe, expect, it } from 'vitest';
import { commonHorizon, isDiverged } from '../../src/analysis/horizon.js';
import { runSet } from './runSetBuilder.js';

describe('commonHorizon', () => {
  const set = runSet(
    ['lr'],
    [
      { params: { lr: '1' }, seed: 1, metrics: { acc: { steps: [0, 100, 200, 300], values: [0, 1, 2, 3] } } },
      { params: { lr: '1' }, seed: 2, metrics: { acc: { steps: [10, 100, 250], values: [0, 1, 2] } } },
      { params: { lr: '2' }, seed: 1, metrics: { acc: { steps: [0, 50], values: [0, 1], divergedAt: 60 } } },
      { params: { lr: '2' }, seed: 2, metrics: { acc: { steps: [], values: [] } } },
    ],
    [{ name: 'acc', goal: 'max' }],
  );

  it('is the last step every compared run reached; diverged and value-less runs do not set it', () => {
    const h = commonHorizon(set.runs, 'acc', 'logs');
    expect(h).toEqual({ step: 250, setBy: 'lr=1,seed=2', firstStep: 0 });
    expect(isDiverged(set.runs[2]!, 'acc')).toBe(true);
    expect(isDiverged(set.runs[0]!, 'acc')).toBe(false);
  });

  it('is null for score tables and when no run has a value', () => {
    expect(commonHorizon(set.runs, 'acc', 'scores').step).toBeNull();
    expect(commonHorizon(set.runs, 'loss', 'logs')).toEqual({ step: null, setBy: null, firstStep: null });
  });
});
