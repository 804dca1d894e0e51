/**
 * valuesChart: dots per seed and the mean tick, for the fixture (tests/report/fixtures.ts).
 * External reference: Vega's SVG serialisation of symbol and tick marks.
 */
import type { TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import { valuesChart } from '../../../src/report/charts/valuesChart.js';
import { CONFIG_COLOURS } from '../../../src/report/palette.js';
import { renderSvg } from '../../../src/report/renderSvg.js';
import { DEFAULT_NAMES, makeResults } from '../fixtures.js';
import { attr, drawn, markItems } from './svgInspect.js';

const results = makeResults();
const { metric, summary, configs } = DEFAULT_NAMES;
type Layered = TopLevelSpec & {
  layer: { name?: string; data?: { values: Record<string, unknown>[] } }[];
  title: { subtitle: string[] };
};

describe('valuesChart', () => {
  it('returns null when no run has a value for that metric and summary', () => {
    expect(valuesChart(results, metric, 'final')).toBeNull();
    const empty = { ...results, values: results.values.map((v) => ({ ...v, value: null, usedInTests: false })) };
    expect(valuesChart(empty, metric, summary)).toBeNull();
  });

  it(
    'draws each run with a value once: filled if used in tests, hollow if not; runs without a value are ' +
      'counted, not drawn',
    async () => {
      const spec = valuesChart(results, metric, summary) as Layered;
      const svg = await renderSvg(spec);
      // Fixture: 9 runs, one diverged (no value), one with a value not used in tests.
      expect(markItems(svg, 'used')).toHaveLength(7);
      const unused = markItems(svg, 'unused');
      expect(unused).toHaveLength(1);
      expect(attr(unused[0] ?? '', 'stroke')).toBe(CONFIG_COLOURS[2]);
      expect(attr(unused[0] ?? '', 'fill')).not.toBe(CONFIG_COLOURS[2]);
      expect(spec.title.subtitle.join(' ')).toContain('1 run has no value');
    },
  );

  it('takes the mean and its interval from Results.configValues, computing nothing', async () => {
    const spec = valuesChart(results, metric, summary) as Layered;
    const mean = spec.layer.find((l) => l.name === 'mean');
    // configs[1]: configValues says 0.77; its two values (0.75, 0.76) would average 0.755.
    expect(mean?.data?.values.map((r) => [r.config, r.mean, r.low, r.high])).toEqual([
      [configs[0], 0.74, 0.72, 0.76],
      [configs[1], 0.77, 0.75, 0.79],
      [configs[2], 0.8, 0.78, 0.8200000000000001],
    ]);
    const svg = await renderSvg(spec);
    expect(markItems(svg, 'mean')).toHaveLength(3);
    expect(markItems(svg, 'mean').every(drawn)).toBe(true);
    expect(markItems(svg, 'interval')).toHaveLength(3);
    expect(spec.title.subtitle.join(' ')).toContain('t-interval');
  });

  it('draws no interval line for a config whose interval is null (one seed)', () => {
    const one = {
      ...results,
      configValues: results.configValues.map((c, k) =>
        k === 0 ? { ...c, n: 1, low: null, high: null, method: 'none' as const } : c,
      ),
    };
    const spec = valuesChart(one, metric, summary) as Layered;
    expect(spec.layer.find((l) => l.name === 'interval')?.data?.values.map((r) => r.config)).toEqual([
      configs[1],
      configs[2],
    ]);
    expect(spec.layer.find((l) => l.name === 'mean')?.data?.values).toHaveLength(3);
  });

  it('spreads equal values of one config apart and keeps rows in Results.configs order', () => {
    const spec = valuesChart(results, metric, summary) as Layered;
    const used = spec.layer.find((l) => l.name === 'used')?.data?.values ?? [];
    const slots = used.filter((r) => r.config === configs[0]).map((r) => r.slot);
    expect(slots).toEqual([-1, 0, 1]);
    expect(JSON.stringify(spec)).toContain(JSON.stringify({ domain: [...configs] }));
  });
});
