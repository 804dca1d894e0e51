/**
 * Learning curves: for each config, the mean across seeds as a line, its interval as a band, and
 * each seed as a thin line, against the training step.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { IntervalMethod, Results } from '../../analysis/results.js';
import { CONFIG_LEGEND, configColourScale, MUTED_INK, REFERENCE_INK } from '../palette.js';
import { HIGHLIGHT_FROM } from '../studyShape.js';
import { chartFrame, NUMBER_FORMAT, STEP_FORMAT, type Layer } from './chartFrame.js';
import { coarsenLine, lineStride } from './coarsenLine.js';
import { intervalLabel, intervalLabels } from './intervalLabel.js';
import { layerOpacity, withLegendToggle } from './legendToggle.js';

/** Most points the single-seed lines of one chart hold (all lines together). */
export const SEED_POINTS = 24_000;
/**
 * Most points of one single-seed line: 200 across the 520-pixel plot is one point every 2.6
 * pixels, as fine as a thin translucent line can show (400 bins drawn in full cost a curves chart
 * about 350 ms to render and 355 KB of SVG on the medium benchmark; at 200, 220 ms and 235 KB).
 */
export const SEED_LINE_POINTS = 200;

/**
 * Vega-Lite spec of the learning curves of one metric (`Results.curves`), one colour per config.
 * Draws what `Results` carries, computes nothing: the mean line breaks where `mean` is null, the
 * band (`low`..`high`, labelled with its method and level in the subtitle, per bin from
 * `bandByBin` when present, else `band`; each bin's method also in the tooltip) where either end is
 * null, and each seed's line (`Curve.runs`) where its value is null. Hover points on the mean
 * carry tooltips (step, mean, interval, runs in the bin). A dashed vertical rule marks the metric's
 * step where the metric's comparisons are made (`MetricRecord.horizon`, when they share one). A layer with nothing to
 * draw is left out.
 * Clicking a config in the legend fades the others (`withLegendToggle`).
 * Data is stored compactly: one row per run (seed lines) or per config (mean and band) holding
 * its steps and values as parallel arrays, which a `flatten` transform turns back into one row
 * per step (a row names its config and seed once instead of at every step: the bulk of a long
 * curve's bytes).
 * Single-seed lines hold at most `SEED_LINE_POINTS` points each and `SEED_POINTS` in all: beyond
 * that each is drawn with one point per group of consecutive bins (`coarsenLine`), and the
 * subtitle says so; the mean and its band keep every bin. (400 runs x 400 bins drawn in full made the page's
 * rendering take 1.4 GB of memory and 20 s.)
 * Returns null when the metric has no curve with a value. Cost O(configs * bins * seeds). Never throws.
 * Example: `curvesChart(results, 'val_acc')` → a layered spec with layers seeds, band, mean, hover.
 */
export function curvesChart(results: Results, metric: string): TopLevelSpec | null {
  const curves = results.curves.filter((c) => c.metric === metric && c.steps.length > 0);
  if (curves.length === 0) return null;
  const runCount = curves.reduce((total, c) => total + c.runs.length, 0);
  const bins = Math.max(...curves.map((c) => c.steps.length));
  const stride = Math.max(lineStride(runCount, bins, SEED_POINTS), lineStride(1, bins, SEED_LINE_POINTS));

  const summary: {
    config: string;
    step: number[];
    mean: (number | null)[];
    low: (number | null)[];
    high: (number | null)[];
    n: number[];
    band: string[];
  }[] = [];
  const seeds: { config: string; run: string; seed: string; step: number[]; value: (number | null)[] }[] = [];
  const bandMethods: { method: IntervalMethod; level: number }[] = [];
  for (const c of curves) {
    const row = {
      config: c.config,
      step: [...c.steps],
      mean: [] as (number | null)[],
      low: [] as (number | null)[],
      high: [] as (number | null)[],
      n: [] as number[],
      band: [] as string[],
    };
    c.steps.forEach((_, i) => {
      const low = c.low[i] ?? null;
      const high = c.high[i] ?? null;
      const banded = low !== null && high !== null;
      const method = c.bandByBin?.[i] ?? c.band;
      if (banded && method !== 'none') bandMethods.push({ method, level: c.level });
      row.mean.push(c.mean[i] ?? null);
      row.low.push(banded ? low : null);
      row.high.push(banded ? high : null);
      row.n.push(c.n[i] ?? 0);
      row.band.push(banded ? intervalLabel(method, c.level) : 'none');
    });
    summary.push(row);
    for (const r of c.runs) {
      const line = coarsenLine(
        c.steps,
        c.steps.map((_, i) => r.values[i] ?? null),
        stride,
      );
      seeds.push({ config: c.config, run: r.run, seed: r.seed, step: line.steps, value: line.values });
    }
  }

  const configs = curves.map((c) => c.config);
  const scale = configColourScale(results, configs);
  // Many configs: the legend lists only the highlighted ones (the rest are drawn grey).
  const many = configs.length >= HIGHLIGHT_FROM;
  const named = many ? scale.domain.filter((_, i) => scale.range[i] !== MUTED_INK) : scale.domain;
  const color = {
    field: 'config',
    type: 'nominal',
    title: 'config',
    scale,
    legend: many ? { ...CONFIG_LEGEND, values: named } : CONFIG_LEGEND,
  } as const;
  const x = { field: 'step', type: 'quantitative', title: 'step', axis: { format: '~s' } } as const;
  const y = (field: string) => ({ field, type: 'quantitative', title: metric, scale: { zero: false } }) as const;
  const band = intervalLabels(bandMethods);

  // Beyond a dozen configs single seeds are left out (the per-seed chart shows every one).
  const hasSeeds = !many && seeds.some((row) => row.value.some((v) => v !== null));
  const hasBand = summary.some((row) => row.low.some((v) => v !== null));
  const hasMean = summary.some((row) => row.mean.some((v) => v !== null));
  const perStep = { flatten: ['step', 'mean', 'low', 'high', 'n', 'band'] };
  if (!hasSeeds && !hasMean) return null;

  const horizon = results.metrics.find((m) => m.name === metric && m.kind === 'scalar')?.horizon ?? null;

  // A layer whose data has no drawable value is left out (Vega warns on an empty extent).
  const layers: Layer[] = [];
  if (horizon !== null) {
    layers.push({
      name: 'horizon',
      data: { values: [{ step: horizon }] },
      mark: { type: 'rule', color: REFERENCE_INK, strokeDash: [4, 4], strokeWidth: 1 },
      encoding: {
        x,
        tooltip: [{ field: 'step', type: 'quantitative', title: 'step compared at', format: STEP_FORMAT }],
      },
    });
  }
  if (hasSeeds) {
    layers.push({
      name: 'seeds',
      data: { values: seeds },
      transform: [{ flatten: ['step', 'value'] }],
      mark: { type: 'line', strokeWidth: 0.8 },
      encoding: {
        x,
        y: y('value'),
        color,
        opacity: layerOpacity(0.35, configs.length),
        detail: { field: 'run', type: 'nominal' },
        tooltip: [
          { field: 'config', type: 'nominal', title: 'config' },
          { field: 'seed', type: 'nominal', title: 'seed' },
        ],
      },
    });
  }
  // Many configs: bands and hover points only for the highlighted ones (grey lines are context).
  const focus = many ? summary.filter((row) => named.includes(row.config)) : summary;
  if (hasBand && focus.some((row) => row.low.some((v) => v !== null))) {
    layers.push({
      name: 'band',
      data: { values: focus },
      transform: [perStep],
      mark: { type: 'area' },
      encoding: { x, y: y('low'), y2: { field: 'high' }, color, opacity: layerOpacity(0.2, configs.length) },
    });
  }
  if (hasMean) {
    // Many configs: the grey ones are drawn first, thin, so the highlighted lines stay on top.
    const context = many ? summary.filter((row) => !named.includes(row.config)) : [];
    if (context.length > 0)
      layers.push({
        name: 'context',
        data: { values: context },
        transform: [perStep],
        mark: { type: 'line', strokeWidth: 1, opacity: 0.6 },
        encoding: { x, y: y('mean'), color },
      });
    layers.push(
      {
        name: 'mean',
        data: { values: many ? focus : summary },
        transform: [perStep],
        mark: { type: 'line', strokeWidth: 2.2 },
        encoding: { x, y: y('mean'), color, opacity: layerOpacity(1, configs.length) },
      },
      {
        name: 'hover',
        data: { values: focus },
        transform: [perStep, { filter: { field: 'mean', valid: true } }],
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
        many
          ? `Line: mean across seeds; single seeds are left out at ${configs.length} configs. The baseline ` +
            `and ${named.length - 1} decided candidates in colour, the other ${configs.length - named.length} in grey.`
          : `Thick line: mean across seeds. Thin lines: single seeds ` +
            `(${runCount})${stride === 1 ? '' : `, each drawn with one point per ${stride} bins`}.`,
        band === ''
          ? 'No band: too few seeds per step for an interval.'
          : `Band: ${band} of the mean across seeds, per step.`,
        ...(horizon === null ? [] : [`Dashed line: step ${horizon}, where this metric's comparisons are made.`]),
      ],
      description:
        `Learning curves of ${metric} against step for ${curves.length} ` +
        `config${curves.length === 1 ? '' : 's'}: mean across ` +
        `seeds${band === '' ? '' : ` with a ${band} band`}, and ${runCount} single-seed lines.`,
    }),
    layer: withLegendToggle(layers, configs.length, ['seeds', 'mean']),
  };
}
