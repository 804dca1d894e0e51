/**
 * reliabilityChart: bins, points and the diagonal. External reference: Vega's SVG serialisation.
 */
import type { TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import type { Results } from '../../../src/analysis/results.js';
import { reliabilityChart } from '../../../src/report/charts/reliabilityChart.js';
import { renderSvg } from '../../../src/report/renderSvg.js';
import { DEFAULT_NAMES, makeResults } from '../fixtures.js';
import { attr, drawn, markItems } from './svgInspect.js';

const results = makeResults();
const config = DEFAULT_NAMES.configs[0];

describe('reliabilityChart', () => {
  it('returns null for an unknown config or when no bin has samples', () => {
    expect(reliabilityChart(results, 'nope')).toBeNull();
    const empty: Results = { ...results, calibration: results.calibration.map((c) => ({ ...c, reliability: c.reliability.map((b) => ({ ...b, count: 0, accuracy: null, confidence: null })) })) };
    expect(reliabilityChart(empty, config)).toBeNull();
  });

  it('says over how many seeds samples were summed when analysis gives it', () => {
    const subtitle = (r: Results): string => (reliabilityChart(r, config) as TopLevelSpec & { title: { subtitle: string[] } }).title.subtitle.join(' ');
    expect(subtitle(results)).toContain('summed over seeds');
    expect(subtitle({ ...results, calibration: results.calibration.map((c) => ({ ...c, seeds: 3 })) })).toContain('summed over 3 seeds');
  });

  it('draws the non-empty bins, their points and the diagonal from (0,0) to (1,1)', async () => {
    const svg = await renderSvg(reliabilityChart(results, config) as TopLevelSpec);
    const bins = markItems(svg, 'bins');
    expect(bins).toHaveLength(4); // the fixture's first bin is empty
    expect(bins.every(drawn)).toBe(true);
    expect(markItems(svg, 'points')).toHaveLength(4);
    // 320 x 320 plot: the diagonal runs from the bottom-left to the top-right corner.
    expect(attr(markItems(svg, 'diagonal')[0] ?? '', 'd')).toBe('M0,320L320,0');
  });
});
