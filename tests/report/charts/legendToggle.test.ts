/**
 * Legend toggling: the selection parameter and opacity conditions (checked against Vega-Lite's
 * compiler: the legend becomes the selection's event source), and the server-drawn SVG of every
 * chart that has it looks the same as without it. "Looks the same" is checked element by element
 * on Vega's SVG, after removing only what draws nothing: `pointer-events="none"` and
 * `cursor="pointer"` (event handling), `opacity="1"` (the SVG default) and the legend groups'
 * extra class names (`config_legend_*`, which Vega adds to name the event sources).
 */
import type { TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import { calibrationChart } from '../../../src/report/charts/calibrationChart.js';
import type { Layer } from '../../../src/report/charts/chartFrame.js';
import { curvesChart } from '../../../src/report/charts/curvesChart.js';
import { haltingChart } from '../../../src/report/charts/haltingChart.js';
import {
  FADED,
  hasLegendToggle,
  layerOpacity,
  pickedOpacity,
  PICKED_CONFIGS,
  withLegendToggle,
} from '../../../src/report/charts/legendToggle.js';
import { ticksChart } from '../../../src/report/charts/ticksChart.js';
import { valuesChart } from '../../../src/report/charts/valuesChart.js';
import { compileVega, renderSvg } from '../../../src/report/renderSvg.js';
import { DEFAULT_NAMES, makeResults } from '../fixtures.js';

const results = makeResults();

/** The same spec with the selection taken out: no params, each conditioned opacity back to its plain value. */
function withoutToggle(spec: TopLevelSpec): TopLevelSpec {
  const layers = (spec as unknown as { layer: Record<string, unknown>[] }).layer.map((layer) => {
    const { params: _params, ...rest } = layer;
    const encoding = rest.encoding as Record<string, unknown> | undefined;
    const opacity = encoding?.opacity as { condition?: { value: number } } | undefined;
    if (encoding === undefined || opacity?.condition === undefined) return rest;
    return { ...rest, encoding: { ...encoding, opacity: { value: opacity.condition.value } } };
  });
  return { ...spec, layer: layers } as unknown as TopLevelSpec;
}

function look(svg: string): string[] {
  return svg
    .replace(/ pointer-events="none"| cursor="pointer"| opacity="1"| config_legend_(?:entries|symbols|labels)/g, '')
    .split(/(?=<)/);
}

const CHARTS: [string, TopLevelSpec | null][] = [
  ['curvesChart', curvesChart(results, DEFAULT_NAMES.metric)],
  ['ticksChart', ticksChart(results, DEFAULT_NAMES.tickMetric)],
  ['haltingChart', haltingChart(results)],
  ['calibrationChart', calibrationChart(results)],
];

describe('pickedOpacity, layerOpacity, withLegendToggle', () => {
  it('keeps the layer opacity for picked configs and fades the others', () => {
    expect(pickedOpacity(0.2)).toEqual({ condition: { param: PICKED_CONFIGS, value: 0.2 }, value: 0.03 });
    expect(pickedOpacity(1).value).toBe(FADED);
    expect(layerOpacity(0.35, 1)).toEqual({ value: 0.35 });
    expect(layerOpacity(0.35, 2)).toEqual(pickedOpacity(0.35));
  });

  it('puts the selection on the first holder present, and on nothing with one config or no holder', () => {
    const layers: Layer[] = [
      { name: 'band', mark: 'area', encoding: {} },
      { name: 'mean', mark: 'line', encoding: {} },
    ];
    const params = (ls: Layer[]): unknown[] => ls.map((l) => ('params' in l ? l.params : undefined));
    expect(params(withLegendToggle(layers, 3, ['seeds', 'mean']))).toEqual([
      undefined,
      [{ name: PICKED_CONFIGS, select: { type: 'point', fields: ['config'] }, bind: 'legend' }],
    ]);
    expect(withLegendToggle(layers, 1, ['mean'])).toEqual(layers);
    expect(withLegendToggle(layers, 3, ['points'])).toEqual(layers);
  });

  it('tells which specs carry the selection: not the per-seed values (no legend), not a chart of one config', () => {
    expect(hasLegendToggle(curvesChart(results, DEFAULT_NAMES.metric))).toBe(true);
    expect(hasLegendToggle(valuesChart(results, DEFAULT_NAMES.metric, DEFAULT_NAMES.summary))).toBe(false);
    const one = { ...results, curves: results.curves.filter((c) => c.config === DEFAULT_NAMES.configs[0]) };
    expect(hasLegendToggle(curvesChart(one, DEFAULT_NAMES.metric))).toBe(false);
  });
});

for (const [name, spec] of CHARTS) {
  describe(`${name} with legend toggling`, () => {
    it(
      'binds a point selection on config to the legend, and ' + 'conditions the opacity of every config layer on it',
      () => {
        expect(spec).not.toBeNull();
        const vega = compileVega(spec as TopLevelSpec) as {
          signals?: { name: string }[];
          legends?: { encode?: { symbols?: { name?: string } } }[];
        };
        // Vega-Lite's compiler makes the legend's symbols the event source of the selection.
        expect((vega.signals ?? []).map((s) => s.name)).toContain(`${PICKED_CONFIGS}_config_legend`);
        expect(JSON.stringify(vega.legends)).toContain('config_legend_symbols');
        const layers = (
          spec as { layer: { encoding?: { color?: { field?: string }; opacity?: unknown }; mark: unknown }[] }
        ).layer;
        const configLayers = layers.filter(
          (l) => l.encoding?.color?.field === 'config' && (l.mark as { opacity?: number }).opacity !== 0,
        );
        expect(configLayers.length).toBeGreaterThan(1);
        for (const l of configLayers)
          expect(l.encoding?.opacity).toMatchObject({ condition: { param: PICKED_CONFIGS } });
      },
    );

    it('draws the same SVG as without the selection (nothing is picked on a page without JavaScript)', async () => {
      const withIt = look(await renderSvg(spec as TopLevelSpec));
      const without = look(await renderSvg(withoutToggle(spec as TopLevelSpec)));
      expect(withIt.length).toBeGreaterThan(50);
      expect(withIt).toEqual(without);
    });
  });
}
