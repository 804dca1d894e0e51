import { describe, expect, it } from 'vitest';
import { seedsNeeded } from '../../src/analysis/seedsNeeded.js';
import { SeedsiftError } from '../../src/problems.js';

describe('seedsNeeded', () => {
  it('from figures: METHODS.md seeds per arm at d = 0.5, 0.8, 1, 1.5, 2, 3 are 64, 26, 17, 9, 6, 4', () => {
    const got = [0.5, 0.8, 1, 1.5, 2, 3].map(
      (d) => seedsNeeded({ kind: 'figures', sd: 2, effect: 2 * d, alpha: 0.05, power: 0.8 }).seedsPerArm,
    );
    expect(got).toEqual([64, 26, 17, 9, 6, 4]);
  });

  it('gives the power at a few seed counts (scipy noncentral t)', () => {
    // power at d = 0.5 with 3, 5, 10, 20, 50 per arm: scipy 1.10.1 nct.sf(tc) + nct.cdf(-tc), tc = t.ppf(0.975)
    // (tests/reference/analysis_reference.py); its t.ppf is good to a few 1e-9, so 8 digits are checked.
    const r = seedsNeeded({ kind: 'figures', sd: 1, effect: -0.5, alpha: 0.05, power: 0.8 });
    const expected = [
      0.07684904996035868, 0.10768598982105744, 0.18509565629118482, 0.33793902869253206, 0.696893405561745,
    ];
    r.powerAt.forEach((row, i) => {
      expect(row.power).toBeCloseTo(expected[i] as number, 8);
    });
    expect(r.standardized).toBe(0.5);
    expect(r.effect).toBe(-0.5);
  });

  it('from pilot configs: sd pooled within configs, never across them (METHODS.md A and B)', () => {
    const A = [71.2, 69.8, 73.1, 70.4, 72.0];
    const B = [68.9, 70.1, 69.5, 71.0, 67.8, 70.6, 69.2];
    // scipy 1.10.1 (tests/reference/analysis_reference.py): pooled within-config sd 1.1793460657742232.
    // Taking A and B as one group would give sd 1.4295581008256926
    // instead (numpy, ddof 1): their difference is not seed noise.
    const effect = 1.4535900564185282 * 1.1793460657742232; // d = 1.4536 -> 9 per arm (scipy, same script)
    const r = seedsNeeded({ kind: 'pilot', groups: [B, A], effect, alpha: 0.05, power: 0.8 });
    expect(r.sd).toBeCloseTo(1.1793460657742232, 12);
    expect(r.standardized).toBeCloseTo(1.4535900564185282, 12);
    expect(r.seedsPerArm).toBe(9);
    expect(r.effectFrom).toBe('given');
  });

  it('from one pilot config and a target difference', () => {
    const r = seedsNeeded({ kind: 'pilot', groups: [[1, 3]], effect: Math.SQRT2, alpha: 0.05, power: 0.8 });
    expect(r.sd).toBeCloseTo(Math.SQRT2, 14);
    expect(r.seedsPerArm).toBe(17); // d = 1: METHODS.md 17
  });

  it('plans at the family-corrected alpha when several comparisons are made', () => {
    // d = 0.5 at alpha .05: 64 per arm (METHODS.md). At alpha .01 (5 comparisons, Bonferroni): 96 per arm
    // (noncentral t; statsmodels 0.13.5 TTestIndPower().solve_power(0.5, alpha=0.01, power=0.8) = 95.10 -> 96).
    const r = seedsNeeded({ kind: 'figures', sd: 1, effect: 0.5, alpha: 0.05, power: 0.8, comparisons: 5 });
    expect(r.testAlpha).toBeCloseTo(0.01, 15);
    expect(r.seedsPerArm).toBe(96);
  });

  it('a difference of 0 needs no finite count; bad input is rejected', () => {
    expect(seedsNeeded({ kind: 'figures', sd: 1, effect: 0, alpha: 0.05, power: 0.8 }).seedsPerArm).toBeNull();
    expect(() => seedsNeeded({ kind: 'figures', sd: 0, effect: 1, alpha: 0.05, power: 0.8 })).toThrow(
      '--sd: expected a positive number',
    );
    expect(() => seedsNeeded({ kind: 'figures', sd: 1, effect: 1, alpha: 1.5, power: 0.8 })).toThrow('--alpha');
    expect(() => seedsNeeded({ kind: 'figures', sd: 1, effect: 1, alpha: 0.05, power: 0.01 })).toThrow('--power');
    expect(() => seedsNeeded({ kind: 'pilot', groups: [[1], [2]], effect: 1, alpha: 0.05, power: 0.8 })).toThrow(
      SeedsiftError,
    );
    expect(() => seedsNeeded({ kind: 'pilot', groups: [[2, 2, 2]], effect: 1, alpha: 0.05, power: 0.8 })).toThrow(
      'sd 0',
    );
  });
});
