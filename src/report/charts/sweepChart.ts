/**
 * A sweep chart (`sweepModel`): the summary value against a numeric config key, one line per
 * combination of the other keys, each point the mean across seeds with its interval as a vertical
 * bar. The key's axis is linear, or logarithmic (base 2) when its values are positive and span a
 * factor of 8 or more (tick counts and widths usually double). With more than 8 lines, the other
 * key with fewest values (at most 6) splits the chart into side-by-side panels sharing the y axis,
 * and colour tells the remaining keys apart.
 */
import type { TopLevelSpec } from 'vega-lite';
import { CHART_CONFIG, CONFIG_COLOURS, CONFIG_LEGEND } from '../palette.js';
import type { Sweep } from '../sweepModel.js';
import { VEGA_LITE_SCHEMA, wrapLines } from './chartFrame.js';
import { intervalLabel } from './intervalLabel.js';

/** Lines drawn in one panel before the chart is split into panels. */
export const LINES_PER_PANEL = 8;

/**
 * Vega-Lite spec of one sweep; null when it has fewer than two key values.
 * Cost O(points). Never throws.
 * Example: demo val_acc against ticks → two lines (memory=4, memory=12) over ticks 8, 16, 32.
 */
export function sweepChart(sweep: Sweep): TopLevelSpec | null {
  if (sweep.xs.length < 2) return null;
  const values = new Map<string, Set<string>>();
  for (const s of sweep.series)
    for (const [k, v] of Object.entries(s.params)) values.set(k, (values.get(k) ?? new Set()).add(v));
  const panelKey =
    sweep.series.length > LINES_PER_PANEL
      ? ([...values].filter(([, vs]) => vs.size > 1 && vs.size <= 6).sort((a, b) => a[1].size - b[1].size)[0]?.[0] ??
        null)
      : null;
  const colourKeys = sweep.others.filter((k) => k !== panelKey);
  const rows = sweep.series.flatMap((s) =>
    s.points.map((p) => ({
      x: p.x,
      mean: p.mean,
      low: p.low,
      high: p.high,
      n: p.n,
      config: p.config,
      line: colourKeys.map((k) => `${k}=${s.params[k]}`).join(',') || 'all',
      panel: panelKey === null ? '' : `${panelKey}=${s.params[panelKey]}`,
    })),
  );
  const lines = [...new Set(rows.map((r) => r.line))];
  const xs = sweep.xs;
  const log = (xs[0] ?? 0) > 0 && (xs[xs.length - 1] ?? 0) / (xs[0] ?? 1) >= 8;
  const x = {
    field: 'x',
    type: 'quantitative',
    title: sweep.key,
    scale: log ? { type: 'log', base: 2, nice: false } : { zero: false, nice: false },
    axis: { values: [...xs], format: ',.6~g' },
  } as const;
  const y = {
    field: 'mean',
    type: 'quantitative',
    title: `${sweep.metric} (${sweep.summary})`,
    scale: { zero: false },
  } as const;
  const colour = {
    field: 'line',
    type: 'nominal',
    title: colourKeys.join(', ') || 'configs',
    scale: { domain: lines, range: lines.map((_, i) => CONFIG_COLOURS[i % CONFIG_COLOURS.length] ?? '#000') },
    legend: lines.length > 1 ? { ...CONFIG_LEGEND, columns: lines.length > 6 ? 3 : 2 } : null,
  } as const;
  const tooltip = [
    { field: 'config', type: 'nominal', title: 'config' },
    { field: 'mean', type: 'quantitative', title: 'mean', format: '.4~g' },
    { field: 'low', type: 'quantitative', title: 'interval low', format: '.4~g' },
    { field: 'high', type: 'quantitative', title: 'interval high', format: '.4~g' },
    { field: 'n', type: 'quantitative', title: 'runs' },
  ];
  const layer = [
    {
      mark: { type: 'rule', strokeWidth: 1.5, opacity: 0.7 },
      transform: [{ filter: 'isValid(datum.low) && isValid(datum.high)' }],
      encoding: { x, y: { field: 'low', type: 'quantitative' }, y2: { field: 'high' }, color: colour },
    },
    { mark: { type: 'line', strokeWidth: 1.8 }, encoding: { x, y, color: colour } },
    { mark: { type: 'point', filled: true, size: 40 }, encoding: { x, y, color: colour, tooltip } },
  ];
  const panels = panelKey === null ? 1 : new Set(rows.map((r) => r.panel)).size;
  const width = panelKey === null ? 480 : Math.max(140, Math.floor(760 / panels) - 20);
  const head = {
    $schema: VEGA_LITE_SCHEMA,
    description:
      `${sweep.metric} against ${sweep.key}: mean across seeds with its interval, one line ` +
      `per ${colourKeys.join(', ') || 'config'}${panelKey === null ? '' : `, one panel per ${panelKey}`}.`,
    title: {
      text: `${sweep.metric} against ${sweep.key}`,
      subtitle: wrapLines(
        [
          `Points: mean across seeds of each config's ${sweep.summary} value; bars: ` +
            `its ${intervalLabel(sweep.method, sweep.level)} (between seeds).`,
          `One line per ${colourKeys.join(', ') || 'config'}` +
            `${panelKey === null ? '' : `; one panel per ${panelKey}`}` +
            `${log ? `; ${sweep.key} on a doubling scale` : ''}.`,
        ],
        90,
      ),
    },
    config: CHART_CONFIG,
    data: { values: rows },
  };
  if (panelKey === null) return { ...head, width, height: 240, layer } as unknown as TopLevelSpec;
  return {
    ...head,
    facet: { column: { field: 'panel', type: 'nominal', title: null, header: { labelFontSize: 11 } } },
    spec: { width, height: 200, layer },
    resolve: { scale: { y: 'shared' } },
  } as unknown as TopLevelSpec;
}
