/**
 * A reduced, deterministic run of bench/calibrate.ts's simulation (the same functions), asserting
 * that the tests hold their level and that the intervals cover as they should, within Monte Carlo
 * error. Seeded, so the figures are the same on every run; the bounds are set from the Monte Carlo
 * standard error (MC SE) at the number of replications used, so a real miscalibration of a few
 * points fails while noise does not.
 */
import { describe, expect, it } from 'vitest';
import { coverage, typeIErrors, type SimulationOptions } from '../../bench/calibrate.js';

const ALPHA = 0.05;
const REPS = 4000;
const options: SimulationOptions = { reps: REPS, seed: 7, resamples: 500, permutationResamples: 2000, alpha: ALPHA };
/** MC SE of a proportion p estimated from REPS replications. */
const mcSe = (p: number): number => Math.sqrt((p * (1 - p)) / REPS);

describe('type-I error at 5 seeds per arm, normal vs normal, 4,000 replications', () => {
  const r = typeIErrors('N vs N', 5, options, ['welch', 'permutation', 'mannWhitney']);

  it('Welch holds its level: rate <= alpha + 3 MC SE, and is not far below METHODS.md', () => {
    expect(r.welch?.trials).toBe(REPS);
    const rate = r.welch?.rate ?? NaN;
    expect(rate).toBeLessThanOrEqual(ALPHA + 3 * mcSe(ALPHA)); // 0.0603
    // METHODS.md simulation (20,000 replications): Welch at n = 5, N vs N rejects at 0.046.
    expect(rate).toBeGreaterThanOrEqual(0.046 - 3 * mcSe(0.046)); // 0.0361
  });

  it(
    'the exact permutation test has its exact size 12/252: ' + 'rate <= alpha + 3 MC SE and within 3 MC SE of 12/252',
    () => {
      // By hand: with 5 v 5 every split's complement has T* = -T, so the 252 values of |T*| come in 126
      // equal pairs; p <= 0.05 means at most 12 splits as extreme, i.e. the observed |T| is among the 6
      // largest pairs, which under H0 (continuous data) has probability 12/252 = 0.0476.
      const rate = r.permutation?.rate ?? NaN;
      expect(rate).toBeLessThanOrEqual(ALPHA + 3 * mcSe(ALPHA));
      expect(Math.abs(rate - 12 / 252)).toBeLessThanOrEqual(3 * mcSe(12 / 252));
    },
  );

  it('the exact Mann-Whitney test has its exact size 8/252', () => {
    // By hand: U of 5 v 5 takes 0..25 with frequencies 1, 1, 2, 3, ... out of 252; two-sided p <= 0.05
    // exactly when U <= 2 or U >= 23 (p = 2 * 4/252 = 0.0317; U = 3 gives 2 * 7/252 = 0.056), 8 splits.
    const rate = r.mannWhitney?.rate ?? NaN;
    expect(Math.abs(rate - 8 / 252)).toBeLessThanOrEqual(3 * mcSe(8 / 252));
  });
});

describe('coverage of 95% intervals for a mean on normal data, 4,000 replications', () => {
  it('the t-interval covers 0.95 +/- 0.015 at n = 3, 5 and 10 (MC SE 0.0034)', () => {
    for (const n of [3, 5, 10]) {
      const t = coverage('normal', n, options, ['t']).t;
      // Exact for normal data (Student 1908): nominal 0.95.
      expect(Math.abs((t?.rate ?? NaN) - 0.95), `n = ${n}: ${t?.rate}`).toBeLessThanOrEqual(0.015);
    }
  });

  it(
    'the percentile bootstrap under-covers at n = 5 (about ' + '0.84) and the expanded percentile repairs most of it',
    () => {
      const r = coverage('normal', 5, options, ['percentile', 'expanded-percentile']);
      // METHODS.md simulation (20,000 replications, B = 2,000): percentile 0.838, expanded 0.917 at n = 5.
      // A guard that the tool knows its weakness: +/- 0.03 (about 5 MC SE at p = 0.84, covering B = 500 too).
      expect(Math.abs((r.percentile?.rate ?? NaN) - 0.838)).toBeLessThanOrEqual(0.03);
      expect(Math.abs((r['expanded-percentile']?.rate ?? NaN) - 0.917)).toBeLessThanOrEqual(0.03);
    },
  );

  it('the percentile bootstrap cannot cover more than 1 - 2 (1/2)^3 = 0.75 at n = 3', () => {
    // METHODS.md: the interval lies inside [min, max] of the sample, which holds the mean of a
    // symmetric distribution with probability 1 - 2 (1/2)^n.
    const rate = coverage('normal', 3, options, ['percentile']).percentile?.rate ?? NaN;
    expect(rate).toBeLessThanOrEqual(0.75 + 3 * mcSe(0.75));
    expect(rate).toBeGreaterThanOrEqual(0.751 - 0.03); // METHODS.md: 0.751
  });
});
