import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { exactUDistribution, mannWhitney } from '../../src/stats/mannWhitney.js';

// METHODS.md inputs, frozen to prove the functions do not mutate them.
const A = Object.freeze([71.2, 69.8, 73.1, 70.4, 72.0]);
const B = Object.freeze([68.9, 70.1, 69.5, 71.0, 67.8, 70.6, 69.2]);
const C = Object.freeze([72, 70, 74, 70, 72]);
const D = Object.freeze([69, 70, 68, 71, 70, 67, 72]);

function expectRelative(actual: number, expected: number, tolerance = 1e-10): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tolerance * Math.abs(expected));
}

/** U of x by its definition, #(x > y) + #(x = y)/2, for the brute-force checks. */
function uByDefinition(x: readonly number[], y: readonly number[]): number {
  let u = 0;
  for (const a of x) for (const b of y) u += a > b ? 1 : a === b ? 0.5 : 0;
  return u;
}

/** Every way to choose k of the indices 0..n-1. */
function combinations(n: number, k: number): number[][] {
  const out: number[][] = [];
  const pick = (start: number, chosen: number[]): void => {
    if (chosen.length === k) {
      out.push([...chosen]);
      return;
    }
    for (let i = start; i < n; i++) pick(i + 1, [...chosen, i]);
  };
  pick(0, []);
  return out;
}

describe('mannWhitney: METHODS.md check values', () => {
  it('A vs B exact (no ties): U1 = 30, p two-sided 38/792, p greater (scipy 1.10.1 via METHODS.md)', () => {
    const two = mannWhitney(A, B);
    expect(two.u).toBe(30);
    expect(two.method).toBe('exact');
    expect(two.exact).toBe(true);
    expectRelative(two.p, 38 / 792);
    expectRelative(two.p, 0.04797979797979798);
    expectRelative(mannWhitney(A, B, { alternative: 'greater' }).p, 0.02398989898989899);
    // scipy 1.10.1 (Debian python3-scipy), mannwhitneyu(A, B, alternative='less', method='exact');
    // tests/reference/rank_resampling_reference.py
    expectRelative(mannWhitney(A, B, { alternative: 'less' }).p, 0.9848484848484849);
  });

  it('A vs B asymptotic with and without continuity correction (scipy 1.10.1 via METHODS.md)', () => {
    const cc = mannWhitney(A, B, { method: 'asymptotic' });
    expect(cc.method).toBe('asymptotic');
    expect(cc.exact).toBe(false);
    expectRelative(cc.p, 0.05131990358807116);
    expectRelative(mannWhitney(A, B, { method: 'asymptotic', continuity: false }).p, 0.042357062026854894);
    // scipy 1.10.1, method='asymptotic', alternative='greater', use_continuity True / False
    expectRelative(mannWhitney(A, B, { method: 'asymptotic', alternative: 'greater' }).p, 0.02565995179403558);
    expectRelative(
      mannWhitney(A, B, { method: 'asymptotic', alternative: 'greater', continuity: false }).p,
      0.021178531013427447,
    );
  });

  it('C vs D tie-corrected asymptotic with and without continuity correction (scipy 1.10.1 via METHODS.md)', () => {
    expectRelative(mannWhitney(C, D, { method: 'asymptotic' }).p, 0.09585979482497743);
    expectRelative(mannWhitney(C, D, { method: 'asymptotic', continuity: false }).p, 0.08037250424680117);
    // scipy 1.10.1: alternative='less', with correction
    expectRelative(mannWhitney(C, D, { method: 'asymptotic', alternative: 'less' }).p, 0.9665087973635119);
  });

  it(
    'C vs D exact conditional with ties (scipy 1.10.1: ' + 'permutation_test of mannwhitneyu U over all 792 splits)',
    () => {
      const two = mannWhitney(C, D);
      expect(two.method).toBe('exact-conditional');
      expect(two.exact).toBe(true);
      expect(two.u).toBe(28);
      expectRelative(two.p, 0.11363636363636363); // = 90/792
      expectRelative(mannWhitney(C, D, { alternative: 'greater' }).p, 0.056818181818181816);
      expectRelative(mannWhitney(C, D, { alternative: 'less' }).p, 0.9709595959595959);
    },
  );
});

describe('mannWhitney: against brute-force enumeration of every split', () => {
  it('the exact conditional p of C vs D equals the fraction of all 792 splits with U* >= U (and <= U)', () => {
    const pooled = [...C, ...D];
    const observed = uByDefinition(C, D);
    let atLeast = 0;
    let atMost = 0;
    const splits = combinations(pooled.length, C.length);
    for (const chosen of splits) {
      const x = chosen.map((i) => pooled[i] as number);
      const y = pooled.filter((_, i) => !chosen.includes(i));
      const u = uByDefinition(x, y);
      if (u >= observed) atLeast++;
      if (u <= observed) atMost++;
    }
    expect(splits.length).toBe(792);
    expectRelative(mannWhitney(C, D, { alternative: 'greater' }).p, atLeast / 792, 1e-12);
    expectRelative(mannWhitney(C, D, { alternative: 'less' }).p, atMost / 792, 1e-12);
  });

  it('exactUDistribution(4, 3) equals the frequencies of U over all 35 splits of 1..7', () => {
    const counts = new Array<number>(13).fill(0);
    for (const chosen of combinations(7, 4)) {
      const y = [0, 1, 2, 3, 4, 5, 6].filter((i) => !chosen.includes(i));
      const u = uByDefinition(chosen, y);
      counts[u] = (counts[u] as number) + 1;
    }
    const dist = exactUDistribution(4, 3);
    expect(dist.length).toBe(13);
    counts.forEach((c, u) => {
      expect(dist[u]).toBeCloseTo(c / 35, 15);
    });
  });

  it('smallest two-sided p: 3 v 3 is 0.1, 4 v 4 is 2/70 = .0286, 5 v 5 is 2/252 = .0079 (METHODS.md)', () => {
    expectRelative(mannWhitney([4, 5, 6], [1, 2, 3]).p, 0.1);
    expectRelative(mannWhitney([5, 6, 7, 8], [1, 2, 3, 4]).p, 2 / 70);
    expectRelative(mannWhitney([6, 7, 8, 9, 10], [1, 2, 3, 4, 5]).p, 2 / 252);
  });
});

describe('mannWhitney: properties and edges', () => {
  it('swapping the groups swaps U for n1 n2 - U and greater for less (definition of U)', () => {
    const sample = fc.array(fc.integer({ min: 0, max: 6 }), { minLength: 1, maxLength: 7 });
    fc.assert(
      fc.property(sample, sample, (x, y) => {
        const xy = mannWhitney(x, y, { alternative: 'greater' });
        const yx = mannWhitney(y, x, { alternative: 'less' });
        expect(xy.u + yx.u).toBe(x.length * y.length);
        expect(xy.u).toBe(uByDefinition(x, y));
        expect(Math.abs(xy.p - yx.p)).toBeLessThan(1e-12);
        expect(xy.p).toBeGreaterThan(0);
        expect(xy.p).toBeLessThanOrEqual(1);
      }),
      { seed: 20240601, numRuns: 200 },
    );
  });

  it('auto uses the normal approximation beyond 200,000 splits with ties, and exact up to 50 per group without', () => {
    const many = Array.from({ length: 30 }, (_, i) => i % 7);
    expect(
      mannWhitney(
        many,
        many.map((v) => v + 1),
      ).method,
    ).toBe('asymptotic');
    const distinct = Array.from({ length: 40 }, (_, i) => i);
    expect(
      mannWhitney(
        distinct,
        distinct.map((v) => v + 0.5),
      ).method,
    ).toBe('exact');
    // forced exact with ties counts the conditional distribution even for large samples
    expect(
      mannWhitney(
        many,
        many.map((v) => v + 1),
        { method: 'exact' },
      ).method,
    ).toBe('exact-conditional');
  });

  it('all values tied gives p = 1 for every method', () => {
    for (const method of ['auto', 'exact', 'asymptotic'] as const) {
      expect(mannWhitney([3, 3, 3], [3, 3], { method }).p).toBe(1);
    }
  });

  it('throws a RangeError on an empty group, NaN, or a bad option', () => {
    expect(() => mannWhitney([], [1])).toThrow(/at least 1 value per group/);
    expect(() => mannWhitney([1, Number.NaN], [1])).toThrow(RangeError);
    expect(() => mannWhitney([1], [2], { alternative: 'bigger' as never })).toThrow(RangeError);
    expect(() => mannWhitney([1], [2], { method: 'approx' as never })).toThrow(RangeError);
  });
});
