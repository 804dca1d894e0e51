import { describe, expect, it } from 'vitest';
import { pairedT } from '../../src/stats/pairedT.js';
import { tInterval } from '../../src/stats/tInterval.js';

// Student's sleep data (Cushny & Peebles 1905, analysed by Student 1908): extra hours of sleep of
// 10 patients under two drugs; R's `datasets::sleep`, whose help page runs the paired t-test.
const DRUG1 = Object.freeze([0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0]);
const DRUG2 = Object.freeze([1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4]);

function expectRel(actual: number, expected: number, tolerance: number): void {
  const err = Math.abs(actual - expected) / Math.abs(expected);
  expect(err, `${actual} vs ${expected}`).toBeLessThanOrEqual(tolerance);
}

describe('pairedT', () => {
  it("reproduces the paired t-test on Student's sleep data", () => {
    const r = pairedT(DRUG1, DRUG2);
    // scipy 1.10.1: ttest_rel(drug1, drug2) -> statistic, pvalue. R's printed output (from memory):
    // t = -4.0621, df = 9, p-value = 0.002833, 95 percent CI -2.4598858 -0.7001142, mean difference -1.58.
    expectRel(r.statistic, -4.062127683382037, 1e-10);
    expect(r.df).toBe(9);
    expectRel(r.p, 0.00283289019738427, 1e-10);
    expectRel(r.difference, -1.58, 1e-13);
    // mpmath at 40 digits (mean -+ exact t quantile x se).
    expectRel(r.low, -2.4598857632769829, 1e-10);
    expectRel(r.high, -0.70011423672301726, 1e-10);
    // R's printed interval, 8 significant digits.
    expect(Math.abs(r.low - -2.4598858)).toBeLessThan(5e-8);
    expect(Math.abs(r.high - -0.7001142)).toBeLessThan(5e-8);
    expect(r.level).toBe(0.95);
  });

  it('gives the one-sided p-values of scipy 1.10.1 ttest_rel', () => {
    expectRel(pairedT(DRUG1, DRUG2, { alternative: 'greater' }).p, 0.9985835549013079, 1e-10);
    expectRel(pairedT(DRUG1, DRUG2, { alternative: 'less' }).p, 0.001416445098692135, 1e-10);
    const less = pairedT(DRUG1, DRUG2, { alternative: 'less' });
    expect(less.low).toBe(-Infinity);
    expect(less.high).toBeLessThan(0);
  });

  it('is the one-sample t-interval of the differences (definition, Student 1908)', () => {
    const differences = DRUG1.map((v, i) => v - (DRUG2[i] as number));
    for (const level of [0.9, 0.95, 0.99]) {
      const paired = pairedT(DRUG1, DRUG2, { level });
      const oneSample = tInterval(differences, level);
      expect(paired.difference).toBeCloseTo(oneSample.estimate, 14);
      expect(paired.low).toBeCloseTo(oneSample.low, 13);
      expect(paired.high).toBeCloseTo(oneSample.high, 13);
      expect(paired.df).toBe(oneSample.df);
    }
  });

  it('does not depend on which differences are positive beyond the sign', () => {
    const r = pairedT(DRUG2, DRUG1);
    expectRel(r.statistic, 4.062127683382037, 1e-10);
    expectRel(r.p, 0.00283289019738427, 1e-10);
  });

  it('throws RangeError on unequal lengths, too few pairs, zero variance and bad options', () => {
    expect(() => pairedT([1, 2, 3], [1, 2])).toThrow(/equal length/);
    expect(() => pairedT([1], [2])).toThrow(/at least 2 pairs/);
    expect(() => pairedT([1, 2, 3], [0, 1, 2])).toThrow(/zero variance/);
    expect(() => pairedT(DRUG1, DRUG2, { level: 1.5 })).toThrow(RangeError);
    expect(() => pairedT(DRUG1, DRUG2, { alternative: 'up' as never })).toThrow(RangeError);
  });
});
