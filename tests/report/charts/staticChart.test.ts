/**
 * staticChart: the SVG's spec leaves out layers with mark opacity 0 and changes nothing else. The
 * look is checked on Vega's SVG: the static SVG equals the full chart's SVG with the hover group
 * taken out, but for the SVG's outer size (the invisible points at the plot's edge no longer
 * widen its bounds; everything is drawn at the same place).
 */
import type { TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import { curvesChart } from '../../../src/report/charts/curvesChart.js';
import { staticChart } from '../../../src/report/charts/staticChart.js';
import { valuesChart } from '../../../src/report/charts/valuesChart.js';
import { renderSvg } from '../../../src/report/renderSvg.js';
import { DEFAULT_NAMES, makeResults } from '../fixtures.js';
import { markItems } from './svgInspect.js';

const results = makeResults();

function layerNames(spec: TopLevelSpec): string[] {
  return 'layer' in spec ? spec.layer.map((l) => l.name ?? '') : [];
}

/** SVG elements without the root's size attributes and the background rect's size. */
function inner(svg: string): string[] {
  return svg
    .replace(/<svg[^>]*>/, '<svg>')
    .replace(/<rect width="\d+" height="\d+"/, '<rect')
    .split(/(?=<)/);
}

describe('staticChart', () => {
  it('drops the invisible hover layer of the learning curves and keeps the others in order', () => {
    const spec = curvesChart(results, DEFAULT_NAMES.metric) as TopLevelSpec;
    expect(layerNames(spec)).toEqual(['horizon', 'seeds', 'band', 'mean', 'hover']);
    expect(layerNames(staticChart(spec))).toEqual(['horizon', 'seeds', 'band', 'mean']);
    expect(staticChart(spec)).toMatchObject({ title: spec.title, description: spec.description, config: spec.config });
  });

  it('returns a chart without invisible layers as it is', () => {
    const spec = valuesChart(results, DEFAULT_NAMES.metric, DEFAULT_NAMES.summary) as TopLevelSpec;
    expect(staticChart(spec)).toBe(spec);
  });

  it('draws every visible element as the full chart does', async () => {
    const spec = curvesChart(results, DEFAULT_NAMES.metric) as TopLevelSpec;
    const full = await renderSvg(spec);
    expect(markItems(full, 'hover').length).toBeGreaterThan(0);
    const withoutHover = full.replace(/<g class="mark-symbol role-mark hover_marks"[^>]*>[\s\S]*?<\/g>/, '');
    const bare = await renderSvg(staticChart(spec));
    expect(markItems(bare, 'hover')).toEqual([]);
    expect(inner(bare)).toEqual(inner(withoutHover));
  });
});
