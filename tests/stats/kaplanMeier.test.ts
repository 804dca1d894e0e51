import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { kaplanMeier } from '../../src/stats/kaplanMeier.js';

interface KmCase {
  readonly label: string;
  readonly times: number[];
  readonly events: boolean[];
  readonly survTimes: number[];
  readonly survProb: number[];
  readonly medianStrict: number | null;
}

// Written by tests/reference/survival_reference.py: statsmodels 0.13.5 SurvfuncRight through Debian.
const fixture = JSON.parse(readFileSync(new URL('../reference/survival-cases.json', import.meta.url), 'utf8')) as {
  statsmodelsVersion: string;
  kaplanMeier: KmCase[];
};

/**
 * The first time with S(t) <= 0.5, from statsmodels' (rounded) survival values, with exactly-0.5 steps taken as 0.5.
 */
function medianFromReference(c: KmCase): number | null {
  const i = c.survProb.findIndex((s) => s <= 0.5 + 1e-12);
  return i < 0 ? null : (c.survTimes[i] as number);
}

describe('kaplanMeier: statsmodels 0.13.5 SurvfuncRight (tests/reference/survival-cases.json)', () => {
  it('the fixture is from statsmodels 0.13.5', () => {
    expect(fixture.statsmodelsVersion.startsWith('0.13.5')).toBe(true);
  });

  for (const c of fixture.kaplanMeier) {
    it(c.label, () => {
      const r = kaplanMeier(
        Object.freeze({ times: Object.freeze([...c.times]), events: Object.freeze([...c.events]) }),
      );
      expect(r.n).toBe(c.times.length);
      expect(r.events).toBe(c.events.filter(Boolean).length);
      expect(r.fractionReached).toBe(r.events / r.n);
      expect(r.times).toEqual(c.survTimes);
      expect(r.survival.length).toBe(c.survProb.length);
      for (const [i, s] of r.survival.entries())
        expect(Math.abs(s - (c.survProb[i] as number))).toBeLessThanOrEqual(1e-14);
      // statsmodels' quantile(0.5) is the first time with S < 0.5 (strict, as SAS); ours is S <= 0.5.
      // They agree except where S equals 0.5 exactly, which the "hits 0.5" case covers.
      const strictDiffers = c.survProb.some((s) => Math.abs(s - 0.5) <= 1e-12);
      if (!strictDiffers) expect(r.median).toBe(c.medianStrict);
      expect(r.median).toBe(medianFromReference(c));
    });
  }
});

describe('kaplanMeier: worked examples', () => {
  it('Gehan (1965) 6-MP and placebo arms: medians 23 and 8 weeks', () => {
    // Freireich et al. (1963) data as tabulated by Gehan (1965), Biometrika 52:203-223 (METHODS.md).
    // Medians 23 weeks (6-MP) and 8 weeks (placebo) are the usual textbook values (from memory);
    // statsmodels 0.13.5 gives the same (fixture, labels "Gehan 6-MP arm" and "Gehan placebo arm").
    const mp = {
      times: [6, 6, 6, 6, 7, 9, 10, 10, 11, 13, 16, 17, 19, 20, 22, 23, 25, 32, 32, 34, 35],
      events: [1, 1, 1, 0, 1, 0, 1, 0, 0, 1, 1, 0, 0, 0, 1, 1, 0, 0, 0, 0, 0].map(Boolean),
    };
    const placebo = {
      times: [1, 1, 2, 2, 3, 4, 4, 5, 5, 8, 8, 8, 8, 11, 11, 12, 12, 15, 17, 22, 23],
      events: new Array<boolean>(21).fill(true),
    };
    expect(kaplanMeier(mp).median).toBe(23);
    expect(kaplanMeier(placebo).median).toBe(8);
    // First principles: at week 6, 3 of 21 relapse: S = 18/21.
    expect(kaplanMeier(mp).survival[0]).toBeCloseTo(18 / 21, 15);
    expect(kaplanMeier(mp).fractionReached).toBeCloseTo(9 / 21, 15);
  });

  it('a run censored at an event time is at risk there (first principles)', () => {
    // Times 2 (event), 2 (censored), 3 (event): at t = 2 all three are at risk, S = 1 - 1/3; the
    // run censored at 2 then leaves, so at t = 3 one is at risk, S = 0. (Were the censored run not
    // at risk at 2, S(2) would be 1/2.)
    const r = kaplanMeier({ times: [2, 2, 3], events: [true, false, true] });
    expect(r.times).toEqual([2, 3]);
    expect(r.survival[0]).toBeCloseTo(2 / 3, 15);
    expect(r.survival[1]).toBe(0);
    expect(r.median).toBe(3);
  });

  it('no events: empty curve, median null, nothing reached', () => {
    const r = kaplanMeier({ times: [5, 7], events: [false, false] });
    expect(r).toEqual({ n: 2, events: 0, fractionReached: 0, times: [], survival: [], median: null });
  });

  it('rejects bad input with the entry named', () => {
    expect(() => kaplanMeier({ times: [], events: [] })).toThrow(/at least 1/);
    expect(() => kaplanMeier({ times: [1, 2], events: [true] })).toThrow(/equal lengths/);
    expect(() => kaplanMeier({ times: [1, Number.NaN], events: [true, true] })).toThrow(/times\[1\]/);
    expect(() => kaplanMeier({ times: [1, -2], events: [true, true] })).toThrow(/times\[1\]/);
  });
});
