import { describe, expect, it } from 'vitest';
import type { TickDump } from '../../src/ingest/types.js';
import { calibrationCurves } from '../../src/analysis/calibration.js';

function dump(
  run: string,
  config: string,
  confidence: number[][] | null,
  correct: number[][],
  step: number | null = 10,
): TickDump {
  const ticks = correct[0]?.length ?? 0;
  return {
    run,
    config,
    seed: run,
    file: `${run}.csv`,
    step,
    samples: correct.length,
    ticks,
    correct: Uint8Array.from(correct.flat()),
    certainty: new Float64Array(correct.length * ticks).fill(0.5),
    confidence: confidence === null ? null : Float64Array.from(confidence.flat()),
  };
}

/*
 * Worked by hand from ECE = sum_b |B_b|/n |acc(B_b) - conf(B_b)| (Naeini, Cooper & Hauskrecht 2015;
 * Guo et al. 2017), 2 bins [0, .5] and (.5, 1]; per bin |B|/n |acc - conf| = |#correct - sum conf| / n.
 * Run 1 (rows are samples, columns ticks 0 and 1):
 *   conf .4 .9 / .6 .8 / .7 .6 / .3 .5     correct 0 1 / 1 1 / 0 0 / 1 0
 *   tick 0: bin 0 {.4 w, .3 r} |1 - .7| = .3;  bin 1 {.6 r, .7 w} |1 - 1.3| = .3;   ECE = .6/4 = .15
 *   tick 1: bin 0 {.5 w}       |0 - .5| = .5;  bin 1 {.9 r, .8 r, .6 w} |2 - 2.3| = .3; ECE = .8/4 = .2
 * Run 2: conf .2 1 / .9 .95 / .55 .7 / NaN .4   correct 0 1 / 1 1 / 1 1 / 0 0
 *   tick 0 (NaN left out, n = 3): bin 0 {.2 w} .2; bin 1 {.9 r, .55 r} |2 - 1.45| = .55; ECE = .75/3 = .25
 *   tick 1: bin 0 {.4 w} .4; bin 1 {1 r, .95 r, .7 r} |3 - 2.65| = .35;             ECE = .75/4 = .1875
 * Reliability at the last tick, pooled: bin 0: 2 predictions, conf .45, acc 0;
 *   bin 1: 6 predictions, conf (2.3 + 2.65)/6 = .825, acc 5/6.
 * Across the two seeds, 95% t-intervals stats.t.interval(0.95, 1, loc=mean(x), scale=stats.sem(x)),
 *   with the exact t quantile (mpmath, 40 digits); scipy 1.10.1 (Debian python3-scipy) agrees within
 *   1.3e-11 (tests/reference/ticks_reference.py):
 *   tick 0 x = [.15, .25]:  mean .2,     (-0.43531023680873476, 0.8353102368087348)
 *   tick 1 x = [.2, .1875]: mean .19375, (0.1143362203989081, 0.2731637796010919)
 */
const RUN_1 = dump(
  'r1',
  'memory=4',
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
);
const RUN_2 = dump(
  'r2',
  'memory=4',
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
);

describe('calibrationCurves', () => {
  it('reproduces the hand-worked ECE per tick, its t-interval and the pooled reliability bins', () => {
    const [curve] = calibrationCurves([RUN_1, RUN_2], { bins: 2, level: 0.95 });
    expect(curve).toMatchObject({ config: 'memory=4', bins: 2, seeds: 2 });
    const [t0, t1] = curve?.ece ?? [];
    expect(t0?.tick).toBe(0);
    expect(t0?.mean).toBeCloseTo(0.2, 14);
    expect(t0?.low).toBeCloseTo(-0.43531023680873476, 10);
    expect(t0?.high).toBeCloseTo(0.8353102368087348, 10);
    expect(t1?.mean).toBeCloseTo(0.19375, 14);
    expect(t1?.low).toBeCloseTo(0.1143362203989081, 10);
    expect(t1?.high).toBeCloseTo(0.2731637796010919, 10);
    const [b0, b1] = curve?.reliability ?? [];
    expect(b0).toMatchObject({ low: 0, high: 0.5, count: 2, accuracy: 0 });
    expect(b0?.confidence).toBeCloseTo(0.45, 14);
    expect(b1).toMatchObject({ low: 0.5, high: 1, count: 6 });
    expect(b1?.confidence).toBeCloseTo(0.825, 14);
    expect(b1?.accuracy).toBeCloseTo(5 / 6, 14);
  });

  it('skips dumps without confidence, uses the latest step per run, and gives no interval for one seed', () => {
    const noConfidence = dump('r3', 'memory=4', null, [[1, 1]]);
    const olderRun1 = { ...RUN_2, run: 'r1', step: 5 };
    const onlyCertainty = dump('q1', 'memory=8', null, [[1, 0]]);
    const curves = calibrationCurves([olderRun1, RUN_1, noConfidence, onlyCertainty], { bins: 2, level: 0.95 });
    expect(curves.map((c) => c.config)).toEqual(['memory=4']);
    expect(curves[0]?.seeds).toBe(1);
    expect(curves[0]?.ece[0]).toEqual({ tick: 0, mean: expect.closeTo(0.15, 14) as number, low: null, high: null });
    expect(curves[0]?.ece[1]?.mean).toBeCloseTo(0.2, 14);
  });

  it('uses 15 equal-width bins when asked, with Guo et al. edges', () => {
    const [curve] = calibrationCurves([RUN_1], { bins: 15, level: 0.95 });
    expect(curve?.reliability).toHaveLength(15);
    expect(curve?.reliability[14]?.high).toBe(1);
    expect(curve?.reliability.reduce((a, b) => a + b.count, 0)).toBe(4);
  });

  it('analyses 10,000 samples x 64 ticks x 10 seeds', () => {
    const samples = 10_000;
    const ticks = 64;
    const dumps: TickDump[] = [];
    for (let r = 0; r < 10; r++) {
      const confidence = new Float64Array(samples * ticks);
      const correct = new Uint8Array(samples * ticks);
      for (let s = 0; s < samples; s++) {
        for (let t = 0; t < ticks; t++) {
          // Confidence 0.75 everywhere; the fraction correct is 3/4 at even ticks and 1/2 at odd
          // ticks (sample index mod 4), so ECE is 0 at even ticks and |0.5 - 0.75| = 0.25 at odd.
          confidence[s * ticks + t] = 0.75;
          correct[s * ticks + t] = t % 2 === 0 ? (s % 4 !== 0 ? 1 : 0) : s % 2;
        }
      }
      dumps.push({
        run: `r${r}`,
        config: 'big',
        seed: String(r),
        file: '',
        step: 1,
        samples,
        ticks,
        correct,
        certainty: confidence,
        confidence,
      });
    }
    const [curve] = calibrationCurves(dumps, { bins: 15, level: 0.95 });
    expect(curve?.seeds).toBe(10);
    expect(curve?.ece).toHaveLength(ticks);
    expect(curve?.ece[0]?.mean).toBeCloseTo(0, 12);
    expect(curve?.ece[63]?.mean).toBeCloseTo(0.25, 12);
    expect(curve?.ece[63]?.low).toBeCloseTo(0.25, 12);
    expect(curve?.reliability[11]).toMatchObject({ count: 10 * samples, accuracy: 0.5, confidence: 0.75 });
  });

  it('throws a RangeError for bad bins or confidence outside [0, 1]', () => {
    expect(() => calibrationCurves([RUN_1], { bins: 0, level: 0.95 })).toThrow(RangeError);
    const bad = dump('x', 'c', [[1.2]], [[1]]);
    expect(() => calibrationCurves([bad], { bins: 15, level: 0.95 })).toThrow(/\[0, 1\]/);
  });
});
