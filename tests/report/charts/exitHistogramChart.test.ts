/**
 * exitHistogramChart: one bar per tick, heights proportional to the counts Results carries.
 * External reference: Vega's SVG serialisation of rect marks (path "M0,0h{w}v{h}h-{w}Z").
 */
import type { TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import type { Results } from '../../../src/analysis/results.js';
import { exitHistogramChart } from '../../../src/report/charts/exitHistogramChart.js';
import { CONFIG_COLOURS } from '../../../src/report/palette.js';
import { renderSvg } from '../../../src/report/renderSvg.js';
import { DEFAULT_NAMES, makeResults } from '../fixtures.js';
import { attr, markItems } from './svgInspect.js';

const results = makeResults();
const config = DEFAULT_NAMES.configs[1];

describe('exitHistogramChart', () => {
  it('returns null for an unknown config or when every count is zero', () => {
    expect(exitHistogramChart(results, 'nope')).toBeNull();
    const zero: Results = {
      ...results,
      halting: results.halting.map((h) => ({ ...h, exitHistogram: { threshold: 0.7, counts: [0, 0, 0, 0] } })),
    };
    expect(exitHistogramChart(zero, config)).toBeNull();
  });

  it('draws one bar per tick in the config colour, heights proportional to the counts', async () => {
    const spec = exitHistogramChart(results, config) as TopLevelSpec & { title: { text: string[] } };
    expect(spec.title.text.join(' ')).toContain('certainty ≥ 0.7');
    const bars = markItems(await renderSvg(spec), 'bars');
    expect(bars).toHaveLength(4);
    expect(bars.every((b) => attr(b, 'fill') === CONFIG_COLOURS[1])).toBe(true);
    const heights = bars.map((b) => Number(/v(-?[\d.]+)/.exec(attr(b, 'd') ?? '')?.[1]));
    const counts = [120, 260, 150, 70]; // fixture
    for (const [i, h] of heights.entries()) expect(h / (heights[1] ?? 1)).toBeCloseTo((counts[i] ?? 0) / 260, 2);
  });
});
