import { describe, expect, it } from 'vitest';
import { BOOTSTRAP_METHODS, bootstrapMean } from '../../src/stats/bootstrap.js';
import { bootstrapMeanFromCounts, resampleCounts } from '../../src/stats/bootstrapMeanFromCounts.js';
import { createRandom } from '../../src/stats/random.js';

describe('resampleCounts and bootstrapMeanFromCounts', () => {
  // The counts path draws bootstrapMean's resamples and sums them in another order: the same
  // interval up to rounding.
  const x = [71.2, 69.8, 73.1, 70.4, 72.0, 68.9, 74.3];
  for (const method of BOOTSTRAP_METHODS) {
    it(`equals bootstrapMean for ${method} with a generator in the same state, up to rounding`, () => {
      const direct = bootstrapMean(x, createRandom(7), { method, resamples: 999, level: 0.9 });
      const counted = bootstrapMeanFromCounts(x, resampleCounts(createRandom(7), x.length, 999), {
        method,
        level: 0.9,
      });
      expect(counted.estimate).toBe(direct.estimate);
      expect(counted.resamples).toBe(999);
      expect(Math.abs(counted.low - direct.low)).toBeLessThan(1e-12 * Math.abs(direct.low));
      expect(Math.abs(counted.high - direct.high)).toBeLessThan(1e-12 * Math.abs(direct.high));
    });
  }
  it('counts the draws of each resample, row by row, in the order bootstrapMean draws them', () => {
    const counts = resampleCounts(createRandom(3), 4, 50);
    expect(counts.length).toBe(200);
    for (let b = 0; b < 50; b++) expect(counts.subarray(b * 4, b * 4 + 4).reduce((a, c) => a + c, 0)).toBe(4);
    const again = createRandom(3);
    const first = [0, 0, 0, 0];
    for (let i = 0; i < 4; i++) {
      const k = again.int(4);
      first[k] = (first[k] as number) + 1;
    }
    expect(Array.from(counts.subarray(0, 4))).toEqual(first);
  });
  it('refuses tables that do not fit the sample', () => {
    expect(() => resampleCounts(createRandom(1), 0, 10)).toThrow(RangeError);
    expect(() => resampleCounts(createRandom(1), 3, 0)).toThrow(RangeError);
    expect(() => bootstrapMeanFromCounts([1, 2, 3], new Float64Array(10))).toThrow(/whole number of resamples/);
    expect(() => bootstrapMeanFromCounts([1, 2, 3], Float64Array.of(1, 1, 0))).toThrow(/draws 2 values/);
  });
});
