import { describe, expect, it } from 'vitest';
import { quantile, quantileSorted } from '../../src/stats/quantile.js';

describe('quantile (Hyndman & Fan type 7)', () => {
  const Q = Object.freeze([3.2, -1.0, 7.5, 0.0, 2.25, 9.0, 4.4]);

  it('matches numpy 1.24.2 np.quantile (default method "linear" = type 7)', () => {
    // np.quantile([3.2, -1.0, 7.5, 0.0, 2.25, 9.0, 4.4], p) with Debian python3-numpy 1.24.2.
    const numpy: ReadonlyArray<readonly [number, number]> = [
      [0, -1.0],
      [0.1, -0.3999999999999999],
      [0.25, 1.125],
      [0.5, 3.2],
      [0.8, 6.880000000000003],
      [0.9, 8.100000000000001],
      [1, 9.0],
    ];
    for (const [p, expected] of numpy) expect(quantile(Q, p), `p = ${p}`).toBeCloseTo(expected, 13);
  });

  it('interpolates as in Hyndman & Fan (1996), definition 7, worked by hand', () => {
    // sorted 1, 2, 3, 4: h = 3p; p = 0.25 -> 1 + 0.75 (2 - 1) = 1.75; p = 0.5 -> 2.5; p = 0.9 -> 3 + 0.7 = 3.7.
    expect(quantileSorted([1, 2, 3, 4], 0.25)).toBe(1.75);
    expect(quantileSorted([1, 2, 3, 4], 0.5)).toBe(2.5);
    expect(quantileSorted([1, 2, 3, 4], 0.9)).toBeCloseTo(3.7, 14);
    expect(quantileSorted(Float64Array.from([5]), 0.3)).toBe(5);
  });

  it('does not change its input and accepts typed arrays', () => {
    const typed = Float64Array.from(Q);
    expect(quantile(typed, 0.25)).toBeCloseTo(1.125, 13);
    expect(Array.from(typed)).toEqual(Q);
  });

  it('gives the same answer as quantileSorted on the sorted values', () => {
    const sorted = Object.freeze([...Q].sort((a, b) => a - b));
    for (const p of [0, 0.13, 0.5, 0.77, 1]) expect(quantile(Q, p)).toBe(quantileSorted(sorted, p));
  });

  it('keeps infinite values at the ends without NaN', () => {
    expect(quantile([Infinity, 1, 2], 1)).toBe(Infinity);
    expect(quantile([-Infinity, 1, 2], 0)).toBe(-Infinity);
    expect(quantile([-Infinity, 1, 2], 0.5)).toBe(1);
  });

  it('throws RangeError on empty input, NaN values and p outside [0, 1]', () => {
    expect(() => quantile([], 0.5)).toThrow(/at least 1 value/);
    expect(() => quantileSorted([], 0.5)).toThrow(RangeError);
    expect(() => quantile([1, Number.NaN, 3], 0.5)).toThrow(/NaN/);
    expect(() => quantile(Q, -0.01)).toThrow(/p must be in/);
    expect(() => quantile(Q, 1.01)).toThrow(/p must be in/);
    expect(() => quantile(Q, Number.NaN)).toThrow(/p must be in/);
  });
});
