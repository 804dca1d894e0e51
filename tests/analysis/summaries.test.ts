import { describe, expect, it } from 'vitest';
import { lastIndexAtOrBefore, summarizeSeries } from '../../src/analysis/summaries.js';
import { series } from './runSetBuilder.js';

// Hand-made curves; expected values worked out by hand in the comments.
const s = series([0, 10, 20, 30, 40], [0.1, 0.5, 0.4, 0.7, 0.6]);
const window = { horizon: 30, firstStep: 0 };

describe('summarizeSeries', () => {
  it('final: the last value at or before the horizon', () => {
    expect(summarizeSeries(s, { kind: 'final' }, 'max', window).value).toBe(0.7);
    expect(summarizeSeries(s, { kind: 'final' }, 'max', { horizon: 25, firstStep: 0 }).value).toBe(0.4);
  });

  it('last:P%: mean of the values in the last P% of [first step, horizon]', () => {
    // last 50% of [0, 30] is [15, 30]: steps 20 and 30 -> (0.4 + 0.7) / 2
    expect(summarizeSeries(s, { kind: 'last', percent: 50 }, 'max', window).value).toBeCloseTo(0.55, 15);
    // last 10% of [0, 30] is [27, 30]: step 30 only
    expect(summarizeSeries(s, { kind: 'last', percent: 10 }, 'max', window).value).toBe(0.7);
    // no logged step in [28.5, 29]: falls back to the last value before the horizon, with a note
    const r = summarizeSeries(s, { kind: 'last', percent: 5 }, 'max', { horizon: 29, firstStep: 0 });
    expect(r.value).toBe(0.4);
    expect(r.note).toContain('no step logged in the last 5%');
  });

  it('best: goal-aware, up to the horizon only', () => {
    expect(summarizeSeries(s, { kind: 'best' }, 'max', window).value).toBe(0.7);
    expect(summarizeSeries(s, { kind: 'best' }, 'min', window).value).toBe(0.1);
    expect(summarizeSeries(s, { kind: 'best' }, 'max', { horizon: 20, firstStep: 0 }).value).toBe(0.5);
  });

  it('auc: trapezoid area to the horizon over the span (interpolated at the horizon)', () => {
    // [0,30]: (0.3*10 + 0.45*10 + 0.55*10) / 30 = 13/30
    expect(summarizeSeries(s, { kind: 'auc' }, 'max', window).value).toBeCloseTo(13 / 30, 14);
    // horizon 35: value at 35 interpolated 0.65; extra area 0.675*5 -> (13 + 3.375) / 35
    expect(summarizeSeries(s, { kind: 'auc' }, 'max', { horizon: 35, firstStep: 0 }).value).toBeCloseTo(
      16.375 / 35,
      14,
    );
  });

  it('reach:VALUE: first step reaching the value in the goal direction; censored when never', () => {
    expect(summarizeSeries(s, { kind: 'reach', value: 0.45 }, 'max', window).value).toBe(10);
    expect(summarizeSeries(s, { kind: 'reach', value: 0.4 }, 'min', { horizon: 30, firstStep: 0 }).value).toBe(0);
    const never = summarizeSeries(s, { kind: 'reach', value: 0.65 }, 'max', { horizon: 20, firstStep: 0 });
    expect(never).toEqual({
      value: 20,
      loggedAt: 20,
      note: 'had not reached 0.65 by step 20 (censored there)',
      censored: true,
      short: false,
    });
  });

  it('step:N: the value at the last logged step <= N, whatever the horizon', () => {
    expect(summarizeSeries(s, { kind: 'step', step: 35 }, 'max', window).value).toBe(0.7);
    expect(summarizeSeries(s, { kind: 'step', step: 40 }, 'max', window).value).toBe(0.6);
    // past the run's end: no value, short for this comparison (METHODS.md), never its last value
    const past = summarizeSeries(s, { kind: 'step', step: 100 }, 'max', window);
    expect(past.value).toBeNull();
    expect(past.short).toBe(true);
    expect(past.note).toBe('run ends at step 40, before step 100: short for this comparison');
    expect(summarizeSeries(series([5], [1]), { kind: 'step', step: 2 }, 'max', window).value).toBeNull();
  });

  it('score tables (no horizon): the single point, whatever the summary', () => {
    const point = series([0], [0.83]);
    for (const spec of [{ kind: 'final' }, { kind: 'best' }, { kind: 'auc' }, { kind: 'last', percent: 10 }] as const) {
      expect(summarizeSeries(point, spec, 'max', { horizon: null, firstStep: null }).value).toBe(0.83);
    }
  });

  it('a run without values gets null and a note', () => {
    const r = summarizeSeries(series([], []), { kind: 'final' }, 'max', window);
    expect(r.value).toBeNull();
    expect(r.note).not.toBeNull();
  });

  it('lastIndexAtOrBefore: binary search on sorted steps', () => {
    const steps = Float64Array.from([0, 10, 20]);
    expect([-1, 0, 5, 10, 19, 20, 99].map((x) => lastIndexAtOrBefore(steps, x))).toEqual([-1, 0, 0, 1, 1, 2, 2]);
  });
});
