/**
 * The jackknife estimate of the BCa acceleration (Efron & Tibshirani 1993, ch. 14.3), for one or
 * several samples.
 */
import { mean, type Numbers } from './moments.js';

/**
 * Jackknife estimate of the BCa acceleration from leave-one-out estimates, one array per sample:
 * with U_ji = (n_j - 1)(mean_i theta_(j,i) - theta_(j,i)),
 * a = (1/6) sum_j sum_i U_ji^3 / n_j^3 / (sum_j sum_i U_ji^2 / n_j^2)^(3/2)
 * (Efron & Tibshirani 1993, eq. 14.15 for one sample; the several-sample form is scipy.stats.bootstrap's).
 * A constant shift of one sample's estimates does not change a. Cost O(total n).
 * Throws a RangeError when a sample has fewer than 2 estimates, a value is not finite, or every
 * estimate within each sample is equal (a is 0/0).
 * Example: for the mean of [71.2, 69.8, 73.1, 70.4, 72.0] (estimates 71.325, 71.675, 70.85, 71.525, 71.125)
 * a is 0.019456097143550056.
 */
export function jackknifeAcceleration(jackknife: readonly Numbers[]): number {
  let numerator = 0;
  let denominator = 0;
  for (const estimates of jackknife) {
    const n = estimates.length;
    if (n < 2)
      throw new RangeError(`jackknifeAcceleration requires at least 2 leave-one-out estimates per sample, got ${n}`);
    for (let i = 0; i < n; i++) {
      if (!Number.isFinite(estimates[i])) throw new RangeError(`jackknifeAcceleration: estimate ${i} is not finite`);
    }
    const centre = mean(estimates);
    let cubes = 0;
    let squares = 0;
    for (let i = 0; i < n; i++) {
      const u = (n - 1) * (centre - (estimates[i] as number));
      squares += u * u;
      cubes += u * u * u;
    }
    numerator += cubes / n ** 3;
    denominator += squares / n ** 2;
  }
  if (!(denominator > 0))
    throw new RangeError('bca: jackknife acceleration is undefined because every leave-one-out estimate is equal');
  return numerator / (6 * denominator ** 1.5);
}

/** Leave-one-out means minus the full mean, times sign: -(x_i - mean)/(n - 1) for centred x. */
export function jackknifeMeanDeviations(centred: Float64Array, sign: 1 | -1): Float64Array {
  const n = centred.length;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = (-sign * (centred[i] as number)) / (n - 1);
  return out;
}
