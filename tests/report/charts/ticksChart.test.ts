/**
 * ticksChart: accuracy by tick with bands, between-example whiskers and the earliest good tick.
 * External reference: Vega's SVG serialisation.
 */
import type { TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import type { Results } from '../../../src/analysis/results.js';
import { ticksChart } from '../../../src/report/charts/ticksChart.js';
import { renderSvg } from '../../../src/report/renderSvg.js';
import { DEFAULT_NAMES, makeResults } from '../fixtures.js';
import { drawn, markItems, subpaths } from './svgInspect.js';

const results = makeResults();
const metric = DEFAULT_NAMES.tickMetric;
const subtitle = (r: Results): string => ((ticksChart(r, metric) as TopLevelSpec & { title: { subtitle: string[] } }).title.subtitle).join(' ');

describe('ticksChart', () => {
  it('returns null for a metric without tick curves', () => {
    expect(ticksChart(results, DEFAULT_NAMES.metric)).toBeNull();
  });

  it('draws a band, a line and a point per tick for every config, whiskers where m is known, and the earliest good tick', async () => {
    const svg = await renderSvg(ticksChart(results, metric) as TopLevelSpec);
    expect(markItems(svg, 'band').filter(drawn)).toHaveLength(3);
    expect(markItems(svg, 'mean').filter(drawn)).toHaveLength(3);
    expect(markItems(svg, 'points')).toHaveLength(12);
    expect(markItems(svg, 'exampleSpread').filter(drawn)).toHaveLength(4); // only configs[1] has exampleHalfWidth
    expect(markItems(svg, 'earliest').filter(drawn)).toHaveLength(3);
    expect(subtitle(results)).toContain('95% t-interval across seeds');
    expect(subtitle(results)).toContain('between-example');
    expect(subtitle(results)).toContain('at step 400');
  });

  it('breaks the line at a null mean and leaves out whiskers when no curve has them', async () => {
    const holed: Results = {
      ...results,
      ticks: results.ticks.map((t, k) => ({ ...t, exampleHalfWidth: null, mean: k === 0 ? t.mean.map((v, i) => (i === 1 ? null : v)) : t.mean })),
    };
    const svg = await renderSvg(ticksChart(holed, metric) as TopLevelSpec);
    expect(markItems(svg, 'mean').map(subpaths)).toEqual([2, 1, 1]);
    expect(markItems(svg, 'points')).toHaveLength(11);
    expect(markItems(svg, 'exampleSpread')).toEqual([]);
    expect(subtitle(holed)).not.toContain('between-example');
  });

  it('counts diverged runs left out when analysis reports them', () => {
    expect(subtitle(results)).not.toContain('diverged');
    const some: Results = { ...results, ticks: results.ticks.map((t, k) => ({ ...t, diverged: k === 1 ? 2 : 0 })) };
    expect(subtitle(some)).toContain('2 diverged runs left out.');
  });
});
