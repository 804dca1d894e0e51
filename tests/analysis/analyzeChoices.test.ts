/**
 * Analysis choices pinned end to end, by value: each option below changes the numbers `analyze` (or
 * the aggregate it calls) writes, and each expected number comes from outside the project.
 *
 * - `--level`: curve bands and per-config intervals below 20 runs are Student t-intervals of the mean
 *   at that level. Expected ends: scipy 1.10.1 `stats.t.interval(level, n - 1, loc=mean, scale=sem)`
 *   via Debian python3-scipy, held here to 10 digits with the quantile computed by mpmath at 40
 *   digits (scipy 1.10.1's own t.ppf is good to a few 1e-9 only); tests/reference/analysis_reference.py
 *   ("analyzeChoices.test.ts") checks both.
 * - `--calibration-bins`: the expected calibration error with 2 bins, worked by hand in
 *   tests/analysis/calibration.test.ts (Naeini, Cooper & Hauskrecht 2015; Guo et al. 2017), differs
 *   from the one with the default 15 bins.
 * - The across-task interval keeps tasks apart (stratified bootstrap, Agarwal et al. 2021): first
 *   principles, stated in the test.
 */
import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/analysis/analyze.js';
import { resolveOptions } from '../../src/analysis/options.js';
import { taskAggregates, type TaskScore } from '../../src/analysis/tasks.js';
import type { Results } from '../../src/analysis/results.js';
import type { RunSet, TickDump } from '../../src/ingest/types.js';
import { meta, runSet } from './runSetBuilder.js';

/** Two configs x 3 seeds, one metric logged at steps 0 and 10 (two curve bins; the final value is at step 10). */
const AT_0: Readonly<Record<string, readonly number[]>> = { 'width=1': [0.1, 0.2, 0.4], 'width=2': [0.15, 0.25, 0.3] };
const AT_10: Readonly<Record<string, readonly number[]>> = {
  'width=1': [0.6, 0.64, 0.71],
  'width=2': [0.66, 0.7, 0.69],
};
const SET: RunSet = runSet(
  ['width'],
  ['1', '2'].flatMap((w) =>
    [0, 1, 2].map((k) => ({
      params: { width: w },
      seed: k + 1,
      metrics: {
        acc: { steps: [0, 10], values: [AT_0[`width=${w}`]?.[k] as number, AT_10[`width=${w}`]?.[k] as number] },
      },
    })),
  ),
  [{ name: 'acc', goal: 'max' }],
);

/** scipy 1.10.1 t.interval ends (mpmath quantile), see the file comment. */
const T90: Readonly<Record<string, readonly [number, number]>> = {
  'width=1 step 0': [-0.024185189250352207, 0.49085185591701896],
  'width=1 step 10': [0.5561355961197778, 0.7438644038802222],
  'width=2 step 0': [0.10457407204149055, 0.36209259462517607],
  'width=2 step 10': [0.6482394742213973, 0.7184271924452692],
};
const T95_WIDTH1_STEP10: readonly [number, number] = [0.511689065761544, 0.788310934238456];

function expectEnds(
  low: number | null | undefined,
  high: number | null | undefined,
  want: readonly [number, number],
): void {
  expect(low).toBeCloseTo(want[0], 10);
  expect(high).toBeCloseTo(want[1], 10);
}

describe('--level: a level other than 0.95 moves curve bands and per-config intervals to its t-interval', () => {
  // Computed inside each test, not here: work done while vitest collects the tests counts as
  // "static" in mutation runs, and a static mutant runs every test (DEVELOPERS.md, "Mutation testing").
  const at90 = (): Results => analyze(SET, resolveOptions({ baseline: 'width=1', level: '0.9' }), meta);

  it('curve bands, per bin, at 0.9', () => {
    const r = at90();
    for (const config of ['width=1', 'width=2']) {
      const curve = r.curves.find((c) => c.metric === 'acc' && c.config === config);
      expect(curve?.level).toBe(0.9);
      expect(curve?.n).toEqual([3, 3]);
      expectEnds(curve?.low[0], curve?.high[0], T90[`${config} step 0`] as [number, number]);
      expectEnds(curve?.low[1], curve?.high[1], T90[`${config} step 10`] as [number, number]);
    }
  });

  it('per-config intervals of the final values, at 0.9 and at the default 0.95', () => {
    const r = at90();
    const at95 = analyze(SET, resolveOptions({ baseline: 'width=1' }), meta);
    for (const config of ['width=1', 'width=2']) {
      const value = r.configValues.find((v) => v.metric === 'acc' && v.config === config);
      expect(value?.level).toBe(0.9);
      expect(value?.n).toBe(3);
      expectEnds(value?.low, value?.high, T90[`${config} step 10`] as [number, number]);
    }
    const value95 = at95.configValues.find((v) => v.metric === 'acc' && v.config === 'width=1');
    expect(value95?.level).toBe(0.95);
    expectEnds(value95?.low, value95?.high, T95_WIDTH1_STEP10);
  });
});

/** One run's tick dump: rows are samples, columns ticks (as in tests/analysis/calibration.test.ts). */
function dump(run: string, seed: string, confidence: number[][], correct: number[][]): TickDump {
  return {
    run,
    config: 'width=1',
    seed,
    file: `${run}.csv`,
    step: 10,
    samples: correct.length,
    ticks: 2,
    correct: Uint8Array.from(correct.flat()),
    certainty: new Float64Array(correct.length * 2).fill(0.5),
    confidence: Float64Array.from(confidence.flat()),
  };
}

describe('--calibration-bins is the number of calibration bins analyze uses', () => {
  // RUN_1 and RUN_2 of tests/analysis/calibration.test.ts, whose comment works the 2-bin ECE by hand:
  // ticks 0 and 1 give .15 and .2 (run 1) and .25 and .1875 (run 2); means .2 and .19375.
  const dumps = [
    dump(
      'width=1,seed=1',
      '1',
      [
        [0.4, 0.9],
        [0.6, 0.8],
        [0.7, 0.6],
        [0.3, 0.5],
      ],
      [
        [0, 1],
        [1, 1],
        [0, 0],
        [1, 0],
      ],
    ),
    dump(
      'width=1,seed=2',
      '2',
      [
        [0.2, 1],
        [0.9, 0.95],
        [0.55, 0.7],
        [Number.NaN, 0.4],
      ],
      [
        [0, 1],
        [1, 1],
        [1, 1],
        [0, 0],
      ],
    ),
  ];
  const withDumps: RunSet = { ...SET, tickDumps: dumps };

  it('2 bins: the hand-worked ECE per tick, and its t-interval at level 0.9', () => {
    const r = analyze(withDumps, resolveOptions({ baseline: 'width=1', calibrationBins: '2', level: '0.9' }), meta);
    const [curve] = r.calibration;
    expect(curve?.bins).toBe(2);
    expect(curve?.reliability).toHaveLength(2);
    expect(curve?.ece[0]?.mean).toBeCloseTo(0.2, 14);
    expect(curve?.ece[1]?.mean).toBeCloseTo(0.19375, 14);
    // scipy 1.10.1 t.interval(0.9, 1, mean, sem) of [.15, .25] and [.2, .1875] (mpmath quantile; see the top).
    expectEnds(curve?.ece[0]?.low, curve?.ece[0]?.high, [-0.11568757573375188, 0.5156875757337519]);
    expectEnds(curve?.ece[1]?.low, curve?.ece[1]?.high, [0.154289053033281, 0.233210946966719]);
  });

  it('the default (15 bins) gives other numbers on the same dumps', () => {
    const r = analyze(withDumps, resolveOptions({ baseline: 'width=1' }), meta);
    const [curve] = r.calibration;
    expect(curve?.bins).toBe(15);
    expect(curve?.reliability).toHaveLength(15);
    // With 15 bins of width 1/15 each prediction at tick 0 sits alone in its bin. Run 1:
    // .4 (bin 6), .6 (bin 9), .7 (bin 10), .3 (bin 4); ECE = (.4 + .4 + .7 + .7) / 4 = .55 (|correct - conf| each).
    // Run 2 at tick 0: .2 (bin 3, wrong) .2; .9 (bin 13, right) .1; .55 (bin 8, right) .45; ECE = .75 / 3 = .25.
    expect(curve?.ece[0]?.mean).toBeCloseTo((0.55 + 0.25) / 2, 14);
  });
});

describe('the across-task interval keeps tasks apart (stratified bootstrap)', () => {
  it('two tasks of four runs, all 0 on one task and all 1 on the other: the interval is exactly [0.5, 0.5]', () => {
    // First principles: a stratified resample draws four runs within each task, so every resample
    // holds four 0s and four 1s, whose interquartile mean (the middle four of eight) is 0.5. Pooling
    // the eight scores instead gives resamples with other mixes (e.g. six 0s: IQM 0.25) and a wide
    // interval.
    const scores: TaskScore[] = [
      ...[0, 0, 0, 0].map((value) => ({ task: 'a', group: 'g', value })),
      ...[1, 1, 1, 1].map((value) => ({ task: 'b', group: 'g', value })),
    ];
    const [agg] = taskAggregates('acc', 'max', ['g'], scores, new Map(), { level: 0.95, resamples: 2000, seed: 1 });
    expect(agg?.interquartileMean).toBe(0.5);
    expect(agg?.low).toBe(0.5);
    expect(agg?.high).toBe(0.5);
  });
});
