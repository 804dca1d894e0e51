import { describe, expect, it } from 'vitest';
import { T_TABLE_0975 } from './tTable.js';
import { studentTBounds, tInterval } from '../../src/stats/tInterval.js';

function expectRel(actual: number, expected: number, tolerance: number): void {
  const err = Math.abs(actual - expected) / Math.abs(expected);
  expect(err, `${actual} vs ${expected}`).toBeLessThanOrEqual(tolerance);
}

const A = Object.freeze([71.2, 69.8, 73.1, 70.4, 72.0]); // METHODS.md input A

/**
 * n values with mean 0 and standard error 1: -c, +c, -c, +c, ... (and a 0 when n is odd) have mean 0
 * and sum of squares 2 floor(n/2) c^2; c is chosen so that the variance is n, so se = sqrt(var / n) = 1.
 */
function unitStandardError(n: number): number[] {
  const pairs = Math.floor(n / 2);
  const c = Math.sqrt((n * (n - 1)) / (2 * pairs));
  const x: number[] = [];
  for (let i = 0; i < pairs; i++) x.push(-c, c);
  if (n % 2 === 1) x.push(0);
  return x;
}

describe('tInterval', () => {
  it('uses the Student t quantiles of the handbook table (0.975, df 1, 2, 5, 10, 30, 120)', () => {
    // METHODS.md's t table (6 decimals): 40-digit mpmath roots, rounded (tests/stats/tTable.ts).
    const table = T_TABLE_0975;
    for (const [df, q] of table) {
      const r = tInterval(Object.freeze(unitStandardError(df + 1)));
      expect(r.df).toBe(df);
      expect(Math.abs(r.estimate)).toBeLessThan(1e-14);
      // The table has 6 decimals: agree to half a unit in the last place.
      expect(Math.abs(r.high - q), `df ${df}`).toBeLessThanOrEqual(5e-7);
      expect(Math.abs(-r.low - q), `df ${df}`).toBeLessThanOrEqual(5e-7);
    }
  });

  it('uses exact t quantiles (mpmath at 40 digits)', () => {
    const exact: ReadonlyArray<readonly [number, number]> = [
      [1, 12.706204736174705],
      [2, 4.3026527297494639],
      [4, 2.7764451051977944],
      [5, 2.5705818356363155],
      [10, 2.2281388519862747],
      [30, 2.0422724563012383],
      [120, 1.9799304050824408],
    ];
    for (const [df, q] of exact) {
      expectRel(studentTBounds(0, 1, df, 0.95, 'two-sided').high, q, 1e-12);
      expectRel(tInterval(unitStandardError(df + 1)).high, q, 1e-12);
    }
  });

  it('reproduces the interval for the mean of A (scipy 1.10.1 t.interval; mpmath)', () => {
    const r = tInterval(A);
    expectRel(r.estimate, 71.3, 1e-14); // by hand: 356.5 / 5
    // scipy 1.10.1: t.interval(0.95, 4, loc=mean(A), scale=sem(A)) = (69.68106821529129, 72.9189317847087)
    expectRel(r.low, 69.68106821529129, 1e-12);
    expectRel(r.high, 72.9189317847087, 1e-12);
    // mpmath at 40 digits
    expectRel(r.low, 69.681068215291296, 1e-13);
    expectRel(r.high, 72.918931784708704, 1e-13);
    expect(r.level).toBe(0.95);
    expect(r.df).toBe(4);
  });

  it('has zero width when all values are equal, and accepts typed arrays', () => {
    expect(tInterval(Float64Array.from([3, 3, 3]))).toEqual({ estimate: 3, low: 3, high: 3, df: 2, level: 0.95 });
  });

  it('throws RangeError for n < 2 and bad levels', () => {
    expect(() => tInterval([1])).toThrow(/at least 2 values/);
    expect(() => tInterval([])).toThrow(RangeError);
    expect(() => tInterval(A, 0)).toThrow(/level/);
    expect(() => tInterval(A, 1)).toThrow(/level/);
    expect(() => tInterval(A, Number.NaN)).toThrow(/level/);
  });
});

describe('studentTBounds', () => {
  it('gives one-sided bounds with the level quantile and an infinite other end', () => {
    // t_{0.95, 10} = 1.8124611228116764 (mpmath at 40 digits; printed t tables give 1.812, common practice).
    const greater = studentTBounds(5, 2, 10, 0.95, 'greater');
    expectRel(greater.low, 5 - 2 * 1.8124611228116764, 1e-12);
    expect(greater.high).toBe(Infinity);
    const less = studentTBounds(5, 2, 10, 0.95, 'less');
    expect(less.low).toBe(-Infinity);
    expectRel(less.high, 5 + 2 * 1.8124611228116764, 1e-12);
  });

  it('throws RangeError on bad level, df or standard error', () => {
    expect(() => studentTBounds(0, 1, 10, 1, 'two-sided')).toThrow(RangeError);
    expect(() => studentTBounds(0, 1, 0, 0.95, 'two-sided')).toThrow(RangeError);
    expect(() => studentTBounds(0, -1, 10, 0.95, 'two-sided')).toThrow(RangeError);
  });
});
