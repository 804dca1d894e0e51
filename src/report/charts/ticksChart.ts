/**
 * A per-tick metric against the model's internal tick: per config, the mean across seeds, its
 * between-seed band, the between-example standard error when known, and the earliest good tick.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { Results } from '../../analysis/results.js';
import { CONFIG_LEGEND, configColourScale } from '../palette.js';
import { chartFrame, NUMBER_FORMAT } from './chartFrame.js';
import { intervalLabels } from './intervalLabel.js';
import { layerOpacity, withLegendToggle } from './legendToggle.js';
import { tickAxis } from './tickDomain.js';
import { tickLayers } from './tickLayers.js';

/**
 * Vega-Lite spec of `Results.ticks` for one metric: mean line with points, band `low`..`high`
 * (between-seed spread; `TickCurve` carries no level, so `Settings.level` is named), whiskers of
 * ±1 between-example standard error `sqrt(p(1-p)/m)` (`exampleHalfWidth`, drawn as given, around
 * the mean) where analysis supplied it, and a dashed vertical rule at each config's earliest good
 * tick. Lines and bands break where values are null. Clicking a config in the legend fades the
 * others (`withLegendToggle`).
 * Returns null when the metric has no tick curve with a mean. Cost O(configs * ticks). Never throws.
 * Example: `ticksChart(results, 'val_acc')` → layers band, mean, points, exampleSpread?, earliest?.
 */
export function ticksChart(results: Results, metric: string): TopLevelSpec | null {
  const curves = results.ticks.filter((c) => c.metric === metric && c.ticks.length > 0);
  if (curves.length === 0) return null;

  const rows: Record<string, unknown>[] = [];
  const whiskers: Record<string, unknown>[] = [];
  const earliest: Record<string, unknown>[] = [];
  for (const c of curves) {
    c.ticks.forEach((tick, i) => {
      const mean = c.mean[i] ?? null;
      const low = c.low[i] ?? null;
      const high = c.high[i] ?? null;
      const banded = low !== null && high !== null;
      const half = c.exampleHalfWidth?.[i] ?? null;
      rows.push({
        config: c.config,
        tick,
        mean,
        low: banded ? low : null,
        high: banded ? high : null,
        n: c.n[i] ?? 0,
        exampleSe: half,
      });
      if (mean !== null && half !== null)
        whiskers.push({ config: c.config, tick, from: mean - half, to: mean + half, exampleSe: half });
    });
    if (c.earliestGood !== null) {
      const e = c.earliestGood;
      earliest.push({ config: c.config, tick: e.tick, low: e.low, high: e.high, tolerance: e.tolerance });
    }
  }

  const configs = curves.map((c) => c.config);
  const color = {
    field: 'config',
    type: 'nominal',
    title: 'config',
    scale: configColourScale(results, configs),
    legend: CONFIG_LEGEND,
  } as const;
  const x = tickAxis(curves.flatMap((c) => c.ticks));
  const y = (field: string) => ({ field, type: 'quantitative', title: metric, scale: { zero: false } }) as const;

  if (!rows.some((r) => r.mean !== null)) return null;
  const opacity = (o: number) => layerOpacity(o, configs.length);
  const layers = tickLayers({
    rows,
    x,
    y,
    color,
    configs: configs.length,
    tooltip: [
      { field: 'config', type: 'nominal', title: 'config' },
      { field: 'tick', type: 'quantitative', title: 'tick' },
      { field: 'mean', type: 'quantitative', title: 'mean', format: NUMBER_FORMAT },
      { field: 'low', type: 'quantitative', title: 'interval low', format: NUMBER_FORMAT },
      { field: 'high', type: 'quantitative', title: 'interval high', format: NUMBER_FORMAT },
      { field: 'n', type: 'quantitative', title: 'seeds' },
      { field: 'exampleSe', type: 'quantitative', title: 'between-example SE', format: NUMBER_FORMAT },
    ],
  });
  if (whiskers.length > 0) {
    layers.push({
      name: 'exampleSpread',
      data: { values: whiskers },
      mark: { type: 'rule', strokeWidth: 1, strokeDash: [2, 2] },
      encoding: { x, y: y('from'), y2: { field: 'to' }, color, opacity: opacity(1) },
    });
  }
  if (earliest.length > 0) {
    layers.push({
      name: 'earliest',
      data: { values: earliest },
      mark: { type: 'rule', strokeDash: [6, 4], strokeWidth: 1.2 },
      encoding: {
        x,
        color,
        opacity: opacity(0.8),
        tooltip: [
          { field: 'config', type: 'nominal', title: 'config' },
          { field: 'tick', type: 'quantitative', title: 'earliest good tick' },
          { field: 'low', type: 'quantitative', title: 'across seeds, low' },
          { field: 'high', type: 'quantitative', title: 'across seeds, high' },
          { field: 'tolerance', type: 'quantitative', title: 'tolerance', format: NUMBER_FORMAT },
        ],
      },
    });
  }

  const banded = curves.filter((c) => c.band !== 'none' && c.low.some((v, i) => v !== null && c.high[i] !== null));
  const band = intervalLabels(banded.map((c) => ({ method: c.band, level: results.settings.level })));
  const steps = [...new Set(curves.map((c) => c.step))];
  const at = steps.length === 1 && steps[0] !== null && steps[0] !== undefined ? ` at step ${steps[0]}` : '';
  const subtitle = [
    `Line: mean across seeds${at}. ` +
      (band === '' ? 'No band: too few seeds.' : `Band: ${band} across seeds (seed-to-seed spread).`),
  ];
  if (whiskers.length > 0)
    subtitle.push('Dotted whiskers: ±1 between-example standard error, √(p(1−p)/m), of one evaluation.');
  if (earliest.length > 0) subtitle.push('Dashed rule: earliest tick within tolerance of the best tick.');
  const diverged = curves.reduce((total, c) => total + (c.diverged ?? 0), 0);
  if (diverged > 0) subtitle.push(`${diverged} diverged run${diverged === 1 ? '' : 's'} left out.`);

  return {
    ...chartFrame({
      title: `${metric} by internal tick`,
      subtitle,
      description:
        `${metric} against internal tick for ${curves.length} ` +
        `config${curves.length === 1 ? '' : 's'}${at}: mean across seeds${band === '' ? '' : ` with a ${band} band`}.`,
    }),
    layer: withLegendToggle(layers, configs.length, ['mean']),
  };
}
