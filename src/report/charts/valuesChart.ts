/**
 * Per-seed values: one dot per run's summary value, one row per config, with the mean of the
 * values used in tests as a tick.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { Results } from '../../analysis/results.js';
import { CONFIG_LEGEND, configColourScale } from '../palette.js';
import { chartFrame, NUMBER_FORMAT, type Layer } from './chartFrame.js';

/**
 * Vega-Lite spec of the per-run summary values of one metric and summary (`Results.values`):
 * a filled dot per run used in tests, a hollow diamond per run with a value that was not used
 * (its note in the tooltip), spread vertically within the config's row by seed order so that
 * equal values stay visible. The mean tick is the arm mean the comparisons report
 * (`Comparison.mean` of the first comparison naming the config); nothing is computed here, and
 * `Results` carries no per-config interval, so none is drawn. Runs without a value are counted in
 * the subtitle.
 * Returns null when no run has a value. Cost O(values + comparisons). Never throws.
 * Example: `valuesChart(results, 'val_acc', 'last:10%')` → layers used, unused, mean.
 */
export function valuesChart(results: Results, metric: string, summary: string): TopLevelSpec | null {
  const values = results.values.filter((v) => v.metric === metric && v.summary === summary);
  const drawn = values.filter((v) => v.value !== null);
  if (drawn.length === 0) return null;

  const order = results.configs.map((c) => c.id);
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
    return { config: v.config, seed: v.seed, run: v.run, value: v.value, used: v.usedInTests, note: v.note ?? '', slot };
  });

  const means = new Map<string, { mean: number; n: number }>();
  for (const c of results.comparisons) {
    if (c.metric !== metric || c.summary !== summary) continue;
    if (c.mean.baseline !== null && !means.has(c.baseline)) means.set(c.baseline, { mean: c.mean.baseline, n: c.n.baseline });
    if (c.mean.candidate !== null && !means.has(c.candidate)) means.set(c.candidate, { mean: c.mean.candidate, n: c.n.candidate });
  }
  const meanRows = configs.filter((c) => means.has(c)).map((config) => ({ config, ...means.get(config) }));

  const scale = configColourScale(results, configs);
  const y = { field: 'config', type: 'nominal', title: null, scale: { domain: configs }, axis: { labelLimit: 200 } } as const;
  const x = { field: 'value', type: 'quantitative', title: `${metric} (${summary})`, scale: { zero: false } } as const;
  const color = { field: 'config', type: 'nominal', scale, legend: null } as const;
  const yOffset = { field: 'slot', type: 'quantitative' as const, scale: { domain: [-1.6, 1.6] } };
  const tooltip = [
    { field: 'config', type: 'nominal', title: 'config' },
    { field: 'seed', type: 'nominal', title: 'seed' },
    { field: 'value', type: 'quantitative', title: 'value', format: NUMBER_FORMAT },
    { field: 'note', type: 'nominal', title: 'note' },
  ] as const;
  const missing = values.length - drawn.length;
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
  if (meanRows.length > 0) {
    layers.push({
      name: 'mean',
      data: { values: meanRows },
      mark: { type: 'tick', thickness: 2.5, size: 26, orient: 'vertical' },
      encoding: {
        x: { ...x, field: 'mean' },
        y,
        color,
        tooltip: [
          { field: 'config', type: 'nominal', title: 'config' },
          { field: 'mean', type: 'quantitative', title: 'mean (used in tests)', format: NUMBER_FORMAT },
          { field: 'n', type: 'quantitative', title: 'runs' },
        ],
      },
    });
  }

  const subtitle = [
    `One dot per seed: filled, used in tests${unused > 0 ? `; hollow diamond, not used (${unused})` : ''}. Bar: mean of the values used in tests.`,
  ];
  if (missing > 0) subtitle.push(`${missing} run${missing === 1 ? ' has' : 's have'} no value (diverged, censored or missing) and ${missing === 1 ? 'is' : 'are'} not drawn.`);
  if (meanRows.length < configs.length) subtitle.push('Configs in no comparison have no mean bar.');

  return {
    ...chartFrame({
      title: `${metric}: one value per seed (${summary})`,
      subtitle,
      description: `Per-seed ${summary} values of ${metric} for ${configs.length} config${configs.length === 1 ? '' : 's'} (${drawn.length} runs drawn${missing > 0 ? `, ${missing} without a value` : ''}), with the mean of each config's values used in tests.`,
      height: { step: 40 },
    }),
    layer: layers,
  };
}

function rank(order: readonly string[], id: string): number {
  const i = order.indexOf(id);
  return i < 0 ? order.length : i;
}
