import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { bootstrapMean } from '../../src/stats/bootstrap.js';
import { interquartileMean } from '../../src/stats/interquartileMean.js';
import { mean } from '../../src/stats/moments.js';
import { quantileSorted } from '../../src/stats/quantile.js';
import { createRandom } from '../../src/stats/random.js';
import { stratifiedBootstrap } from '../../src/stats/stratifiedBootstrap.js';

function expectRelative(actual: number, expected: number, tolerance = 1e-10): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tolerance * Math.abs(expected));
}

/** Michelson's speed-of-light data (NIST StRD "Michelso"): 5 experiments of 20 runs, our strata. */
const MICHELSON = readFileSync(new URL('../reference/nist-strd-univariate/Michelso.txt', import.meta.url), 'utf8')
  .split('\n')
  .slice(60)
  .map((line) => line.trim())
  .filter((line) => line !== '')
  .map(Number);
const EXPERIMENTS = Object.freeze([0, 1, 2, 3, 4].map((e) => Object.freeze(MICHELSON.slice(20 * e, 20 * e + 20))));

const concat = (strata: readonly Float64Array[]): Float64Array => {
  const out = new Float64Array(strata.reduce((s, a) => s + a.length, 0));
  let k = 0;
  for (const a of strata) for (const v of a) out[k++] = v;
  return out;
};

describe('stratifiedBootstrap', () => {
  it('matches a naive recomputation with the same draws (IQM over all task x run scores)', () => {
    const strata = Object.freeze([
      Object.freeze([0.2, 0.5, 0.9]),
      Object.freeze([0.1, 0.4]),
      Object.freeze([0.7, 0.8, 0.3, 0.6]),
    ]);
    const resamples = 1000;
    const result = stratifiedBootstrap(strata, (s) => interquartileMean(concat(s)), createRandom(4), { resamples });
    const random = createRandom(4);
    const stats: number[] = [];
    for (let b = 0; b < resamples; b++) {
      const drawn = strata.map((st) => Float64Array.from(st, () => st[random.int(st.length)] as number));
      stats.push(interquartileMean(concat(drawn)));
    }
    const sorted = Float64Array.from(stats).sort();
    expect(result.estimate).toBe(interquartileMean(concat(strata.map((s) => Float64Array.from(s)))));
    expect(result.low).toBe(quantileSorted(sorted, 0.025));
    expect(result.high).toBe(quantileSorted(sorted, 0.975));
    expect(result.level).toBe(0.95);
  });

  it('with one stratum and the mean, equals the percentile bootstrap of the mean with the same seed', () => {
    const x = Object.freeze([71.2, 69.8, 73.1, 70.4, 72.0]);
    const s = stratifiedBootstrap([x], (st) => mean(st[0] as Float64Array), createRandom(9), {
      resamples: 3000,
      level: 0.9,
    });
    const b = bootstrapMean(x, createRandom(9), { method: 'percentile', resamples: 3000, level: 0.9 });
    expectRelative(s.low, b.low, 1e-12);
    expectRelative(s.high, b.high, 1e-12);
  });

  it('resamples within each stratum only, keeping stratum sizes', () => {
    const strata = [
      [0, 0, 0],
      [100, 100],
    ];
    const r = stratifiedBootstrap(
      strata,
      (s) => {
        expect(s.map((a) => a.length)).toEqual([3, 2]);
        return Math.max(...(s[0] as Float64Array)) + Math.min(...(s[1] as Float64Array));
      },
      createRandom(1),
      { resamples: 200 },
    );
    expect([r.estimate, r.low, r.high]).toEqual([100, 100, 100]);
  });

  it('a statistic may sort its buffers in place without changing the result', () => {
    const strata = EXPERIMENTS.slice(0, 2);
    const copying = stratifiedBootstrap(
      strata,
      (s) => Float64Array.from(s[0] as Float64Array).sort()[10] as number,
      createRandom(5),
      { resamples: 500 },
    );
    const inPlace = stratifiedBootstrap(strata, (s) => (s[0] as Float64Array).sort()[10] as number, createRandom(5), {
      resamples: 500,
    });
    expect(inPlace).toEqual(copying);
  });

  it('for the mean of stratum means, the interval width is near 2 x 1.96 x the bootstrap standard error', () => {
    // Bootstrap variance of a mean = plug-in variance / n (Efron & Tibshirani 1993, sec. 5.2), so for
    // (1/H) sum of stratum means it is (1/H^2) sum_h s2_h (n_h - 1) / n_h^2; near normal with 5 x 20 runs.
    const H = EXPERIMENTS.length;
    const r = stratifiedBootstrap(
      EXPERIMENTS,
      (s) => s.reduce((acc, a) => acc + mean(a), 0) / s.length,
      createRandom(11),
      { resamples: 20_000 },
    );
    let v = 0;
    for (const e of EXPERIMENTS) {
      const m = mean(e);
      v += e.reduce((acc, x) => acc + (x - m) ** 2, 0) / e.length / e.length;
    }
    const sd = Math.sqrt(v) / H;
    expect((r.high - r.low) / (2 * 1.959963984540054 * sd)).toBeGreaterThan(0.95);
    expect((r.high - r.low) / (2 * 1.959963984540054 * sd)).toBeLessThan(1.05);
    expectRelative(r.estimate, EXPERIMENTS.reduce((acc, e) => acc + mean(e), 0) / H, 1e-14);
  });

  it(
    'throws a RangeError on no strata, an empty stratum, a non-finite value, a non-finite statistic, or bad ' +
      'options',
    () => {
      const random = createRandom(1);
      const stat = (s: readonly Float64Array[]): number => mean(s[0] as Float64Array);
      expect(() => stratifiedBootstrap([], stat, random)).toThrow(/at least 1 stratum/);
      expect(() => stratifiedBootstrap([[1], []], stat, random)).toThrow(/stratum 1 is empty/);
      expect(() => stratifiedBootstrap([[1, Number.NaN]], stat, random)).toThrow(RangeError);
      expect(() => stratifiedBootstrap([[1, 2]], () => Number.NaN, random)).toThrow(/statistic returned NaN/);
      expect(() => stratifiedBootstrap([[1, 2]], stat, random, { resamples: 1.5 })).toThrow(RangeError);
      expect(() => stratifiedBootstrap([[1, 2]], stat, random, { level: 0 })).toThrow(RangeError);
    },
  );
});
