/**
 * Fisher's exact test against scipy 1.10.1 (Debian python3-scipy, `scipy.stats.fisher_exact`), and
 * the log-rank test and Kaplan-Meier against the Freireich et al. (1963) 6-MP remission data as
 * tabulated by Gehan (1965), Biometrika 52:203-223 (METHODS.md check value: chi-square 16.7929,
 * p 4.17e-5; Debian python3-statsmodels 0.13.5 `statsmodels.duration.survfunc.survdiff` gives
 * 16.792940989216532, 4.1688091093394775e-05). These are this branch's versions of the stats
 * modules; wt-stats owns them, and its tests take precedence when merged.
 */
import { describe, expect, it } from 'vitest';
import { fisherExact } from '../../src/stats/fisherExact.js';
import { kaplanMeier } from '../../src/stats/kaplanMeier.js';
import { logRank, logRankPermutation } from '../../src/stats/logRank.js';
import { createRandom } from '../../src/stats/random.js';

describe('fisherExact (scipy 1.10.1 fisher_exact, two-sided)', () => {
  it('matches scipy', () => {
    expect(fisherExact([8, 2, 1, 5]).p).toBeCloseTo(0.034965034965034975, 14);
    expect(fisherExact([8, 2, 1, 5]).oddsRatio).toBe(20);
    expect(fisherExact([0, 7, 1, 5]).p).toBeCloseTo(0.46153846153846156, 14);
    expect(fisherExact([3, 2, 0, 5]).p).toBeCloseTo(0.16666666666666666, 14);
  });
});

const SIX_MP: [number, boolean][] = [
  [6, true],
  [6, true],
  [6, true],
  [6, false],
  [7, true],
  [9, false],
  [10, true],
  [10, false],
  [11, false],
  [13, true],
  [16, true],
  [17, false],
  [19, false],
  [20, false],
  [22, true],
  [23, true],
  [25, false],
  [32, false],
  [32, false],
  [34, false],
  [35, false],
];
const PLACEBO = [1, 1, 2, 2, 3, 4, 4, 5, 5, 8, 8, 8, 8, 11, 11, 12, 12, 15, 17, 22, 23];
const sixMp = { times: SIX_MP.map(([t]) => t), events: SIX_MP.map(([, e]) => e) };
const placebo = { times: PLACEBO, events: PLACEBO.map(() => true) };

describe('logRank (Gehan 1965 6-MP data; statsmodels 0.13.5 survdiff)', () => {
  it('chi-square 16.792940989216532, p 4.1688091093394775e-05', () => {
    const r = logRank(sixMp, placebo);
    expect(r.statistic).toBeCloseTo(16.792940989216532, 10);
    expect(r.p).toBeCloseTo(4.1688091093394775e-5, 12);
    expect(r.observed).toEqual([9, 21]);
  });

  it('Kaplan-Meier median of the 6-MP arm is 23 weeks (Kaplan-Meier on the same data; common practice)', () => {
    expect(kaplanMeier(sixMp).median).toBe(23);
    expect(kaplanMeier(placebo).median).toBe(8);
  });

  it('the permutation p at small n enumerates every relabeling', () => {
    // 3 v 3, all events, complete separation: the observed split is one of 2 extreme splits of C(6,3) = 20.
    const a = { times: [1, 2, 3], events: [true, true, true] };
    const b = { times: [4, 5, 6], events: [true, true, true] };
    const r = logRankPermutation(a, b, createRandom(1));
    expect(r.exact).toBe(true);
    expect(r.splits).toBe(20);
    expect(r.p).toBeCloseTo(2 / 20, 14);
  });
});
