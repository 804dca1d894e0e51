/**
 * Between-example noise of one evaluation: the binomial standard error sqrt(p(1 - p) / m) of an
 * accuracy p measured on m examples (the Wald standard error; any statistics textbook, e.g.
 * Agresti, "Categorical Data Analysis", section 1.3). It is the half-width of a band of one
 * standard error, the figure `TickCurve.exampleHalfWidth` carries; multiply by a normal quantile
 * (1.96 for 95%) for a Wald interval.
 *
 * This is a different noise from the between-seed spread that the tests use: it says how much the
 * number would move if the same model were evaluated on another m examples, not if it were trained
 * again (METHODS.md, "keep two noises apart").
 *
 * Cost O(1).
 */

/**
 * One binomial standard error sqrt(p(1 - p) / m).
 * Throws a RangeError when p is outside [0, 1] or NaN, or when m is not a positive integer.
 * Example: `binomialHalfWidth(0.9, 10000)` is 0.003 (to 15 digits).
 */
export function binomialHalfWidth(p: number, m: number): number {
  if (!(p >= 0 && p <= 1)) throw new RangeError(`binomialHalfWidth: p must lie in [0, 1], got ${p}`);
  if (!Number.isInteger(m) || m < 1) throw new RangeError(`binomialHalfWidth: m must be a positive integer, got ${m}`);
  return Math.sqrt((p * (1 - p)) / m);
}
