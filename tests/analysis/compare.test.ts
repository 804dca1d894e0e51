import { beforeEach, describe, expect, it } from 'vitest';
import { compareMetric, type ComparisonRequest } from '../../src/analysis/compare.js';
import type { RunOutcome } from '../../src/analysis/runValues.js';
import { resolveOptions } from '../../src/analysis/options.js';

// METHODS.md check inputs (values from scipy 1.10.1 there; the rest checked by tests/reference/analysis_reference.py).
const A = [71.2, 69.8, 73.1, 70.4, 72.0];
const B = [68.9, 70.1, 69.5, 71.0, 67.8, 70.6, 69.2];
const C = [72, 70, 74, 70, 72];
const D = [69, 70, 68, 71, 70, 67, 72];

const arm = (values: readonly (number | null)[], diverged: readonly number[] = [], seed0 = 1): RunOutcome[] =>
  values.map((value, i) => ({
    run: `r${seed0 + i}`,
    seed: String(seed0 + i),
    config: 'x',
    value: diverged.includes(i) ? null : value,
    loggedAt: 0,
    failed: diverged.includes(i) ? 'diverged' : null,
    censored: false,
    stale: false,
    note: null,
  }));

function request(
  candidate: readonly (number | null)[],
  baseline: readonly (number | null)[],
  over: Partial<ComparisonRequest> = {},
): ComparisonRequest {
  return {
    metric: 'acc',
    goal: 'max',
    goalInferred: false,
    summary: 'final',
    reachValue: null,
    task: null,
    baseline: 'base',
    candidate: 'cand',
    step: null,
    baselineRuns: arm(baseline),
    candidateRuns: arm(candidate),
    ...over,
  };
}

const settings = resolveOptions({});
const one = (r: ComparisonRequest, s = settings): ReturnType<typeof compareMetric>['comparisons'][number] => {
  const c = compareMetric([r], s).comparisons[0];
  if (c === undefined) throw new Error('no comparison');
  return c;
};

describe('compareMetric on METHODS.md check values (candidate A, baseline B)', () => {
  // In beforeEach, not while collecting: mutation runs count collection-time work as "static" and
  // then run every test for each such mutant (DEVELOPERS.md, "Mutation testing").
  let c = {} as ReturnType<typeof one>;
  beforeEach(() => {
    c = one(request(A, B));
  });

  it('Welch (primary), its interval, permutation and Mann-Whitney', () => {
    expect(c.tests.welch.statistic).toBeCloseTo(2.4022431408862186, 12);
    expect(c.tests.welch.df).toBeCloseTo(7.701328923514923, 10);
    expect(c.p).toBeCloseTo(0.04418107272139468, 12);
    expect(c.difference.method).toBe('welch-t');
    expect(c.difference.estimate).toBeCloseTo(71.3 - 487.1 / 7, 12);
    // t quantile at fractional df: stdlib v scipy agree to ~2e-10
    expect(c.difference.low).toBeCloseTo(0.057502837562101, 9);
    expect(c.difference.high).toBeCloseTo(3.371068591009343, 9);
    expect(c.tests.permutation).toEqual({ p: 27 / 792, exact: true });
    expect(c.tests.mannWhitney.u).toBe(30);
    expect(c.tests.mannWhitney.p).toBeCloseTo(0.04797979797979798, 14);
    expect(c.tests.mannWhitney.exact).toBe(true);
    expect(c.n).toEqual({ baseline: 7, candidate: 5 });
  });

  it("effect sizes: Hedges' g with its noncentral-t interval, Cliff's delta and P(improvement)", () => {
    const J = 0.922745608053087;
    expect(c.effect.hedgesG).toBeCloseTo(1.341293840469836, 10);
    expect(c.effect.hedgesGLow).toBeCloseTo(J * 0.11761377366, 8);
    expect(c.effect.hedgesGHigh).toBeCloseTo(J * 2.73461003886, 8);
    expect(c.effect.cliffsDelta).toBeCloseTo(0.714285714, 8);
    expect(c.effect.probabilityOfImprovement).toBeCloseTo(0.857142857, 8);
    expect(c.effect.cliffsDeltaLow).toBeCloseTo(0.00061319297, 8);
    expect(c.effect.cliffsDeltaHigh).toBeCloseTo(0.94588140903, 8);
  });

  it(
    'detectable: pooled sd and minimum detectable difference at 80% power (no post-hoc seeds for the observed ' +
      'difference)',
    () => {
      // scipy 1.10.1 (tests/reference/analysis_reference.py): pooled sd 1.1793460657742232; noncentral-t MDE at 5 v 7
      // (brentq on nct power) = 1.8210108583 sd = 2.1476019914743016 metric units.
      expect(c.detectable.sd).toBeCloseTo(1.1793460657742232, 12);
      expect(c.detectable.minimumEffect).toBeCloseTo(2.1476019914743016, 6);
      expect(Object.keys(c.detectable)).toEqual(['sd', 'minimumEffect']);
    },
  );

  it('verdict: better for goal max; for goal min the same data is worse and P(improvement) flips', () => {
    expect(c.verdict).toBe('better');
    expect(c.pAdjusted).toBeCloseTo(0.04418107272139468, 12);
    expect(c.cautions).toContain('unequal seed counts (5 candidate v 7 baseline)');
    const min = one(request(A, B, { goal: 'min' }));
    expect(min.verdict).toBe('worse');
    expect(min.effect.probabilityOfImprovement).toBeCloseTo(1 / 7, 8);
    // One sign convention (METHODS.md "Effect sizes"): g and Cliff's delta are candidate minus baseline in the
    // metric's own direction, whatever the goal; only P(candidate better) follows the goal.
    expect(min.effect.cliffsDelta).toBeCloseTo(0.714285714, 8);
    expect(min.effect.cliffsDeltaLow).toBeCloseTo(0.00061319297, 8);
    expect(min.effect.hedgesG).toBeCloseTo(1.341293840469836, 10);
    // lower is better and the candidate is lower: better
    expect(one(request(B, A, { goal: 'min' })).verdict).toBe('better');
    expect(one(request(B, A)).verdict).toBe('worse');
  });
});

describe('multiple comparisons within one family', () => {
  it('Holm across the family (Welch p .04418 and .07120 both become .08836, so neither is better)', () => {
    // Holm by hand: sorted p .04418 x 2 = .08836; .07120 x 1 = .07120 -> max with previous = .08836.
    const { comparisons } = compareMetric(
      [request(A, B, { candidate: 'a' }), request(C, D, { candidate: 'c' })],
      settings,
    );
    expect(comparisons.map((x) => x.p)).toEqual([
      expect.closeTo(0.04418107272139468, 12),
      expect.closeTo(0.07119723188477407, 12),
    ]);
    expect(comparisons.map((x) => x.pAdjusted)).toEqual([
      expect.closeTo(0.08836214544278936, 12),
      expect.closeTo(0.08836214544278936, 12),
    ]);
    expect(comparisons.map((x) => x.verdict)).toEqual(['inconclusive', 'inconclusive']);
    const bh = compareMetric([request(A, B), request(C, D)], resolveOptions({ correction: 'bh' })).comparisons;
    expect(bh.map((x) => x.pAdjusted)).toEqual([
      expect.closeTo(0.07119723188477407, 12),
      expect.closeTo(0.07119723188477407, 12),
    ]);
    const none = compareMetric([request(A, B), request(C, D)], resolveOptions({ correction: 'none' })).comparisons;
    expect(none[0]?.verdict).toBe('better');
  });

  it('the permutation stream is seeded per comparison, so order does not matter', () => {
    const x = Array.from({ length: 15 }, (_, i) => Math.sin(i + 1) + 0.3);
    const y = Array.from({ length: 15 }, (_, i) => Math.cos(i + 1));
    const r1 = request(x, y, { candidate: 'one' });
    const r2 = request(y, x, { candidate: 'two' });
    const ab = compareMetric([r1, r2], settings).comparisons;
    const ba = compareMetric([r2, r1], settings).comparisons;
    expect(ab[0]?.tests.permutation.exact).toBe(false); // C(30, 15) > 200,000: random relabelings
    expect(ab[0]?.tests.permutation.p).toBe(ba[1]?.tests.permutation.p);
    expect(ab[1]?.tests.permutation.p).toBe(ba[0]?.tests.permutation.p);
  });
});

describe('diverged runs', () => {
  const withDiverged: ComparisonRequest = { ...request(A, B), candidateRuns: arm([...A, null], [5]) };

  it('exclude (default): left out, counted, said', () => {
    const c = one(withDiverged);
    expect(c.n.candidate).toBe(5);
    expect(c.diverged).toEqual({ baseline: 0, candidate: 1 });
    expect(c.p).toBeCloseTo(0.04418107272139468, 12);
    expect(c.failures).toEqual({
      baseline: { runs: 7, diverged: 0, short: 0 },
      candidate: { runs: 6, diverged: 1, short: 0 },
      // scipy.stats.fisher_exact([[0, 7], [1, 5]]).pvalue = 0.46153846153846156
      fisherP: expect.closeTo(6 / 13, 12) as unknown as number,
    });
    expect(c.cautions).toContain(
      '1 failed run left out of the values: baseline 0 of 7 failed, candidate 1 of 6 failed (1 diverged); ' +
        "Fisher's exact test on the failure counts p = 0.462",
    );
  });

  it('worst: counted as the worst value observed in the comparison (goal-aware)', () => {
    const c = one(withDiverged, resolveOptions({ failed: 'worst' }));
    expect(c.n.candidate).toBe(6);
    expect(c.mean.candidate).toBeCloseTo((356.5 + 67.8) / 6, 12); // worst for max = min of A and B = 67.8
    expect(c.cautions).toContain(
      '1 failed run scored as the worst value observed in this comparison: baseline 0 of 7 failed, candidate 1 ' +
        "of 6 failed (1 diverged); Fisher's exact test on the failure counts p = 0.462",
    );
    // the old option name still works
    const min = one({ ...withDiverged, goal: 'min' }, resolveOptions({ diverged: 'worst' }));
    expect(min.mean.candidate).toBeCloseTo((356.5 + 73.1) / 6, 12); // worst for min = max = 73.1
  });
});

describe('--paired and --margin', () => {
  // scipy 1.10.1 (tests/reference/analysis_reference.py):
  // ttest_rel(P1, P0) t 3.362691229906825, df 5, p 0.0200489220167276,
  // wilcoxon exact p 0.0625. Interval (0.16489071939106448, 1.2351092806089412) with the exact t quantile
  // (mpmath, 40 digits); scipy 1.10.1's ttest_rel interval is 2.0e-10 off (its t.ppf(.975, 5) is 9.8e-10 high).
  const P1 = [71.2, 69.8, 73.1, 70.4, 72.0, 70.9];
  const P0 = [70.1, 69.9, 71.8, 70.0, 71.1, 70.3];

  it('pairs the seeds present in both arms: paired t primary, Wilcoxon beside', () => {
    const r: ComparisonRequest = {
      ...request(P1, P0),
      candidateRuns: [...arm(P1), ...arm([99], [], 7)],
    };
    const c = one(r, resolveOptions({ paired: true }));
    expect(c.tests.paired?.pairs).toBe(6);
    expect(c.tests.paired?.t).toBeCloseTo(3.362691229906825, 10);
    expect(c.tests.paired?.df).toBe(5);
    expect(c.p).toBeCloseTo(0.020048922016727606, 10);
    expect(c.tests.paired?.wilcoxonP).toBeCloseTo(0.0625, 12);
    expect(c.difference).toMatchObject({
      method: 't',
      low: expect.closeTo(0.16489071939106448, 10),
      high: expect.closeTo(1.2351092806089412, 10),
    });
    expect(c.verdict).toBe('better');
    expect(c.n.candidate).toBe(7);
  });

  it('non-inferiority: one-sided Welch against the margin, in the goal direction', () => {
    // scipy 1.10.1: ttest_ind(A + 2, B, equal_var=False, alternative='greater') p 0.000461317630382501
    const max = one(request(A, B), resolveOptions({ margin: 2 }));
    expect(max.nonInferiority?.p).toBeCloseTo(0.0004613176303825015, 12);
    expect(max.nonInferiority?.holds).toBe(true);
    // goal min, candidate B v baseline A, margin 0.5: ttest_ind(B - 0.5, A, alternative='less') p 0.007652026712195942
    const min = one(request(B, A, { goal: 'min' }), resolveOptions({ margin: 0.5 }));
    expect(min.nonInferiority?.p).toBeCloseTo(0.007652026712195942, 12);
    expect(one(request(A, B)).nonInferiority).toBeNull();
  });
});

describe('when tests cannot run: nulls, inconclusive, a caution - never a crash', () => {
  it('one seed in an arm', () => {
    const c = one(request([70], B));
    expect(c.tests.welch).toEqual({ statistic: null, df: null, p: null });
    expect(c.p).toBeNull();
    expect(c.verdict).toBe('inconclusive');
    expect(c.difference).toMatchObject({ method: 'none', low: null, high: null });
    expect(c.effect.hedgesG).toBeNull();
    expect(c.cautions.some((l) => l.includes('fewer than 2 seeds in an arm (1 v 7)'))).toBe(true);
  });

  it('zero spread in both arms and different values: the exact permutation test decides, with a caution', () => {
    // 4 v 4 distinct groups: the observed split is one of the 2 most extreme of C(8, 4) = 70 (first principles).
    const c = one(request([2, 2, 2, 2], [1, 1, 1, 1]));
    expect(c.primary).toBe('permutation');
    expect(c.p).toBeCloseTo(2 / 70, 14);
    expect(c.tests.welch.p).toBeNull();
    expect(c.verdict).toBe('better');
    expect(c.cautions.some((l) => l.startsWith('zero spread in both arms and the arms differ'))).toBe(true);
    // 3 v 3: 2/20 = 0.1 cannot reach alpha: inconclusive
    expect(one(request([2, 2, 2], [1, 1, 1])).verdict).toBe('inconclusive');
    // the same value everywhere: nothing to test
    const same = one(request([1, 1, 1, 1], [1, 1, 1, 1]));
    expect(same.verdict).toBe('inconclusive');
  });

  it('an arm without any value is not compared; a problem says so', () => {
    const r = compareMetric([{ ...request(A, B), candidateRuns: arm([null, null], [0, 1]) }], settings);
    expect(r.comparisons).toEqual([]);
    expect(r.problems.map((p) => p.code)).toEqual(['few-seeds']);
  });
});

describe('cautions and intervals by seed count', () => {
  it('3 v 3: no rank or permutation test can reach alpha; no resampling interval under --interval bca', () => {
    const c = one(request([3, 4, 5], [1, 2, 3.5]), resolveOptions({ interval: 'bca' }));
    expect(c.difference.method).toBe('welch-t');
    expect(c.cautions).toContain(
      'with 3 v 3 seeds no rank or permutation test can reach p < 0.05 (smallest two-sided p = 0.1)',
    );
    expect(c.cautions.some((l) => l.startsWith('no bootstrap interval with 3 seeds in an arm'))).toBe(true);
  });

  it("a 'better' verdict on 4 v 4 seeds is called fragile", () => {
    const c = one(request([10, 11, 12, 13], [1, 2, 3, 4]));
    expect(c.verdict).toBe('better');
    expect(c.cautions).toContain(
      "the 'better' verdict rests on 4 v 4 seeds: fragile; confirm it with more seeds before claiming it",
    );
  });

  it(
    'the headline interval is Welch at every n; BCa is given beside from 10 runs per arm, headline only under ' +
      '--interval bca',
    () => {
      const x = (n: number, shift: number): number[] => Array.from({ length: n }, (_, i) => Math.sin(3 * i) + shift);
      const nine = one(request(x(9, 1), x(20, 0)));
      expect(nine.difference.method).toBe('welch-t');
      expect(nine.difference.bca).toBeNull();
      const thirty = one(request(x(30, 1), x(30, 0)));
      expect(thirty.difference.method).toBe('welch-t');
      const bca = thirty.difference.bca;
      expect(bca).not.toBeNull();
      expect(bca?.low).toBeLessThan(thirty.difference.estimate as number);
      expect(bca?.high).toBeGreaterThan(thirty.difference.estimate as number);
      const headline = one(request(x(5, 1), x(5, 0)), resolveOptions({ interval: 'bca' }));
      expect(headline.difference.method).toBe('bca');
      expect(headline.difference.low).toBe(headline.difference.bca?.low);
    },
  );

  it('an inferred goal is said in the comparison and recorded as a problem once per metric', () => {
    const r = compareMetric(
      [request(A, B, { goalInferred: true }), request(C, D, { goalInferred: true, candidate: 'c' })],
      settings,
    );
    expect(r.comparisons[0]?.cautions).toContain(
      "higher is better was inferred from the name 'acc'; say --metric acc:min if that is wrong",
    );
    const inferred = r.problems.filter((p) => p.code === 'goal-inferred');
    expect(new Set(inferred.map((p) => p.message)).size).toBe(1);
  });
});
