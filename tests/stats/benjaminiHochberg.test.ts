import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { benjaminiHochberg } from '../../src/stats/benjaminiHochberg.js';
import { holm } from '../../src/stats/holm.js';

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

describe('benjaminiHochberg', () => {
  it(
    'adjusts [.01, .04, .03, .005, .2, .03] to [.03, .048, .045, .03, .2, .045] (METHODS.md; statsmodels 0.13.5 ' +
      'multipletests fdr_bh agrees)',
    () => {
      const p = Object.freeze([0.01, 0.04, 0.03, 0.005, 0.2, 0.03]);
      expectAllRelative(benjaminiHochberg(p), [0.03, 0.048, 0.045, 0.03, 0.2, 0.045]);
    },
  );

  it('rejects 4 of the 15 Benjamini & Hochberg (1995) p-values at .05, as in their paper', () => {
    const q = benjaminiHochberg(BH_1995);
    expect(q.filter((v) => v <= 0.05).length).toBe(4);
    // Debian python3-statsmodels 0.13.5: multipletests(p, method='fdr_bh'), and the step-up formula written out
    // in numpy (tests/reference/rank_resampling_reference.py); scipy 1.10.1 has no Benjamini-Hochberg function.
    expectAllRelative(
      q,
      [
        0.0015, 0.003, 0.0095, 0.035625, 0.0603, 0.06385714285714286, 0.06385714285714286, 0.0645, 0.07650000000000001,
        0.486, 0.5811818181818181, 0.7148749999999999, 0.7532307692307693, 0.8132142857142857, 1,
      ],
    );
  });

  it('is monotone in p, at least p, at most Holm and at most 1 (step-up dominates step-down; definition)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { maxLength: 20 }), (p) => {
        const q = benjaminiHochberg(p);
        const h = holm(p);
        p.forEach((pi, i) => {
          expect(q[i]).toBeGreaterThanOrEqual(pi);
          expect(q[i]).toBeLessThanOrEqual((h[i] as number) * (1 + 1e-12));
          p.forEach((pj, j) => {
            if (pi < pj) expect(q[i]).toBeLessThanOrEqual(q[j] as number);
          });
        });
      }),
      { seed: 11, numRuns: 200 },
    );
  });

  it('returns [] for no p-values and throws a RangeError on a value outside [0, 1] or NaN', () => {
    expect(benjaminiHochberg([])).toEqual([]);
    expect(() => benjaminiHochberg([2])).toThrow(RangeError);
    expect(() => benjaminiHochberg([Number.NaN])).toThrow(RangeError);
  });
});
