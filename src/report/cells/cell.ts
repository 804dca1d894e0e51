/**
 * What every notebook cell shares: the per-render state, the cell interface, argument checks and
 * chart slots.
 *
 * Charts and the synchronous template. Handlebars runs helpers synchronously, while rendering a
 * chart to SVG is asynchronous. A cell therefore builds its HTML at once, with a placeholder
 * comment `<!--seedsift-chart:N-->` where chart N goes, and records the chart's spec in the
 * render state; after the template has run, `renderNotebook` awaits the SVG of every recorded
 * chart (only the charts the notebook asked for) and puts each in its place. Data cannot forge a
 * placeholder: every data value is escaped, so `<!--` from data reads `&lt;!--`.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { MetricRecord, Results } from '../../analysis/results.js';
import { hasLegendToggle, LEGEND_TOGGLE_HINT } from '../charts/legendToggle.js';
import { escapeHtml, visibleText } from '../escape.js';

/**
 * The state of one render, made fresh for each render. `charts` and `cells` are collectors that
 * the cells append to (the only mutation in the report layer, confined to one render).
 */
export interface RenderState {
  readonly results: Results;
  /** Notebook file and the line on which its body starts (for error messages). */
  readonly file: string;
  readonly bodyLine: number;
  readonly charts: TopLevelSpec[];
  readonly cells: string[];
  /** Heading ids, unique within the page. */
  readonly slug: (text: string) => string;
}

/** Arguments of one cell call: positional parameters and `key=value` options. */
export interface CellCall {
  readonly params: readonly unknown[];
  readonly hash: Readonly<Record<string, unknown>>;
}

/** A notebook cell: a Handlebars helper that renders part of `Results` as HTML. */
export interface Cell {
  readonly name: string;
  /** How to call it, for error messages: `{{curves "val_acc"}}`. */
  readonly usage: string;
  /** Fewest and most positional parameters. */
  readonly arity: readonly [number, number];
  /** Allowed `key=value` options. */
  readonly options: readonly string[];
  /**
   * Build the cell's HTML (arity and options already checked). Throws
   * CellError on a bad argument (the caller adds file and line).
   */
  render(state: RenderState, call: CellCall): string;
}

/** A mistake in a cell call (unknown metric, wrong argument); becomes SeedsiftError('notebook') with the line. */
export class CellError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'CellError';
  }
}

/** Quote a name for an error message (hidden characters visible, cut when long). */
export function quoted(name: string): string {
  return `'${visibleText(name, 80)}'`;
}

/**
 * Check a call's arity and options against the cell's declaration.
 * Throws CellError naming the usage. Cost O(arguments).
 */
export function checkCall(cell: Cell, call: CellCall): void {
  const [low, high] = cell.arity;
  const n = call.params.length;
  if (n < low || n > high) {
    throw new CellError(
      `expected ${low === high ? low : `${low} to ${high}`} argument${high === 1 ? '' : 's'} (${cell.usage}), got ${n}`,
    );
  }
  for (const key of Object.keys(call.hash)) {
    if (!cell.options.includes(key)) {
      const allowed = cell.options.length === 0 ? 'no options' : `options ${cell.options.join(', ')}`;
      throw new CellError(`unknown option ${quoted(key)}; ${cell.name} takes ${allowed} (${cell.usage})`);
    }
  }
}

/**
 * The metric named by positional parameter `index`: it must be text naming a metric of Results.
 * Throws CellError listing the metrics there are. Cost O(metrics).
 */
export function metricParam(state: RenderState, call: CellCall, index: number): MetricRecord {
  const name = call.params[index];
  if (typeof name !== 'string') throw new CellError(`expected a metric name in quotes, got ${String(name)}`);
  const metric = state.results.metrics.find((m) => m.name === name);
  if (metric === undefined) {
    const known = state.results.metrics.map((m) => quoted(m.name)).join(', ');
    throw new CellError(`no metric ${quoted(name)} in these runs; the metrics are ${known === '' ? 'none' : known}`);
  }
  return metric;
}

/**
 * The summary a cell shows: its `summary=` option, else the report's summary. With an option,
 * Results must hold values or comparisons of that metric under that summary.
 * Throws CellError naming the summaries there are. Cost O(values + comparisons).
 */
export function summaryOption(state: RenderState, call: CellCall, metric: string): string {
  const given = call.hash.summary;
  if (given === undefined) return state.results.settings.summary;
  if (typeof given !== 'string') throw new CellError(`summary: expected text such as "last:10%", got ${String(given)}`);
  const present = new Set([
    ...state.results.values.filter((v) => v.metric === metric).map((v) => v.summary),
    ...(state.results.configValues ?? []).filter((v) => v.metric === metric).map((v) => v.summary),
    ...state.results.comparisons.filter((c) => c.metric === metric).map((c) => c.summary),
  ]);
  if (!present.has(given)) {
    const list = [...present].map(quoted).join(', ');
    throw new CellError(
      `no results for ${quoted(metric)} under summary ${quoted(given)}; these results ` +
        `hold ${list === '' ? 'none' : list} (run the report with --summary ${given})`,
    );
  }
  return given;
}

/**
 * A figure for a chart: records the spec and returns the figure with a placeholder where the SVG
 * goes, and the caption (text, escaped here; none when empty). A chart whose legend toggles
 * configs gets a hint saying how, which the style sheet shows only once the chart is live. A null
 * spec gives the `missing` note instead.
 * Cost O(1) (the spec is rendered later). Never throws.
 */
export function figureHtml(state: RenderState, spec: TopLevelSpec | null, caption: string, missing: string): string {
  if (spec === null) return `<p class="note">${escapeHtml(visibleText(missing))}</p>`;
  const index = state.charts.push(spec) - 1;
  const hint = hasLegendToggle(spec) ? `<p class="chart-hint">${escapeHtml(LEGEND_TOGGLE_HINT)}</p>` : '';
  const figcaption = caption === '' ? '' : `<figcaption>${escapeHtml(visibleText(caption))}</figcaption>`;
  return `<figure class="chart" id="chart-${index + 1}"><!--seedsift-chart:${index}-->${hint}${figcaption}</figure>`;
}

/** The placeholder pattern that `figureHtml` leaves for chart N. */
export const CHART_PLACEHOLDER = /<!--seedsift-chart:(\d+)-->/g;

/** Tables with more rows than this are folded (`foldWhenLong`). */
export const FOLD_ROWS = 24;

/**
 * A long block folded in `<details>` with `summary` as its label (escaped); short ones as they are.
 * Cost O(1). Never throws.
 */
export function foldWhenLong(html: string, rows: number, summary: string): string {
  if (rows <= FOLD_ROWS) return html;
  return `<details class="fold"><summary>${escapeHtml(visibleText(summary))}</summary>${html}</details>`;
}
