import tQuantile from '@stdlib/stats-base-dists-t-quantile';
import { describe, expect, it } from 'vitest';
import { T_TABLE_0975 } from './tTable.js';
import { createTQuantileCache, studentTQuantile } from '../../src/stats/studentTQuantile.js';

function expectRel(actual: number, expected: number, tolerance: number): void {
  const err = Math.abs(actual - expected) / Math.abs(expected);
  expect(err, `${actual} vs ${expected}`).toBeLessThanOrEqual(tolerance);
}

describe('studentTQuantile', () => {
  it('matches the handbook t table of METHODS.md (0.975 at df 1, 2, 5, 10, 30, 120), directly and from a cache', () => {
    // METHODS.md check values: 40-digit mpmath roots rounded to 6 decimals (tests/stats/tTable.ts).
    const table = T_TABLE_0975;
    const cache = createTQuantileCache();
    for (let round = 0; round < 2; round++) {
      for (const [df, q] of table) {
        expect(Math.abs(studentTQuantile(0.975, df) - q), `df ${df}, round ${round}`).toBeLessThanOrEqual(5e-7);
        expect(Math.abs(cache.quantile(0.975, df) - q), `df ${df}, round ${round}`).toBeLessThanOrEqual(5e-7);
      }
    }
  });

  it('matches 40-digit t quantiles, whole and fractional df, both tails', () => {
    // mpmath 1.2.1 at 40 digits (Debian python3-mpmath): the root of the regularized incomplete beta
    // form of the t CDF, tests/reference/t_family_reference.py ('studentTQuantile cases'). Debian's
    // scipy 1.10.1 t.ppf is only good to a few 1e-9 relative here (the script prints it beside each).
    const cases: ReadonlyArray<readonly [number, number, number]> = [
      [0.975, 1, 12.706204736174705],
      [0.975, 7.5, 2.3330396268649746],
      [0.95, 10, 1.8124611228116764],
      [0.995, 3.25, 5.4169512012358878],
      [0.025, 12, -2.1788128296672289],
    ];
    for (let round = 0; round < 2; round++) {
      for (const [p, df, q] of cases) expectRel(studentTQuantile(p, df), q, 1e-12);
    }
  });

  it('a cache returns exactly the number @stdlib returns, also once remembered and after it starts over', () => {
    // More distinct (p, df) pairs than the cache keeps (4,096), so it is cleared at least once on the way.
    const cache = createTQuantileCache();
    const pairs: [number, number][] = [];
    for (const p of [0.9, 0.95, 0.975, 0.995, 0.025, 0.5]) for (let i = 0; i < 800; i++) pairs.push([p, 1 + i * 0.37]);
    for (let round = 0; round < 2; round++) {
      for (const [p, df] of pairs) {
        expect(Object.is(cache.quantile(p, df), tQuantile(p, df)), `p ${p}, df ${df}`).toBe(true);
        expect(Object.is(studentTQuantile(p, df), tQuantile(p, df)), `p ${p}, df ${df}`).toBe(true);
      }
    }
    expect(cache.size()).toBeLessThanOrEqual(4096);
  });

  it('caches are independent: a new one starts empty, and nothing is kept between calls of studentTQuantile', () => {
    const a = createTQuantileCache(2);
    a.quantile(0.975, 10);
    a.quantile(0.975, 11);
    expect(a.size()).toBe(2);
    a.quantile(0.975, 12); // over the limit: starts over with this pair
    expect(a.size()).toBe(1);
    expect(createTQuantileCache().size()).toBe(0);
    expect(() => createTQuantileCache(0)).toThrow(RangeError);
  });

  it('gives what @stdlib gives outside the domain (NaN) and at the ends (infinities), without throwing', () => {
    expect(studentTQuantile(0.975, 0)).toBeNaN();
    expect(studentTQuantile(0.975, -1)).toBeNaN();
    expect(studentTQuantile(1.5, 3)).toBeNaN();
    expect(studentTQuantile(Number.NaN, 3)).toBeNaN();
    expect(studentTQuantile(0, 3)).toBe(-Infinity);
    expect(studentTQuantile(1, 3)).toBe(Infinity);
  });
});
