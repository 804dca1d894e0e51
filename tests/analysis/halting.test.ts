import { describe, expect, it } from 'vitest';
import type { TickDump } from '../../src/ingest/types.js';
import { haltingCurves, latestDumpPerRun } from '../../src/analysis/halting.js';
import { createRandom } from '../../src/stats/random.js';
import { at } from '../support/at.js';

/** Build a dump from sample-major rows (rows[s][t]). */
function dump(
  run: string,
  config: string,
  certainty: number[][],
  correct: number[][],
  step: number | null = null,
): TickDump {
  const ticks = certainty[0]?.length ?? 0;
  return {
    run,
    config,
    seed: run,
    file: `${run}.csv`,
    step,
    samples: certainty.length,
    ticks,
    correct: Uint8Array.from(correct.flat()),
    certainty: Float64Array.from(certainty.flat()),
    confidence: null,
  };
}

/*
 * Worked by hand (definition in METHODS.md: a sample exits at the first tick with certainty >= tau,
 * else at the last tick), 3 samples x 4 ticks, thresholds 0.5 and 0.8:
 *   sample 0: certainty .2 .6 .9 .95   correct 0 1 1 1
 *   sample 1: certainty .7 .5 .8 .4    correct 1 0 0 1   (.8 at tick 2 equals tau: exits there)
 *   sample 2: certainty .1 .3 .4 .45   correct 0 0 1 0   (never certain: exits at tick 3)
 *   tau .5: exits 1, 0, 3 -> correct 1, 1, 0 -> accuracy 2/3, mean exit tick 4/3
 *   tau .8: exits 2, 2, 3 -> correct 1, 0, 0 -> accuracy 1/3, mean exit tick 7/3
 *   exit histogram at .8: ticks 0..3 -> [0, 0, 2, 1]
 */
const RUN_A = dump(
  'a',
  'ticks=4',
  [
    [0.2, 0.6, 0.9, 0.95],
    [0.7, 0.5, 0.8, 0.4],
    [0.1, 0.3, 0.4, 0.45],
  ],
  [
    [0, 1, 1, 1],
    [1, 0, 0, 1],
    [0, 0, 1, 0],
  ],
);
// Always certain: every sample exits at tick 0; correct at tick 0: 1, 1, 0 -> accuracy 2/3, exit 0.
const RUN_B = dump(
  'b',
  'ticks=4',
  [
    [0.9, 0.9, 0.9, 0.9],
    [1, 1, 1, 1],
    [0.95, 0.1, 0.1, 0.1],
  ],
  [
    [1, 0, 0, 0],
    [1, 0, 0, 0],
    [0, 1, 1, 1],
  ],
);
// Never certain: every sample exits at tick 3; correct at tick 3: 1, 1, 1 -> accuracy 1, exit 3.
const RUN_C = dump(
  'c',
  'ticks=4',
  [
    [0, 0, 0, 0],
    [0.1, 0.2, 0.3, 0.4],
    [0.3, 0.3, 0.3, 0.3],
  ],
  [
    [0, 0, 0, 1],
    [0, 0, 0, 1],
    [0, 0, 0, 1],
  ],
);

describe('haltingCurves', () => {
  it('reproduces the hand-worked 3 x 4 dump', () => {
    const [curve] = haltingCurves([RUN_A], { thresholds: [0.5, 0.8], level: 0.95, referenceThreshold: 0.8 });
    expect(curve?.config).toBe('ticks=4');
    expect(curve?.accuracy[0]?.mean).toBeCloseTo(2 / 3, 15);
    expect(curve?.exitTick[0]?.mean).toBeCloseTo(4 / 3, 15);
    expect(curve?.accuracy[1]?.mean).toBeCloseTo(1 / 3, 15);
    expect(curve?.exitTick[1]?.mean).toBeCloseTo(7 / 3, 15);
    // One seed: no interval (null, never NaN).
    expect(curve?.accuracy[0]?.low).toBeNull();
    expect(curve?.exitTick[1]?.high).toBeNull();
    expect(curve?.exitHistogram).toEqual({ threshold: 0.8, counts: [0, 0, 2, 1] });
    expect(curve).toMatchObject({ seeds: 1, samples: 3, ticks: 4, thresholds: [0.5, 0.8] });
  });

  it('gives t-intervals across seeds and sums the histogram over runs', () => {
    // Per-run accuracy at tau .8: 1/3, 2/3, 1; mean exit tick at .5: 4/3, 0, 3.
    // 95% t-intervals stats.t.interval(0.95, 2, loc=mean(x), scale=stats.sem(x)) with the exact t quantile
    // (mpmath, 40 digits; closed form (2p - 1)/sqrt(2p(1 - p)) at df 2). scipy 1.10.1 (Debian python3-scipy)
    // gives t.ppf(.975, 2) 1.6e-10 too high, which moves the second interval by 1.4e-10
    // (tests/reference/ticks_reference.py).
    //   x = [1/3, 2/3, 1]  -> (-0.16137923725011016, 1.4947125705834434)
    //   x = [4/3, 0, 3]    -> (-2.289421343118291, 5.17831023200718)
    const [curve] = haltingCurves([RUN_A, RUN_B, RUN_C], {
      thresholds: [0.5, 0.8],
      level: 0.95,
      referenceThreshold: 0.8,
    });
    expect(curve?.seeds).toBe(3);
    expect(curve?.accuracy[1]?.mean).toBeCloseTo(2 / 3, 14);
    expect(curve?.accuracy[1]?.low).toBeCloseTo(-0.16137923725011016, 10);
    expect(curve?.accuracy[1]?.high).toBeCloseTo(1.4947125705834434, 10);
    expect(curve?.exitTick[0]?.mean).toBeCloseTo(13 / 9, 14);
    expect(curve?.exitTick[0]?.low).toBeCloseTo(-2.289421343118291, 10);
    expect(curve?.exitTick[0]?.high).toBeCloseTo(5.17831023200718, 10);
    // [0,0,2,1] + [3,0,0,0] + [0,0,0,3]
    expect(curve?.exitHistogram.counts).toEqual([3, 0, 2, 4]);
  });

  it('keeps the caller order of thresholds, allows duplicates and a reference outside the grid', () => {
    const [curve] = haltingCurves([RUN_A], { thresholds: [0.8, 0.5, 0.8], level: 0.95, referenceThreshold: 0.5 });
    expect(curve?.thresholds).toEqual([0.8, 0.5, 0.8]);
    expect(curve?.accuracy.map((a) => a.mean)).toEqual([1 / 3, 2 / 3, 1 / 3]);
    // At tau .5 the exits are 1, 0, 3.
    expect(curve?.exitHistogram).toEqual({ threshold: 0.5, counts: [1, 1, 0, 1] });
    const [other] = haltingCurves([RUN_A], { thresholds: [0.5], level: 0.95, referenceThreshold: 0.8 });
    expect(other?.exitHistogram.counts).toEqual([0, 0, 2, 1]);
  });

  it('uses the latest step of each run and groups runs by config', () => {
    const older = { ...RUN_C, run: 'a', step: 100 };
    const newer = { ...RUN_A, step: 200 };
    expect(latestDumpPerRun([newer, older])).toEqual([newer]);
    expect(latestDumpPerRun([{ ...RUN_C, run: 'a' }, newer])).toEqual([newer]); // a null step is oldest
    const curves = haltingCurves([older, newer, { ...RUN_B, config: 'ticks=8' }], {
      thresholds: [0.8],
      level: 0.95,
      referenceThreshold: 0.8,
    });
    expect(curves.map((c) => c.config)).toEqual(['ticks=4', 'ticks=8']);
    expect(curves[0]?.accuracy[0]?.mean).toBeCloseTo(1 / 3, 15);
  });

  it('agrees with a direct first-crossing search on random dumps', () => {
    const random = createRandom(7);
    const samples = 200;
    const ticks = 9;
    const thresholds = [0.1, 0.35, 0.5, 0.5001, 0.72, 0.9, 0.99];
    const certainty = Array.from({ length: samples }, () => Array.from({ length: ticks }, () => random.next()));
    const correct = Array.from({ length: samples }, () =>
      Array.from({ length: ticks }, () => (random.next() < 0.6 ? 1 : 0)),
    );
    at(certainty, 0)[3] = Number.NaN; // never triggers an exit
    const [curve] = haltingCurves([dump('r', 'c', certainty, correct)], {
      thresholds,
      level: 0.95,
      referenceThreshold: 0.72,
    });
    thresholds.forEach((tau, j) => {
      let right = 0;
      let exits = 0;
      for (let s = 0; s < samples; s++) {
        let e = at(certainty, s).findIndex((c) => c >= tau);
        if (e < 0) e = ticks - 1;
        right += at(at(correct, s), e);
        exits += e;
      }
      expect(curve?.accuracy[j]?.mean).toBeCloseTo(right / samples, 14);
      expect(curve?.exitTick[j]?.mean).toBeCloseTo(exits / samples, 14);
    });
    expect(curve?.exitHistogram.counts.reduce((a, b) => a + b, 0)).toBe(samples);
  });

  it('analyses 10,000 samples x 64 ticks x 10 seeds', () => {
    const samples = 10_000;
    const ticks = 64;
    const dumps: TickDump[] = [];
    for (let r = 0; r < 10; r++) {
      const certainty = new Float64Array(samples * ticks);
      const correct = new Uint8Array(samples * ticks);
      for (let s = 0; s < samples; s++) {
        for (let t = 0; t < ticks; t++) {
          certainty[s * ticks + t] = t / 63;
          correct[s * ticks + t] = (7 * s + t + r) % 3 === 0 ? 1 : 0;
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
        certainty,
        confidence: null,
      });
    }
    const thresholds = [0.25, 0.5, 0.9];
    const [curve] = haltingCurves(dumps, { thresholds, level: 0.95, referenceThreshold: 0.5 });
    thresholds.forEach((tau, j) => {
      // certainty t/63 first reaches tau at the same tick for every sample and seed.
      let exit = 0;
      while (exit / 63 < tau) exit++;
      expect(curve?.exitTick[j]?.mean).toBe(exit);
      expect(curve?.exitTick[j]?.low).toBeCloseTo(exit, 12);
      let right = 0;
      for (let r = 0; r < 10; r++) for (let s = 0; s < samples; s++) right += (7 * s + exit + r) % 3 === 0 ? 1 : 0;
      expect(curve?.accuracy[j]?.mean).toBeCloseTo(right / (10 * samples), 12);
    });
    expect(curve?.exitHistogram.counts[32]).toBe(10 * samples);
    expect(curve).toMatchObject({ seeds: 10, samples, ticks });
  });

  it('throws a RangeError on bad options or inconsistent dumps', () => {
    expect(() => haltingCurves([RUN_A], { thresholds: [], level: 0.95, referenceThreshold: 0.5 })).toThrow(RangeError);
    expect(() => haltingCurves([RUN_A], { thresholds: [Number.NaN], level: 0.95, referenceThreshold: 0.5 })).toThrow(
      RangeError,
    );
    const broken = { ...RUN_A, samples: 4 };
    expect(() => haltingCurves([broken], { thresholds: [0.5], level: 0.95, referenceThreshold: 0.5 })).toThrow(
      /samples x ticks/,
    );
    const notBinary = { ...RUN_A, correct: Uint8Array.from(RUN_A.correct, (k) => k * 2) };
    expect(() => haltingCurves([notBinary], { thresholds: [0.5], level: 0.95, referenceThreshold: 0.5 })).toThrow(
      /0 or 1/,
    );
  });
});
