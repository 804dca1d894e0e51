/**
 * compareChart: intervals around zero, verdict colours, shapes and words, the margin rule.
 * External reference: Vega's SVG serialisation (rules as <line>, positions as translate()).
 */
import type { TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import type { Results } from '../../../src/analysis/results.js';
import { compareChart } from '../../../src/report/charts/compareChart.js';
import { VERDICT_COLOURS } from '../../../src/report/palette.js';
import { renderSvg } from '../../../src/report/renderSvg.js';
import { DEFAULT_NAMES, makeResults } from '../fixtures.js';
import { attr, drawn, markItems, translate } from './svgInspect.js';

const results = makeResults();
const { metric, summary } = DEFAULT_NAMES;
const render = async (r: Results): Promise<string> => renderSvg(compareChart(r, metric, summary) as TopLevelSpec);

describe('compareChart', () => {
  it('returns null when there is no comparison for that metric and summary', () => {
    expect(compareChart(results, 'other', summary)).toBeNull();
    expect(compareChart(results, metric, 'final')).toBeNull();
  });

  it(
    'draws every estimate in its verdict colour, intervals ' + 'only where they exist, and the verdict as words',
    async () => {
      const svg = await render(results);
      const points = markItems(svg, 'estimate');
      expect(points.map((p) => attr(p, 'fill'))).toEqual([
        VERDICT_COLOURS.better,
        VERDICT_COLOURS.worse,
        VERDICT_COLOURS.inconclusive,
      ]);
      const intervals = markItems(svg, 'interval');
      expect(intervals).toHaveLength(2); // the third comparison has no interval
      expect(intervals.every(drawn)).toBe(true);
      expect(markItems(svg, 'verdict').map((t) => /> *([^<]*)<\/text>$/.exec(t)?.[1])).toEqual([
        'better',
        'worse',
        'inconclusive',
      ]);
      // The legend names all three verdicts.
      const legend = svg.match(/role-legend-label[\s\S]*?<\/g>/g)?.join('') ?? '';
      for (const v of ['better', 'worse', 'inconclusive']) expect(legend).toContain(`>${v}</text>`);
    },
  );

  it('draws the zero rule, and the margin on the worse side of it: left for goal max, right for goal min', async () => {
    const svg = await render(results);
    const zero = translate(markItems(svg, 'zero')[0] ?? '').x;
    const margin = translate(markItems(svg, 'margin')[0] ?? '').x;
    expect(margin).toBeLessThan(zero);
    const worse = translate(markItems(svg, 'estimate')[1] ?? '').x; // the worse comparison, estimate -0.04
    expect(worse).toBeLessThan(zero);

    const min: Results = { ...results, comparisons: results.comparisons.map((c) => ({ ...c, goal: 'min' as const })) };
    const svgMin = await render(min);
    expect(translate(markItems(svgMin, 'margin')[0] ?? '').x).toBeGreaterThan(
      translate(markItems(svgMin, 'zero')[0] ?? '').x,
    );
  });

  it('has no margin rule without a margin', async () => {
    const none: Results = {
      ...results,
      settings: { ...results.settings, margin: null },
      comparisons: results.comparisons.map((c) => ({ ...c, nonInferiority: null })),
    };
    const svg = await render(none);
    expect(markItems(svg, 'margin')).toEqual([]);
    expect(markItems(svg, 'zero')).toHaveLength(1);
  });

  it('labels rows by candidate and baseline (and task), unique even when two would collide', () => {
    const first = results.comparisons[0];
    if (first === undefined) throw new Error('fixture has comparisons');
    const twice: Results = { ...results, comparisons: [first, { ...first }, { ...first, task: 'count' }] };
    const spec = compareChart(twice, metric, summary) as TopLevelSpec & {
      layer: { name?: string; data?: { values: { label: string }[] } }[];
    };
    const labels = spec.layer.find((l) => l.name === 'estimate')?.data?.values.map((r) => r.label);
    expect(labels).toEqual([
      `${first.candidate} vs ${first.baseline}`,
      `${first.candidate} vs ${first.baseline} (2)`,
      `${first.candidate} vs ${first.baseline} [count]`,
    ]);
  });
});
