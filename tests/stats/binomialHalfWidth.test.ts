import { describe, expect, it } from 'vitest';
import { binomialHalfWidth } from '../../src/stats/binomialHalfWidth.js';

describe('binomialHalfWidth', () => {
  it('is the binomial standard error sqrt(p(1-p)/m) (Agresti, Categorical Data Analysis, sec. 1.3)', () => {
    // Textbook figure: p = 0.5 on m = 100 examples gives a standard error of 0.05.
    expect(binomialHalfWidth(0.5, 100)).toBeCloseTo(0.05, 15);
    // sqrt(0.9 * 0.1 / 10000) = sqrt(9e-6) = 0.003
    expect(binomialHalfWidth(0.9, 10000)).toBeCloseTo(0.003, 15);
    expect(binomialHalfWidth(0, 10)).toBe(0);
    expect(binomialHalfWidth(1, 10)).toBe(0);
  });

  it('throws a RangeError outside its domain', () => {
    expect(() => binomialHalfWidth(1.2, 10)).toThrow(RangeError);
    expect(() => binomialHalfWidth(Number.NaN, 10)).toThrow(RangeError);
    expect(() => binomialHalfWidth(0.5, 0)).toThrow(RangeError);
    expect(() => binomialHalfWidth(0.5, 2.5)).toThrow(RangeError);
  });
});
