import { describe, expect, it } from 'vitest';
import { DEFAULT_OPTIONS, resolveOptions } from '../../src/analysis/options.js';
import { SeedsiftError } from '../../src/problems.js';
import { runSet } from './runSetBuilder.js';

describe('resolveOptions', () => {
  it('fills every default of METHODS.md', () => {
    const o = resolveOptions({});
    expect(o).toMatchObject({
      alpha: 0.05,
      seed: 1,
      correction: 'holm',
      summary: { kind: 'final' },
      summaryText: 'final',
      baseline: null,
      taskKey: null,
      margin: null,
      paired: false,
      failed: 'exclude',
      family: 'study',
      interval: 'welch',
      failOn: null,
      level: 0.95,
      resamples: 10000,
      bandResamples: 2000,
      bins: 400,
      bootstrapFrom: 10,
      calibrationBins: 15,
    });
    expect(o.haltingThresholds).toEqual(DEFAULT_OPTIONS.haltingThresholds);
  });

  it('parses values typed on the command line (strings) and front matter (numbers)', () => {
    const o = resolveOptions({
      alpha: '0.01',
      seed: '42',
      correction: 'bh',
      summary: 'last:10%',
      baseline: 'memory=4',
      taskKey: 'task',
      margin: '0.5',
      paired: true,
      diverged: 'worst',
      failOn: 'not-better',
      bins: 100,
      haltingThresholds: '0.9, 0.5,0.9',
    });
    expect(o.alpha).toBe(0.01);
    expect(o.seed).toBe(42);
    expect(o.correction).toBe('bh');
    expect(o.summary).toEqual({ kind: 'last', percent: 10, text: 'last:10%' });
    expect(o.summaryText).toBe('last:10%');
    expect(o.baseline?.pairs).toEqual([{ key: 'memory', value: '4' }]);
    expect(o.margin).toBe(0.5);
    expect(o.paired).toBe(true);
    expect(o.failed).toBe('worst');
    expect(o.failOn).toBe('not-better');
    expect(o.bins).toBe(100);
    expect(o.haltingThresholds).toEqual([0.5, 0.9]);
  });

  it('rejects bad values naming the option', () => {
    expect(() => resolveOptions({ alpha: 2 })).toThrow('--alpha: expected a number in (0, 1), got 2');
    expect(() => resolveOptions({ alpha: 'x' })).toThrow(SeedsiftError);
    expect(() => resolveOptions({ seed: '1.5' })).toThrow('--seed: expected an integer');
    expect(() => resolveOptions({ correction: 'bonferroni' })).toThrow(
      "--correction: expected holm, bh, none, got 'bonferroni'",
    );
    expect(() => resolveOptions({ summary: 'median' })).toThrow(
      '--summary: expected final, last:P%, best, auc, reach:VALUE or step:N',
    );
    expect(() => resolveOptions({ diverged: 'drop' })).toThrow('--diverged');
    expect(() => resolveOptions({ failed: 'drop' })).toThrow('--failed');
    expect(() => resolveOptions({ family: 'metric' })).toThrow('--family');
    expect(() => resolveOptions({ interval: 'percentile' })).toThrow('--interval');
    // intervals follow alpha (METHODS.md: level 1 - alpha) unless a level is given
    expect(resolveOptions({ alpha: '0.01' }).level).toBeCloseTo(0.99, 15);
    expect(() => resolveOptions({ failOn: 'better' })).toThrow('--fail-on');
    expect(() => resolveOptions({ margin: -1 })).toThrow('--margin');
    expect(() => resolveOptions({ level: 1 })).toThrow('--level');
    expect(() => resolveOptions({ resamples: 10 })).toThrow('--resamples');
    expect(() => resolveOptions({ paired: 'maybe' })).toThrow('--paired');
    expect(() => resolveOptions({ haltingThresholds: '0.5,1.5' })).toThrow('--halting-thresholds');
    expect(() => resolveOptions({ baseline: 'memory' })).toThrow('--baseline: expected key=value');
    const thrown = ((): unknown => {
      try {
        resolveOptions({ alpha: 0 });
      } catch (error) {
        return error;
      }
      return null;
    })();
    expect(thrown).toBeInstanceOf(SeedsiftError);
    expect((thrown as SeedsiftError).code).toBe('usage');
  });

  it('checks the baseline and the task key against a run set', () => {
    const set = runSet(
      ['ticks', 'memory'],
      [4, 8].map((m) => ({ params: { ticks: '16', memory: String(m) }, seed: 1, metrics: { acc: 1 } })),
      [{ name: 'acc', goal: 'max' }],
      'scores',
    );
    expect(resolveOptions({ baseline: 'memory=4' }, set).baseline?.text).toBe('memory=4');
    expect(() => resolveOptions({ baseline: 'memory=5' }, set)).toThrow(
      '--baseline: memory=5 matches no config; memory takes 4, 8',
    );
    expect(() => resolveOptions({ baseline: 'width=5' }, set)).toThrow(
      "--baseline: no config key 'width'; keys are ticks, memory",
    );
    expect(() => resolveOptions({ taskKey: 'task' }, set)).toThrow('--task-key');
  });
});
