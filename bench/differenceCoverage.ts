/**
 * Coverage of the interval for a difference of means (METHODS.md, "Interval for the difference"):
 * the Welch t-interval that seedsift shows at every n, and the BCa two-sample bootstrap interval it
 * shows beside from 10 runs per arm, at nominal 95%, with equal means in both arms (the true
 * difference is 0). Used by `npm run calibrate`; target for the Welch interval 0.95 +/- 0.015 at
 * 20 v 20 and 30 v 30 on normal data.
 * Deterministic: datasets from `deriveSeed(seed, cell)`, the bootstrap from its own derived stream.
 */
import { bootstrapMeanDifference } from '../src/stats/bootstrap.js';
import { createRandom, deriveSeed } from '../src/stats/random.js';
import { welch } from '../src/stats/welch.js';
import { DISTRIBUTIONS, type Distribution, type Proportion, type SimulationOptions } from './calibrate.js';

export const DIFFERENCE_METHODS = ['welch-t', 'bca'] as const;
export type DifferenceMethod = (typeof DIFFERENCE_METHODS)[number];

/** Coverage of each method's 95% interval for mean(x) - mean(y) = 0, n per arm. */
export function differenceCoverage(
  distribution: Distribution,
  n: number,
  opts: SimulationOptions,
): Record<DifferenceMethod, Proportion> {
  const cell = `difference/${distribution}/${n}`;
  const data = createRandom(deriveSeed(opts.seed, `${cell}/data`));
  const boot = createRandom(deriveSeed(opts.seed, `${cell}/bootstrap`));
  const draw = DISTRIBUTIONS[distribution].draw;
  const hits = { 'welch-t': 0, bca: 0 };
  const errors = { 'welch-t': 0, bca: 0 };
  for (let r = 0; r < opts.reps; r++) {
    const x = Float64Array.from({ length: n }, () => draw(data));
    const y = Float64Array.from({ length: n }, () => draw(data));
    const w = welch(x, y, { level: 0.95 });
    if (w.low <= 0 && 0 <= w.high) hits['welch-t']++;
    try {
      const b = bootstrapMeanDifference(x, y, boot, { method: 'bca', resamples: opts.resamples, level: 0.95 });
      if (b.low <= 0 && 0 <= b.high) hits.bca++;
    } catch (error) {
      if (!(error instanceof RangeError)) throw error;
      errors.bca++;
    }
  }
  const out = {} as Record<DifferenceMethod, Proportion>;
  for (const m of DIFFERENCE_METHODS) {
    const trials = opts.reps - errors[m];
    const rate = hits[m] / trials;
    out[m] = { rate, se: Math.sqrt((rate * (1 - rate)) / trials), trials, errors: errors[m] };
  }
  return out;
}
