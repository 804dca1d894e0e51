import { describe, expect, it } from 'vitest';
import { pairedNonInferiority } from '../../src/stats/pairedNonInferiority.js';
import { pairedT } from '../../src/stats/pairedT.js';

// Invented paired fixture (candidate x, baseline y, same seed at the same index); expected values from scipy.
const X = [10.0, 11.0, 9.9, 11.8, 10.4, 11.2];
const Y = [10.1, 11.3, 9.8, 12.0, 10.7, 11.5];

describe('pairedNonInferiority', () => {
  it('goal max equals the paired t greater-test of x + margin against y (scipy 1.10.1)', () => {
    const r = pairedNonInferiority(X, Y, 0.5, 'max');
    // /usr/bin/python3, scipy 1.10.1: stats.ttest_rel(x + 0.5, y, alternative='greater').pvalue
    expect(r.p).toBeCloseTo(0.0023540719592755376, 12);
    expect(r.df).toBe(5);
    expect(r.margin).toBe(0.5);
  });

  it('goal min equals the paired t less-test of x - margin against y (scipy 1.10.1)', () => {
    // /usr/bin/python3, scipy 1.10.1: stats.ttest_rel(x - 0.5, y, alternative='less').pvalue
    expect(pairedNonInferiority(X, Y, 0.5, 'min').p).toBeCloseTo(6.925412012914093e-5, 14);
  });

  it('margin 0 is the one-sided paired t-test (first principles: no shift)', () => {
    expect(pairedNonInferiority(X, Y, 0, 'max').p).toBe(pairedT(X, Y, { alternative: 'greater' }).p);
  });

  it('rejects a bad margin, goal or pairing', () => {
    expect(() => pairedNonInferiority(X, Y, -1, 'max')).toThrow(/margin must be/);
    expect(() => pairedNonInferiority(X, Y, 1, 'up' as never)).toThrow(/goal must be/);
    expect(() => pairedNonInferiority(X, Y.slice(1), 1, 'max')).toThrow(/equal length/);
  });
});
