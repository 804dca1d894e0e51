/**
 * Every case of the committed scipy fixture (tests/reference/scipy-cases.json, written by
 * tests/reference/scipy_reference.py with Debian's /usr/bin/python3) against src/stats/.
 *
 * Source of the expected values: scipy 1.10.1 via Debian python3-scipy (the version METHODS.md's
 * check values came from), except where a section says "formula check" or names another source.
 * README.md in tests/reference/ says what each section records.
 *
 * Tolerances (explicit, per quantity):
 * - p-values and CDF values: relative 1e-9, or absolute 1e-12 for tiny values (either suffices);
 * - t statistics, df, U, W+: relative 1e-10 (absolute 1e-12 near 0);
 * - t quantiles: relative 1e-12 against a 40-digit mpmath root and against scipy's Boost quantile
 *   nct.ppf(p, df, 0); relative 1e-8 against scipy 1.10.1's t.ppf, which is accurate to only a few
 *   1e-9 (the generator prints its largest error against mpmath: 3.7e-9 at p 0.9, df 27; @stdlib's
 *   quantile, which src/stats uses, agrees with mpmath to 1e-15 there);
 * - interval endpoints: 1e-8 of the interval's half-width, because scipy's endpoints are
 *   mean difference -+ t.ppf x se and inherit t.ppf's error (relative to the half-width, not to the
 *   endpoint, which can be near 0);
 * - exact counts (permutation splits, seeds per arm): equality.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { ALTERNATIVES, type Alternative } from '../../src/stats/alternative.js';
import { benjaminiHochberg } from '../../src/stats/benjaminiHochberg.js';
import { hedgesG } from '../../src/stats/hedgesG.js';
import { holm } from '../../src/stats/holm.js';
import { mannWhitney } from '../../src/stats/mannWhitney.js';
import { noncentralTCdf } from '../../src/stats/noncentralT.js';
import { pairedT } from '../../src/stats/pairedT.js';
import { permutationTest } from '../../src/stats/permutation.js';
import { minimumDetectableEffect, seedsPerArm, welchPower } from '../../src/stats/power.js';
import { createRandom } from '../../src/stats/random.js';
import { studentTBounds } from '../../src/stats/tInterval.js';
import { welch } from '../../src/stats/welch.js';
import { wilcoxonSignedRank } from '../../src/stats/wilcoxon.js';

type ByAlternative = Readonly<Record<Alternative, number>>;
interface TwoGroups {
  readonly kind: string;
  readonly x: readonly number[];
  readonly y: readonly number[];
}
interface TTestCase extends TwoGroups {
  readonly statistic: number;
  readonly df: number;
  readonly p: ByAlternative;
  readonly interval95: { readonly low: number; readonly high: number };
  readonly greater95Low: number;
  readonly less95High: number;
}
interface MannWhitneyCase extends TwoGroups {
  readonly ties: boolean;
  readonly splits: number;
  readonly u: number;
  readonly asymptotic: ByAlternative;
  readonly asymptoticNoContinuity: ByAlternative;
  readonly exact?: ByAlternative;
  readonly exactConditional?: ByAlternative;
}
interface WilcoxonCase extends TwoGroups {
  readonly method: 'exact' | 'approx';
  readonly pairs: number;
  readonly rPlus: number;
  readonly p: ByAlternative;
}
interface PermutationCase extends TwoGroups {
  readonly splits: number;
  readonly scipy: ByAlternative;
  readonly exactCounts: { readonly greater: number; readonly less: number; readonly absAtLeast: number };
  readonly scipyAgreesWithCounts: boolean;
}
interface AdjustmentCase {
  readonly p: readonly number[];
  readonly adjusted: readonly number[];
}
interface HedgesCase extends TwoGroups {
  readonly d: number;
  readonly j: number;
  readonly g: number;
  readonly dLow: number;
  readonly dHigh: number;
}
interface Fixture {
  readonly source: string;
  readonly scipyVersion: string;
  readonly welch: readonly TTestCase[];
  readonly pairedT: readonly TTestCase[];
  readonly mannWhitney: readonly MannWhitneyCase[];
  readonly wilcoxon: readonly WilcoxonCase[];
  readonly permutation: readonly PermutationCase[];
  readonly adjustments: {
    readonly source: string;
    readonly holm: readonly AdjustmentCase[];
    readonly benjaminiHochberg: readonly AdjustmentCase[];
  };
  readonly tQuantile: readonly {
    readonly p: number;
    readonly df: number;
    readonly tPpf: number;
    readonly nctPpf: number;
    readonly mpmath: string;
  }[];
  readonly noncentralTCdf: readonly {
    readonly t: number;
    readonly df: number;
    readonly ncp: number;
    readonly cdf: number;
    readonly mpmath: string;
  }[];
  readonly power: {
    readonly welchPower: readonly {
      readonly effect: number;
      readonly n1: number;
      readonly n2: number;
      readonly alpha: number;
      readonly power: number;
    }[];
    readonly minimumDetectableEffect: readonly {
      readonly n1: number;
      readonly n2: number;
      readonly alpha: number;
      readonly power: number;
      readonly effect: number;
    }[];
    readonly seedsPerArm: readonly {
      readonly effect: number;
      readonly alpha: number;
      readonly power: number;
      readonly seedsPerArm: number;
    }[];
  };
  readonly hedgesG: readonly HedgesCase[];
}

const fixture = JSON.parse(readFileSync(new URL('../reference/scipy-cases.json', import.meta.url), 'utf8')) as Fixture;

/** |actual - expected| <= max(rel |expected|, abs): relative tolerance, or absolute for values near 0. */
function expectClose(actual: number, expected: number, rel: number, abs: number, what: string): void {
  const error = Math.abs(actual - expected);
  expect(error, `${what}: got ${actual}, reference ${expected}`).toBeLessThanOrEqual(
    Math.max(rel * Math.abs(expected), abs),
  );
}
const expectP = (actual: number, expected: number, what: string): void =>
  expectClose(actual, expected, 1e-9, 1e-12, what);
const expectStatistic = (actual: number, expected: number, what: string): void =>
  expectClose(actual, expected, 1e-10, 1e-12, what);

/** Frozen copies: the functions must not mutate their input. */
function frozen(c: TwoGroups): { x: readonly number[]; y: readonly number[] } {
  return { x: Object.freeze([...c.x]), y: Object.freeze([...c.y]) };
}
/** Relative accuracy of scipy 1.10.1's t.ppf (measured against mpmath: at most 3.7e-9), with margin. */
const T_PPF = 1e-8;
const cases = <T>(list: readonly T[]): { i: number; c: T }[] => list.map((c, i) => ({ i, c }));

it('the fixture was written by scipy 1.10.1 (Debian python3-scipy), with at least 50 cases per function', () => {
  expect(fixture.scipyVersion).toBe('1.10.1');
  expect(fixture.source).toMatch(/^scipy 1\.10\.1 via Debian python3-scipy/);
  for (const list of [
    fixture.welch,
    fixture.pairedT,
    fixture.mannWhitney,
    fixture.wilcoxon,
    fixture.permutation,
    fixture.hedgesG,
  ]) {
    expect(list.length).toBeGreaterThanOrEqual(50);
  }
  expect(fixture.mannWhitney.filter((c) => c.exact !== undefined).length).toBeGreaterThanOrEqual(20);
  expect(fixture.mannWhitney.filter((c) => c.exactConditional !== undefined).length).toBeGreaterThanOrEqual(20);
  expect(fixture.adjustments.holm.length).toBeGreaterThanOrEqual(50);
  expect(fixture.noncentralTCdf.length).toBeGreaterThanOrEqual(50);
  expect(fixture.power.welchPower.length).toBeGreaterThanOrEqual(50);
});

describe('welch against scipy 1.10.1 ttest_ind(equal_var=False) via Debian python3-scipy', () => {
  it.each(cases(fixture.welch))('case $i ($c.kind)', ({ c }) => {
    const { x, y } = frozen(c);
    for (const alternative of ALTERNATIVES) {
      const r = welch(x, y, { alternative });
      expectStatistic(r.statistic, c.statistic, 't');
      expectClose(r.df, c.df, 1e-10, 0, 'df');
      expectP(r.p, c.p[alternative], `p ${alternative}`);
    }
    // Intervals: mean difference -+ scipy t.ppf x se (scipy 1.10's ttest_ind has no confidence_interval()).
    const two = welch(x, y);
    const half = (c.interval95.high - c.interval95.low) / 2;
    expectClose(two.low, c.interval95.low, 0, T_PPF * half, 'low');
    expectClose(two.high, c.interval95.high, 0, T_PPF * half, 'high');
    const greater = welch(x, y, { alternative: 'greater' });
    expectClose(greater.low, c.greater95Low, 0, T_PPF * half, 'one-sided low');
    expect(greater.high).toBe(Infinity);
    const less = welch(x, y, { alternative: 'less' });
    expectClose(less.high, c.less95High, 0, T_PPF * half, 'one-sided high');
    expect(less.low).toBe(-Infinity);
  });
});

describe('pairedT against scipy 1.10.1 ttest_rel and its confidence_interval() via Debian python3-scipy', () => {
  it.each(cases(fixture.pairedT))('case $i ($c.kind)', ({ c }) => {
    const { x, y } = frozen(c);
    for (const alternative of ALTERNATIVES) {
      const r = pairedT(x, y, { alternative });
      expectStatistic(r.statistic, c.statistic, 't');
      expect(r.df).toBe(c.df);
      expectP(r.p, c.p[alternative], `p ${alternative}`);
    }
    const two = pairedT(x, y);
    const half = (c.interval95.high - c.interval95.low) / 2;
    expectClose(two.low, c.interval95.low, 0, T_PPF * half, 'low');
    expectClose(two.high, c.interval95.high, 0, T_PPF * half, 'high');
    expectClose(pairedT(x, y, { alternative: 'greater' }).low, c.greater95Low, 0, T_PPF * half, 'one-sided low');
    expectClose(pairedT(x, y, { alternative: 'less' }).high, c.less95High, 0, T_PPF * half, 'one-sided high');
  });
});

describe(
  'mannWhitney against scipy 1.10.1 mannwhitneyu (and permutation_test for ties) via Debian ' + 'python3-scipy',
  () => {
    it.each(cases(fixture.mannWhitney))('case $i ($c.kind, $c.x.length v $c.y.length)', ({ c }) => {
      const { x, y } = frozen(c);
      for (const alternative of ALTERNATIVES) {
        const withCorrection = mannWhitney(x, y, { alternative, method: 'asymptotic' });
        expect(withCorrection.u).toBe(c.u); // multiples of 0.5: exact in floating point
        expect(withCorrection.method).toBe('asymptotic');
        expectP(withCorrection.p, c.asymptotic[alternative], `asymptotic ${alternative}`);
        const without = mannWhitney(x, y, { alternative, method: 'asymptotic', continuity: false });
        expectP(without.p, c.asymptoticNoContinuity[alternative], `asymptotic without continuity ${alternative}`);
        if (c.exact !== undefined) {
          // scipy mannwhitneyu(method='exact'): the no-ties distribution.
          const r = mannWhitney(x, y, { alternative, method: 'exact' });
          expect(r.method).toBe('exact');
          expectP(r.p, c.exact[alternative], `exact ${alternative}`);
        }
        if (c.exactConditional !== undefined) {
          // scipy permutation_test over all C(N, n1) splits of the pooled mid-ranks, statistic U.
          const r = mannWhitney(x, y, { alternative, method: 'exact' });
          expect(r.method).toBe('exact-conditional');
          expectP(r.p, c.exactConditional[alternative], `exact conditional ${alternative}`);
        }
      }
      // What 'auto' picks (STATS-API.md): exact without ties up to 50 per group, exact conditional with
      // ties up to 200,000 splits, else the tie-corrected normal approximation with continuity correction.
      const auto = mannWhitney(x, y);
      const expectedMethod = !c.ties
        ? x.length <= 50 && y.length <= 50
          ? 'exact'
          : 'asymptotic'
        : c.splits <= 200_000
          ? 'exact-conditional'
          : 'asymptotic';
      expect(auto.method).toBe(expectedMethod);
      const expectedP = { exact: c.exact, 'exact-conditional': c.exactConditional, asymptotic: c.asymptotic }[
        expectedMethod
      ];
      // Every case carries scipy's p-value for the method auto picks (scipy_reference.py records the exact
      // one up to 50 per group, as auto uses it); a missing one fails rather than skipping the check.
      expect(expectedP, `fixture has scipy's ${expectedMethod} p-value`).toBeDefined();
      expectP(auto.p, (expectedP as Record<Alternative, number>)['two-sided'], 'auto two-sided');
    });
  },
);

describe('wilcoxonSignedRank against scipy 1.10.1 wilcoxon via Debian python3-scipy', () => {
  it.each(cases(fixture.wilcoxon))('case $i ($c.kind, $c.method)', ({ c }) => {
    const { x, y } = frozen(c);
    for (const alternative of ALTERNATIVES) {
      const r = wilcoxonSignedRank(x, y, { alternative });
      expect(r.exact).toBe(c.method === 'exact');
      expect(r.pairs).toBe(c.pairs);
      expect(r.statistic).toBe(c.rPlus); // scipy reports W+ for one-sided alternatives
      expectP(r.p, c.p[alternative], `p ${alternative}`);
    }
  });
});

describe('permutationTest against scipy 1.10.1 permutation_test (all splits) and exact integer counts', () => {
  it.each(cases(fixture.permutation))('case $i ($c.kind, $c.splits splits)', ({ c }) => {
    const { x, y } = frozen(c);
    // The script checked scipy's one-sided p-values against the integer counts; it flags any disagreement.
    expect(c.scipyAgreesWithCounts).toBe(true);
    const random = createRandom(1); // not used: every case is small enough to enumerate
    const greater = permutationTest(x, y, random, { alternative: 'greater' });
    expect(greater.exact).toBe(true);
    expect(greater.splits).toBe(c.splits);
    expect(greater.atLeast).toBe(c.exactCounts.greater);
    expectP(greater.p, c.scipy.greater, 'p greater (scipy)');
    const less = permutationTest(x, y, random, { alternative: 'less' });
    expect(less.atLeast).toBe(c.exactCounts.less);
    expectP(less.p, c.scipy.less, 'p less (scipy)');
    // Two-sided: our convention counts |T*| >= |T| (exact integer count in the script); scipy's
    // two-sided p is 2 min(one-sided) instead, so it is not compared.
    const two = permutationTest(x, y, random);
    expect(two.atLeast).toBe(c.exactCounts.absAtLeast);
    expectP(two.p, c.exactCounts.absAtLeast / c.splits, 'p two-sided');
  });
});

describe(`holm and benjaminiHochberg against ${fixture.adjustments.source}`, () => {
  it.each(cases(fixture.adjustments.holm))('holm case $i', ({ c }) => {
    const adjusted = holm(Object.freeze([...c.p]));
    expect(adjusted).toHaveLength(c.adjusted.length);
    c.adjusted.forEach((q, k) => {
      expectClose(adjusted[k] as number, q, 1e-12, 0, `holm ${k}`);
    });
  });
  it.each(cases(fixture.adjustments.benjaminiHochberg))('benjaminiHochberg case $i', ({ c }) => {
    const adjusted = benjaminiHochberg(Object.freeze([...c.p]));
    expect(adjusted).toHaveLength(c.adjusted.length);
    c.adjusted.forEach((q, k) => {
      expectClose(adjusted[k] as number, q, 1e-12, 0, `BH ${k}`);
    });
  });
});

describe(
  'Student t quantiles (via studentTBounds) against mpmath, scipy 1.10.1 nct.ppf(p, df, 0) ' + '(Boost) and t.ppf',
  () => {
    it.each(cases(fixture.tQuantile))('case $i: p $c.p, df $c.df', ({ c }) => {
      // 'greater' gives low = estimate - t_{level, df} se, so -low with estimate 0, se 1 is the level quantile.
      const quantile = -studentTBounds(0, 1, c.df, c.p, 'greater').low;
      expectClose(quantile, Number(c.mpmath), 1e-12, 0, 't quantile against mpmath (40 digits)');
      expectClose(quantile, c.nctPpf, 1e-12, 0, "t quantile against scipy's Boost nct.ppf(p, df, 0)");
      expectClose(quantile, c.tPpf, T_PPF, 0, "t quantile against scipy 1.10.1's t.ppf (cdflib)");
    });
  },
);

describe('noncentralTCdf against scipy 1.10.1 nct.cdf (Boost) via Debian python3-scipy', () => {
  it.each(cases(fixture.noncentralTCdf))('case $i: t $c.t, df $c.df, ncp $c.ncp', ({ c }) => {
    expectP(noncentralTCdf(c.t, c.df, c.ncp), c.cdf, 'cdf');
  });
});

describe('noncentralTCdf within its documented 1e-12 of a 40-digit mpmath integral E[Phi(t sqrt(V/df) - ncp)]', () => {
  // src/stats/noncentralT.ts documents an absolute error below 1e-12 (largest seen 5.4e-13: 2.5e-13
  // for |ncp| of 25 to 36, and 5.4e-13 at t = -5.20, df = 58.56, ncp = 4.79, from @stdlib's betainc).
  // scipy's Boost nct.cdf stays within 2e-14 of the same integral (checked below as a sanity check
  // of the integral itself), so ours is about 20 times less accurate than Boost; the bound here is
  // the documented one, not a loosened one.
  it.each(cases(fixture.noncentralTCdf))('case $i: t $c.t, df $c.df, ncp $c.ncp', ({ c }) => {
    const truth = Number(c.mpmath);
    expect(Math.abs(c.cdf - truth), "scipy's own error (sanity check of the integral)").toBeLessThanOrEqual(2e-14);
    expectClose(noncentralTCdf(c.t, c.df, c.ncp), truth, 0, 1e-12, 'cdf against mpmath');
  });
});

describe(
  'power against scipy 1.10.1 nct (Boost; critical value nct.ppf(1 - alpha/2, df, 0)) via ' + 'Debian python3-scipy',
  () => {
    it.each(cases(fixture.power.welchPower))(
      'welchPower case $i: d $c.effect, $c.n1 v $c.n2, alpha $c.alpha',
      ({ c }) => {
        expectP(welchPower(c.effect, c.n1, c.n2, c.alpha), c.power, 'power');
      },
    );
    it.each(cases(fixture.power.minimumDetectableEffect))('minimumDetectableEffect case $i: $c.n1 v $c.n2', ({ c }) => {
      // scipy brentq on the same power function to 1e-14; both roots are good to about 1e-12.
      expectClose(minimumDetectableEffect(c.n1, c.n2, c.alpha, c.power), c.effect, 1e-9, 0, 'effect');
    });
    it.each(cases(fixture.power.seedsPerArm))(
      'seedsPerArm case $i: d $c.effect, alpha $c.alpha, power $c.power',
      ({ c }) => {
        expect(seedsPerArm(c.effect, c.alpha, c.power)).toBe(c.seedsPerArm);
      },
    );
  },
);

describe(
  'hedgesG: d and J are formula checks (numpy, scipy.special.gammaln); the interval is a ' +
    'root of scipy 1.10.1 nct.cdf',
  () => {
    it.each(cases(fixture.hedgesG))('case $i ($c.kind)', ({ c }) => {
      const { x, y } = frozen(c);
      const r = hedgesG(x, y);
      expectClose(r.d, c.d, 1e-10, 1e-13, 'd');
      expectClose(r.j, c.j, 1e-12, 0, 'J');
      expectClose(r.g, c.g, 1e-10, 1e-13, 'g');
      // Roots of F(t; v, ncp) = 0.975 and 0.025 found by scipy's brentq on scipy's nct.cdf.
      expectClose(r.dLow, c.dLow, 1e-8, 1e-12, 'dLow');
      expectClose(r.dHigh, c.dHigh, 1e-8, 1e-12, 'dHigh');
    });
  },
);
