/**
 * Certainty-threshold halting: the trade-off between how early samples exit and how accurate
 * they are at exit, one curve per config over the grid of thresholds.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { Results } from '../../analysis/results.js';
import { CONFIG_LEGEND, configColourScale } from '../palette.js';
import { chartFrame, NUMBER_FORMAT, type Layer } from './chartFrame.js';
import { layerOpacity, withLegendToggle } from './legendToggle.js';
import { formatLevel } from './intervalLabel.js';

/**
 * Vega-Lite spec of `Results.halting`: per config and threshold, the mean exit tick (x) against
 * the accuracy at exit (y), both means across seeds, joined in threshold order, with horizontal
 * and vertical bars for their intervals (level from `Settings.level`; `HaltingCurve` carries no
 * level or method). Points or bars with a null end are not drawn; the line breaks there; a layer
 * with nothing to draw is left out. Clicking a config in the legend fades the others
 * (`withLegendToggle`).
 * Returns null when there is no halting curve. Cost O(configs * thresholds). Never throws.
 * Example: `haltingChart(results)` → layers path, exitInterval, accuracyInterval, points.
 */
export function haltingChart(results: Results): TopLevelSpec | null {
  const curves = results.halting.filter((h) => h.thresholds.length > 0);
  if (curves.length === 0) return null;

  const rows = curves.flatMap((h) =>
    h.thresholds.map((threshold, i) => {
      const a = h.accuracy[i];
      const e = h.exitTick[i];
      return {
        config: h.config,
        threshold,
        accuracy: a?.mean ?? null,
        accuracyLow: a?.low ?? null,
        accuracyHigh: a?.high ?? null,
        exitTick: e?.mean ?? null,
        exitLow: e?.low ?? null,
        exitHigh: e?.high ?? null,
        seeds: h.seeds,
      };
    }),
  );
  const points = rows.filter((r) => r.accuracy !== null && r.exitTick !== null);
  if (points.length === 0) return null;

  const configs = curves.map((h) => h.config);
  const color = {
    field: 'config',
    type: 'nominal',
    title: 'config',
    scale: configColourScale(results, configs),
    legend: CONFIG_LEGEND,
  } as const;
  const x = { field: 'exitTick', type: 'quantitative', title: 'mean exit tick', scale: { zero: false } } as const;
  const y = { field: 'accuracy', type: 'quantitative', title: 'accuracy at exit', scale: { zero: false } } as const;

  const exitIntervals = points.filter((r) => r.exitLow !== null && r.exitHigh !== null);
  const accuracyIntervals = points.filter((r) => r.accuracyLow !== null && r.accuracyHigh !== null);
  const opacity = (o: number) => layerOpacity(o, configs.length);
  // A layer with no rows is left out (Vega warns on an empty extent).
  const layers: Layer[] = [
    {
      name: 'path',
      data: { values: rows },
      mark: { type: 'line', strokeWidth: 1.5 },
      encoding: { x, y, color, opacity: opacity(1), order: { field: 'threshold', type: 'quantitative' } },
    },
  ];
  if (exitIntervals.length > 0) {
    layers.push({
      name: 'exitInterval',
      data: { values: exitIntervals },
      mark: { type: 'rule', strokeWidth: 1.2 },
      encoding: { x: { ...x, field: 'exitLow' }, x2: { field: 'exitHigh' }, y, color, opacity: opacity(1) },
    });
  }
  if (accuracyIntervals.length > 0) {
    layers.push({
      name: 'accuracyInterval',
      data: { values: accuracyIntervals },
      mark: { type: 'rule', strokeWidth: 1.2 },
      encoding: { x, y: { ...y, field: 'accuracyLow' }, y2: { field: 'accuracyHigh' }, color, opacity: opacity(1) },
    });
  }
  layers.push({
    name: 'points',
    data: { values: points },
    mark: { type: 'point', filled: true, size: 44 },
    encoding: {
      // 0.7: Vega-Lite's default opacity of point marks, kept so the chart looks as before.
      x,
      y,
      color,
      opacity: opacity(0.7),
      tooltip: [
        { field: 'config', type: 'nominal', title: 'config' },
        { field: 'threshold', type: 'quantitative', title: 'certainty threshold', format: NUMBER_FORMAT },
        { field: 'exitTick', type: 'quantitative', title: 'mean exit tick', format: NUMBER_FORMAT },
        { field: 'exitLow', type: 'quantitative', title: 'exit tick low', format: NUMBER_FORMAT },
        { field: 'exitHigh', type: 'quantitative', title: 'exit tick high', format: NUMBER_FORMAT },
        { field: 'accuracy', type: 'quantitative', title: 'accuracy at exit', format: NUMBER_FORMAT },
        { field: 'accuracyLow', type: 'quantitative', title: 'accuracy low', format: NUMBER_FORMAT },
        { field: 'accuracyHigh', type: 'quantitative', title: 'accuracy high', format: NUMBER_FORMAT },
        { field: 'seeds', type: 'quantitative', title: 'seeds' },
      ],
    },
  });

  return {
    ...chartFrame({
      title: 'Halting: accuracy at exit against exit tick',
      subtitle: [
        'Each point is a certainty threshold: a sample exits at the first tick whose certainty reaches it (else ' +
          'at the last tick).',
        `Points: means across seeds. ` +
          (exitIntervals.length + accuracyIntervals.length > 0
            ? `Bars: ${formatLevel(results.settings.level)} intervals across seeds (seed-to-seed spread).`
            : 'No intervals: too few seeds.'),
      ],
      description:
        `Certainty-threshold halting trade-off for ${curves.length} ` +
        `config${curves.length === 1 ? '' : 's'}: mean exit tick against accuracy at exit over ${points.length} ` +
        `threshold points, with intervals across seeds.`,
    }),
    layer: withLegendToggle(layers, configs.length, ['path']),
  };
}
