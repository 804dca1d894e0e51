/**
 * Sample mean and variance, computed so that they stay accurate on hard data.
 *
 * - `sum`: Neumaier's compensated summation (Neumaier 1974, an improved Kahan sum), so long sums of
 *   numbers of mixed magnitude keep their digits (as d3-array's `fsum`).
 * - `mean`: compensated sum / n.
 * - `variance`: the corrected two-pass algorithm (Chan, Golub & LeVeque 1983, eq. 1.7):
 *   sum((x - m)^2) - (sum(x - m))^2 / n, divided by n - 1 (the unbiased sample variance).
 *   On NIST StRD NumAcc4 it keeps about 8 significant digits of the standard deviation, where a
 *   one-pass formula loses all of them.
 *
 * Cost O(n), no allocation. Throws a RangeError on too-small input rather than returning NaN.
 * Example: `variance([1, 2, 3, 4])` is 1.6666666666666667.
 */
export type Numbers = ArrayLike<number>;

/** Compensated sum (Neumaier). `sum([1e100, 1, -1e100])` is 1. */
export function sum(x: Numbers): number {
  let s = 0;
  let c = 0;
  for (let i = 0; i < x.length; i++) {
    const v = x[i] as number;
    const t = s + v;
    c += Math.abs(s) >= Math.abs(v) ? s - t + v : v - t + s;
    s = t;
  }
  return s + c;
}

/** Arithmetic mean. Throws when x is empty. `mean([1, 2, 3])` is 2. */
export function mean(x: Numbers): number {
  if (x.length === 0) throw new RangeError('mean requires at least 1 value');
  return sum(x) / x.length;
}

/** Unbiased sample variance (denominator n - 1), corrected two-pass. Throws when n < 2. */
export function variance(x: Numbers): number {
  const n = x.length;
  if (n < 2) throw new RangeError(`variance requires at least 2 values, got ${n}`);
  const m = mean(x);
  let ss = 0;
  let comp = 0;
  for (let i = 0; i < n; i++) {
    const d = (x[i] as number) - m;
    ss += d * d;
    comp += d;
  }
  return Math.max(0, (ss - (comp * comp) / n) / (n - 1));
}

/** Sample standard deviation, sqrt of `variance`. Throws when n < 2. */
export function standardDeviation(x: Numbers): number {
  return Math.sqrt(variance(x));
}
