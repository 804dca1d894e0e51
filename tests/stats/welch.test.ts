import { describe, expect, it } from 'vitest';
import { welch, welchNonInferiority } from '../../src/stats/welch.js';

// METHODS.md check inputs (frozen: the functions must not mutate them).
const A = Object.freeze([71.2, 69.8, 73.1, 70.4, 72.0]);
const B = Object.freeze([68.9, 70.1, 69.5, 71.0, 67.8, 70.6, 69.2]);
const C = Object.freeze([72, 70, 74, 70, 72]);
const D = Object.freeze([69, 70, 68, 71, 70, 67, 72]);

function expectRel(actual: number, expected: number, tolerance: number): void {
  const err = Math.abs(actual - expected) / Math.abs(expected);
  expect(err, `${actual} vs ${expected}`).toBeLessThanOrEqual(tolerance);
}

/** Sample mean and (n-1) variance by the textbook formulas, written out here independently of src/. */
function byHand(x: readonly number[]): { n: number; m: number; v: number } {
  let s = 0;
  for (const v of x) s += v;
  const m = s / x.length;
  let ss = 0;
  for (const v of x) ss += (v - m) * (v - m);
  return { n: x.length, m, v: ss / (x.length - 1) };
}

describe('welch', () => {
  it('reproduces METHODS.md Welch A vs B (scipy 1.10.1)', () => {
    const r = welch(A, B);
    // METHODS.md (scipy 1.10.1 ttest_ind(A, B, equal_var=False)): t, df, p two-sided.
    expectRel(r.statistic, 2.4022431408862186, 1e-10);
    expectRel(r.df, 7.701328923514923, 1e-10);
    expectRel(r.p, 0.04418107272139468, 1e-10);
    expect(r.alternative).toBe('two-sided');
    expect(r.level).toBe(0.95);
    // mpmath at 40 digits (tests/reference/t_family_reference.py): se and the difference of means.
    expectRel(r.se, 0.71361873621722693, 1e-12);
    expectRel(r.difference, 12 / 7, 1e-13); // by hand: 356.5/5 - 487.1/7 = 71.3 - 69.585714... = 12/7
  });

  it('reproduces METHODS.md p greater and scipy 1.10.1 p less for A vs B', () => {
    // METHODS.md (scipy 1.10.1, alternative='greater').
    expectRel(welch(A, B, { alternative: 'greater' }).p, 0.02209053636069734, 1e-10);
    // scipy 1.10.1 ttest_ind(A, B, equal_var=False, alternative='less').
    expectRel(welch(A, B, { alternative: 'less' }).p, 0.9779094636393026, 1e-10);
  });

  it('matches the 95% interval of mean(A) - mean(B) from METHODS.md and from mpmath', () => {
    const r = welch(A, B);
    // mpmath at 40 digits (t quantile by root-finding on the incomplete beta function).
    expectRel(r.low, 0.057502837388943994, 1e-10);
    expectRel(r.high, 3.3710685911824846, 1e-10);
    // METHODS.md gives (0.057502837562101, 3.371068591009343). Those endpoints used scipy 1.10.1's
    // t.ppf(0.975, 7.7013...) = 2.3216639259024388, while the quantile is 2.3216639261450702
    // (mpmath): an error of 2.4e-10 in the quantile, 1.7e-10 in each endpoint (0.7136 x 2.4e-10).
    // So METHODS' endpoints are correct only to about 2e-10 absolute, 3e-9 relative for the low end;
    // we check them to 5e-10 absolute, and the exact values above to 1e-10 relative.
    expect(Math.abs(r.low - 0.057502837562101)).toBeLessThanOrEqual(5e-10);
    expect(Math.abs(r.high - 3.371068591009343)).toBeLessThanOrEqual(5e-10);
  });

  it('gives one-sided bounds for one-sided alternatives (mpmath)', () => {
    const greater = welch(A, B, { alternative: 'greater' });
    expectRel(greater.low, 0.38057481883734251, 1e-10); // mpmath: diff - t_{0.95, df} se
    expect(greater.high).toBe(Infinity);
    const less = welch(A, B, { alternative: 'less' });
    expect(less.low).toBe(-Infinity);
    expectRel(less.high, 3.0479966097340861, 1e-10); // mpmath: diff + t_{0.95, df} se
  });

  it('reproduces METHODS.md Welch C vs D (ties)', () => {
    const r = welch(C, D);
    expectRel(r.statistic, 2.047319918089656, 1e-10);
    expectRel(r.df, 8.920743949035275, 1e-10);
    expectRel(r.p, 0.07119723188477407, 1e-10);
  });

  it('agrees with the test: the two-sided interval excludes 0 exactly when p < 1 - level', () => {
    // Property of inverting the test (common practice), on the METHODS inputs at several levels.
    for (const [x, y] of [
      [A, B],
      [C, D],
      [B, A],
    ] as const) {
      for (const level of [0.8, 0.9, 0.95, 0.99]) {
        const r = welch(x, y, { level });
        expect(r.low > 0 || r.high < 0).toBe(r.p < 1 - level);
      }
    }
    // A vs B: p = 0.044, so the 95% interval excludes 0 and the 99% interval does not.
    expect(welch(A, B, { level: 0.95 }).low).toBeGreaterThan(0);
    expect(welch(A, B, { level: 0.99 }).low).toBeLessThan(0);
  });

  it('is antisymmetric in its groups', () => {
    const ab = welch(A, B);
    const ba = welch(B, A);
    expect(ba.statistic).toBeCloseTo(-ab.statistic, 14);
    expect(ba.p).toBeCloseTo(ab.p, 15);
    expect(ba.low).toBeCloseTo(-ab.high, 13);
    // 'greater' for (A, B) is 'less' for (B, A).
    expect(welch(B, A, { alternative: 'less' }).p).toBeCloseTo(welch(A, B, { alternative: 'greater' }).p, 15);
  });

  it('ignores opts.margin (the margin belongs to welchNonInferiority)', () => {
    expect(welch(A, B, { margin: 3 })).toEqual(welch(A, B));
  });

  it('accepts one group with zero variance and typed arrays', () => {
    const r = welch(Float64Array.from([5, 5, 5]), Float64Array.from(B));
    // Only B's variance counts: df = n_B - 1 = 6 exactly (Welch-Satterthwaite by hand).
    expectRel(r.df, 6, 1e-14);
    const b = byHand(B);
    expectRel(r.statistic, (5 - b.m) / Math.sqrt(b.v / b.n), 1e-13);
  });

  it('throws RangeError on too-small or degenerate input and bad options', () => {
    expect(() => welch([1], B)).toThrow(RangeError);
    expect(() => welch(A, [2])).toThrow('welch requires at least 2 values per group, got 5 and 1');
    expect(() => welch([1, 1, 1], [2, 2])).toThrow(/both groups have zero variance/);
    // The level is checked first, by welch itself, with a message naming it (not left to the t quantile).
    for (const level of [1, 0, 1.5, -0.1, Number.NaN])
      expect(() => welch(A, B, { level }), `level ${level}`).toThrow(`welch: level must be in (0, 1), got ${level}`);
    expect(() => welch(A, B, { alternative: 'bigger' as never })).toThrow(/^welch: alternative must be one of/);
  });
});

describe('welchNonInferiority', () => {
  it('with margin 0 and goal max is the METHODS.md one-sided "greater" p', () => {
    const r = welchNonInferiority(A, B, 0, 'max');
    expectRel(r.p, 0.02209053636069734, 1e-10); // METHODS.md, scipy 1.10.1 alternative='greater'
    expectRel(r.statistic, 2.4022431408862186, 1e-10);
    expect(r.margin).toBe(0);
  });

  it('goal max equals Welch "greater" on x + margin vs y (by hand and scipy 1.10.1)', () => {
    const margin = 0.5;
    const r = welchNonInferiority(A, B, margin, 'max');
    // Hand algebra: shifting x by the margin leaves both variances alone, so
    // t = (mean(A) + margin - mean(B)) / sqrt(var(A)/5 + var(B)/7), with the same Welch df.
    const a = byHand(A);
    const b = byHand(B);
    const se = Math.sqrt(a.v / a.n + b.v / b.n);
    expectRel(r.statistic, (a.m + margin - b.m) / se, 1e-12);
    expectRel(r.df, welch(A, B).df, 1e-14);
    // scipy 1.10.1: ttest_ind(np.array(A) + 0.5, B, equal_var=False, alternative='greater').pvalue
    expectRel(r.p, 0.007652026712195935, 1e-10);
    // and our own 'greater' test on the shifted data
    const shifted = A.map((v) => v + margin);
    expectRel(r.p, welch(shifted, B, { alternative: 'greater' }).p, 1e-12);
    // A margin can only help non-inferiority: p falls as the margin grows.
    expect(r.p).toBeLessThan(welchNonInferiority(A, B, 0, 'max').p);
  });

  it('goal min equals Welch "less" on x - margin vs y (by hand and scipy 1.10.1)', () => {
    const margin = 2.5;
    const r = welchNonInferiority(A, B, margin, 'min');
    const a = byHand(A);
    const b = byHand(B);
    const se = Math.sqrt(a.v / a.n + b.v / b.n);
    expectRel(r.statistic, (a.m - margin - b.m) / se, 1e-12);
    // scipy 1.10.1: ttest_ind(np.array(A) - 2.5, B, equal_var=False, alternative='less').pvalue
    expectRel(r.p, 0.15205148626027684, 1e-10);
  });

  it('throws RangeError on bad margin, goal or input', () => {
    expect(() => welchNonInferiority(A, B, -1, 'max')).toThrow(/margin must be/);
    expect(() => welchNonInferiority(A, B, Number.NaN, 'max')).toThrow(RangeError);
    expect(() => welchNonInferiority(A, B, 1, 'up' as never)).toThrow(/goal must be/);
    expect(() => welchNonInferiority([1], B, 1, 'min')).toThrow(
      'welchNonInferiority requires at least 2 values per group, got 1 and 7',
    );
    expect(() => welchNonInferiority([3, 3], [3, 3], 1, 'min')).toThrow(/zero variance/);
  });
});
