import { describe, expect, it } from 'vitest';
import {
  comparisonCautions,
  pooledSkewness,
  formatNumber,
  sampleSkewness,
  smallestTwoSidedP,
  type CautionFacts,
} from '../../src/analysis/cautions.js';

const base: CautionFacts = {
  metric: 'acc',
  summary: 'final',
  task: null,
  baseline: 'b',
  candidate: 'c',
  goal: 'max',
  goalInferred: false,
  reachValue: null,
  baselineValues: [1, 2, 3, 4, 5],
  candidateValues: [2, 3, 4, 5, 6],
  failures: {
    baseline: { runs: 5, diverged: 0, short: 0 },
    candidate: { runs: 5, diverged: 0, short: 0 },
    fisherP: null,
  },
  failedPolicy: 'exclude',
  zeroSpread: false,
  noValue: { baseline: 0, candidate: 0 },
  alpha: 0.05,
  p: { welch: 0.3, permutation: 0.3, mannWhitney: 0.3 },
  verdict: 'inconclusive',
  reasons: [],
};

describe('smallestTwoSidedP', () => {
  it('is 2 / C(n1 + n2, n1): METHODS.md .1 at 3 v 3, .0286 at 4 v 4, .0079 at 5 v 5', () => {
    expect(smallestTwoSidedP(3, 3)).toBeCloseTo(0.1, 14);
    expect(smallestTwoSidedP(4, 4)).toBeCloseTo(2 / 70, 14);
    expect(formatNumber(smallestTwoSidedP(4, 4))).toBe('0.0286');
    expect(smallestTwoSidedP(5, 5)).toBeCloseTo(2 / 252, 14);
    expect(smallestTwoSidedP(1, 1)).toBe(1);
  });
});

describe('sampleSkewness', () => {
  it('matches scipy.stats.skew (bias=True)', () => {
    // scipy 1.10.1 (tests/reference/analysis_reference.py): skew([1, 1.1, 1.2, 1.3, 5]) = 1.48427744360567
    expect(sampleSkewness([1, 1.1, 1.2, 1.3, 5])).toBeCloseTo(1.48427744360567, 12);
    expect(sampleSkewness([1, 2])).toBeNull();
    expect(sampleSkewness([3, 3, 3])).toBeNull();
  });
});

describe('pooledSkewness', () => {
  it(
    'centres each arm and matches scipy.stats.skew on the ' + 'pooled values, with the normal-theory standard error',
    () => {
      // scipy 1.10.1 (Debian): b=[1,2,3], c=[1,1.1,1.2,1.3,1.4,9]; r = concat(b-b.mean(), c-c.mean());
      // stats.skew(r) = 2.058442550919847; 2*sqrt(6n(n-1)/((n-2)(n+1)(n+3))) at n=9 = 1.4342743312012722
      const s = pooledSkewness([1, 2, 3], [1, 1.1, 1.2, 1.3, 1.4, 9]);
      expect(s?.g1).toBeCloseTo(2.058442550919847, 12);
      expect(2 * (s?.se as number)).toBeCloseTo(1.4342743312012722, 12);
      expect(s?.n).toBe(9);
      // A shift between arms is not skew: two symmetric arms far apart give 0.
      expect(pooledSkewness([1, 2, 3], [101, 102, 103])?.g1).toBeCloseTo(0, 12);
      expect(pooledSkewness([1, 2], [3, 4])).toBeNull();
    },
  );
});

describe('comparisonCautions', () => {
  it('says nothing for a plain 5 v 5 comparison', () => {
    expect(comparisonCautions(base)).toEqual({ lines: [], kinds: [], problems: [] });
  });

  it('few seeds, skew, unequal seeds, disagreeing tests, fragile better: lines and problems', () => {
    const r = comparisonCautions({
      ...base,
      baselineValues: [1, 2, 3],
      candidateValues: [1, 1.1, 1.2, 1.3, 1.4, 9],
      p: { welch: 0.04, permutation: 0.2, mannWhitney: null },
      verdict: 'better',
    });
    expect(r.lines).toEqual([
      'only 3 seeds in the baseline arm: intervals are wide and one more seed can turn the verdict',
      'the values are skewed within the arms (sample skewness 2.06 of the 9 values centred on their arm means, ' +
        'beyond 1.43, twice its standard error under normality): t-based intervals may under-cover; read the ' +
        'rank and permutation tests beside Welch',
      'unequal seed counts (6 candidate v 3 baseline)',
      'the tests disagree at alpha 0.05 (Welch p = 0.04, the permutation test p = 0.2); treat the verdict as fragile',
      "the 'better' verdict rests on 6 v 3 seeds: fragile; confirm it with more seeds before claiming it",
    ]);
    expect(r.kinds).toEqual(['few-seeds', 'skewed', 'unequal-seeds', 'tests-disagree', 'fragile']);
    expect(r.problems.map((p) => p.code)).toEqual(['few-seeds', 'skewed-values', 'unequal-seeds', 'tests-disagree']);
    expect(r.problems[0]?.message).toBe(
      'acc (final), c v b: only 3 seeds in the baseline arm: intervals are wide and one more seed can turn the verdict',
    );
  });

  it('reach summaries, inferred goals, diverged and value-less runs, reasons', () => {
    const r = comparisonCautions({
      ...base,
      goal: 'min',
      goalInferred: true,
      reachValue: 0.9,
      failures: {
        baseline: { runs: 6, diverged: 1, short: 0 },
        candidate: { runs: 7, diverged: 0, short: 1 },
        // scipy.stats.fisher_exact([[1, 5], [1, 6]]) (two-sided) is 1.0
        fisherP: 1,
      },
      noValue: { baseline: 0, candidate: 1 },
      reasons: ["Welch's test could not run: because"],
    });
    expect(r.lines).toEqual([
      'the summary is the number of steps until acc first reaches 0.9 (reaching sooner is better); runs that ' +
        "have not reached it are censored at the comparison's step and kept (log-rank test)",
      "lower is better was inferred from the name 'acc'; say --metric acc:max if that is wrong",
      '2 failed runs left out of the values: baseline 1 of 6 failed (1 diverged), candidate 1 of 7 failed (1 ' +
        "short); Fisher's exact test on the failure counts p = 1",
      '1 run has no value for this summary and is left out (baseline 0, candidate 1)',
      "Welch's test could not run: because",
    ]);
    expect(r.kinds).toEqual(['reach-summary', 'goal-guessed', 'failed-runs', 'no-value', 'not-run']);
    expect(r.problems.map((p) => [p.code, p.message])).toEqual([
      ['goal-inferred', "acc: lower is better was inferred from the name 'acc'; say --metric acc:max if that is wrong"],
    ]);
  });
});
