import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { logRank, logRankPermutation } from '../../src/stats/logRank.js';
import { createRandom } from '../../src/stats/random.js';
import type { TimeToEvent } from '../../src/stats/timeToEvent.js';

interface LogRankCase {
  readonly label: string;
  readonly a: TimeToEvent;
  readonly b: TimeToEvent;
  readonly statistic: number | null;
  readonly p: number | null;
  readonly observed: [number, number];
}

// Written by tests/reference/survival_reference.py: statsmodels 0.13.5 survdiff through Debian.
const fixture = JSON.parse(readFileSync(new URL('../reference/survival-cases.json', import.meta.url), 'utf8')) as {
  statsmodelsVersion: string;
  logRank: LogRankCase[];
};

// Freireich et al. (1963) 6-MP remission data as tabulated by Gehan (1965), Biometrika 52:203-223 (METHODS.md).
const MP6: TimeToEvent = Object.freeze({
  times: Object.freeze([6, 6, 6, 6, 7, 9, 10, 10, 11, 13, 16, 17, 19, 20, 22, 23, 25, 32, 32, 34, 35]),
  events: Object.freeze([1, 1, 1, 0, 1, 0, 1, 0, 0, 1, 1, 0, 0, 0, 1, 1, 0, 0, 0, 0, 0].map(Boolean)),
});
const PLACEBO: TimeToEvent = Object.freeze({
  times: Object.freeze([1, 1, 2, 2, 3, 4, 4, 5, 5, 8, 8, 8, 8, 11, 11, 12, 12, 15, 17, 22, 23]),
  events: Object.freeze(new Array<boolean>(21).fill(true)),
});

describe('logRank: METHODS.md check value (Gehan 6-MP)', () => {
  it('chi-square 16.7929, p 4.17e-5, observed 9 and 21, expected 19.25 and 10.75', () => {
    const r = logRank(MP6, PLACEBO);
    // METHODS.md: chi-square 16.7929, p 4.17e-5 (statsmodels 0.13.5 survdiff; textbook 16.79).
    expect(r.statistic).toBeCloseTo(16.7929, 4);
    expect(r.p).toBeCloseTo(4.17e-5, 7);
    expect(r.df).toBe(1);
    expect(r.observed).toEqual([9, 21]);
    // Expected 19.25 and 10.75: the usual textbook table for these data (from memory).
    expect(r.expected[0]).toBeCloseTo(19.25, 2);
    expect(r.expected[1]).toBeCloseTo(10.75, 2);
    expect(r.expected[0] + r.expected[1]).toBeCloseTo(30, 12);
    // The statistic does not depend on which arm is first.
    expect(logRank(PLACEBO, MP6).statistic).toBeCloseTo(r.statistic, 12);
  });
});

describe('logRank: statsmodels 0.13.5 survdiff (tests/reference/survival-cases.json)', () => {
  it('the fixture is from statsmodels 0.13.5 and has 41 cases', () => {
    expect(fixture.statsmodelsVersion.startsWith('0.13.5')).toBe(true);
    expect(fixture.logRank.length).toBe(41);
  });

  for (const c of fixture.logRank) {
    it(c.label, () => {
      const r = logRank(c.a, c.b);
      expect(r.observed).toEqual(c.observed);
      if (c.statistic === null || c.p === null) {
        // statsmodels raises (singular variance); V = 0 implies O1 = E1 (see logRank.ts): statistic 0, p 1.
        expect(r.statistic).toBe(0);
        expect(r.p).toBe(1);
        return;
      }
      expect(Math.abs(r.statistic - c.statistic)).toBeLessThanOrEqual(1e-10 * Math.max(1, c.statistic));
      expect(Math.abs(r.p - c.p)).toBeLessThanOrEqual(Math.max(1e-9 * c.p, 1e-14));
    });
  }
});

/** All k-subsets of 0..n-1. */
function subsets(n: number, k: number): number[][] {
  const out: number[][] = [];
  const walk = (start: number, picked: number[]): void => {
    if (picked.length === k) {
      out.push(picked);
      return;
    }
    for (let i = start; i < n; i++) walk(i + 1, [...picked, i]);
  };
  walk(0, []);
  return out;
}

/** Brute force: relabel the pooled units every possible way, rebuild the two arms and call logRank on each. */
function bruteForceP(a: TimeToEvent, b: TimeToEvent): { p: number; splits: number } {
  const times = [...a.times, ...b.times];
  const events = [...a.events, ...b.events];
  const observed = logRank(a, b).statistic;
  const all = subsets(times.length, a.times.length);
  let atLeast = 0;
  for (const chosen of all) {
    const inA = new Set(chosen);
    const pick = (want: boolean): TimeToEvent => ({
      times: times.filter((_, i) => inA.has(i) === want),
      events: events.filter((_, i) => inA.has(i) === want),
    });
    if (logRank(pick(true), pick(false)).statistic >= observed - 1e-9 * Math.max(1, observed)) atLeast++;
  }
  return { p: atLeast / all.length, splits: all.length };
}

describe('logRankPermutation', () => {
  const small: [string, TimeToEvent, TimeToEvent][] = [
    [
      '2 v 2, one arm never reaches',
      { times: [1, 2], events: [true, true] },
      { times: [3, 4], events: [false, false] },
    ],
    [
      '3 v 4 with ties',
      { times: [2, 2, 5], events: [true, true, false] },
      { times: [2, 4, 6, 6], events: [true, true, false, true] },
    ],
    [
      '5 v 3, every run censored at the same last step but two',
      { times: [9, 9, 9, 9, 3], events: [false, false, false, false, true] },
      { times: [1, 2, 9], events: [true, true, false] },
    ],
    [
      '6 v 7 from the 6-MP data',
      { times: MP6.times.slice(0, 6), events: MP6.events.slice(0, 6) },
      { times: PLACEBO.times.slice(5, 12), events: PLACEBO.events.slice(5, 12) },
    ],
  ];
  for (const [label, a, b] of small) {
    it(`exact p equals brute-force enumeration: ${label}`, () => {
      const r = logRankPermutation(a, b, createRandom(1));
      const ref = bruteForceP(a, b);
      expect(r.exact).toBe(true);
      expect(r.splits).toBe(ref.splits);
      expect(r.p).toBe(ref.p);
    });
  }

  it('2 v 2 where one arm never reaches: p = 2/6 (first principles: the labeling and its mirror)', () => {
    const r = logRankPermutation(
      { times: [1, 2], events: [true, true] },
      { times: [3, 4], events: [false, false] },
      createRandom(1),
    );
    expect(r).toEqual({ p: 2 / 6, exact: true, splits: 6 });
  });

  it('no events at all: every relabeling ties, p = 1', () => {
    const none = { times: [4, 5], events: [false, false] };
    expect(logRankPermutation(none, none, createRandom(1)).p).toBe(1);
  });

  it('Monte Carlo beyond exactLimit: p = (1 + b)/(1 + M), close to the exact p, reproducible by seed', () => {
    const a = { times: MP6.times.slice(0, 8), events: MP6.events.slice(0, 8) };
    const b = { times: PLACEBO.times.slice(0, 8), events: PLACEBO.events.slice(0, 8) };
    const exact = logRankPermutation(a, b, createRandom(1));
    expect(exact.splits).toBe(12870);
    const mc = logRankPermutation(a, b, createRandom(7), { exactLimit: 1000, resamples: 20_000 });
    expect(mc.exact).toBe(false);
    expect(mc.splits).toBe(20_000);
    // p (1 + M) = 1 + b is a whole number.
    expect(Math.abs(mc.p * 20_001 - Math.round(mc.p * 20_001))).toBeLessThan(1e-6);
    // Binomial standard error of the Monte Carlo count: 4 SE covers it.
    const se = Math.sqrt((exact.p * (1 - exact.p)) / 20_000);
    expect(Math.abs(mc.p - exact.p)).toBeLessThanOrEqual(4 * se + 1 / 20_001);
    expect(logRankPermutation(a, b, createRandom(7), { exactLimit: 1000, resamples: 20_000 })).toEqual(mc);
  });

  it('rejects bad options', () => {
    const a = { times: [1], events: [true] };
    expect(() => logRankPermutation(a, a, createRandom(1), { resamples: 0 })).toThrow(/resamples/);
    expect(() => logRankPermutation(a, a, createRandom(1), { exactLimit: -1 })).toThrow(/exactLimit/);
  });
});
