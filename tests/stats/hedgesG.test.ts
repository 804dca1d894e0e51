import { describe, expect, it } from 'vitest';
import { hedgesG } from '../../src/stats/hedgesG.js';

const A = Object.freeze([71.2, 69.8, 73.1, 70.4, 72.0]); // METHODS.md input A
const B = Object.freeze([68.9, 70.1, 69.5, 71.0, 67.8, 70.6, 69.2]); // METHODS.md input B

function expectRel(actual: number, expected: number, tolerance: number): void {
  const err = Math.abs(actual - expected) / Math.abs(expected);
  expect(err, `${actual} vs ${expected}`).toBeLessThanOrEqual(tolerance);
}

describe('hedgesG', () => {
  it("reproduces METHODS.md Hedges' g for A vs B (d, J exact, g)", () => {
    const r = hedgesG(A, B);
    // METHODS.md (scipy 1.10.1 / scipy.special.gamma)
    expectRel(r.d, 1.4535900564185282, 1e-10);
    expectRel(r.j, 0.922745608053087, 1e-10);
    expectRel(r.g, 1.341293840469836, 1e-10);
  });

  it('uses the exact J, not the 1 - 3/(4v - 1) approximation (hand algebra)', () => {
    // v = 10: J = Gamma(5) / (sqrt(5) Gamma(9/2)), Gamma(9/2) = (105/16) sqrt(pi) (Gamma recursion).
    const exact = 24 / (Math.sqrt(5) * (105 / 16) * Math.sqrt(Math.PI));
    expectRel(hedgesG(A, B).j, exact, 1e-14);
    expect(Math.abs(hedgesG(A, B).j - (1 - 3 / 39))).toBeGreaterThan(1e-4);
    // v = 2 (two values per group): J = Gamma(1) / (1 * Gamma(1/2)) = 1 / sqrt(pi).
    expectRel(hedgesG([1, 2], [0, 0.5]).j, 1 / Math.sqrt(Math.PI), 1e-14);
  });

  it('reproduces the METHODS.md noncentral-t 95% interval for delta (Steiger & Fouladi 1997)', () => {
    const r = hedgesG(A, B);
    // METHODS.md gives 11 decimals: half a unit in the last place.
    expect(Math.abs(r.dLow - 0.11761377366)).toBeLessThanOrEqual(5e-12);
    expect(Math.abs(r.dHigh - 2.73461003886)).toBeLessThanOrEqual(5e-12);
    // mpmath at 40 digits (tests/reference/t_family_reference.py)
    expectRel(r.dLow, 0.11761377366008766, 1e-10);
    expectRel(r.dHigh, 2.7346100388569063, 1e-10);
    // low/high are the same limits on the g scale.
    expectRel(r.low, r.j * r.dLow, 1e-15);
    expectRel(r.high, r.j * r.dHigh, 1e-15);
  });

  it('narrows with a lower level and flips with the groups', () => {
    const r95 = hedgesG(A, B);
    const r80 = hedgesG(A, B, 0.8);
    expect(r80.dLow).toBeGreaterThan(r95.dLow);
    expect(r80.dHigh).toBeLessThan(r95.dHigh);
    const ba = hedgesG(B, A);
    expect(ba.d).toBeCloseTo(-r95.d, 14);
    expect(ba.dLow).toBeCloseTo(-r95.dHigh, 9);
    expect(ba.dHigh).toBeCloseTo(-r95.dLow, 9);
  });

  it('throws RangeError on too-small or degenerate input and bad levels', () => {
    expect(() => hedgesG([1], B)).toThrow(/at least 2 values per group/);
    expect(() => hedgesG(A, [1])).toThrow(RangeError);
    expect(() => hedgesG([2, 2], [1, 1, 1])).toThrow(/zero variance/);
    expect(() => hedgesG(A, B, 0)).toThrow(/level/);
  });
});
