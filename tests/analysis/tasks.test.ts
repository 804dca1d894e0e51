import { describe, expect, it } from 'vitest';
import {
  normaliseTaskScores,
  probabilityOfImprovement,
  PROFILE_POINTS,
  taskAggregates,
  type TaskScore,
} from '../../src/analysis/tasks.js';

const settings = { level: 0.95, resamples: 2000, seed: 1 };

describe('taskAggregates', () => {
  it('IQM of all task x run scores: METHODS.md check 0.617 (fractional interquartile mean)', () => {
    const values = [0.05, 0.31, 0.42, 0.48, 0.55, 0.61, 0.77, 0.93, 1.2, 2.5];
    const scores: TaskScore[] = values.map((value, i) => ({ task: i < 5 ? 't1' : 't2', group: 'g', value }));
    const [agg] = taskAggregates('acc', 'max', ['g'], scores, new Map(), settings);
    expect(agg?.interquartileMean).toBeCloseTo(0.617, 12);
    expect(agg?.tasks).toBe(2);
    expect(agg?.low).toBeLessThan(0.617);
    expect(agg?.high).toBeGreaterThan(0.617);
    expect(agg?.probabilityOfImprovement).toBeNull();
    expect(agg?.profile.thresholds).toHaveLength(PROFILE_POINTS);
    expect(agg?.profile.thresholds[0]).toBe(0.05);
    expect(agg?.profile.thresholds[PROFILE_POINTS - 1]).toBe(2.5);
    expect(agg?.profile.fraction[0]).toBe(0.9); // 9 of 10 scores above the smallest
    expect(agg?.profile.fraction[PROFILE_POINTS - 1]).toBe(0);
  });

  it('probability of improvement averaged over tasks, in the goal direction', () => {
    const scores: TaskScore[] = [
      ...[1, 2, 3].map((value) => ({ task: 'a', group: 'base', value })),
      ...[2, 3, 4].map((value) => ({ task: 'a', group: 'ours', value })),
      ...[5, 6].map((value) => ({ task: 'b', group: 'base', value })),
      ...[1, 2].map((value) => ({ task: 'b', group: 'ours', value })),
    ];
    const aggs = taskAggregates('acc', 'max', ['base', 'ours'], scores, new Map([['ours', 'base']]), settings);
    // task a: pairs (x > y) 6, ties 2 -> (6 + 1) / 9 = 7/9; task b: 0. Average 7/18.
    expect(aggs[1]?.probabilityOfImprovement).toBeCloseTo(7 / 18, 14);
    expect(aggs[1]?.baseline).toBe('base');
    const min = taskAggregates('loss', 'min', ['base', 'ours'], scores, new Map([['ours', 'base']]), settings);
    expect(min[1]?.probabilityOfImprovement).toBeCloseTo((2 / 9 + 1) / 2, 14);
  });

  it('probabilityOfImprovement counts ties as one half', () => {
    expect(probabilityOfImprovement([1, 2], [2], 'max')).toBe(0.25);
    expect(probabilityOfImprovement([1, 2], [2], 'min')).toBe(0.75);
  });
});

describe('normaliseTaskScores (METHODS.md: min-max per task over all runs, only tasks every group has)', () => {
  it('puts each task on [0, 1] from its own smallest and largest score (first principles)', () => {
    const scores: TaskScore[] = [
      { task: 'points', group: 'base', value: 100 },
      { task: 'points', group: 'ours', value: 300 },
      { task: 'points', group: 'ours', value: 200 },
      { task: 'fraction', group: 'base', value: 0.5 },
      { task: 'fraction', group: 'ours', value: 0.7 },
      { task: 'flat', group: 'base', value: 3 },
      { task: 'flat', group: 'ours', value: 3 },
      { task: 'only-base', group: 'base', value: 9 },
    ];
    const frozen = Object.freeze(scores.map((s) => Object.freeze({ ...s })));
    const out = normaliseTaskScores(frozen, ['base', 'ours']);
    expect(out.leftOut).toEqual(['only-base']);
    expect(out.scores.map((s) => [s.task, s.group, s.value])).toEqual([
      ['points', 'base', 0],
      ['points', 'ours', 1],
      ['points', 'ours', 0.5],
      ['fraction', 'base', 0],
      ['fraction', 'ours', 1],
      ['flat', 'base', 0],
      ['flat', 'ours', 0],
    ]);
  });

  it('makes the interquartile mean weigh a task in hundreds and one in fractions alike', () => {
    // Two tasks, two groups, two runs each; 'ours' is the best run on both tasks by the same share of
    // the task's range, so after normalisation both groups have the same scores on both tasks.
    const scores: TaskScore[] = [
      ...[100, 300].map((value) => ({ task: 'points', group: 'base', value })),
      ...[200, 300].map((value) => ({ task: 'points', group: 'ours', value })),
      ...[0.1, 0.3].map((value) => ({ task: 'fraction', group: 'base', value })),
      ...[0.2, 0.3].map((value) => ({ task: 'fraction', group: 'ours', value })),
    ];
    const normal = normaliseTaskScores(scores, ['base', 'ours']);
    const aggs = taskAggregates('acc', 'max', ['base', 'ours'], normal.scores, new Map(), {
      ...settings,
      leftOut: normal.leftOut,
    });
    // base: [0, 1, 0, 1] → IQM (fractional, 25% trimmed each end of 4) = mean of the middle two = 0.5.
    expect(aggs[0]?.interquartileMean).toBeCloseTo(0.5, 12);
    // ours: [0.5, 1, 0.5, 1] → middle two 0.5 and 1 → 0.75.
    expect(aggs[1]?.interquartileMean).toBeCloseTo(0.75, 12);
    expect(aggs[1]?.normalisation).toBe('min-max per task');
    expect(aggs[1]?.leftOut).toEqual([]);
  });
});
