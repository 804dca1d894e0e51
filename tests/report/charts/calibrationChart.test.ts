/**
 * calibrationChart: ECE by tick with bands. External reference: Vega's SVG serialisation.
 */
import type { TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import type { Results } from '../../../src/analysis/results.js';
import { calibrationChart } from '../../../src/report/charts/calibrationChart.js';
import { CONFIG_COLOURS } from '../../../src/report/palette.js';
import { renderSvg } from '../../../src/report/renderSvg.js';
import { makeResults } from '../fixtures.js';
import { attr, drawn, markItems } from './svgInspect.js';

const results = makeResults();
const subtitle = (r: Results): string =>
  (calibrationChart(r) as TopLevelSpec & { title: { subtitle: string[] } }).title.subtitle.join(' ');

describe('calibrationChart', () => {
  it('returns null without calibration curves', () => {
    expect(calibrationChart({ ...results, calibration: [] })).toBeNull();
  });

  it('draws a band and a line per config in the report colours, and a point per tick', async () => {
    const svg = await renderSvg(calibrationChart(results) as TopLevelSpec);
    expect(markItems(svg, 'band').filter(drawn)).toHaveLength(3);
    const lines = markItems(svg, 'mean');
    expect(lines.filter(drawn)).toHaveLength(3);
    expect(lines.map((l) => attr(l, 'stroke'))).toEqual(CONFIG_COLOURS.slice(0, 3));
    expect(markItems(svg, 'points')).toHaveLength(12);
    expect(subtitle(results)).toContain('5 equal-width confidence bins');
    expect(subtitle(results)).toContain('95% interval across seeds');
  });

  it('says there is no band when no tick has an interval', async () => {
    const bare: Results = {
      ...results,
      calibration: results.calibration.map((c) => ({ ...c, ece: c.ece.map((e) => ({ ...e, low: null, high: null })) })),
    };
    expect(subtitle(bare)).toContain('No band');
    const svg = await renderSvg(calibrationChart(bare) as TopLevelSpec);
    expect(markItems(svg, 'band')).toEqual([]);
  });
});
