/**
 * Each comparison at its own step (METHODS.md, "The step a comparison is made at"), on invented
 * fixtures whose expected steps follow from the rule itself (first principles, stated per test).
 */
import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/analysis/analyze.js';
import { comparisonStep, typicalInterval } from '../../src/analysis/comparisonStep.js';
import { resolveOptions } from '../../src/analysis/options.js';
import { meta, runSet, series, type RunSpec } from './runSetBuilder.js';
import { at } from '../support/at.js';

/** A rising curve logged every `every` steps up to `last`, offset by `shift`. */
function curve(last: number, shift: number, every = 100): { steps: number[]; values: number[] } {
  const steps: number[] = [];
  for (let s = 0; s <= last; s += every) steps.push(s);
  return { steps, values: steps.map((s) => shift + s / 10000 + ((s * 7919) % 13) / 1000) };
}

function runs(params: Record<string, string>, lasts: readonly number[], shift: number, status?: 'short'): RunSpec[] {
  return lasts.map((last, i) => ({
    params,
    seed: i + 1,
    metrics: { acc: { ...curve(last, shift + i / 100) } },
    ...(status === undefined ? {} : { status }),
  }));
}

describe('comparisonStep', () => {
  it('is the last step every non-failed run reached; failed runs never set it; step:N fixes it', () => {
    const set = runSet(
      ['m'],
      [...runs({ m: 'a' }, [1000, 900], 0), ...runs({ m: 'a' }, [300], 0, 'short').map((r) => ({ ...r, seed: 9 }))],
      [{ name: 'acc', goal: 'max' }],
    );
    expect(comparisonStep(set.runs, 'acc', { kind: 'final' }, 'logs')).toMatchObject({ step: 900, longest: 1000 });
    expect(comparisonStep(set.runs, 'acc', { kind: 'step', step: 500 }, 'logs').step).toBe(500);
    expect(comparisonStep(set.runs, 'acc', { kind: 'final' }, 'scores').step).toBeNull();
  });

  it('typical logging interval: the median gap between logged steps', () => {
    expect(typicalInterval(series([0, 10, 20, 50], [1, 2, 3, 4]))).toBe(10);
    expect(typicalInterval(series([0], [1]))).toBeNull();
  });
});

describe('analyze: each comparison at its own step', () => {
  it('a run that crashed early in one config moves no other comparison (and not its own: it is a failure)', () => {
    // base, c1, c2 all run to 2000; one c2 run crashed at 300 (ingest marks it short). Before, one
    // study-wide horizon put every comparison at 300; now each pair's step is 2000.
    const set = runSet(
      ['m'],
      [
        ...runs({ m: 'base' }, [2000, 2000, 2000, 2000], 0),
        ...runs({ m: 'c1' }, [2000, 2000, 2000, 2000], 0.05),
        ...runs({ m: 'c2' }, [2000, 2000, 2000], 0.05),
        { ...at(runs({ m: 'c2' }, [300], 0.05, 'short'), 0), seed: 4 },
      ],
      [{ name: 'acc', goal: 'max' }],
    );
    const r = analyze(set, resolveOptions({ baseline: 'm=base' }), meta);
    expect(r.comparisons.map((c) => [c.candidate, c.step])).toEqual([
      ['m=c1', 2000],
      ['m=c2', 2000],
    ]);
    const c2 = at(r.comparisons, 1);
    expect(c2.failures.candidate).toEqual({ runs: 4, diverged: 0, short: 1 });
    expect(c2.n.candidate).toBe(3);
    // scipy.stats.fisher_exact([[0, 4], [1, 3]]).pvalue = 1.0
    expect(c2.failures.fisherP).toBeCloseTo(1, 12);
    expect(c2.runs.find((u) => u.failed === 'short')).toMatchObject({ value: null, loggedAt: null });
    expect(c2.runs.filter((u) => u.failed === null).every((u) => u.loggedAt === 2000)).toBe(true);
  });

  it('tasks of different lengths: each task compares at its own step', () => {
    const set = runSet(
      ['task', 'm'],
      [
        ...runs({ task: 'short', m: 'base' }, [500, 500, 500], 0),
        ...runs({ task: 'short', m: 'new' }, [500, 500, 500], 0.02),
        ...runs({ task: 'long', m: 'base' }, [5000, 5000, 5000], 0),
        ...runs({ task: 'long', m: 'new' }, [5000, 5000, 5000], 0.02),
      ],
      [{ name: 'acc', goal: 'max' }],
    );
    const r = analyze(set, resolveOptions({ baseline: 'm=base', taskKey: 'task' }), meta);
    expect(r.comparisons.map((c) => [c.task, c.step])).toEqual([
      ['long', 5000],
      ['short', 500],
    ]);
    expect(r.metrics[0]?.horizon).toBeNull(); // no single step for the metric
  });

  it(
    'a workload whose baseline runs all stopped after one evaluation: that comparison is flagged, the others ' +
      'keep their steps',
    () => {
      const set = runSet(
        ['task', 'm'],
        [
          ...runs({ task: 'w1', m: 'base' }, [0, 0, 0], 0),
          ...runs({ task: 'w1', m: 'new' }, [3000, 3000, 3000], 0.02),
          ...runs({ task: 'w2', m: 'base' }, [3000, 3000, 3000], 0),
          ...runs({ task: 'w2', m: 'new' }, [3000, 3000, 3000], 0.02),
        ],
        [{ name: 'acc', goal: 'max' }],
      );
      const r = analyze(set, resolveOptions({ baseline: 'm=base', taskKey: 'task' }), meta);
      expect(r.comparisons.map((c) => [c.task, c.step])).toEqual([
        ['w1', 0],
        ['w2', 3000],
      ]);
      const early = r.problems.filter((p) => p.code === 'step-early');
      expect(early).toHaveLength(1);
      expect(early[0]?.message).toContain('task w1');
      expect(early[0]?.message).toContain('compared at step 0');
    },
  );

  it("step:N past some runs' ends: those runs are short for that comparison, never their last value", () => {
    const set = runSet(
      ['m'],
      [...runs({ m: 'base' }, [1000, 1000, 1000, 600], 0), ...runs({ m: 'new' }, [1000, 1000, 1000, 1000], 0.02)],
      [{ name: 'acc', goal: 'max' }],
    );
    const r = analyze(set, resolveOptions({ baseline: 'm=base', summary: 'step:800' }), meta);
    const c = at(r.comparisons, 0);
    expect(c.step).toBe(800);
    expect(c.failures.baseline).toEqual({ runs: 4, diverged: 0, short: 1 });
    expect(c.n).toEqual({ baseline: 3, candidate: 4 });
    expect(c.runs.find((u) => u.run === 'm=base,seed=4')).toMatchObject({ failed: 'short', value: null });
    const beyond = r.problems.filter((p) => p.code === 'step-beyond-run');
    expect(beyond).toHaveLength(1);
    expect(beyond[0]?.message).toContain('m=base,seed=4');
  });

  it('a value logged more than one typical logging interval before the step is flagged', () => {
    // A run that logs every 100 steps but skipped 600..900, ending at 1000, and a run ending at 950:
    // the step is 950, and the first run's value there was logged at 500 (450 > its interval of 100).
    const gap = { steps: [0, 100, 200, 300, 400, 500, 1000], values: [0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.9] };
    const set = runSet(
      ['m'],
      [
        { params: { m: 'base' }, seed: 1, metrics: { acc: curve(950, 0, 50) } },
        { params: { m: 'base' }, seed: 2, metrics: { acc: curve(1000, 0.01) } },
        { params: { m: 'new' }, seed: 1, metrics: { acc: gap } },
        { params: { m: 'new' }, seed: 2, metrics: { acc: curve(1000, 0.03) } },
      ],
      [{ name: 'acc', goal: 'max' }],
    );
    const r = analyze(set, resolveOptions({ baseline: 'm=base' }), meta);
    const c = at(r.comparisons, 0);
    expect(c.step).toBe(950);
    expect(c.runs.find((u) => u.run === 'm=new,seed=1')).toMatchObject({ loggedAt: 500, stale: true, value: 0.6 });
    // the other runs logged within one interval: 900 (interval 100) and 950
    expect(c.runs.filter((u) => u.stale).map((u) => u.run)).toEqual(['m=new,seed=1']);
    expect(r.problems.filter((p) => p.code === 'value-stale')).toHaveLength(1);
  });
});
