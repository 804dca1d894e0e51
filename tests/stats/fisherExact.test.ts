import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Alternative } from '../../src/stats/alternative.js';
import { fisherExact } from '../../src/stats/fisherExact.js';

interface FisherCase {
  readonly label: string;
  readonly table: [number, number, number, number];
  readonly twoSided: number;
  readonly less: number;
  readonly greater: number;
  readonly oddsRatio: number | 'Infinity' | null;
}

// Written by tests/reference/survival_reference.py: scipy.stats.fisher_exact, scipy 1.10.1 through Debian.
const fixture = JSON.parse(readFileSync(new URL('../reference/survival-cases.json', import.meta.url), 'utf8')) as {
  scipyVersion: string;
  fisher: FisherCase[];
};

/** p-values: relative 1e-9 or absolute 1e-15, whichever is larger (the tolerance of scipyFixture.test.ts). */
function expectP(actual: number, expected: number, label: string): void {
  expect(Math.abs(actual - expected), `${label}: ${actual} vs ${expected}`).toBeLessThanOrEqual(
    Math.max(1e-9 * Math.abs(expected), 1e-15),
  );
}

describe('fisherExact: scipy 1.10.1 fisher_exact (tests/reference/survival-cases.json)', () => {
  it('the fixture is from scipy 1.10.1 and covers zeros, empty margins, all-failed arms and large counts', () => {
    expect(fixture.scipyVersion).toBe('1.10.1');
    const labels = fixture.fisher.map((c) => c.label);
    for (const needed of [
      'every run failed in both arms',
      'every run of one arm failed, none of the other',
      'large counts',
    ])
      expect(labels).toContain(needed);
    expect(fixture.fisher.length).toBeGreaterThanOrEqual(60);
  });

  for (const c of fixture.fisher) {
    it(`${c.label}: ${JSON.stringify(c.table)}`, () => {
      const table = Object.freeze([...c.table]) as unknown as readonly [number, number, number, number];
      const expected: Record<Alternative, number> = { 'two-sided': c.twoSided, less: c.less, greater: c.greater };
      for (const alternative of ['two-sided', 'less', 'greater'] as const) {
        const r = fisherExact(table, alternative);
        expectP(r.p, expected[alternative], `${c.label} ${alternative}`);
        if (c.oddsRatio === null) expect(r.oddsRatio).toBeNaN();
        else if (c.oddsRatio === 'Infinity') expect(r.oddsRatio).toBe(Number.POSITIVE_INFINITY);
        else expect(r.oddsRatio).toBeCloseTo(c.oddsRatio, 12);
      }
    });
  }
});

describe('fisherExact: worked example', () => {
  it("Fisher's tea-tasting experiment: 3 of 4 cups right, P(as good or better) = 17/70", () => {
    // Fisher (1935), The Design of Experiments, ch. 2 (from memory): 8 cups, 4 with milk first; the lady
    // picks 4 and gets 3 right. The table [[3, 1], [1, 3]] has probabilities C(4,x)C(4,4-x)/70 =
    // 1, 16, 36, 16, 1 over 70, so P(X >= 3) = 17/70 and the two-sided p is (1 + 16 + 16 + 1)/70.
    const r = fisherExact([3, 1, 1, 3], 'greater');
    expect(r.p).toBeCloseTo(17 / 70, 14);
    expect(fisherExact([3, 1, 1, 3]).p).toBeCloseTo(34 / 70, 14);
    expect(fisherExact([3, 1, 1, 3]).oddsRatio).toBe(9);
  });

  it('counts a tied probability on the far side (symmetric table, first principles)', () => {
    // [[1, 4], [4, 1]]: margins 5/5/5/5; P(x) = C(5,x)C(5,5-x)/252 = 1, 25, 100, 100, 25, 1 over 252.
    // x = 1 has probability 25/252 and so does x = 4: two-sided p = (1 + 25 + 25 + 1)/252.
    expect(fisherExact([1, 4, 4, 1]).p).toBeCloseTo(52 / 252, 14);
  });
});

describe('fisherExact: input checks', () => {
  it('rejects negative, fractional and non-finite cells', () => {
    expect(() => fisherExact([-1, 2, 3, 4])).toThrow(/cell 0/);
    expect(() => fisherExact([1, 2.5, 3, 4])).toThrow(/cell 1/);
    expect(() => fisherExact([1, 2, Number.NaN, 4])).toThrow(/cell 2/);
    expect(() => fisherExact([1, 2, 3, 4], 'both' as Alternative)).toThrow(/alternative/);
  });
});
