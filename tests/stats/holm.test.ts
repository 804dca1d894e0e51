import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { holm, sortedOrder } from '../../src/stats/holm.js';

function expectAllRelative(actual: number[], expected: number[], tolerance = 1e-10): void {
  expect(actual.length).toBe(expected.length);
  actual.forEach((a, i) => {
    expect(Math.abs(a - (expected[i] as number))).toBeLessThanOrEqual(tolerance * Math.abs(expected[i] as number));
  });
}

// Benjamini & Hochberg (1995), JRSS B 57:289-300, section 4.1: the 15 p-values of their example.
const BH_1995 = Object.freeze([
  0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344, 0.0459, 0.324, 0.4262, 0.5719, 0.6528, 0.759, 1,
]);

describe('holm', () => {
  it(
    'adjusts [.01, .04, .03, .005, .2, .03] to [.05, .12, ' + '.12, .03, .2, .12] (METHODS.md, scipy 1.10.1 era check)',
    () => {
      const p = Object.freeze([0.01, 0.04, 0.03, 0.005, 0.2, 0.03]);
      expectAllRelative(holm(p), [0.05, 0.12, 0.12, 0.03, 0.2, 0.12]);
    },
  );

  it(
    'rejects 3 of the 15 Benjamini & Hochberg (1995) p-values ' + 'at .05 (their paper: Holm-type procedures reject 3)',
    () => {
      const adjusted = holm(BH_1995);
      expect(adjusted.filter((q) => q < 0.05).length).toBe(3);
      // First three by hand: 15 x .0001 = .0015, 14 x .0004 = .0056, 13 x .0019 = .0247; then 12 x .0095 = .114.
      expectAllRelative(adjusted.slice(0, 4), [0.0015, 0.0056, 0.0247, 0.114]);
    },
  );

  it('is monotone in p, never below p and at most 1 (definition)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { maxLength: 20 }), (p) => {
        const q = holm(p);
        p.forEach((pi, i) => {
          expect(q[i]).toBeGreaterThanOrEqual(pi);
          expect(q[i]).toBeLessThanOrEqual(1);
          p.forEach((pj, j) => {
            if (pi < pj) expect(q[i]).toBeLessThanOrEqual(q[j] as number);
          });
        });
      }),
      { seed: 7, numRuns: 200 },
    );
  });

  it('returns [] for no p-values and throws a RangeError on a value outside [0, 1] or NaN', () => {
    expect(holm([])).toEqual([]);
    expect(() => holm([0.1, 1.2])).toThrow(RangeError);
    expect(() => holm([Number.NaN])).toThrow(RangeError);
    expect(() => holm([-0.1])).toThrow(RangeError);
    expect(() => holm([0.1, 1.2])).toThrow('holm: p-value 1 must be in [0, 1], got 1.2');
  });

  it('sortedOrder: increasing p, ties in input order (its documented contract)', () => {
    expect(sortedOrder([0.3, 0.1, 0.2], 'holm')).toEqual([1, 2, 0]);
    expect(sortedOrder([0.2, 0.1, 0.2, 0.1, 0.2], 'holm')).toEqual([1, 3, 0, 2, 4]);
  });
});
