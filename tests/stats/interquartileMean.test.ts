import { describe, expect, it } from 'vitest';
import { interquartileMean } from '../../src/stats/interquartileMean.js';
import { createRandom } from '../../src/stats/random.js';

// METHODS.md check input.
const X = Object.freeze([0.05, 0.31, 0.42, 0.48, 0.55, 0.61, 0.77, 0.93, 1.2, 2.5]);

describe('interquartileMean', () => {
  it('is 0.617 on the METHODS.md input (fractional weights at the 25%/75% cuts)', () => {
    expect(interquartileMean(X)).toBeCloseTo(0.617, 14); // METHODS.md; by hand: (0.21 + 2.41 + 0.465) / 5
  });

  it('differs from the trimmed mean that drops whole values (METHODS.md note: 0.626667)', () => {
    // scipy.stats.trim_mean(x, 0.25) drops int(0.25 * 10) = 2 values per end; written out by hand here.
    const sorted = [...X].sort((a, b) => a - b);
    const middle = sorted.slice(2, 8);
    const trimmed = middle.reduce((s, v) => s + v, 0) / middle.length;
    expect(Math.abs(trimmed - 0.626667)).toBeLessThan(5e-7); // METHODS.md, 6 decimals
    expect(Math.abs(interquartileMean(X) - trimmed)).toBeGreaterThan(0.009);
  });

  it('equals the 25% trimmed mean when n is a multiple of 4 (hand algebra)', () => {
    // n = 8: the cuts fall between values, so the IQM is the mean of values 3..6 of the sorted list.
    expect(interquartileMean([8, 1, 7, 2, 6, 3, 5, 4])).toBeCloseTo((3 + 4 + 5 + 6) / 4, 15);
  });

  it('weights small samples by overlap (n = 1, 2, 3 by hand)', () => {
    expect(interquartileMean([4])).toBe(4);
    expect(interquartileMean([1, 3])).toBe(2);
    // n = 3: the middle stretch [0.75, 2.25] covers 0.25 of the first value, all of the second, 0.25 of the third.
    expect(interquartileMean([0, 10, 100])).toBeCloseTo((0.25 * 0 + 10 + 0.25 * 100) / 1.5, 14);
  });

  it('does not depend on order and does not change its input', () => {
    const random = createRandom(7);
    const shuffled = [...X];
    for (let i = shuffled.length - 1; i > 0; i--) {
      const j = random.int(i + 1);
      [shuffled[i], shuffled[j]] = [shuffled[j] as number, shuffled[i] as number];
    }
    const typed = Float64Array.from(shuffled);
    expect(interquartileMean(typed)).toBeCloseTo(0.617, 14);
    expect(Array.from(typed)).toEqual(shuffled);
  });

  it('throws RangeError on empty input and NaN', () => {
    expect(() => interquartileMean([])).toThrow(/at least 1 value/);
    expect(() => interquartileMean([1, Number.NaN])).toThrow(/NaN/);
  });
});
