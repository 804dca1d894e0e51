/**
 * Lag-1 sample autocorrelation as defined by the NIST Statistical Reference Datasets (univariate
 * summary statistics, https://www.itl.nist.gov/div898/strd/univ/):
 *
 *   r(1) = sum_{i=2..n} (y_i - ybar)(y_{i-1} - ybar) / sum_{i=1..n} (y_i - ybar)^2
 *
 * (both sums over the full-sample mean, denominator over all n terms; the same as R's
 * `acf(y, plot = FALSE)$acf[2]`).
 */
import { mean, type Numbers } from './moments.js';

/**
 * Lag-1 autocorrelation r(1), NIST StRD definition. Two passes: the compensated mean first, then
 * deviations from it, with Neumaier-compensated sums of the cross and square terms, so that
 * data with a large common offset (NIST NumAcc4: 10000000.1 +- 0.1) keep their digits.
 *
 * Cost O(n) time, O(1) memory. Throws a RangeError when n < 2 or when all values are equal (the
 * denominator is then 0 and r(1) is undefined).
 * Example: `lag1Autocorrelation([10000001, 10000003, 10000002])` is -0.5 (NIST NumAcc1).
 */
export function lag1Autocorrelation(x: Numbers): number {
  const n = x.length;
  if (n < 2) throw new RangeError(`lag1Autocorrelation requires at least 2 values, got ${n}`);
  const m = mean(x);
  let prev = (x[0] as number) - m;
  const squares = new Accumulator();
  const cross = new Accumulator();
  squares.add(prev * prev);
  for (let i = 1; i < n; i++) {
    const d = (x[i] as number) - m;
    squares.add(d * d);
    cross.add(d * prev);
    prev = d;
  }
  const denominator = squares.value();
  if (denominator === 0) throw new RangeError('lag1Autocorrelation: all values are equal, so r(1) is undefined');
  return cross.value() / denominator;
}

/** Neumaier compensated running sum (Neumaier 1974), as in moments.sum. */
class Accumulator {
  private s = 0;
  private c = 0;
  add(v: number): void {
    const t = this.s + v;
    this.c += Math.abs(this.s) >= Math.abs(v) ? this.s - t + v : v - t + this.s;
    this.s = t;
  }
  value(): number {
    return this.s + this.c;
  }
}
