import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { wilcoxonSignedRank } from '../../src/stats/wilcoxon.js';

function expectRelative(actual: number, expected: number, tolerance = 1e-10): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tolerance * Math.abs(expected));
}

// Darwin's Zea mays differences (cross- minus self-fertilised heights, eighths of an inch), as in
// Fisher's "The design of experiments" and the scipy.stats.wilcoxon documentation example.
const DARWIN = Object.freeze([6, 8, 14, 16, 23, 24, 28, 29, 41, -48, 49, 56, 60, -67, 75]);
const ZEROS = Object.freeze(new Array<number>(15).fill(0));
// METHODS.md values used as pairs.
const A = Object.freeze([71.2, 69.8, 73.1, 70.4, 72.0]);
const B5 = Object.freeze([68.9, 70.1, 69.5, 71.0, 67.8]);
const C = Object.freeze([72, 70, 74, 70, 72]);
const D5 = Object.freeze([69, 70, 68, 71, 70]); // differences 3, 0, 6, -1, 2: one zero
const D5b = Object.freeze([68, 71, 70, 67, 72]); // differences 4, -1, 4, 3, 0: a zero and a tie

describe('wilcoxonSignedRank: exact (no zeros, no ties)', () => {
  it(
    "Darwin's data: W+ = 96, p two-sided 0.041259765625, " + 'greater 0.0206298828125 (scipy documentation example)',
    () => {
      const two = wilcoxonSignedRank(DARWIN, ZEROS);
      expect(two.exact).toBe(true);
      expect(two.statistic).toBe(96);
      expect(two.pairs).toBe(15);
      expectRelative(two.p, 0.041259765625);
      expectRelative(wilcoxonSignedRank(DARWIN, ZEROS, { alternative: 'greater' }).p, 0.0206298828125);
      // scipy 1.10.1 (Debian python3-scipy): wilcoxon(d, alternative='less').pvalue;
      // tests/reference/rank_resampling_reference.py
      expectRelative(wilcoxonSignedRank(DARWIN, ZEROS, { alternative: 'less' }).p, 0.982330322265625);
    },
  );

  it('A vs the first 5 of B as pairs: p two-sided 0.3125, greater 0.15625 (scipy 1.10.1)', () => {
    const two = wilcoxonSignedRank(A, B5);
    expect(two.statistic).toBe(12);
    expectRelative(two.p, 0.3125);
    expectRelative(wilcoxonSignedRank(A, B5, { alternative: 'greater' }).p, 0.15625);
    expectRelative(wilcoxonSignedRank(A, B5, { alternative: 'less' }).p, 0.90625);
  });

  it('exact p equals the fraction of all 2^n sign patterns with W+ at least as extreme (definition)', () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.integer({ min: 1, max: 40 }), { minLength: 1, maxLength: 10 }),
        fc.array(fc.boolean(), { minLength: 10, maxLength: 10 }),
        (magnitudes, signs) => {
          const d = magnitudes.map((m, i) => (signs[i] ? m : -m));
          const n = d.length;
          const order = [...magnitudes].sort((a, b) => a - b);
          const rank = (m: number): number => order.indexOf(m) + 1;
          const wPlus = d.reduce((s, v) => s + (v > 0 ? rank(v) : 0), 0);
          let atLeast = 0;
          for (let mask = 0; mask < 2 ** n; mask++) {
            let w = 0;
            for (let i = 0; i < n; i++) if (mask & (1 << i)) w += i + 1;
            if (w >= wPlus) atLeast++;
          }
          const result = wilcoxonSignedRank(d, new Array<number>(n).fill(0), { alternative: 'greater' });
          expect(result.statistic).toBe(wPlus);
          expect(result.p).toBeCloseTo(atLeast / 2 ** n, 14);
        },
      ),
      { seed: 99, numRuns: 100 },
    );
  });
});

describe('wilcoxonSignedRank: normal approximation (zeros dropped, ties mid-ranked)', () => {
  it('drops a zero difference and uses the normal approximation: C vs D[0:5] (scipy 1.10.1, method="approx")', () => {
    const two = wilcoxonSignedRank(C, D5);
    expect(two.exact).toBe(false);
    expect(two.pairs).toBe(4);
    expect(two.statistic).toBe(9);
    expectRelative(two.p, 0.14412703481601533);
    expectRelative(wilcoxonSignedRank(C, D5, { alternative: 'greater' }).p, 0.07206351740800766);
    expectRelative(wilcoxonSignedRank(C, D5, { alternative: 'less' }).p, 0.9279364825919924);
  });

  it('tie-corrected variance: C vs D[2:7] (scipy 1.10.1, method="approx")', () => {
    const two = wilcoxonSignedRank(C, D5b);
    expect(two.exact).toBe(false);
    expect(two.pairs).toBe(4);
    expectRelative(two.p, 0.14077277337135014);
    expectRelative(wilcoxonSignedRank(C, D5b, { alternative: 'greater' }).p, 0.07038638668567507);
  });

  it(
    "more than 50 pairs use the approximation: Darwin's differences repeated 4 times (scipy 1.10.1, " +
      "method='approx')",
    () => {
      const d = [...DARWIN, ...DARWIN, ...DARWIN, ...DARWIN]; // 60 pairs, every |d| tied 4 times
      const zeros = new Array<number>(60).fill(0);
      const two = wilcoxonSignedRank(d, zeros);
      expect(two.exact).toBe(false);
      expect(two.statistic).toBe(1458);
      expectRelative(two.p, 6.350786691903962e-5);
      expectRelative(wilcoxonSignedRank(d, zeros, { alternative: 'greater' }).p, 3.175393345951981e-5);
    },
  );
});

describe('wilcoxonSignedRank: edges', () => {
  it('throws a RangeError for unequal lengths, all-zero differences, or non-finite values', () => {
    expect(() => wilcoxonSignedRank([1, 2], [1])).toThrow(/equal length/);
    expect(() => wilcoxonSignedRank([1, 2], [1, 2])).toThrow(/non-zero difference/);
    expect(() => wilcoxonSignedRank([1, Number.NaN], [0, 0])).toThrow(RangeError);
    expect(() => wilcoxonSignedRank([1], [0], { alternative: 'bigger' as never })).toThrow(RangeError);
  });
});
