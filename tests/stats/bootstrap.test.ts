import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import tQuantile from '@stdlib/stats-base-dists-t-quantile';
import { describe, expect, it } from 'vitest';
import { BOOTSTRAP_METHODS, bootstrapMean, bootstrapMeanDifference } from '../../src/stats/bootstrap.js';
import { bcaInterval } from '../../src/stats/bcaInterval.js';
import { jackknifeAcceleration } from '../../src/stats/jackknifeAcceleration.js';
import { percentileInterval } from '../../src/stats/percentileInterval.js';
import { mean, standardDeviation } from '../../src/stats/moments.js';
import { quantileSorted } from '../../src/stats/quantile.js';
import { createRandom } from '../../src/stats/random.js';
import { A, B, expectRelative, leaveOneOutMeans } from './idealBootstrap.js';

/** Naive resampling with the same draw order as the library: for each resample, n draws random.int(n). */
function naiveResamples(x: readonly number[], random: ReturnType<typeof createRandom>): number[] {
  return x.map(() => x[random.int(x.length)] as number);
}

function studentized(diff: number, se: number): number {
  if (se > 0) return diff / se;
  return diff === 0 ? 0 : diff > 0 ? Infinity : -Infinity;
}

const tieTolerance = (stats: Float64Array, theta: number): number =>
  1e-9 * Math.max(...Array.from(stats, (v) => Math.abs(v - theta)));

describe('bootstrapMean: Monte Carlo paths against a naive recomputation of the same resamples', () => {
  const resamples = 2000;
  const naive = (): { theta: number; stats: Float64Array; t: Float64Array } => {
    const random = createRandom(1);
    const theta = mean(A);
    const stats = new Float64Array(resamples);
    const t = new Float64Array(resamples);
    for (let b = 0; b < resamples; b++) {
      const r = naiveResamples(A, random);
      stats[b] = mean(r);
      t[b] = studentized(mean(r) - theta, standardDeviation(r) / Math.sqrt(A.length));
    }
    return { theta, stats: stats.sort(), t: t.sort() };
  };
  const ref = naive();

  it('percentile: quantiles .025 and .975 of the resample means', () => {
    const r = bootstrapMean(A, createRandom(1), { method: 'percentile', resamples });
    expectRelative(r.low, quantileSorted(ref.stats, 0.025), 1e-12);
    expectRelative(r.high, quantileSorted(ref.stats, 0.975), 1e-12);
    expect(r).toMatchObject({ estimate: ref.theta, level: 0.95, method: 'percentile', resamples });
  });

  it(
    'expanded percentile: tail Phi(sqrt(5/4) t_{.025,4}) = ' + '0.0009541005518824885 (Hesterberg 2015; scipy 1.10.1)',
    () => {
      const tail = normalCdf(Math.sqrt(5 / 4) * tQuantile(0.025, 4), 0, 1);
      expectRelative(tail, 0.0009541005518824885, 1e-9);
      const r = bootstrapMean(A, createRandom(1), { method: 'expanded-percentile', resamples });
      expectRelative(r.low, quantileSorted(ref.stats, tail), 1e-12);
      expectRelative(r.high, quantileSorted(ref.stats, 1 - tail), 1e-12);
    },
  );

  it('BCa: the core applied to the resample means with the jackknife acceleration', () => {
    const a = jackknifeAcceleration([leaveOneOutMeans(A)]);
    const expected = bcaInterval(ref.stats, ref.theta, a, 0.95, tieTolerance(ref.stats, ref.theta));
    const r = bootstrapMean(A, createRandom(1), { resamples }); // BCa is the default
    expect(r.method).toBe('bca');
    expectRelative(r.low, expected.low, 1e-12);
    expectRelative(r.high, expected.high, 1e-12);
  });

  it('bootstrap-t: theta - t*_{.975} se, theta - t*_{.025} se, se* from each resample', () => {
    const se = standardDeviation(A) / Math.sqrt(A.length);
    const r = bootstrapMean(A, createRandom(1), { method: 'bootstrap-t', resamples });
    expectRelative(r.low, ref.theta - quantileSorted(ref.t, 0.975) * se, 1e-9);
    expectRelative(r.high, ref.theta - quantileSorted(ref.t, 0.025) * se, 1e-9);
  });

  it('reproduces exact seeded outputs (regression pins of this implementation, seed 1, B = 2000)', () => {
    const pins: Record<(typeof BOOTSTRAP_METHODS)[number], [number, number]> = {
      percentile: [70.32000000000001, 72.2815],
      'expanded-percentile': [69.92, 72.6655651798072],
      bca: [70.44, 72.34],
      'bootstrap-t': [69.83578344122039, 73.51844220069796],
    };
    for (const method of BOOTSTRAP_METHODS) {
      const r = bootstrapMean(A, createRandom(1), { method, resamples });
      expect([r.low, r.high]).toEqual(pins[method]);
    }
  });
});

describe('bootstrapMeanDifference: Monte Carlo paths against a naive recomputation', () => {
  const resamples = 2000;
  const random = createRandom(2);
  const theta = mean(A) - mean(B);
  const stats = new Float64Array(resamples);
  const t = new Float64Array(resamples);
  for (let b = 0; b < resamples; b++) {
    const rx = naiveResamples(A, random); // x first, then y, as the library draws
    const ry = naiveResamples(B, random);
    const diff = mean(rx) - mean(ry);
    stats[b] = diff;
    const seStar = Math.sqrt(standardDeviation(rx) ** 2 / A.length + standardDeviation(ry) ** 2 / B.length);
    t[b] = studentized(diff - theta, seStar);
  }
  stats.sort();
  t.sort();

  it('percentile and BCa (two-sample jackknife acceleration) match the cores on the same resamples', () => {
    const p = bootstrapMeanDifference(A, B, createRandom(2), { method: 'percentile', resamples });
    expectRelative(p.estimate, theta, 1e-14);
    expectRelative(p.low, quantileSorted(stats, 0.025), 1e-11);
    expectRelative(p.high, quantileSorted(stats, 0.975), 1e-11);
    const bca = bootstrapMeanDifference(A, B, createRandom(2), { method: 'bca', resamples });
    const expected = bcaInterval(stats, theta, 0.013974522533729852, 0.95, tieTolerance(stats, theta));
    expectRelative(bca.low, expected.low, 1e-10);
    expectRelative(bca.high, expected.high, 1e-10);
  });

  it('bootstrap-t uses the Welch standard error of each resample', () => {
    const se = Math.sqrt(standardDeviation(A) ** 2 / A.length + standardDeviation(B) ** 2 / B.length);
    const r = bootstrapMeanDifference(A, B, createRandom(2), { method: 'bootstrap-t', resamples });
    expectRelative(r.low, theta - quantileSorted(t, 0.975) * se, 1e-9);
    expectRelative(r.high, theta - quantileSorted(t, 0.025) * se, 1e-9);
  });

  it("expanded percentile reduces to Hesterberg's one-sample tail when y is constant", () => {
    const y = Object.freeze([70, 70, 70]);
    const r = bootstrapMeanDifference(A, y, createRandom(3), { method: 'expanded-percentile', resamples });
    const random = createRandom(3);
    const diffs = new Float64Array(resamples);
    for (let b = 0; b < resamples; b++) {
      diffs[b] = mean(naiveResamples(A, random)) - 70;
      naiveResamples(y, random); // y's draws follow x's in every resample
    }
    diffs.sort();
    const tail = normalCdf(Math.sqrt(5 / 4) * tQuantile(0.025, 4), 0, 1);
    expectRelative(r.low, quantileSorted(diffs, tail), 1e-11);
    expectRelative(r.high, quantileSorted(diffs, 1 - tail), 1e-11);
  });

  it('reproduces exact seeded outputs (regression pins of this implementation, seed 1, B = 2000)', () => {
    const pins: Record<(typeof BOOTSTRAP_METHODS)[number], [number, number]> = {
      percentile: [0.5170714285714315, 3.0346428571428516],
      'expanded-percentile': [0.19427843663502875, 3.3085714285714274],
      bca: [0.540194607401822, 3.067631233113696],
      'bootstrap-t': [0.1438493761360493, 3.4001298261006148],
    };
    for (const method of BOOTSTRAP_METHODS) {
      const r = bootstrapMeanDifference(A, B, createRandom(1), { method, resamples });
      expect([r.low, r.high]).toEqual(pins[method]);
    }
  });
});

describe('bootstrap: facts and failures', () => {
  it('a percentile interval of a mean lies inside [min, max] of the sample (METHODS.md)', () => {
    for (const seed of [1, 2, 3]) {
      const r = bootstrapMean([3, 1, 4, 1, 5], createRandom(seed), { method: 'percentile', resamples: 500 });
      expect(r.low).toBeGreaterThanOrEqual(1);
      expect(r.high).toBeLessThanOrEqual(5);
    }
  });

  it('bootstrap-t at n = 3 is usually infinite (METHODS.md: infinite in 99.7% of cases)', () => {
    const r = bootstrapMean([0.3, 1.1, 2.9], createRandom(1), { method: 'bootstrap-t', resamples: 2000 });
    expect(r.low).toBe(-Infinity);
    expect(r.high).toBe(Infinity);
  });

  it('BCa throws a RangeError with the reason when every value is equal or z0 is infinite', () => {
    expect(() => bootstrapMean([2, 2, 2], createRandom(1))).toThrow(/every resampled statistic is equal/);
    expect(() => bcaInterval([1, 2, 3], 10, 0, 0.95)).toThrow(/one side of the estimate/);
    expect(() => bcaInterval([1, 2, 3, 4], 2.5, 0.9, 0.95)).toThrow(/too large/);
  });

  it('constant data give a zero-width interval for the other methods', () => {
    for (const method of ['percentile', 'expanded-percentile', 'bootstrap-t'] as const) {
      const r = bootstrapMean([2, 2, 2], createRandom(1), { method, resamples: 100 });
      expect([r.low, r.high]).toEqual([2, 2]);
    }
  });

  it('throws a RangeError on too few values, non-finite values or bad options', () => {
    const random = createRandom(1);
    expect(() => bootstrapMean([1], random)).toThrow(/at least 2 values/);
    expect(() => bootstrapMeanDifference([1, 2], [3], random)).toThrow(/at least 2 values in y/);
    expect(() => bootstrapMean([1, Number.NaN], random)).toThrow(RangeError);
    expect(() => bootstrapMean([1, 2], random, { resamples: 0 })).toThrow(RangeError);
    expect(() => bootstrapMean([1, 2], random, { level: 1 })).toThrow(RangeError);
    expect(() => bootstrapMean([1, 2], random, { method: 'basic' as never })).toThrow(RangeError);
    expect(() => percentileInterval([], 0.95)).toThrow(RangeError);
  });
});
