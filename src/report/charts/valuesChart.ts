/**
 * Per-seed values: one dot per run's summary value, one row per config, with the mean of the
 * values used in tests as a tick.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { Results } from '../../analysis/results.js';
import { configColourScale, MUTED_INK } from '../palette.js';
import { HIGHLIGHT_FROM } from '../studyShape.js';
import { chartFrame, NUMBER_FORMAT, type Layer } from './chartFrame.js';
import { intervalLabel, intervalLabels } from './intervalLabel.js';

/**
 * Vega-Lite spec of the per-run summary values of one metric and summary (`Results.values`):
 * a filled dot per run used in tests, a hollow diamond per run with a value that was not used
 * (its note in the tooltip), spread vertically within the config's row by seed order so that
 * equal values stay visible. The mean tick and its interval line come from `Results.configValues`
 * (mean across seeds, t-interval below 20 runs, BCa at 20 or more); nothing is computed here.
 * Runs without a value are counted in the subtitle.
 * Returns null when no run has a value. Cost O(values + comparisons). Never throws.
 * Example: `valuesChart(results, 'val_acc', 'last:10%')` → layers used, unused, mean.
 */
export function valuesChart(results: Results, metric: string, summary: string): TopLevelSpec | null {
  const values = results.values.filter((v) => v.metric === metric && v.summary === summary);
  if (!values.some((v) => v.value !== null)) return null;

  const order = results.configs.map((c) => c.id);
  const present = [...new Set(values.filter((v) => v.value !== null).map((v) => v.config))];
  // Many configs: only the highlighted ones (baseline, decided candidates) get a row; the table lists all.
  const full = configColourScale(results, present);
  const keep =
    present.length >= HIGHLIGHT_FROM ? new Set(full.domain.filter((_, i) => full.range[i] !== MUTED_INK)) : null;
  const drawn = values.filter((v) => v.value !== null && (keep === null || keep.has(v.config)));
  const configs = [...new Set(drawn.map((v) => v.config))].sort((a, b) => rank(order, a) - rank(order, b));
  const perConfig = new Map<string, number>();
  for (const v of drawn) perConfig.set(v.config, (perConfig.get(v.config) ?? 0) + 1);
  const seen = new Map<string, number>();
  const dots = drawn.map((v) => {
    const index = seen.get(v.config) ?? 0;
    seen.set(v.config, index + 1);
    const count = perConfig.get(v.config) ?? 1;
    // Layout only: spread a row's dots evenly over [-1, 1] in seed order.
    const slot = count === 1 ? 0 : (2 * index) / (count - 1) - 1;
    return {
      config: v.config,
      seed: v.seed,
      run: v.run,
      value: v.value,
      used: v.usedInTests,
      note: v.note ?? '',
      slot,
    };
  });

  const summaries = new Map(
    results.configValues
      .filter((c) => c.metric === metric && c.summary === summary && c.mean !== null)
      .map((c) => [c.config, c]),
  );
  const meanRows = configs.flatMap((config) => {
    const c = summaries.get(config);
    return c === undefined
      ? []
      : [{ config, mean: c.mean, low: c.low, high: c.high, n: c.n, interval: intervalLabel(c.method, c.level) }];
  });
  const withInterval = meanRows.filter((r) => r.low !== null && r.high !== null);

  const scale = configColourScale(results, configs);
  const y = {
    field: 'config',
    type: 'nominal',
    title: null,
    scale: { domain: configs },
    axis: { labelLimit: 200 },
  } as const;
  const x = { field: 'value', type: 'quantitative', title: `${metric} (${summary})`, scale: { zero: false } } as const;
  const color = { field: 'config', type: 'nominal', scale, legend: null } as const;
  const yOffset = { field: 'slot', type: 'quantitative' as const, scale: { domain: [-1.6, 1.6] } };
  const tooltip = [
    { field: 'config', type: 'nominal', title: 'config' },
    { field: 'seed', type: 'nominal', title: 'seed' },
    { field: 'value', type: 'quantitative', title: 'value', format: NUMBER_FORMAT },
    { field: 'note', type: 'nominal', title: 'note' },
  ] as const;
  const meanTooltip = [
    { field: 'config', type: 'nominal', title: 'config' },
    { field: 'mean', type: 'quantitative', title: 'mean across seeds', format: NUMBER_FORMAT },
    { field: 'low', type: 'quantitative', title: 'interval low', format: NUMBER_FORMAT },
    { field: 'high', type: 'quantitative', title: 'interval high', format: NUMBER_FORMAT },
    { field: 'interval', type: 'nominal', title: 'interval' },
    { field: 'n', type: 'quantitative', title: 'runs' },
  ] as const;
  const missing = values.filter((v) => v.value === null).length;
  const unused = dots.filter((d) => !d.used).length;

  const used = dots.filter((d) => d.used);
  // A layer with no rows is left out (Vega warns on an empty extent).
  const layers: Layer[] = [];
  if (used.length > 0) {
    layers.push({
      name: 'used',
      data: { values: used },
      mark: { type: 'point', filled: true, size: 48, opacity: 0.85 },
      encoding: { x, y, yOffset, color, tooltip: [...tooltip] },
    });
  }
  if (unused > 0) {
    layers.push({
      name: 'unused',
      data: { values: dots.filter((d) => !d.used) },
      mark: { type: 'point', filled: false, shape: 'diamond', size: 60, strokeWidth: 1.5 },
      encoding: { x, y, yOffset, color, tooltip: [...tooltip] },
    });
  }
  if (withInterval.length > 0) {
    layers.push({
      name: 'interval',
      data: { values: withInterval },
      mark: { type: 'rule', strokeWidth: 2, opacity: 0.55 },
      encoding: { x: { ...x, field: 'low' }, x2: { field: 'high' }, y, color, tooltip: [...meanTooltip] },
    });
  }
  if (meanRows.length > 0) {
    layers.push({
      name: 'mean',
      data: { values: meanRows },
      mark: { type: 'tick', thickness: 2.5, size: 26, orient: 'vertical' },
      encoding: {
        x: { ...x, field: 'mean' },
        y,
        color,
        tooltip: [...meanTooltip],
      },
    });
  }

  const subtitle = [
    `One dot per seed: filled, used in tests${unused > 0 ? `; hollow diamond, not used (${unused})` : ''}. Bar: ` +
      `mean across seeds; line: ` +
      intervalLabels(
        meanRows.length === 0 ? [] : [...summaries.values()].map((c) => ({ method: c.method, level: c.level })),
      ) +
      ` of the mean.`,
  ];
  if (keep !== null)
    subtitle.push(
      `Of ${present.length} configs, only the baseline and the decided candidates are drawn ` +
        `(${configs.length}); the table lists every one.`,
    );
  if (missing > 0)
    subtitle.push(
      `${missing} run${missing === 1 ? ' has' : 's have'} no value (diverged, censored or missing) ` +
        `and ${missing === 1 ? 'is' : 'are'} not drawn.`,
    );

  return {
    ...chartFrame({
      title: `${metric}: one value per seed (${summary})`,
      subtitle,
      description:
        `Per-seed ${summary} values of ${metric} for ${configs.length} ` +
        `config${configs.length === 1 ? '' : 's'} (${drawn.length} runs ` +
        `drawn${missing > 0 ? `, ${missing} without a value` : ''}), with the mean across seeds of each config ` +
        `and its interval.`,
      height: { step: 40 },
    }),
    layer: layers,
  };
}

function rank(order: readonly string[], id: string): number {
  const i = order.indexOf(id);
  return i < 0 ? order.length : i;
}
