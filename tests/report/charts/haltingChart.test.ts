/**
 * haltingChart: the exit-tick / accuracy trade-off with interval bars in both directions.
 * External reference: Vega's SVG serialisation.
 */
import type { TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import type { Results } from '../../../src/analysis/results.js';
import { haltingChart } from '../../../src/report/charts/haltingChart.js';
import { renderSvg } from '../../../src/report/renderSvg.js';
import { makeResults } from '../fixtures.js';
import { attr, drawn, markItems, subpaths, translate } from './svgInspect.js';

const results = makeResults();

describe('haltingChart', () => {
  it('returns null without halting curves', () => {
    expect(haltingChart({ ...results, halting: [] })).toBeNull();
  });

  it('draws a path per config through its thresholds, a point per threshold and both interval bars', async () => {
    const svg = await renderSvg(haltingChart(results) as TopLevelSpec);
    expect(markItems(svg, 'path').filter(drawn)).toHaveLength(3);
    expect(markItems(svg, 'points')).toHaveLength(9);
    const exit = markItems(svg, 'exitInterval');
    const accuracy = markItems(svg, 'accuracyInterval');
    expect(exit).toHaveLength(9);
    expect(accuracy).toHaveLength(9);
    // Exit-tick bars are horizontal (x2 only), accuracy bars vertical (y2 only).
    expect(exit.every((l) => Number(attr(l, 'x2')) !== 0 && Number(attr(l, 'y2') ?? 0) === 0)).toBe(true);
    expect(accuracy.every((l) => Number(attr(l, 'y2')) !== 0 && Number(attr(l, 'x2') ?? 0) === 0)).toBe(true);
    // Higher thresholds exit later in the fixture: points of one config move right in threshold order.
    const xs = markItems(svg, 'points')
      .slice(0, 3)
      .map((p) => translate(p).x);
    expect(xs[0]).toBeLessThan(xs[1] ?? -Infinity);
    expect(xs[1]).toBeLessThan(xs[2] ?? -Infinity);
  });

  it('leaves out a threshold with a null mean and breaks the path there', async () => {
    const first = results.halting[0];
    if (first === undefined) throw new Error('fixture has halting curves');
    const holed: Results = {
      ...results,
      halting: [
        { ...first, accuracy: first.accuracy.map((a, i) => (i === 1 ? { mean: null, low: null, high: null } : a)) },
        ...results.halting.slice(1),
      ],
    };
    const svg = await renderSvg(haltingChart(holed) as TopLevelSpec);
    expect(markItems(svg, 'points')).toHaveLength(8);
    expect(markItems(svg, 'path').map(subpaths)).toEqual([2, 1, 1]);
    expect(markItems(svg, 'exitInterval')).toHaveLength(8);
  });
});
