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
    const empty: Results = {
      ...results,
      calibration: results.calibration.map((c) => ({
        ...c,
        reliability: c.reliability.map((b) => ({ ...b, count: 0, accuracy: null, confidence: null })),
      })),
    };
    expect(reliabilityChart(empty, config)).toBeNull();
  });

  it('says over how many seeds samples were summed when analysis gives it', () => {
    const subtitle = (r: Results): string =>
      (reliabilityChart(r, config) as TopLevelSpec & { title: { subtitle: string[] } }).title.subtitle.join(' ');
    expect(subtitle(results)).toContain('summed over seeds');
    expect(subtitle({ ...results, calibration: results.calibration.map((c) => ({ ...c, seeds: 3 })) })).toContain(
      'summed over 3 seeds',
    );
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

describe('reliabilityChart between-example whiskers', () => {
  it('draws ±1 binomial standard error √(a(1−a)/n) per bin and says that seeds are pooled', async () => {
    const spec = reliabilityChart(results, config) as TopLevelSpec & { title: { subtitle: string[] } };
    expect(spec.title.subtitle.join(' ')).toContain(
      'Whiskers: ±1 between-example standard error √(a(1−a)/n) of each bin; seeds are pooled, so ' +
        'seed-to-seed spread is not shown.',
    );
    const whiskers = markItems(await renderSvg(spec), 'exampleSpread');
    expect(whiskers).toHaveLength(4);
    // The fixture's bin 0.2-0.4 of the first config: accuracy a = 0.27 on n = 40 samples; by hand,
    // √(0.27 × 0.73 / 40) = √0.0049275 = 0.0701962, a whisker 2 × 0.0701962 × 320 px = 44.926 px long.
    const bin = whiskers.find((w) => (attr(w, 'aria-label') ?? '').includes('samples: 40;'));
    expect(attr(bin ?? '', 'aria-label')).toContain('accuracy: 0.27;');
    expect(attr(bin ?? '', 'aria-label')).toContain('between-example SE: 0.0702');
    expect(Math.abs(Number(attr(bin ?? '', 'y2')))).toBeCloseTo(44.926, 2);
  });
});
