import { describe, expect, it } from 'vitest';
import type { MetricInfo, Run, RunStatus, TickDump } from '../../src/ingest/types.js';
import { ACCURACY_NAME, examplesFromDumps, tickCurves } from '../../src/analysis/ticks.js';

/** A run whose tick metric `acc` is logged at steps 100, 200, 300; `rows[i]` holds the ticks at step i. */
function run(config: string, seed: number, rows: number[][], status: RunStatus = 'ok', steps = [100, 200, 300]): Run {
  const ticks = rows[0]?.length ?? 0;
  return {
    id: `${config},seed=${seed}`,
    config,
    params: {},
    seed: String(seed),
    info: {},
    files: [],
    identity: 'hive',
    metrics: {},
    tickMetrics: {
      acc: {
        steps: Float64Array.from(steps),
        values: Array.from({ length: ticks }, (_, k) => Float64Array.from(rows, (row) => row[k] as number)),
      },
    },
    status,
    lastStep: steps[steps.length - 1] as number,
    divergedAt: status === 'diverged' ? 300 : null,
  };
}

const ACC: MetricInfo = { name: 'acc', goal: 'max', goalSource: 'option', bookkeeping: false, kind: 'tick', ticks: 4 };
const EARLY = [0.1, 0.1, 0.1, 0.1];

// Final-step (300) accuracy by tick, 4 seeds per config.
const A = [
  [0.5, 0.62, 0.7, 0.71],
  [0.48, 0.6, 0.69, 0.7],
  [0.52, 0.65, 0.72, 0.72],
  [0.49, 0.61, 0.71, 0.73],
];
const B = [
  [0.55, 0.75, 0.8, 0.8],
  [0.54, 0.74, 0.79, 0.81],
  [0.57, 0.77, 0.81, 0.8],
  [0.53, 0.73, 0.785, 0.79],
];
const RUNS: Run[] = [
  ...A.map((last, i) => run('ticks=4', i + 1, [EARLY, [0.3, 0.3, 0.3, 0.3 + i / 100], last])),
  ...B.map((last, i) => run('ticks=8', i + 1, [EARLY, [0.4, 0.4, 0.4, 0.4], last])),
  run('ticks=8', 9, [EARLY, EARLY, [0, 0, 0, 0]], 'diverged'),
];

/*
 * Reference values from scipy 1.10.1 (Debian python3-scipy; tests/reference/ticks_reference.py), to within 1e-14:
 *   mean and stats.t.interval(0.95, 3, loc=mean(x), scale=stats.sem(x)) per tick;
 *   stats.ttest_ind(B[:, k], A[:, k], equal_var=False).pvalue per tick (Welch 1947);
 *   Holm (1979) step-down by its definition: sorted p_(i) times (m - i + 1), running maximum, capped at 1.
 */
const B_MEAN = [0.5475000000000001, 0.7474999999999999, 0.7962500000000001, 0.8];
const B_LOW = [0.52032469116204, 0.7203246911620398, 0.7786084607053466, 0.787007717363749];
const B_HIGH = [0.5746753088379601, 0.7746753088379601, 0.8138915392946536, 0.8129922826362511];
const A_LOW = [0.47032469116203984, 0.5856256511814169, 0.6844573974323948, 0.6944573974323948];
const WELCH_P = [0.006075947389614592, 0.00012069697695037666, 4.501038023428222e-5, 9.384246400884444e-5];
const HOLM = [0.006075947389614592, 0.0002815273920265333, 0.0001800415209371289, 0.0002815273920265333];

describe('tickCurves', () => {
  it('gives the mean and t-interval per tick at the last step, without the diverged run', () => {
    const [a, b] = tickCurves(RUNS, ACC, { step: null, level: 0.95, alpha: 0.05, baseline: null });
    expect(a?.config).toBe('ticks=4');
    expect(b?.config).toBe('ticks=8');
    expect(b?.ticks).toEqual([0, 1, 2, 3]);
    expect(b?.step).toBe(300);
    expect(b?.band).toBe('t');
    expect(b?.n).toEqual([4, 4, 4, 4]);
    expect(b?.diverged).toBe(1);
    expect(a?.diverged).toBe(0);
    B_MEAN.forEach((m, k) => {
      expect(b?.mean[k]).toBeCloseTo(m, 14);
      expect(b?.low[k]).toBeCloseTo(B_LOW[k] as number, 10);
      expect(b?.high[k]).toBeCloseTo(B_HIGH[k] as number, 10);
      expect(a?.low[k]).toBeCloseTo(A_LOW[k] as number, 10);
    });
    expect(b?.versusBaseline).toBeNull();
    expect(b?.exampleHalfWidth).toBeNull();
  });

  it('takes the last logged step at or before opts.step', () => {
    const [a] = tickCurves(RUNS, ACC, { step: 250, level: 0.95, alpha: 0.05, baseline: null });
    expect(a?.step).toBe(200);
    expect(a?.mean[0]).toBeCloseTo(0.3, 14);
    expect(a?.mean[3]).toBeCloseTo(0.315, 14); // (0.30 + 0.31 + 0.32 + 0.33) / 4
    const none = tickCurves(RUNS, ACC, { step: 50, level: 0.95, alpha: 0.05, baseline: null });
    expect(none[0]?.n).toEqual([0, 0, 0, 0]);
    expect(none[0]?.mean).toEqual([null, null, null, null]);
    expect(none[0]?.earliestGood).toBeNull();
  });

  it('compares each tick with the baseline by Welch, Holm across ticks (scipy reference)', () => {
    const [a, b] = tickCurves(RUNS, ACC, { step: null, level: 0.95, alpha: 0.05, baseline: 'ticks=4' });
    expect(a?.versusBaseline).toBeNull();
    const rows = b?.versusBaseline ?? [];
    expect(rows).toHaveLength(4);
    rows.forEach((r, k) => {
      expect(r.tick).toBe(k);
      expect(r.pAdjusted).toBeCloseTo(HOLM[k] as number, 10);
      expect(r.verdict).toBe('better');
    });
    // Unadjusted p at tick 0 is also the Holm value (largest p, multiplier 1).
    expect(rows[0]?.pAdjusted).toBeCloseTo(WELCH_P[0] as number, 10);
    expect(rows[2]?.difference).toBeCloseTo(0.79625 - 0.705, 12);
    // The same numbers for a metric where lower is better: the candidate is worse.
    const [, bMin] = tickCurves(
      RUNS,
      { ...ACC, goal: 'min' },
      { step: null, level: 0.95, alpha: 0.05, baseline: 'ticks=4' },
    );
    expect(bMin?.versusBaseline?.map((r) => r.verdict)).toEqual(['worse', 'worse', 'worse', 'worse']);
    // At alpha = .005 the tick-0 difference (adjusted p .0061) is no longer significant.
    const [, bStrict] = tickCurves(RUNS, ACC, { step: null, level: 0.95, alpha: 0.005, baseline: 'ticks=4' });
    expect(bStrict?.versusBaseline?.map((r) => r.verdict)).toEqual(['inconclusive', 'better', 'better', 'better']);
  });

  it('leaves a tick untested when an arm has fewer than 2 values or both arms are constant', () => {
    const runs = [
      run('base', 1, [[0.5, 0.2]], 'ok', [1]),
      run('base', 2, [[0.5, 0.3]], 'ok', [1]),
      run('new', 1, [[0.6, 0.4]], 'ok', [1]),
      run('new', 2, [[0.6, Number.NaN]], 'ok', [1]),
    ];
    const [, curve] = tickCurves(runs, ACC, { step: null, level: 0.95, alpha: 0.05, baseline: 'base' });
    expect(curve?.n).toEqual([2, 1]);
    expect(curve?.low[1]).toBeNull(); // one seed: no interval, never NaN
    expect(curve?.mean[1]).toBeCloseTo(0.4, 15);
    expect(curve?.versusBaseline).toEqual([
      { tick: 0, difference: expect.closeTo(0.1, 14) as number, pAdjusted: null, verdict: 'inconclusive' },
      { tick: 1, difference: expect.closeTo(0.15, 14) as number, pAdjusted: null, verdict: 'inconclusive' },
    ]);
    // A baseline that has no runs with this metric: nothing to compare with.
    expect(
      tickCurves(runs, ACC, { step: null, level: 0.95, alpha: 0.05, baseline: 'other' })[1]?.versusBaseline,
    ).toBeNull();
  });

  it('finds the earliest good tick with a default and a given tolerance, and its spread across seeds', () => {
    // Default tolerance: 1% of the range of the tick means, (0.8 - 0.5475) / 100 = 0.002525;
    // tick 2 (0.79625) is below 0.8 - 0.002525, so the earliest good tick is 3.
    const [, b] = tickCurves(RUNS, ACC, { step: null, level: 0.95, alpha: 0.05, baseline: null });
    expect(b?.earliestGood?.tick).toBe(3);
    expect(b?.earliestGood?.tolerance).toBeCloseTo(0.002525, 14);
    // Tolerance 0.01: tick 2 (0.79625 >= 0.79) is good. Per seed (own best tick, same tolerance):
    // seeds give ticks 2, 3, 2, 2; scipy 1.10.1 stats.t.interval(0.95, 3, loc=2.25, scale=sem) =
    // (1.454388423679073, 3.045611576320927).
    const [, b1] = tickCurves(RUNS, ACC, { step: null, level: 0.95, alpha: 0.05, baseline: null, tolerance: 0.01 });
    expect(b1?.earliestGood?.tick).toBe(2);
    expect(b1?.earliestGood?.low).toBeCloseTo(1.454388423679073, 10);
    expect(b1?.earliestGood?.high).toBeCloseTo(3.045611576320927, 10);
    // Tolerance 0: the first tick that attains the best mean itself.
    const [, b0] = tickCurves(RUNS, ACC, { step: null, level: 0.95, alpha: 0.05, baseline: null, tolerance: 0 });
    expect(b0?.earliestGood).toMatchObject({ tick: 3, tolerance: 0 });
    // For a metric to minimise, the best tick is the smallest mean (tick 0 here).
    const [, bMin] = tickCurves(
      RUNS,
      { ...ACC, goal: 'min' },
      { step: null, level: 0.95, alpha: 0.05, baseline: null },
    );
    expect(bMin?.earliestGood?.tick).toBe(0);
  });

  it('adds the binomial between-example noise sqrt(p(1-p)/m) for proportions when m is known', () => {
    const [, b] = tickCurves(RUNS, ACC, { step: null, level: 0.95, alpha: 0.05, baseline: null, examples: 1000 });
    B_MEAN.forEach((m, k) => {
      expect(b?.exampleHalfWidth?.[k]).toBeCloseTo(Math.sqrt((m * (1 - m)) / 1000), 15);
    });
    const percent = RUNS.map((r) => run(r.config, Number(r.seed), [[50, 60]], r.status, [1]));
    expect(
      tickCurves(percent, ACC, { step: null, level: 0.95, alpha: 0.05, baseline: null, examples: 1000 })[0]
        ?.exampleHalfWidth,
    ).toBeNull();
  });

  it('takes m per config from its tick dumps (the fewest samples of its dumps), before a study-wide m', () => {
    const dump = (config: string, samples: number): TickDump => ({
      run: `${config},seed=1`,
      config,
      seed: '1',
      file: 'x.csv',
      step: null,
      samples,
      ticks: 1,
      correct: new Uint8Array(samples),
      certainty: new Float64Array(samples),
      confidence: null,
    });
    const byConfig = examplesFromDumps([dump('ticks=8', 300), dump('ticks=8', 280), dump('ticks=4', 0)]);
    expect([...byConfig]).toEqual([['ticks=8', 280]]);
    const opts = { step: null, level: 0.95, alpha: 0.05, baseline: null, examples: 1000 };
    const [a, b] = tickCurves(RUNS, ACC, { ...opts, examplesByConfig: byConfig });
    // sqrt(p(1-p)/m) by its definition: m = 280 for ticks=8 (its dumps), 1000 (study-wide) for ticks=4.
    for (const [k, m] of B_MEAN.entries()) {
      expect(b?.exampleHalfWidth?.[k]).toBeCloseTo(Math.sqrt((m * (1 - m)) / 280), 15);
    }
    expect(a?.mean.length).toBe(4);
    for (const [k, m] of (a?.mean ?? []).entries()) {
      expect(a?.exampleHalfWidth?.[k]).toBeCloseTo(Math.sqrt(((m as number) * (1 - (m as number))) / 1000), 15);
    }
    expect(ACCURACY_NAME.test('val_acc') && ACCURACY_NAME.test('correct@k')).toBe(true);
    expect(ACCURACY_NAME.test('certainty')).toBe(false);
  });

  it('throws a RangeError on bad options', () => {
    const base = { step: null, level: 0.95, baseline: null };
    expect(() => tickCurves(RUNS, ACC, { ...base, alpha: 0 })).toThrow(RangeError);
    expect(() => tickCurves(RUNS, ACC, { ...base, alpha: 0.05, tolerance: -1 })).toThrow(RangeError);
    expect(() => tickCurves(RUNS, ACC, { ...base, alpha: 0.05, examples: 0 })).toThrow(RangeError);
  });
});
