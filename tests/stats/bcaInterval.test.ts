import { describe, expect, it } from 'vitest';
import { bcaInterval } from '../../src/stats/bcaInterval.js';
import { jackknifeAcceleration } from '../../src/stats/jackknifeAcceleration.js';
import { A, expectRelative, idealBootstrapMeans, leaveOneOutMeans, plainMean } from './idealBootstrap.js';

describe(
  'bcaInterval on the ideal bootstrap of mean(A): all 5^5 ' + '= 3125 resamples (METHODS.md, scipy 1.10.1 conventions)',
  () => {
    const stats = idealBootstrapMeans(A);
    const theta = plainMean(A);
    const a = jackknifeAcceleration([leaveOneOutMeans(A)]);

    it('jackknife acceleration a = 0.019456097143550056', () => {
      expectRelative(a, 0.019456097143550056);
    });

    it('BCa: z0 (mid-rank, exact floating-point ties) = 0.026071887453559196 and interval (70.36, 72.44)', () => {
      expect(theta).toBe(71.3);
      const bca = bcaInterval(stats, theta, a, 0.95);
      expectRelative(bca.z0, 0.026071887453559196);
      expectRelative(bca.low, 70.36);
      expectRelative(bca.high, 72.44);
    });

    it('BCa with a tie tolerance counts the 140 resamples whose mean is 71.3 in exact arithmetic', () => {
      // Exact integer arithmetic over all 3125 resamples (values x 10, Python itertools.product):
      // 1523 sums below, 140 equal; z0 = Phi^-1((1523 + 70)/3125) = 0.02446713291103201 (scipy.special.ndtri).
      const bca = bcaInterval(stats, theta, a, 0.95, 1e-9);
      expectRelative(bca.z0, 0.02446713291103201);
      expectRelative(bca.low, 70.36);
      expectRelative(bca.high, 72.44);
    });
  },
);
