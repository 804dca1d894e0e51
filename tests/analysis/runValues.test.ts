import { describe, expect, it } from 'vitest';
import { metricValues } from '../../src/analysis/runValues.js';
import { runSet } from './runSetBuilder.js';

const set = runSet(
  ['m'],
  [
    { params: { m: 'a' }, seed: 1, metrics: { acc: { steps: [0, 10, 20], values: [0.2, 0.6, 0.9] } } },
    { params: { m: 'a' }, seed: 2, metrics: { acc: { steps: [0, 10, 20], values: [0.2, 0.5, 0.7] } } },
    { params: { m: 'a' }, seed: 3, metrics: { acc: { steps: [0, 10, 20], values: [0.1, 0.3, 0.6] } } },
    { params: { m: 'b' }, seed: 1, metrics: { acc: { steps: [0, 10], values: [0.3, 0.4], divergedAt: 15 } } },
    { params: { m: 'b' }, seed: 2, metrics: {} },
  ],
  [{ name: 'acc', goal: 'max' }],
);
const compared = new Set(['m=a', 'm=b']);

describe('metricValues', () => {
  it('counts censored reach runs in one summary-censored problem', () => {
    const r = metricValues(
      set.runs,
      'acc',
      'max',
      { kind: 'reach', value: 0.65 },
      'reach:0.65',
      'exclude',
      compared,
      'logs',
    );
    // run 3 never reaches 0.65: censored at the config's step 20 and kept (value 20, time to event)
    expect(r.values.map((v) => v.value)).toEqual([20, 20, 20, null, null]);
    const censored = r.problems.filter((p) => p.code === 'summary-censored');
    expect(censored).toHaveLength(1);
    expect(censored[0]?.message).toContain('1 of 3 runs had not reached 0.65');
    expect(r.values[2]?.note).toBe('had not reached 0.65 by step 20 (censored there)');
    expect(r.values[2]?.usedInTests).toBe(true);
  });

  it('warns once per metric that best is optimistic', () => {
    const r = metricValues(set.runs, 'acc', 'max', { kind: 'best' }, 'best', 'exclude', compared, 'logs');
    expect(r.problems.map((p) => p.code)).toEqual(['summary-optimistic']);
    expect(r.values[0]?.value).toBe(0.9);
  });

  it('diverged runs: no value of their own; used in tests only under worst', () => {
    const ex = metricValues(set.runs, 'acc', 'max', { kind: 'final' }, 'final', 'exclude', compared, 'logs');
    expect(ex.values[3]).toMatchObject({
      value: null,
      note: 'diverged at step 15: left out of the tests',
      step: null,
      usedInTests: false,
    });
    expect(ex.byRun.get('m=b,seed=1')).toEqual({ value: null, failed: true });
    const worst = metricValues(set.runs, 'acc', 'max', { kind: 'final' }, 'final', 'worst', compared, 'logs');
    expect(worst.values[3]).toMatchObject({
      value: null,
      note: 'diverged at step 15: counted as the worst value of each comparison',
      usedInTests: true,
    });
    expect(ex.values[4]).toMatchObject({ value: null, note: 'no finite value for this metric', usedInTests: false });
  });

  it('runs of configs outside every comparison are not used in tests', () => {
    const r = metricValues(set.runs, 'acc', 'max', { kind: 'final' }, 'final', 'exclude', new Set(['m=b']), 'logs');
    expect(r.values[0]).toMatchObject({ value: 0.9, usedInTests: false });
  });
});
