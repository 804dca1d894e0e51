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
import { drawn, markItems, subpaths, translate } from './svgInspect.js';

const results = makeResults();
const metric = DEFAULT_NAMES.tickMetric;
const subtitle = (r: Results): string =>
  (ticksChart(r, metric) as TopLevelSpec & { title: { subtitle: string[] } }).title.subtitle.join(' ');

describe('ticksChart', () => {
  it('runs the tick axis from the first to the last tick (0..31 on 520 px), not on to a rounder number', async () => {
    // One config with 32 ticks (0..31): a "nice" domain would end past 31 and leave the last point short of the edge.
    const long: Results = {
      ...results,
      ticks: results.ticks.map((t, k) => {
        if (k !== 2) return t;
        const ticks = Array.from({ length: 32 }, (_, i) => i);
        const mean = ticks.map((i) => 0.4 + 0.01 * i);
        return {
          ...t,
          ticks,
          mean,
          low: mean.map((m) => m - 0.01),
          high: mean.map((m) => m + 0.01),
          n: ticks.map(() => 3),
          exampleHalfWidth: null,
          versusBaseline: null,
        };
      }),
    };
    const svg = await renderSvg(ticksChart(long, metric) as TopLevelSpec);
    const xs = markItems(svg, 'points').map((p) => translate(p).x);
    expect(Math.min(...xs)).toBe(0);
    expect(Math.max(...xs)).toBe(520);
  });

  it('returns null for a metric without tick curves', () => {
    expect(ticksChart(results, DEFAULT_NAMES.metric)).toBeNull();
  });

  it(
    'draws a band, a line and a point per tick for every config, whiskers where m is known, and the ' +
      'earliest good tick',
    async () => {
      const svg = await renderSvg(ticksChart(results, metric) as TopLevelSpec);
      expect(markItems(svg, 'band').filter(drawn)).toHaveLength(3);
      expect(markItems(svg, 'mean').filter(drawn)).toHaveLength(3);
      expect(markItems(svg, 'points')).toHaveLength(12);
      expect(markItems(svg, 'exampleSpread').filter(drawn)).toHaveLength(4); // only configs[1] has exampleHalfWidth
      expect(markItems(svg, 'earliest').filter(drawn)).toHaveLength(3);
      expect(subtitle(results)).toContain('95% t-interval across seeds');
      expect(subtitle(results)).toContain('between-example');
      expect(subtitle(results)).toContain('at step 400');
    },
  );

  it('breaks the line at a null mean and leaves out whiskers when no curve has them', async () => {
    const holed: Results = {
      ...results,
      ticks: results.ticks.map((t, k) => ({
        ...t,
        exampleHalfWidth: null,
        mean: k === 0 ? t.mean.map((v, i) => (i === 1 ? null : v)) : t.mean,
      })),
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
