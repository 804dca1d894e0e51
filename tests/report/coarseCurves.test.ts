/**
 * coarseCurves: every k-th bin kept, values untouched (first principles: a subset of the analysed
 * bins, the last always kept, at most maxPoints).
 */
import { describe, expect, it } from 'vitest';
import type { Curve } from '../../src/analysis/results.js';
import { coarseCurves, keptBins } from '../../src/report/coarseCurves.js';
import { resultsJson } from '../../src/report/resultsJson.js';
import { sampleResults } from './sampleResults.js';

describe('coarseCurves', () => {
  it('keeps every k-th bin and the last, at most maxPoints', () => {
    expect(keptBins(10, 4)).toEqual([0, 3, 6, 9]);
    expect(keptBins(10, 20)).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8, 9]);
    // 201 bins, at most 100: stride ceil(200 / 99) = 3 keeps 0, 3, ..., 198 (67 bins) and the last, 200.
    expect(keptBins(201, 100)).toHaveLength(68);
    for (const [bins, max] of [
      [201, 100],
      [1000, 100],
      [7, 3],
      [100, 100],
    ] as const) {
      const kept = keptBins(bins, max);
      expect(kept.length).toBeLessThanOrEqual(max);
      expect(kept[0]).toBe(0);
      expect(kept[kept.length - 1]).toBe(bins - 1);
    }
  });

  it('takes each kept bin exactly as analysed, for the mean, band, counts and every run', () => {
    const steps = Array.from({ length: 9 }, (_, i) => (i + 1) * 10);
    const curve: Curve = {
      metric: 'm',
      config: 'c',
      steps,
      mean: steps.map((s) => s / 100),
      low: steps.map((s) => s / 100 - 0.01),
      high: steps.map((s) => s / 100 + 0.01),
      n: steps.map(() => 3),
      band: 't',
      level: 0.95,
      runs: [{ run: 'r', seed: '1', values: steps.map((s) => s / 50) }],
    };
    const [c] = coarseCurves([curve], 3);
    expect(c?.steps).toEqual([10, 50, 90]);
    expect(c?.mean).toEqual([0.1, 0.5, 0.9]);
    expect(c?.runs[0]?.values).toEqual([0.2, 1, 1.8]);
  });

  it('writes curves coarse by default and in full when asked, and says which in curveGrid', () => {
    const r = sampleResults();
    const bins = Math.max(...r.curves.map((c) => c.steps.length));
    const coarse = JSON.parse(resultsJson(r, { curvePoints: 5 })) as { curves: Curve[]; curveGrid: unknown };
    expect(Math.max(...coarse.curves.map((c) => c.steps.length))).toBeLessThanOrEqual(5);
    expect(coarse.curveGrid).toEqual({ maxPoints: 5, coarsened: bins > 5 });
    const full = JSON.parse(resultsJson(r, { curvePoints: null })) as { curves: Curve[]; curveGrid: unknown };
    expect(Math.max(...full.curves.map((c) => c.steps.length))).toBe(bins);
    expect(full.curveGrid).toEqual({ maxPoints: null, coarsened: false });
  });
});
