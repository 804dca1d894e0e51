import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { cliffsDelta } from '../../src/stats/cliffsDelta.js';
import { mannWhitney } from '../../src/stats/mannWhitney.js';

function expectRelative(actual: number, expected: number, tolerance = 1e-10): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tolerance * Math.abs(expected));
}

const A = Object.freeze([71.2, 69.8, 73.1, 70.4, 72.0]);
const B = Object.freeze([68.9, 70.1, 69.5, 71.0, 67.8, 70.6, 69.2]);
// The R package effsize's own test data (tests/testthat/testCliff.R, "Small differences").
const TREATMENT = Object.freeze([10, 10, 20, 20, 20, 30, 30, 30, 40, 50]);
const CONTROL = Object.freeze([10, 20, 30, 40, 40, 50]);

describe('cliffsDelta', () => {
  it('A vs B: delta, P(improvement), consistent variance and normal-z interval (METHODS.md)', () => {
    const r = cliffsDelta(A, B);
    expectRelative(r.delta, 0.714285714, 1e-9); // = 25/35
    expectRelative(r.delta, 25 / 35);
    expectRelative(r.probabilityOfImprovement, 0.857142857, 1e-9);
    expectRelative(r.variance, 0.06494071914480078);
    expectRelative(r.low, 0.00061319297, 1e-8); // 11 significant digits given
    expectRelative(r.high, 0.94588140903, 1e-10);
  });

  it(
    "effsize's test data: delta -0.25 and interval " + '(-0.7125350951, 0.3639998950) (METHODS.md, R package effsize)',
    () => {
      const r = cliffsDelta(TREATMENT, CONTROL);
      expect(r.delta).toBe(-0.25);
      expect(r.probabilityOfImprovement).toBe(0.375);
      expectRelative(r.low, -0.7125350951, 1e-9);
      expectRelative(r.high, 0.363999895, 1e-9);
    },
  );

  it("effsize's 'Negligible differences' data: delta -0.06666 (effsize tests/testthat/testCliff.R)", () => {
    const r = cliffsDelta([10, 20, 20, 20, 30, 30, 30, 40, 50, 100], [10, 20, 30, 40, 40, 50]);
    expect(r.delta).toBeCloseTo(-0.06666, 4);
  });

  it('probability of improvement is U / (n1 n2), the Mann-Whitney U of x (METHODS.md definition)', () => {
    const sample = fc.array(fc.integer({ min: 0, max: 5 }), { minLength: 2, maxLength: 8 });
    fc.assert(
      fc.property(sample, sample, (x, y) => {
        const r = cliffsDelta(x, y);
        expect(r.probabilityOfImprovement).toBeCloseTo(
          mannWhitney(x, y, { method: 'asymptotic' }).u / (x.length * y.length),
          14,
        );
        expect(r.low).toBeLessThanOrEqual(r.delta + 1e-12);
        expect(r.high).toBeGreaterThanOrEqual(r.delta - 1e-12);
        expect(r.low).toBeGreaterThanOrEqual(-1);
        expect(r.high).toBeLessThanOrEqual(1);
      }),
      { seed: 5, numRuns: 200 },
    );
  });

  it('complete separation: delta 1 with the upper bound set to 1 (as effsize)', () => {
    const r = cliffsDelta([5, 6, 7], [1, 2, 3]);
    expect(r.delta).toBe(1);
    expect(r.high).toBe(1);
    expect(r.low).toBeGreaterThan(0);
    expect(r.low).toBeLessThan(1);
    expect(cliffsDelta([1, 2, 3], [5, 6, 7]).low).toBe(-1);
  });

  it('all values tied: delta 0 with a zero-width interval', () => {
    expect(cliffsDelta([2, 2], [2, 2, 2])).toEqual({
      delta: 0,
      probabilityOfImprovement: 0.5,
      variance: 0,
      low: 0,
      high: 0,
    });
  });

  it('throws a RangeError with fewer than 2 values per group, NaN, or a bad level', () => {
    expect(() => cliffsDelta([1], [1, 2])).toThrow(/at least 2 values per group/);
    expect(() => cliffsDelta([1, Number.NaN], [1, 2])).toThrow(RangeError);
    expect(() => cliffsDelta([1, 2], [1, 2], 1)).toThrow(RangeError);
  });
});
