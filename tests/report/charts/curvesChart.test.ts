/**
 * curvesChart: what the SVG draws for the fixture (tests/report/fixtures.ts). External reference:
 * Vega's own SVG serialisation (a path's move-to commands are its separate pieces).
 */
import type { TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import type { Curve, Results } from '../../../src/analysis/results.js';
import { curvesChart, SEED_LINE_POINTS, SEED_POINTS } from '../../../src/report/charts/curvesChart.js';
import { CONFIG_COLOURS } from '../../../src/report/palette.js';
import { compileVega, renderSvg, renderSvgWithWarnings } from '../../../src/report/renderSvg.js';
import { at } from '../../support/at.js';
import { DEFAULT_NAMES, makeResults } from '../fixtures.js';
import { attr, drawn, markItems, subpaths, vegaMark } from './svgInspect.js';

const results = makeResults();
const [c0, , c2] = DEFAULT_NAMES.configs;

function byConfig(items: string[], config: string): string[] {
  return items.filter((el) => (attr(el, 'aria-label') ?? '').split('; ').includes(`config: ${config}`));
}

function withCurves(r: Results, map: (c: Curve) => Curve): Results {
  return { ...r, curves: r.curves.map(map) };
}

describe('curvesChart', () => {
  it('returns null for a metric without curves', () => {
    expect(curvesChart(results, 'no_such_metric')).toBeNull();
  });

  it('names the band method and level in the subtitle', () => {
    const spec = curvesChart(results, 'val_acc') as TopLevelSpec & { title: { subtitle: string[] } };
    expect(spec.title.subtitle.join(' ')).toContain('95% t-interval of the mean across seeds');
  });

  it('names every band method used, bin by bin when Curve.bandByBin is given', () => {
    const mixed = withCurves(results, (c) =>
      c.config !== c0 ? c : { ...c, bandByBin: c.steps.map((_, i) => (i < 3 ? 't' : 'bca')) },
    );
    const spec = curvesChart(mixed, 'val_acc') as TopLevelSpec & {
      title: { subtitle: string[] };
      layer: { name?: string; data?: { values: Record<string, unknown>[] } }[];
    };
    expect(spec.title.subtitle.join(' ')).toContain('95% t-interval or 95% BCa bootstrap interval of the mean');
    // One row per config holds the per-step arrays (a flatten transform makes them rows).
    const hover = spec.layer.find((l) => l.name === 'hover')?.data?.values ?? [];
    expect(hover.filter((r) => r.config === c0).map((r) => r.band)).toEqual([
      [
        '95% t-interval',
        '95% t-interval',
        '95% t-interval',
        '95% BCa bootstrap interval',
        '95% BCa bootstrap interval',
      ],
    ]);
  });

  it('draws a seed line with at most SEED_LINE_POINTS points, and says so only when it had more', () => {
    const lineOf = (bins: number): { points: number; subtitle: string } => {
      const r = withCurves(results, (c) => ({
        ...c,
        steps: Array.from({ length: bins }, (_, i) => i),
        mean: Array.from({ length: bins }, (_, i) => i),
        low: Array.from({ length: bins }, () => null),
        high: Array.from({ length: bins }, () => null),
        n: Array.from({ length: bins }, () => 3),
        runs: c.runs.map((run) => ({ ...run, values: Array.from({ length: bins }, (_, i) => i) })),
      }));
      const spec = curvesChart(r, 'val_acc') as TopLevelSpec & {
        title: { subtitle: string[] };
        layer: { name?: string; data?: { values: Record<string, unknown>[] } }[];
      };
      const seeds = spec.layer.find((l) => l.name === 'seeds')?.data?.values ?? [];
      return { points: (at(seeds, 0).step as number[]).length, subtitle: spec.title.subtitle.join(' ') };
    };
    expect(lineOf(SEED_LINE_POINTS)).toEqual({
      points: SEED_LINE_POINTS,
      subtitle: expect.not.stringContaining('one point per'),
    });
    expect(lineOf(400)).toEqual({ points: 200, subtitle: expect.stringContaining('one point per 2 bins') });
    expect(lineOf(401).points).toBe(134); // ceil(401 / 3)
  });

  it('draws hundreds of seed lines with fewer points, says so, and keeps every bin of the mean', () => {
    const bins = 400;
    const many = withCurves(results, (c) => ({
      ...c,
      steps: Array.from({ length: bins }, (_, i) => i * 10),
      mean: Array.from({ length: bins }, (_, i) => i / bins),
      low: Array.from({ length: bins }, () => null),
      high: Array.from({ length: bins }, () => null),
      n: Array.from({ length: bins }, () => 100),
      runs: Array.from({ length: 100 }, (_, r) => ({
        run: `${c.config},seed=${r}`,
        seed: String(r),
        values: Array.from({ length: bins }, (_, i) => (i + r) / bins),
      })),
    }));
    const spec = curvesChart(many, 'val_acc') as TopLevelSpec & {
      title: { subtitle: string[] };
      layer: { name?: string; data?: { values: Record<string, unknown>[] } }[];
    };
    const seeds = spec.layer.find((l) => l.name === 'seeds')?.data?.values ?? [];
    const points = seeds.reduce((total, r) => total + (r.step as number[]).length, 0);
    expect(seeds).toHaveLength(300);
    expect(points).toBeLessThanOrEqual(SEED_POINTS);
    expect(points).toBe(300 * Math.ceil(bins / 5)); // 300 x 400 points over 24,000: one point per 5 bins
    expect(spec.title.subtitle.join(' ')).toContain('one point per 5 bins');
    // First seed line, first group: steps 0..40 and values (0..4)/400 averaged.
    expect((at(seeds, 0).step as number[])[0]).toBe(20);
    expect((at(seeds, 0).value as number[])[0]).toBeCloseTo(2 / bins, 15);
    const mean = spec.layer.find((l) => l.name === 'mean')?.data?.values ?? [];
    expect((at(mean, 0).step as number[]).length).toBe(bins);
  });

  it('draws a thin line per seed and a band and mean line per config, each config in its report colour', async () => {
    const svg = await renderSvg(curvesChart(results, 'val_acc') as TopLevelSpec);
    expect(markItems(svg, 'seeds')).toHaveLength(9);
    expect(markItems(svg, 'band')).toHaveLength(3);
    const mean = markItems(svg, 'mean');
    expect(mean).toHaveLength(3);
    DEFAULT_NAMES.configs.forEach((config, k) => {
      const line = byConfig(mean, config);
      expect(line).toHaveLength(1);
      expect(attr(line[0] ?? '', 'stroke')).toBe(CONFIG_COLOURS[k]);
      expect(Number(attr(line[0] ?? '', 'stroke-width'))).toBeGreaterThan(
        Number(attr(byConfig(markItems(svg, 'seeds'), config)[0] ?? '', 'stroke-width')),
      );
    });
  });

  it('breaks the mean line, the band and a seed line at nulls instead of joining across them', async () => {
    const svg = await renderSvg(curvesChart(results, 'val_acc') as TopLevelSpec);
    const mean = markItems(svg, 'mean');
    expect(subpaths(byConfig(mean, c2)[0] ?? '')).toBe(2); // mean null at step 200
    expect(subpaths(byConfig(mean, c0)[0] ?? '')).toBe(1);
    expect(subpaths(byConfig(markItems(svg, 'band'), c2)[0] ?? '')).toBe(2);
    const brokenSeed = markItems(svg, 'seeds').filter((el) =>
      (attr(el, 'aria-label') ?? '').includes(`run: ${c2},seed=1`),
    );
    expect(subpaths(brokenSeed[0] ?? '')).toBe(2); // value null at step 300

    // Control: the same chart with the hole filled draws one piece (the count above is the null's doing).
    const filled = withCurves(results, (c) => (c.config !== c2 ? c : { ...c, mean: c.mean.map((v) => v ?? 0.64) }));
    const svgFilled = await renderSvg(curvesChart(filled, 'val_acc') as TopLevelSpec);
    expect(subpaths(byConfig(markItems(svgFilled, 'mean'), c2)[0] ?? '')).toBe(1);
  });

  it('says when there is no band and draws none', async () => {
    const none = withCurves(results, (c) => ({
      ...c,
      band: 'none',
      low: c.low.map(() => null),
      high: c.high.map(() => null),
    }));
    const spec = curvesChart(none, 'val_acc') as TopLevelSpec & { title: { subtitle: string[] } };
    expect(spec.title.subtitle.join(' ')).toContain('No band');
    const { svg, warnings } = await renderSvgWithWarnings(spec);
    expect(warnings).toEqual([]);
    expect(markItems(svg, 'band').some(drawn)).toBe(false);
    expect(markItems(svg, 'mean').every(drawn)).toBe(true);
  });

  it(
    'stores each run and each config once, with per-step ' + 'arrays, and draws one hover point per step with a mean',
    async () => {
      const spec = curvesChart(results, 'val_acc') as TopLevelSpec & {
        layer: { name?: string; data?: { values: Record<string, unknown>[] } }[];
      };
      const seeds = spec.layer.find((l) => l.name === 'seeds')?.data?.values ?? [];
      expect(seeds).toHaveLength(9);
      expect(Object.keys(seeds[0] ?? {}).sort()).toEqual(['config', 'run', 'seed', 'step', 'value']);
      expect(seeds[0]).toMatchObject({ config: c0, run: `${c0},seed=1`, seed: '1', step: [0, 100, 200, 300, 400] });
      // The fixture's first seed of the first config: its base curve 0.3, 0.5, 0.62, 0.7, 0.74 minus 0.01.
      for (const [i, v] of ((seeds[0]?.value ?? []) as number[]).entries()) {
        expect(v).toBeCloseTo([0.29, 0.49, 0.61, 0.69, 0.73][i] ?? NaN, 12);
      }
      // The fixture has 3 configs x 5 steps, one mean null (config index 2 at step 200): 14 hover points.
      const svg = await renderSvg(spec);
      expect(markItems(svg, 'hover')).toHaveLength(14);
      expect(
        markItems(svg, 'hover').filter((el) => (attr(el, 'aria-label') ?? '').includes(`config: ${c2}`)),
      ).toHaveLength(4);
    },
  );

  it("marks the step of the metric's comparisons (when they share one) with a dashed rule and says so", async () => {
    const spec = curvesChart(results, 'val_acc') as TopLevelSpec & { title: { subtitle: string[] } };
    expect(spec.title.subtitle.join(' ')).toContain("Dashed line: step 400, where this metric's comparisons are made.");
    const svg = await renderSvg(spec);
    const rule = markItems(svg, 'horizon');
    expect(rule).toHaveLength(1);
    // Steps 0..400 on a 520 px axis: the horizon (400) is the right edge.
    expect(attr(rule[0] ?? '', 'transform')).toBe('translate(520,0)');
    expect(attr(rule[0] ?? '', 'stroke-dasharray')).toBe('4,4');
    const none = curvesChart(
      { ...results, metrics: results.metrics.map((m) => ({ ...m, horizon: null })) },
      'val_acc',
    ) as TopLevelSpec & { title: { subtitle: string[] } };
    expect(none.title.subtitle.join(' ')).not.toContain('horizon');
    expect(markItems(await renderSvg(none), 'horizon')).toEqual([]);
  });

  it('puts tooltips on the hover points (not on the band) for the interactive runtime', () => {
    const vega = compileVega(curvesChart(results, 'val_acc') as TopLevelSpec);
    expect(JSON.stringify(vegaMark(vega, 'hover_marks')?.encode?.update?.tooltip)).toContain('interval low');
    expect(vegaMark(vega, 'band_marks')?.encode?.update?.tooltip).toBeUndefined();
    expect(vegaMark(vega, 'seeds_marks')?.encode?.update?.tooltip).toBeDefined();
  });
});
