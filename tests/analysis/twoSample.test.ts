import { describe, expect, it } from 'vitest';
import type { Arm } from '../../src/analysis/arms.js';
import { type TwoSampleSettings, twoSampleDraft } from '../../src/analysis/twoSample.js';

// Invented paired fixture: six seeds; the baseline's runs are listed in another order so that pairing
// has to go by seed. By seed (candidate, baseline): s1 (10.0, 10.1), s2 (11.0, 11.3), s3 (9.9, 9.8),
// s4 (11.8, 12.0), s5 (10.4, 10.7), s6 (11.2, 11.5). Expected p values from scipy, named beside each.
const arm = (seeds: string[], values: number[]): Arm => ({
  values: Float64Array.from(values),
  events: values.map(() => true),
  seeds,
  diverged: 0,
  short: 0,
  noValue: 0,
  scoredWorst: 0,
});
const cand = arm(['s1', 's2', 's3', 's4', 's5', 's6'], [10.0, 11.0, 9.9, 11.8, 10.4, 11.2]);
const base = arm(['s6', 's5', 's4', 's3', 's2', 's1'], [11.5, 10.7, 12.0, 9.8, 11.3, 10.1]);
const settings = (paired: boolean): TwoSampleSettings => ({
  alpha: 0.05,
  level: 0.95,
  seed: 1,
  paired,
  margin: 0.5,
  interval: 'welch',
  resamples: 1000,
  bootstrapFrom: 10,
});
const draft = (paired: boolean) => twoSampleDraft(base, cand, 'max', 'fixture', settings(paired), new Map());

describe('twoSampleDraft non-inferiority (METHODS.md: paired when --paired)', () => {
  it('under --paired: the one-sided paired t on the pairs shifted by the margin (scipy 1.10.1)', () => {
    const d = draft(true);
    // /usr/bin/python3, scipy 1.10.1, x and y the candidate and baseline by seed as listed above:
    // stats.ttest_rel(x + 0.5, y, alternative='greater').pvalue
    expect(d.nonInferiorityP).toBeCloseTo(0.0023540719592755376, 12);
    expect(d.pairedBounds).toBe(true);
    expect(d.primary).toBe('paired-t');
  });

  it('without --paired: Welch on the same data, a different p (scipy 1.10.1)', () => {
    const d = draft(false);
    // /usr/bin/python3, scipy 1.10.1: stats.ttest_ind(x + 0.5, y, equal_var=False, alternative='greater').pvalue
    expect(d.nonInferiorityP).toBeCloseTo(0.2542189468810645, 12);
    expect(d.pairedBounds).toBe(false);
    // The two choices must disagree here (non-inferiority holds at alpha/2 only when paired), so a draft
    // that ignored --paired would fail the test above.
    expect(Math.abs((draft(true).nonInferiorityP ?? 1) - (d.nonInferiorityP ?? 0))).toBeGreaterThan(0.2);
  });

  it('goal min under --paired: the paired t less-test of x - margin against y (scipy 1.10.1)', () => {
    const d = twoSampleDraft(base, cand, 'min', 'fixture', settings(true), new Map());
    // /usr/bin/python3, scipy 1.10.1: stats.ttest_rel(x - 0.5, y, alternative='less').pvalue
    expect(d.nonInferiorityP).toBeCloseTo(6.925412012914093e-5, 14);
  });
});
