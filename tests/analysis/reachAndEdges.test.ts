/**
 * `reach:VALUE` as time to event (METHODS.md), and the analysis side of extreme alphas.
 */
import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/analysis/analyze.js';
import { resolveOptions } from '../../src/analysis/options.js';
import { meta, runSet, type RunSpec } from './runSetBuilder.js';
import { at } from '../support/at.js';

/** A run that reaches `top` at `at` (linear rise from 0, logged every 100 steps to 2000). */
function rise(at: number, top: number): { steps: number[]; values: number[] } {
  const steps = Array.from({ length: 21 }, (_, i) => i * 100);
  return { steps, values: steps.map((s) => Math.min(top, (top * s) / at)) };
}

describe('reach:VALUE as a time-to-event summary', () => {
  // steady: every seed reaches 0.9 at logged step 1500. flaky: half its seeds reach it sooner
  // (logged step 800), the other half never do (they top out at 0.8; censored at step 2000).
  // Log-rank (first principles): at step 800, 4 events among 16 at risk, 8 flaky: E = 2, O = 4;
  // at step 1500, 8 events among 12 at risk, 4 flaky: E = 8/3, O = 0. Total O 4 < E 4.67: the
  // flaky arm reaches less often than its share, so it is not better (dropping its censored runs
  // would have made it 'better': 4 v 8 runs, all of its 4 sooner).
  const specs: RunSpec[] = [];
  for (let s = 1; s <= 8; s++) specs.push({ params: { m: 'steady' }, seed: s, metrics: { acc: rise(1500 + s, 0.95) } });
  for (let s = 1; s <= 8; s++)
    specs.push({ params: { m: 'flaky' }, seed: s, metrics: { acc: s <= 4 ? rise(800 + s, 0.95) : rise(1000, 0.8) } });
  const set = runSet(['m'], specs, [{ name: 'acc', goal: 'max' }]);

  it('a flaky config that often never reaches is never better than a steady one; censored runs are kept', () => {
    const r = analyze(set, resolveOptions({ baseline: 'm=steady', summary: 'reach:0.9' }), meta);
    const c = at(r.comparisons, 0);
    expect(c.candidate).toBe('m=flaky');
    expect(c.primary).toBe('log-rank');
    expect(c.verdict).not.toBe('better');
    expect(c.n).toEqual({ baseline: 8, candidate: 8 }); // nobody dropped
    const k = c.timeToEvent;
    if (k === null) throw new Error('the reach comparison has no time-to-event block');
    expect(k.candidate.reached).toBe(4);
    expect(k.baseline.reached).toBe(8);
    expect(k.candidate.fraction).toBeCloseTo(0.5, 12);
    expect(k.candidate.medianSteps).toBe(800); // Kaplan-Meier: S falls to 0.5 at step 800 (4 of 8 events)
    expect(k.baseline.medianSteps).toBe(1500);
    expect(k.logRank.observed).toBe(4);
    expect(k.logRank.expected).toBeCloseTo(2 + 8 / 3, 12);
    expect(k.logRank.expected).toBeGreaterThan(k.logRank.observed as number);
    expect(k.logRank.method).toBe('exact-permutation'); // C(16, 8) = 12,870 relabelings
    expect(c.runs.filter((u) => u.censored)).toHaveLength(4);
    // the summary's goal is fewer steps, and summary.md reads the same comparison (rendered elsewhere)
    expect(c.goal).toBe('min');
  });

  it('the steady config against the flaky one as baseline is not worse', () => {
    const r = analyze(set, resolveOptions({ baseline: 'm=flaky', summary: 'reach:0.9' }), meta);
    expect(r.comparisons[0]?.verdict).not.toBe('worse');
  });
});

describe('no internal error for any alpha in (0, 1)', () => {
  it('alpha 1e-11 at 2 v 2 and alpha 0.999 at 3 v 3 give results, not errors', () => {
    const specs: RunSpec[] = [
      { params: { m: 'a' }, seed: 1, metrics: { acc: 0.5 } },
      { params: { m: 'a' }, seed: 2, metrics: { acc: 0.52 } },
      { params: { m: 'b' }, seed: 1, metrics: { acc: 0.6 } },
      { params: { m: 'b' }, seed: 2, metrics: { acc: 0.61 } },
      { params: { m: 'b' }, seed: 3, metrics: { acc: 0.65 } },
    ];
    const set = runSet(['m'], specs, [{ name: 'acc', goal: 'max' }], 'scores');
    for (const alpha of ['1e-11', '1e-6', '0.5', '0.999']) {
      const r = analyze(set, resolveOptions({ baseline: 'm=a', alpha }), meta);
      expect(r.comparisons).toHaveLength(1);
      expect(r.comparisons[0]?.difference.level).toBeCloseTo(1 - Number(alpha), 12);
    }
  });
});
