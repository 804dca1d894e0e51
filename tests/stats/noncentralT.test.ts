import { describe, expect, it } from 'vitest';
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import { noncentralTCdf, noncentralTNcpInterval } from '../../src/stats/noncentralT.js';

function expectRel(actual: number, expected: number, tolerance: number): void {
  const err = Math.abs(actual - expected) / Math.abs(expected);
  expect(err, `${actual} vs ${expected}`).toBeLessThanOrEqual(tolerance);
}

/**
 * [t, df, ncp, P(T <= t)] computed with mpmath 1.2.1 at 40 digits (tests/reference/t_family_reference.py,
 * function nct_cdf) from the definition T = (Z + ncp) / sqrt(V / df): the integral of
 * Phi(t s / sqrt(df) - ncp) against the chi density with df degrees of freedom. That route shares
 * nothing with the series summed in src/stats/noncentralT.ts.
 */
const GRID: ReadonlyArray<readonly [number, number, number, number]> = [
  [-3, 1, -2.5, 0.57133285667164499],
  [-3, 1, 0, 0.10241638234956673],
  [-3, 1, 0.7, 0.037124106143083188],
  [-3, 1, 4, 0.000001890981395773194],
  [-3, 3.5, -2.5, 0.43240851269852914],
  [-3, 3.5, 0, 0.023687619742373218],
  [-3, 3.5, 0.7, 0.0056947718395047804],
  [-3, 3.5, 4, 0.000000053421713956811537],
  [-3, 10, -2.5, 0.36341761952442637],
  [-3, 10, 0, 0.0066718275112847886],
  [-3, 10, 0.7, 0.0010323342651305283],
  [-3, 10, 4, 0.00000000096733747656078484],
  [-3, 60, -2.5, 0.31915544981043618],
  [-3, 60, 0, 0.0019638486664863094],
  [-3, 60, 0.7, 0.00018516045109693806],
  [-3, 60, 4, 0.0000000000072455717257924743],
  [-0.5, 1, -2.5, 0.97720931780744399],
  [-0.5, 1, 0, 0.35241638234956673],
  [-0.5, 1, 0.7, 0.14614735633959297],
  [-0.5, 1, 4, 0.0000099428522324966302],
  [-0.5, 3.5, -2.5, 0.97725759619214252],
  [-0.5, 3.5, 0, 0.32342521966127551],
  [-0.5, 3.5, 0.7, 0.12561411172036987],
  [-0.5, 3.5, 4, 0.0000053714095544815936],
  [-0.5, 10, -2.5, 0.97725153612341125],
  [-0.5, 10, 0, 0.31394680287148647],
  [-0.5, 10, 0.7, 0.11889430403037227],
  [-0.5, 10, 4, 0.000004067698438231491],
  [-0.5, 60, -2.5, 0.9772499245631484],
  [-0.5, 60, 0, 0.30945197971899155],
  [-0.5, 60, 0.7, 0.11571544594163083],
  [-0.5, 60, 4, 0.0000035065509782872273],
  [0.5, 1, -2.5, 0.99744336351508774],
  [0.5, 1, 0, 0.64758361765043327],
  [0.5, 1, 0.7, 0.38510262965525525],
  [0.5, 1, 4, 0.00033667649890217034],
  [0.5, 3.5, -2.5, 0.9982578605134923],
  [0.5, 3.5, 0, 0.67657478033872449],
  [0.5, 3.5, 0.7, 0.40877641905436976],
  [0.5, 3.5, 4, 0.00025768482975247591],
  [0.5, 10, -2.5, 0.99851130225455504],
  [0.5, 10, 0, 0.68605319712851353],
  [0.5, 10, 0.7, 0.41640687198872933],
  [0.5, 10, 4, 0.00024100871527853831],
  [0.5, 60, -2.5, 0.99862700068247134],
  [0.5, 60, 0, 0.69054802028100845],
  [0.5, 60, 0.7, 0.42000878571971486],
  [0.5, 60, 4, 0.00023399805141327763],
  [2.5, 1, -2.5, 0.9993687021898188],
  [2.5, 1, 0, 0.8788810584091566],
  [2.5, 1, 0.7, 0.75076877530304296],
  [2.5, 1, 4, 0.13739256154197278],
  [2.5, 3.5, -2.5, 0.99994709035280328],
  [2.5, 3.5, 0, 0.96215267809525496],
  [2.5, 3.5, 0.7, 0.88859185373367872],
  [2.5, 3.5, 4, 0.11022776864343027],
  [2.5, 10, -2.5, 0.99999472499979237],
  [2.5, 10, 0, 0.9842765778816956],
  [2.5, 10, 0.7, 0.93676063323888752],
  [2.5, 10, 4, 0.086364354767187421],
  [2.5, 60, -2.5, 0.99999943877969462],
  [2.5, 60, 0, 0.99241460988255574],
  [2.5, 60, 0.7, 0.95953123515702524],
  [2.5, 60, 4, 0.070444241546478067],
  [8, 1, -2.5, 0.99980037773040902],
  [8, 1, 0, 0.96041657583943446],
  [8, 1, 0.7, 0.91660909134757847],
  [8, 1, 4, 0.61979567635798547],
  [8, 3.5, -2.5, 0.99999887016254117],
  [8, 3.5, 0, 0.99886133677763976],
  [8, 3.5, 0.7, 0.99600644294170259],
  [8, 3.5, 4, 0.8728563566753581],
  [8, 10, -2.5, 0.9999999995875945],
  [8, 10, 0, 0.99999411252860517],
  [8, 10, 0.7, 0.99995638078284418],
  [8, 10, 4, 0.97452215270863415],
  [8, 60, -2.5, 1.0],
  [8, 60, 0, 0.99999999997549867],
  [8, 60, 0.7, 0.99999999891408072],
  [8, 60, 4, 0.99939379474402999],
  [40, 10, 40, 0.44103535095081136],
  [45, 30, 38, 0.87151304344960692],
  [-1, 5, -30, 1.0],
  [2.2281388519649385, 8, 3.1622776601683795, 0.18933657759545942],
];

describe('noncentralTCdf', () => {
  it('matches an independent high-precision integral to 1e-13 absolute', () => {
    for (const [t, df, ncp, expected] of GRID) {
      const got = noncentralTCdf(t, df, ncp);
      expect(Math.abs(got - expected), `t ${t} df ${df} ncp ${ncp}: ${got} vs ${expected}`).toBeLessThanOrEqual(1e-13);
    }
  });

  it('keeps 10 significant digits in the upper half (t >= 0, no reflection)', () => {
    for (const [t, df, ncp, expected] of GRID) {
      if (t < 0 || expected === 1) continue;
      expectRel(noncentralTCdf(t, df, ncp), expected, 1e-10);
    }
  });

  it('handles very large df within 1e-10 (log-gamma differences of size 1e6 limit the digits)', () => {
    // mpmath integral, same script: P(T <= 1.5) with df 200000, ncp 1.2.
    expect(Math.abs(noncentralTCdf(1.5, 200000, 1.2) - 0.61791038529340435)).toBeLessThanOrEqual(1e-10);
  });

  it('is Phi(-ncp) at t = 0 and the central t at ncp = 0', () => {
    // P(Z + ncp <= 0) = Phi(-ncp) by definition; Phi from @stdlib.
    for (const ncp of [-3, -0.2, 0.9, 7]) expect(noncentralTCdf(0, 6, ncp)).toBeCloseTo(normalCdf(-ncp, 0, 1), 15);
    // Central t with df 1 is Cauchy: P(T <= t) = 1/2 + atan(t) / pi (first principles: the df-1 density
    // 1 / (pi (1 + t^2)) integrates to it).
    for (const t of [-4, -1, 0.3, 2, 10]) expect(noncentralTCdf(t, 1, 0)).toBeCloseTo(0.5 + Math.atan(t) / Math.PI, 14);
  });

  it('decreases in ncp and increases in t', () => {
    let previous = 1;
    for (let ncp = -6; ncp <= 12; ncp += 0.25) {
      const f = noncentralTCdf(1.7, 4, ncp);
      expect(f).toBeLessThanOrEqual(previous);
      previous = f;
    }
    previous = 0;
    for (let t = -8; t <= 20; t += 0.5) {
      const f = noncentralTCdf(t, 4, 2.5);
      expect(f).toBeGreaterThanOrEqual(previous);
      previous = f;
    }
  });

  it('returns the limits at infinite t', () => {
    expect(noncentralTCdf(Infinity, 3, 2)).toBe(1);
    expect(noncentralTCdf(-Infinity, 3, 2)).toBe(0);
  });

  it('throws RangeError on invalid arguments', () => {
    expect(() => noncentralTCdf(1, 0, 1)).toThrow(/df/);
    expect(() => noncentralTCdf(1, Infinity, 1)).toThrow(/df/);
    expect(() => noncentralTCdf(1, 5, Number.NaN)).toThrow(/ncp/);
    expect(() => noncentralTCdf(Number.NaN, 5, 1)).toThrow(/NaN/);
  });
});

/**
 * [t, df, ncp, P(T <= t)] far from the centre, 40-digit mpmath integrals split at the step of the Phi
 * factor (tests/reference/noncentral_t_far_reference.py). TC = 316227.75293206575 is scipy 1.10.1's
 * nct.ppf(1 - 5e-12, 2, 0), close to the critical t at df 2 for two-sided alpha 1e-11 (the exact one is
 * 316227.766...: 1 - 5e-12 is rounded in binary); the first five rows are the kind of power
 * computation at 2 v 2 that used to end in an internal error (series did not converge).
 */
// Written as a string: biome's noPrecisionLoss flags 17-digit literals even where they are a double's
// shortest form, as here. The expected values below are the script's 17 digits rounded to 16.
const TC = Number('316227.75293206575');
const FAR: readonly [number, number, number, number][] = [
  [TC, 2, 200000.0, 0.6703200238452655],
  [TC, 2, 300000.0, 0.4065696294626122],
  [TC, 2, 400000.0, 0.201896491266265],
  [TC, 2, 600000.0, 0.02732371430872264],
  [-TC, 2, 300000.0, 0], // mpmath: 4.3e-19543251714
  [2600.0, 10, 2500.0, 0.5089683639737754],
  [-2500.0, 5, -2200.0, 0.4320117778551311],
  [3000.0, 30, 2980.0, 0.4862004189755046],
  [200000000.0, 2, 250000000.0, 0.2096113871510978],
  [50.0, 4, 2500.0, 0], // mpmath: 4.9e-2165
  [100000.0, 60, 99000.0, 0.5194291866621269],
];

describe('noncentralTCdf far from the centre (|ncp| > 2,000: the integral route)', () => {
  it('matches 40-digit mpmath integrals to 1e-13 absolute, up to ncp 2.5e8', () => {
    for (const [t, df, ncp, expected] of FAR) {
      const got = noncentralTCdf(t, df, ncp);
      expect(Math.abs(got - expected), `t ${t} df ${df} ncp ${ncp}: ${got} vs ${expected}`).toBeLessThanOrEqual(1e-13);
    }
  });

  it('the series below 2,000 and the integral above meet: F is continuous in ncp across the switch', () => {
    // First principles: F is smooth in ncp, so over equal steps of 0.002 its decrements change
    // smoothly; the decrement across the switch must equal the mean of its neighbours up to the
    // series' own error near ncp 2,000 (about 3e-9, see noncentralTCdf) and the curvature (1e-12).
    const f = (ncp: number): number => noncentralTCdf(2000, 10, ncp);
    const before = f(1999.997) - f(1999.999);
    const across = f(1999.999) - f(2000.001);
    const after = f(2000.001) - f(2000.003);
    expect(across).toBeGreaterThan(1.7e-6); // dF/dncp about -8.8e-4 here
    expect(Math.abs(across - (before + after) / 2)).toBeLessThan(1e-8);
  });
});

describe('noncentralTNcpInterval', () => {
  it('brackets limits far out (|t| 4e6 and 2e7: once a "could not bracket" error at |t| above 2e6)', () => {
    // Definition of the limits: F(t; df, low) = (1 + level)/2 and F(t; df, high) = (1 - level)/2, with
    // the CDF checked against mpmath far out above.
    for (const [t, df, level] of [
      [-4e6, 3, 0.99],
      [2e7, 8, 0.95],
    ] as const) {
      const { low, high } = noncentralTNcpInterval(t, df, level);
      expect(low).toBeLessThan(high);
      expect(Math.abs(noncentralTCdf(t, df, low) - (1 + level) / 2)).toBeLessThan(1e-12);
      expect(Math.abs(noncentralTCdf(t, df, high) - (1 - level) / 2)).toBeLessThan(1e-12);
    }
  });

  // METHODS.md's A vs B: pooled t = d sqrt(n1 n2 / (n1 + n2)) with d = 1.4535900564185282, n = 5 and 7.
  const scale = Math.sqrt(35 / 12);
  const t = 1.4535900564185282 * scale;

  it('reproduces the METHODS.md interval for A vs B (Steiger & Fouladi 1997)', () => {
    const r = noncentralTNcpInterval(t, 10, 0.95);
    // METHODS.md (scipy 1.10.1), d scale, 11 decimals: agree to half a unit in the last place.
    expect(Math.abs(r.low / scale - 0.11761377366)).toBeLessThanOrEqual(5e-12);
    expect(Math.abs(r.high / scale - 2.73461003886)).toBeLessThanOrEqual(5e-12);
    // mpmath at 40 digits (root-finding on the integral above): ncp scale.
    expectRel(r.low / scale, 0.11761377366008766, 1e-10);
    expectRel(r.high / scale, 2.7346100388569063, 1e-10);
  });

  it('puts the observed t at the (1 + level)/2 and (1 - level)/2 quantiles', () => {
    for (const [tt, df, level] of [
      [0.4, 3, 0.9],
      [-2.2, 12, 0.95],
      [6, 8, 0.99],
    ] as const) {
      const r = noncentralTNcpInterval(tt, df, level);
      expect(noncentralTCdf(tt, df, r.low)).toBeCloseTo((1 + level) / 2, 12);
      expect(noncentralTCdf(tt, df, r.high)).toBeCloseTo((1 - level) / 2, 12);
    }
  });

  it('is symmetric: the interval for -t is minus the interval for t', () => {
    const plus = noncentralTNcpInterval(2.3, 7, 0.95);
    const minus = noncentralTNcpInterval(-2.3, 7, 0.95);
    expect(minus.low).toBeCloseTo(-plus.high, 10);
    expect(minus.high).toBeCloseTo(-plus.low, 10);
  });

  it('throws RangeError on invalid arguments', () => {
    expect(() => noncentralTNcpInterval(Infinity, 5, 0.95)).toThrow(RangeError);
    expect(() => noncentralTNcpInterval(1, -1, 0.95)).toThrow(RangeError);
    expect(() => noncentralTNcpInterval(1, 5, 1)).toThrow(RangeError);
  });
});
