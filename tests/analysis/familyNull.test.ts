/**
 * The documented family (METHODS.md, "Multiple comparisons"): Holm across the comparisons of one
 * metric and one summary over all tasks. Null simulation (fixed seed): 1,000 studies of 10 tasks x
 * 2 configs x 5 seeds, normal values, nothing differs. The family-wise rate of any better/worse
 * must be at most alpha + 3 SE (SE = sqrt(alpha (1 - alpha) / 1000) = 0.0069 at alpha 0.05;
 * Holm 1979 bounds the family-wise error by alpha, first principles). Per-task families (each a
 * family of 1) would call something in about 1 - (1 - 0.046)^10 = 0.37 of studies (Welch's
 * type-I error at 5 v 5 from METHODS.md's table), which the second check shows.
 * Kept fast: the decision path (Welch, `adjustFamily`, `decideVerdict`) is called directly.
 */
import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/analysis/analyze.js';
import { resolveOptions } from '../../src/analysis/options.js';
import { adjustFamily, decideVerdict } from '../../src/analysis/verdict.js';
import { createRandom } from '../../src/stats/random.js';
import { welch } from '../../src/stats/welch.js';
import { meta, normal, runSet, type RunSpec } from './runSetBuilder.js';
import { at } from '../support/at.js';

const ALPHA = 0.05;
const STUDIES = 1000;
const TASKS = 10;
const SEEDS = 5;

function anyCall(scope: 'study' | 'task', seed: number): number {
  const random = createRandom(seed);
  let studiesWithCall = 0;
  for (let s = 0; s < STUDIES; s++) {
    const p: number[] = [];
    const direction: number[] = [];
    for (let t = 0; t < TASKS; t++) {
      const x = Array.from({ length: SEEDS }, () => normal(random));
      const y = Array.from({ length: SEEDS }, () => normal(random));
      const w = welch(x, y);
      p.push(w.p);
      direction.push(w.difference);
    }
    const adjusted = scope === 'study' ? adjustFamily(p, 'holm') : p.map((v) => adjustFamily([v], 'holm')[0] ?? null);
    if (adjusted.some((q, i) => decideVerdict(q, direction[i] as number, 'max', ALPHA) !== 'inconclusive'))
      studiesWithCall++;
  }
  return studiesWithCall / STUDIES;
}

describe('the family over all tasks holds the family-wise error (null simulation)', () => {
  it('1,000 null studies of 10 tasks: any better/worse in at most alpha + 3 SE of them', () => {
    const rate = anyCall('study', 20261203);
    const se = Math.sqrt((ALPHA * (1 - ALPHA)) / STUDIES);
    expect(rate).toBeLessThanOrEqual(ALPHA + 3 * se);
    expect(rate).toBeGreaterThan(0.01); // a test that never rejects would pass the line above
  });

  it('per-task families would not: about a third of null studies get a call', () => {
    const rate = anyCall('task', 20261203);
    expect(rate).toBeGreaterThan(0.25);
    expect(rate).toBeLessThan(0.5);
  });

  it('analyze puts every task of a metric in one family by default, each task alone under --family task', () => {
    const random = createRandom(7);
    const specs: RunSpec[] = [];
    for (let t = 0; t < TASKS; t++)
      for (const m of ['base', 'new'])
        for (let s = 1; s <= SEEDS; s++)
          specs.push({ params: { task: `t${t}`, m }, seed: s, metrics: { acc: normal(random) } });
    const set = runSet(['task', 'm'], specs, [{ name: 'acc', goal: 'max' }], 'scores');
    const study = analyze(set, resolveOptions({ baseline: 'm=base', taskKey: 'task' }), meta);
    expect(study.comparisons).toHaveLength(TASKS);
    expect(study.comparisons.every((c) => c.family.size === TASKS && c.family.scope === 'study')).toBe(true);
    const sorted = [...study.comparisons].map((c) => c.p as number);
    const holm = adjustFamily(sorted, 'holm');
    expect(study.comparisons.map((c) => c.pAdjusted)).toEqual(holm);
    const perTask = analyze(set, resolveOptions({ baseline: 'm=base', taskKey: 'task', family: 'task' }), meta);
    expect(perTask.comparisons.every((c) => c.family.size === 1 && c.pAdjusted === c.p)).toBe(true);
    // simultaneous bounds at 1 - alpha/10 are wider than the unadjusted 95% interval
    const c = at(study.comparisons, 0);
    expect(c.difference.simultaneous?.level).toBeCloseTo(0.995, 15);
    expect(c.difference.simultaneous?.low).toBeLessThan(c.difference.low as number);
    expect(c.difference.simultaneous?.high).toBeGreaterThan(c.difference.high as number);
  });
});
