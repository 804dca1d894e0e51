/**
 * Calibration by tick: the expected calibration error of each config at every internal tick.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { Results } from '../../analysis/results.js';
import { CONFIG_LEGEND, configColourScale } from '../palette.js';
import { chartFrame, NUMBER_FORMAT } from './chartFrame.js';
import { formatLevel } from './intervalLabel.js';
import { withLegendToggle } from './legendToggle.js';
import { tickAxis } from './tickDomain.js';
import { tickLayers } from './tickLayers.js';

/**
 * Vega-Lite spec of `CalibrationCurve.ece`: per config, the expected calibration error
 * (equal-width confidence bins; Naeini, Cooper & Hauskrecht 2015; Guo et al. 2017) by tick as a
 * mean line with points and a band across seeds (level from `Settings.level`; the record carries
 * no level or method). Lines and bands break at nulls. Clicking a config in the legend fades the
 * others (`withLegendToggle`).
 * Returns null when there is no calibration curve with a mean. Cost O(configs * ticks). Never throws.
 * Example: `calibrationChart(results)` → layers band, mean, points.
 */
export function calibrationChart(results: Results): TopLevelSpec | null {
  const curves = results.calibration.filter((c) => c.ece.length > 0);
  if (curves.length === 0) return null;

  const rows = curves.flatMap((c) =>
    c.ece.map((e) => {
      const banded = e.low !== null && e.high !== null;
      return {
        config: c.config,
        tick: e.tick,
        mean: e.mean,
        low: banded ? e.low : null,
        high: banded ? e.high : null,
        bins: c.bins,
      };
    }),
  );
  const configs = curves.map((c) => c.config);
  const color = {
    field: 'config',
    type: 'nominal',
    title: 'config',
    scale: configColourScale(results, configs),
    legend: CONFIG_LEGEND,
  } as const;
  const x = tickAxis(rows.map((r) => r.tick));
  const y = (field: string) => ({ field, type: 'quantitative', title: 'expected calibration error' }) as const;

  if (!rows.some((r) => r.mean !== null)) return null;
  const hasBand = rows.some((r) => r.low !== null);
  const layers = tickLayers({
    rows,
    x,
    y,
    color,
    configs: configs.length,
    tooltip: [
      { field: 'config', type: 'nominal', title: 'config' },
      { field: 'tick', type: 'quantitative', title: 'tick' },
      { field: 'mean', type: 'quantitative', title: 'ECE', format: NUMBER_FORMAT },
      { field: 'low', type: 'quantitative', title: 'interval low', format: NUMBER_FORMAT },
      { field: 'high', type: 'quantitative', title: 'interval high', format: NUMBER_FORMAT },
      { field: 'bins', type: 'quantitative', title: 'bins' },
    ],
  });
  const bins = [...new Set(curves.map((c) => c.bins))].join(' or ');

  return {
    ...chartFrame({
      title: 'Calibration by internal tick',
      subtitle: [
        `Expected calibration error, ${bins} equal-width confidence bins; lower is better.`,
        `Line: mean across seeds. ` +
          (hasBand
            ? `Band: ${formatLevel(results.settings.level)} interval across seeds (seed-to-seed spread).`
            : 'No band: too few seeds.'),
      ],
      description:
        `Expected calibration error against internal tick for ${curves.length} ` +
        `config${curves.length === 1 ? '' : 's'}, mean across ` +
        `seeds${hasBand ? ` with a ${formatLevel(results.settings.level)} band` : ''}.`,
    }),
    layer: withLegendToggle(layers, configs.length, ['mean']),
  };
}
