/**
 * The noncentral t distribution: its CDF, and confidence limits for the noncentrality parameter.
 *
 * CDF. For t >= 0, with x = t^2 / (t^2 + df), b = df / 2 and lambda = ncp^2 / 2, Lenth's series
 * (Lenth 1989, "Algorithm AS 243: Cumulative distribution function of the non-central t
 * distribution", Applied Statistics 38:185-189) is
 *
 *   F(t; df, ncp) = Phi(-ncp) + 1/2 sum_{j>=0} [ P_j I_x(j + 1/2, b) + Q_j I_x(j + 1, b) ],
 *   P_j = e^-lambda lambda^j / j!,   Q_j = sign(ncp) e^-lambda lambda^(j+1/2) / Gamma(j + 3/2),
 *
 * where I_x is the regularized incomplete beta function. As in AS 243, successive I_x values come
 * from the recurrence I_x(a + 1, b) = I_x(a, b) - Gamma(a+b) / (Gamma(a+1) Gamma(b)) x^a (1-x)^b.
 * Unlike AS 243, which sums upward from j = 0 (its Poisson weights underflow once ncp^2/2 exceeds
 * about 745), the sum starts at the largest Poisson weight j = floor(lambda) and runs both ways,
 * as proposed by Benton & Krishnamoorthy (2003), "Computing discrete mixtures of continuous
 * distributions", Computational Statistics & Data Analysis 43:249-267 (details from memory). The two starting I_x
 * values come from @stdlib's `betainc`, Phi from @stdlib's normal CDF. For t < 0,
 * F(t; df, ncp) = 1 - F(-t; df, -ncp).
 *
 * Far from the centre (|ncp| > 2,000, df >= 1) the series needs of the order of 40 sqrt(ncp^2 / 2)
 * terms (millions past |ncp| 10^5), so the CDF is computed instead from its definition
 * T = (Z + ncp) / sqrt(V / df), V ~ chi-square(df):
 *
 *   F(t; df, ncp) = integral_0^inf Phi(t s / sqrt(df) - ncp) chi_df(s) ds,
 *
 * chi_df the density of sqrt(V), by adaptive Simpson quadrature (tolerance 1e-14 per piece) over
 * sqrt(df) -+ 12, split where the Phi factor steps (s = ncp sqrt(df) / t) and at the mode. The two
 * routes agree to 1e-12 where both run (tests/stats/noncentralT.test.ts). This keeps power and the
 * minimum detectable effect finite at any alpha in (0, 1): at 2 v 2 and alpha 1e-11 the critical t
 * is 3.2e5 and the effect sought about 4e5 standard deviations.
 *
 * Noncentrality interval. For an observed t, the confidence limits for ncp are the values at which
 * the observed t is the (1+level)/2 and (1-level)/2 quantile (Steiger & Fouladi 1997, "Noncentrality
 * interval estimation and the evaluation of statistical models", in Harlow, Mulaik & Steiger (eds.),
 * What If There Were No Significance Tests?, pp. 221-257; details from memory). F decreases in ncp, so each limit is
 * one root, found by bisection.
 */
import betainc from '@stdlib/math-base-special-betainc';
import gammaln from '@stdlib/math-base-special-gammaln';
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';

/** Terms smaller than this (absolute, on a probability in [0, 1]) end the series. */
const TERM_TOLERANCE = 1e-18;
/** Upper bound on series terms in each direction; enough for |ncp| up to about 10^5. */
const MAX_TERMS = 1_000_000;
/** Beyond this |ncp| (and for df >= 1) the CDF comes from the integral, not the series. */
const SERIES_NCP_LIMIT = 2000;

/**
 * The CDF P(T <= t) of the noncentral t distribution with `df` degrees of freedom and
 * noncentrality `ncp` (see the file comment for the algorithm: AS 243's series summed from its
 * largest term outward). Against an independent 40-digit integral (tests/reference/scipy-cases.json,
 * 120 random cases with df up to 60 and |ncp| up to 36) the absolute error is below 1e-12: the
 * largest seen is 2.5e-13 at |ncp| 25 to 36 (rounding in the recurrences) and 5.4e-13 in a far
 * lower tail, inherited from @stdlib's incomplete beta (relative error about 1e-12 there). That is
 * about 20 times scipy's Boost nct.cdf (1.2e-14 on the same cases) and far below what power or an
 * effect-size interval needs. Rounding in the series' recurrences grows with |ncp|: against 40-digit mpmath
 * integrals (tests/reference/noncentral_t_far_reference.py) the error is 3e-11 at ncp 300, 3e-10 at
 * 1,000 to 1,500 and about 3e-9 at 2,000; beyond 2,000 the integral route (file comment) is within
 * 1e-13. The series is kept below 2,000 because it costs microseconds where the quadrature costs
 * 3 to 7 milliseconds. At df 200,000 the error is about 1e-11 (differences of log-gamma
 * values near 1e6 limit the digits). For t < 0 the result is 1 - (upper series), so tiny
 * lower-tail probabilities have absolute, not relative, accuracy.
 *
 * Cost O(|ncp| + 40) series terms (a few flops each) and two incomplete beta evaluations; beyond
 * |ncp| 2,000 a quadrature of some hundreds to thousands of normal CDF evaluations. Throws a
 * RangeError when df is not a positive finite number, ncp is not finite, t is NaN, or (df < 1 only)
 * the series needs more than 10^6 terms in one direction (|ncp| beyond about 10^5 with df < 1).
 * Example: `noncentralTCdf(0, 10, 1)` is Phi(-1) = 0.15865525393145707.
 */
export function noncentralTCdf(t: number, df: number, ncp: number): number {
  if (!(df > 0 && Number.isFinite(df)))
    throw new RangeError(`noncentralTCdf: df must be a positive finite number, got ${df}`);
  if (!Number.isFinite(ncp)) throw new RangeError(`noncentralTCdf: ncp must be finite, got ${ncp}`);
  if (Number.isNaN(t)) throw new RangeError('noncentralTCdf: t is NaN');
  if (Math.abs(ncp) > SERIES_NCP_LIMIT && df >= 1) return cdfByIntegral(t, df, ncp);
  if (t < 0) return 1 - upperSeries(-t, df, -ncp);
  return upperSeries(t, df, ncp);
}

/** F(t; df, ncp) for t >= 0 by the series in the file comment. */
function upperSeries(t: number, df: number, ncp: number): number {
  const base = normalCdf(-ncp, 0, 1);
  const t2 = t * t;
  if (t === 0) return base;
  if (!Number.isFinite(t2)) return 1;
  const x = t2 / (t2 + df);
  const b = df / 2;
  const logX = Math.log(t2) - Math.log(t2 + df);
  const log1mX = Math.log(df) - Math.log(t2 + df);
  const lambda = (ncp * ncp) / 2;
  const sign = ncp < 0 ? -1 : 1;
  const k = Math.floor(lambda);
  const logLambda = lambda > 0 ? Math.log(lambda) : -Infinity;
  // Weights at the mode j = k (lambda^0 = 1 also when lambda = 0).
  const p0 = Math.exp(-lambda + (k === 0 ? 0 : k * logLambda) - gammaln(k + 1));
  const q0 = lambda > 0 ? sign * Math.exp(-lambda + (k + 0.5) * logLambda - gammaln(k + 1.5)) : 0;
  const ip0 = betainc(x, k + 0.5, b);
  const iq0 = betainc(x, k + 1, b);
  // g(a) = Gamma(a+b) / (Gamma(a+1) Gamma(b)) x^a (1-x)^b, so that I_x(a+1, b) = I_x(a, b) - g(a).
  const g = (a: number): number => Math.exp(gammaln(a + b) - gammaln(a + 1) - gammaln(b) + a * logX + b * log1mX);

  let total = p0 * ip0 + q0 * iq0;

  // Forward: j = k+1, k+2, ... The I_x values decrease, the weights decrease past the mode.
  let p = p0;
  let q = q0;
  let ip = ip0;
  let iq = iq0;
  let gp = g(k + 0.5);
  let gq = g(k + 1);
  for (let j = k + 1; ; j++) {
    if (j - k > MAX_TERMS) throw new RangeError(`noncentralTCdf: series did not converge (df ${df}, ncp ${ncp})`);
    ip = Math.max(0, ip - gp);
    iq = Math.max(0, iq - gq);
    gp *= (x * (j - 0.5 + b)) / (j + 0.5);
    gq *= (x * (j + b)) / (j + 1);
    p *= lambda / j;
    q *= lambda / (j + 0.5);
    const term = p * ip + q * iq;
    total += term;
    // Past the mode the weights fall at least geometrically with ratio r = lambda / (j + 1), and the
    // I_x values fall too, so the rest of the series is at most (p + |q|)(ip + iq) r / (1 - r).
    const r = lambda / (j + 1);
    if (r < 1 && ((p + Math.abs(q)) * (ip + iq) * r) / (1 - r) < TERM_TOLERANCE) break;
  }

  // Backward: j = k-1, ..., 0. The I_x values increase toward 1, the weights decrease.
  p = p0;
  q = q0;
  ip = ip0;
  iq = iq0;
  if (k >= 1) {
    gp = g(k - 0.5);
    gq = g(k);
    for (let j = k - 1; j >= 0; j--) {
      if (k - j > MAX_TERMS) throw new RangeError(`noncentralTCdf: series did not converge (df ${df}, ncp ${ncp})`);
      ip = Math.min(1, ip + gp);
      iq = Math.min(1, iq + gq);
      gp *= (j + 0.5) / (x * (j - 0.5 + b));
      gq *= (j + 1) / (x * (j + b));
      // Going down, g grows by about 1/x a step; if it underflowed higher up, recompute it directly.
      if (gp === 0 && j >= 1) gp = g(j - 0.5);
      if (gq === 0 && j >= 1) gq = g(j);
      p *= (j + 1) / lambda;
      q *= (j + 1.5) / lambda;
      const term = p * ip + q * iq;
      total += term;
      // Below the mode the weights fall at least geometrically with ratio r = (j + 1/2) / lambda,
      // so the rest is at most (p + |q|) r / (1 - r) (each I_x is at most 1).
      const r = (j + 0.5) / lambda;
      if (r < 1 && ((p + Math.abs(q)) * r) / (1 - r) < TERM_TOLERANCE) break;
    }
  }
  return Math.min(1, Math.max(0, base + total / 2));
}

/** F(t; df, ncp) = E[Phi(t S / sqrt(df) - ncp)], S ~ chi(df), by adaptive Simpson (see the file comment). */
function cdfByIntegral(t: number, df: number, ncp: number): number {
  if (t === 0) return normalCdf(-ncp, 0, 1);
  const root = Math.sqrt(df);
  const logConstant = (1 - df / 2) * Math.LN2 - gammaln(df / 2);
  // Phi's argument t s / sqrt(df) - ncp, written as slope (s - step) so that it has no cancellation
  // near the step (t s / sqrt(df) and ncp are both about 10^5 there: their difference would carry
  // rounding noise of 1e-11 that no quadrature tolerance can get below).
  const slope = t / root;
  const step = ncp / slope;
  const argument = Number.isFinite(step) ? (x: number) => slope * (x - step) : (x: number) => slope * x - ncp;
  const integrand = (x: number): number => {
    if (x <= 0) return 0;
    const density = Math.exp(logConstant + (df - 1) * Math.log(x) - (x * x) / 2);
    return density === 0 ? 0 : normalCdf(argument(x), 0, 1) * density;
  };
  const low = Math.max(0, root - 12);
  const high = root + 12;
  // Pieces: the Phi factor rises from 0 to 1 within 40 / |slope| of the step; the density peaks at the mode.
  const width = 40 / Math.abs(slope);
  const cuts = [low, Math.sqrt(Math.max(df - 1, 0)), step - width, step, step + width, high]
    .filter((c) => Number.isFinite(c) && c >= low && c <= high)
    .sort((a, b) => a - b);
  let total = 0;
  for (let i = 0; i + 1 < cuts.length; i++) {
    const a = cuts[i] as number;
    const b = cuts[i + 1] as number;
    if (b > a) total += adaptiveSimpson(integrand, a, b, 1e-14);
  }
  return Math.min(1, Math.max(0, total));
}

/**
 * Adaptive Simpson quadrature with Richardson extrapolation (Lyness 1969), absolute tolerance tol
 * (halved with each split, never below 1e-3 of the piece's width times 1e-13, so that rounding
 * noise in f cannot force endless splitting), depth at most 40.
 */
function adaptiveSimpson(f: (x: number) => number, a: number, b: number, tol: number): number {
  const fa = f(a);
  const fb = f(b);
  const m = (a + b) / 2;
  const fm = f(m);
  const whole = ((b - a) / 6) * (fa + 4 * fm + fb);
  const step = (
    a: number,
    b: number,
    fa: number,
    fm: number,
    fb: number,
    whole: number,
    tol: number,
    depth: number,
  ): number => {
    const m = (a + b) / 2;
    const lm = (a + m) / 2;
    const rm = (m + b) / 2;
    const flm = f(lm);
    const frm = f(rm);
    const left = ((m - a) / 6) * (fa + 4 * flm + fm);
    const right = ((b - m) / 6) * (fm + 4 * frm + fb);
    const diff = left + right - whole;
    if (depth >= 40 || Math.abs(diff) <= 15 * Math.max(tol, 1e-16 * (b - a))) return left + right + diff / 15;
    return step(a, m, fa, flm, fm, left, tol / 2, depth + 1) + step(m, b, fm, frm, fb, right, tol / 2, depth + 1);
  };
  return step(a, b, fa, fm, fb, whole, tol, 0);
}

/**
 * Confidence limits for the noncentrality parameter of a noncentral t distribution from one
 * observed t (Steiger & Fouladi 1997): `low` solves F(t; df, low) = (1 + level)/2 and `high`
 * solves F(t; df, high) = (1 - level)/2. Dividing by sqrt(n1 n2 / (n1 + n2)) turns them into an
 * interval for a standardized mean difference (see `hedgesG`).
 *
 * Root finding: each limit is bracketed by stepping outward from t (steps 1, 2, 4, ...), then
 * found by bisection until the bracket is within 1e-14 relative (about 50 to 60 CDF evaluations
 * per limit; bisection rather than a faster method because it cannot fail on a monotone function).
 * Cost about 120 CDF evaluations (each some milliseconds when |ncp| passes 2,000, so up to about
 * a second at |t| near 10^6). Throws a RangeError when t is not finite, df is not positive, level
 * is not in (0, 1), or (df < 1 only) the CDF throws.
 * Example: `noncentralTNcpInterval(0, 10, 0.95)` is { low: -1.95996..., high: 1.95996... } (F(0; df, ncp) = Phi(-ncp)).
 */
export function noncentralTNcpInterval(t: number, df: number, level: number): { low: number; high: number } {
  if (!Number.isFinite(t)) throw new RangeError(`noncentralTNcpInterval: t must be finite, got ${t}`);
  if (!(df > 0 && Number.isFinite(df)))
    throw new RangeError(`noncentralTNcpInterval: df must be a positive finite number, got ${df}`);
  if (!(level > 0 && level < 1)) throw new RangeError(`noncentralTNcpInterval: level must be in (0, 1), got ${level}`);
  return {
    low: solveNcp(t, df, (1 + level) / 2),
    high: solveNcp(t, df, (1 - level) / 2),
  };
}

/** The ncp at which F(t; df, ncp) = target, by bracketing then bisection (F decreases in ncp). */
function solveNcp(t: number, df: number, target: number): number {
  const above = (ncp: number): boolean => noncentralTCdf(t, df, ncp) > target;
  let lo = t - 1;
  let hi = t + 1;
  for (let step = 1; !above(lo); step *= 2) {
    lo -= step;
    if (step > 1e300) throw new RangeError(`noncentralTNcpInterval: could not bracket the limit (t ${t}, df ${df})`);
  }
  for (let step = 1; above(hi); step *= 2) {
    hi += step;
    if (step > 1e300) throw new RangeError(`noncentralTNcpInterval: could not bracket the limit (t ${t}, df ${df})`);
  }
  // Invariant: F(lo) > target >= F(hi).
  for (let i = 0; i < 200 && hi - lo > 1e-14 * Math.max(1, Math.abs(lo), Math.abs(hi)); i++) {
    const mid = lo + (hi - lo) / 2;
    if (mid <= lo || mid >= hi) break;
    if (above(mid)) lo = mid;
    else hi = mid;
  }
  return lo + (hi - lo) / 2;
}
