/**
 * Learning curves: for each config, the mean across seeds as a line, its interval as a band, and
 * each seed as a thin line, against the training step.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { IntervalMethod, Results } from '../../analysis/results.js';
import { CONFIG_LEGEND, configColourScale } from '../palette.js';
import { chartFrame, NUMBER_FORMAT, STEP_FORMAT, type Layer } from './chartFrame.js';
import { intervalLabel, intervalLabels } from './intervalLabel.js';

/**
 * Vega-Lite spec of the learning curves of one metric (`Results.curves`), one colour per config.
 * Draws what `Results` carries, computes nothing: the mean line breaks where `mean` is null, the
 * band (`low`..`high`, labelled with its method and level in the subtitle, per bin from
 * `bandByBin` when present, else `band`; each bin's method also in the tooltip) where either end is
 * null, and each seed's line (`Curve.runs`) where its value is null. Hover points on the mean
 * carry tooltips (step, mean, interval, runs in the bin). A layer with nothing to draw is left out.
 * Returns null when the metric has no curve with a value. Cost O(configs * bins * seeds). Never throws.
 * Example: `curvesChart(results, 'val_acc')` → a layered spec with layers seeds, band, mean, hover.
 */
export function curvesChart(results: Results, metric: string): TopLevelSpec | null {
  const curves = results.curves.filter((c) => c.metric === metric && c.steps.length > 0);
  if (curves.length === 0) return null;

  const summary: Record<string, unknown>[] = [];
  const seeds: Record<string, unknown>[] = [];
  const bandMethods: { method: IntervalMethod; level: number }[] = [];
  for (const c of curves) {
    c.steps.forEach((step, i) => {
      const low = c.low[i] ?? null;
      const high = c.high[i] ?? null;
      const banded = low !== null && high !== null;
      const method = c.bandByBin?.[i] ?? c.band;
      if (banded && method !== 'none') bandMethods.push({ method, level: c.level });
      summary.push({ config: c.config, step, mean: c.mean[i] ?? null, low: banded ? low : null, high: banded ? high : null, n: c.n[i] ?? 0, band: banded ? intervalLabel(method, c.level) : 'none' });
    });
    for (const r of c.runs) {
      c.steps.forEach((step, i) => {
        seeds.push({ config: c.config, run: r.run, seed: r.seed, step, value: r.values[i] ?? null });
      });
    }
  }

  const configs = curves.map((c) => c.config);
  const color = { field: 'config', type: 'nominal', title: 'config', scale: configColourScale(results, configs), legend: CONFIG_LEGEND } as const;
  const x = { field: 'step', type: 'quantitative', title: 'step', axis: { format: '~s' } } as const;
  const y = (field: string) => ({ field, type: 'quantitative', title: metric, scale: { zero: false } }) as const;
  const band = intervalLabels(bandMethods);
  const runCount = curves.reduce((total, c) => total + c.runs.length, 0);

  const hasSeeds = seeds.some((row) => row['value'] !== null);
  const hasBand = summary.some((row) => row['low'] !== null);
  const hasMean = summary.some((row) => row['mean'] !== null);
  if (!hasSeeds && !hasMean) return null;

  // A layer whose data has no drawable value is left out (Vega warns on an empty extent).
  const layers: Layer[] = [];
  if (hasSeeds) {
    layers.push({
      name: 'seeds',
      data: { values: seeds },
      mark: { type: 'line', strokeWidth: 0.8, opacity: 0.35 },
      encoding: {
        x,
        y: y('value'),
        color,
        detail: { field: 'run', type: 'nominal' },
        tooltip: [
          { field: 'config', type: 'nominal', title: 'config' },
          { field: 'seed', type: 'nominal', title: 'seed' },
        ],
      },
    });
  }
  if (hasBand) {
    layers.push({
      name: 'band',
      data: { values: summary },
      mark: { type: 'area', opacity: 0.2 },
      encoding: { x, y: y('low'), y2: { field: 'high' }, color },
    });
  }
  if (hasMean) {
    layers.push(
      {
        name: 'mean',
        data: { values: summary },
        mark: { type: 'line', strokeWidth: 2.2 },
        encoding: { x, y: y('mean'), color },
      },
      {
        name: 'hover',
        data: { values: summary.filter((row) => row['mean'] !== null) },
        mark: { type: 'point', filled: true, size: 50, opacity: 0 },
        encoding: {
          x,
          y: y('mean'),
          color,
          tooltip: [
            { field: 'config', type: 'nominal', title: 'config' },
            { field: 'step', type: 'quantitative', title: 'step', format: STEP_FORMAT },
            { field: 'mean', type: 'quantitative', title: 'mean', format: NUMBER_FORMAT },
            { field: 'low', type: 'quantitative', title: 'interval low', format: NUMBER_FORMAT },
            { field: 'high', type: 'quantitative', title: 'interval high', format: NUMBER_FORMAT },
            { field: 'band', type: 'nominal', title: 'band' },
            { field: 'n', type: 'quantitative', title: 'runs' },
          ],
        },
      },
    );
  }

  return {
    ...chartFrame({
      title: `${metric}: learning curves`,
      subtitle: [
        `Thick line: mean across seeds. Thin lines: single seeds (${runCount}).`,
        band === '' ? 'No band: too few seeds per step for an interval.' : `Band: ${band} of the mean across seeds, per step.`,
      ],
      description: `Learning curves of ${metric} against step for ${curves.length} config${curves.length === 1 ? '' : 's'}: mean across seeds${band === '' ? '' : ` with a ${band} band`}, and ${runCount} single-seed lines.`,
    }),
    layer: layers,
  };
}
