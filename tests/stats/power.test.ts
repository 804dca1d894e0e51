import { describe, expect, it } from 'vitest';
import { minimumDetectableEffect, seedsPerArm, welchPower } from '../../src/stats/power.js';

function expectRel(actual: number, expected: number, tolerance: number): void {
  const err = Math.abs(actual - expected) / Math.abs(expected);
  expect(err, `${actual} vs ${expected}`).toBeLessThanOrEqual(tolerance);
}

describe('welchPower', () => {
  it('is 0.2863 at d = 1 with 5 seeds per arm (METHODS.md)', () => {
    // METHODS.md gives 4 decimals: agree to half a unit in the last place.
    expect(Math.abs(welchPower(1, 5, 5) - 0.2863)).toBeLessThanOrEqual(5e-5);
    // mpmath at 40 digits: 1 - F(t_c) + F(-t_c) with F the noncentral t CDF as an integral.
    expectRel(welchPower(1, 5, 5), 0.28629549338059762, 1e-10);
  });

  it('matches the noncentral-t power from mpmath, unequal arms and negative effects included', () => {
    // [d, n1, n2, power], mpmath at 40 digits (tests/reference/t_family_reference.py).
    const cases: ReadonlyArray<readonly [number, number, number, number]> = [
      [0.5, 64, 64, 0.80145955792225408],
      [0.5, 63, 63, 0.79516833812333782],
      [0.8, 26, 26, 0.8074866151465276],
      [0.8, 25, 25, 0.79145128998515591],
      [1.5, 9, 9, 0.84761010415608993],
      [1.5, 8, 8, 0.79654501013360355],
      [2, 6, 6, 0.87641777141198865],
      [2, 5, 5, 0.79054237797257127],
      [3, 4, 4, 0.93893574550902165],
      [3, 3, 3, 0.78255438705811665],
      [1, 3, 8, 0.26231945243656091],
      [-0.7, 12, 20, 0.45849612481967651],
    ];
    for (const [d, n1, n2, expected] of cases) expectRel(welchPower(d, n1, n2), expected, 1e-10);
  });

  it('is alpha at effect 0 (definition of the critical value)', () => {
    for (const alpha of [0.01, 0.05, 0.1]) expect(welchPower(0, 4, 7, alpha)).toBeCloseTo(alpha, 13);
  });

  it('throws RangeError on bad arguments', () => {
    expect(() => welchPower(1, 1, 5)).toThrow(/integer >= 2/);
    expect(() => welchPower(1, 5, 2.5)).toThrow(RangeError);
    expect(() => welchPower(Number.NaN, 5, 5)).toThrow(/effect/);
    expect(() => welchPower(1, 5, 5, 0)).toThrow(/alpha/);
  });
});

describe('seedsPerArm', () => {
  it('gives METHODS.md seeds per arm for d = 0.5, 0.8, 1, 1.5, 2, 3 (64, 26, 17, 9, 6, 4)', () => {
    const table: ReadonlyArray<readonly [number, number]> = [
      [0.5, 64],
      [0.8, 26],
      [1.0, 17],
      [1.5, 9],
      [2.0, 6],
      [3.0, 4],
    ];
    for (const [d, n] of table) {
      expect(seedsPerArm(d), `d = ${d}`).toBe(n);
      expect(seedsPerArm(-d), `d = ${-d}`).toBe(n);
    }
  });

  it('returns Infinity for effect 0 and 2 when 2 seeds already suffice', () => {
    expect(seedsPerArm(0)).toBe(Infinity);
    // mpmath-free check: at d = 10 with 2 per arm, power is above 0.8 (our own welchPower), so the answer is 2.
    expect(welchPower(10, 2, 2)).toBeGreaterThan(0.8);
    expect(seedsPerArm(10)).toBe(2);
  });

  it('uses the large-sample formula beyond 2^20 runs per arm and still gives the exact t answer', () => {
    // mpmath at 30 digits: the t-test power first reaches 0.8 at these n
    // (d 0.002: 0.79999997851 at 3924431, 0.80000007844 at 3924432;
    //  d 0.001: 0.79999997554 at 15697721, 0.80000000052 at 15697722).
    expect(seedsPerArm(0.002)).toBe(3924432);
    expect(seedsPerArm(0.001)).toBe(15697722);
  });

  it('throws RangeError on bad arguments', () => {
    expect(() => seedsPerArm(Number.POSITIVE_INFINITY)).toThrow(/effect/);
    expect(() => seedsPerArm(1, 1.2)).toThrow(/alpha/);
    expect(() => seedsPerArm(1, 0.05, 0)).toThrow(/power/);
    expect(() => seedsPerArm(1, 0.05, 1)).toThrow(/power/);
  });

  it('power at or below alpha: every n has it, even at effect 0, so the smallest arm (2)', () => {
    // First principles: the power of a level-alpha test is at least alpha at any effect.
    expect(seedsPerArm(1, 0.05, 0.01)).toBe(2);
    expect(seedsPerArm(0.1, 0.9, 0.8)).toBe(2);
  });
});

describe('minimumDetectableEffect', () => {
  it('matches mpmath root-finding on the noncentral-t power', () => {
    // mpmath at 40 digits: the d with power 0.8 at n per arm.
    expectRel(minimumDetectableEffect(5, 5), 2.0244393393845432, 1e-10);
    expectRel(minimumDetectableEffect(10, 10), 1.3249473925792307, 1e-10);
    // R's pwr.t.test(n = 10, power = 0.8) prints d = 1.324947 (from memory).
    expect(Math.abs(minimumDetectableEffect(10, 10) - 1.324947)).toBeLessThan(5e-7);
  });

  it('is the inverse of welchPower, also for unequal arms and other power targets', () => {
    for (const [n1, n2, power] of [
      [3, 3, 0.8],
      [4, 9, 0.9],
      [20, 12, 0.5],
    ] as const) {
      const d = minimumDetectableEffect(n1, n2, 0.05, power);
      expect(welchPower(d, n1, n2)).toBeCloseTo(power, 10);
    }
  });

  it('throws RangeError on bad arguments', () => {
    expect(() => minimumDetectableEffect(1, 5)).toThrow(RangeError);
    expect(() => minimumDetectableEffect(5, 5, 0.05, 0)).toThrow(/power/);
    expect(() => minimumDetectableEffect(5, 5, 0.05, 1)).toThrow(/power/);
  });

  it('is 0 when power <= alpha (power alpha is reached at d = 0; first principles)', () => {
    expect(minimumDetectableEffect(5, 5, 0.05, 0.04)).toBe(0);
    expect(minimumDetectableEffect(2, 2, 0.999, 0.8)).toBe(0);
  });

  it('stays finite at extreme alpha: 2 v 2 at alpha 1e-11, 1e-15 and 1e-40 (once an internal error)', () => {
    // 40-digit mpmath root of the noncentral-t power with the closed-form df-2 critical value
    // (tests/reference/noncentral_t_far_reference.py, mde_2v2): 401178.00443595453,
    // 40117800.44361979 and 1.2686362411795197e20 (rounded to 16 digits below).
    expectRel(minimumDetectableEffect(2, 2, 1e-11), 401178.0044359545, 1e-9);
    expectRel(minimumDetectableEffect(2, 2, 1e-15), 40117800.44361979, 1e-9);
    expectRel(minimumDetectableEffect(2, 2, 1e-40), 1.26863624117952e20, 1e-9);
    // alpha/2 below the smallest double: the critical value overflows, no finite effect.
    expect(minimumDetectableEffect(2, 2, Number.MIN_VALUE)).toBe(Infinity);
    expect(welchPower(1e300, 2, 2, Number.MIN_VALUE)).toBe(0);
  });
});
