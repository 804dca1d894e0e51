import { describe, expect, it } from 'vitest';
import { percentileInterval } from '../../src/stats/percentileInterval.js';
import { A, expectRelative, idealBootstrapMeans } from './idealBootstrap.js';

describe(
  'percentileInterval on the ideal bootstrap of mean(A): ' + 'all 5^5 = 3125 resamples (METHODS.md, scipy 1.10.1)',
  () => {
    const stats = idealBootstrapMeans(A);
    it('percentile 95% interval (70.32, 72.34)', () => {
      const { low, high } = percentileInterval(stats, 0.95);
      expectRelative(low, 70.32);
      expectRelative(high, 72.34);
    });
    it('throws a RangeError on empty statistics, NaN or a level outside (0, 1)', () => {
      expect(() => percentileInterval([], 0.95)).toThrow(RangeError);
      expect(() => percentileInterval([1, Number.NaN], 0.95)).toThrow(/NaN/);
      expect(() => percentileInterval([1, 2], 1)).toThrow(/level/);
    });
  },
);
