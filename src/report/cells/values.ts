/**
 * `{{values "val_acc"}}` (option `summary="last:10%"`): each run's summary value, by config, as a
 * chart (`valuesChart`) and a table: runs with a value, the mean across seeds with its interval (as
 * `Results.configValues` holds them; nothing is computed here), every value by seed, and the runs
 * without a value with the reason.
 */
import type { ConfigValue, Results, RunValue } from '../../analysis/results.js';
import { taskValuesChart } from '../charts/taskPanels.js';
import { valuesChart } from '../charts/valuesChart.js';
import { decimalsFor, formatIntervalKind, formatNumber } from '../format.js';
import { nameHtml, tableHtml, textHtml, type TableCell } from '../html.js';
import { figureHtml, foldWhenLong, metricParam, summaryOption, type Cell } from './cell.js';

/** Configs up to which the table lists every seed's value. */
export const SEEDS_LISTED_UP_TO = 60;

function valuesList(values: readonly RunValue[], decimals: number): string {
  return values
    .map((v) => {
      const value = v.value === null ? '—' : formatNumber(v.value, decimals);
      const note = v.note === null ? '' : ` (${v.note})`;
      const cls = v.usedInTests ? 'value' : 'value unused';
      return `<span class="${cls}">${textHtml(`seed ${v.seed}: ${value}${note}`)}</span>`;
    })
    .join('<span class="sep">, </span>');
}

function meanCell(cv: ConfigValue | undefined, decimals: number): TableCell {
  if (cv === undefined || cv.mean === null) return null;
  const interval =
    cv.low === null || cv.high === null
      ? ''
      : ` [${formatNumber(cv.low, decimals)}, ${formatNumber(cv.high, decimals)}]`;
  return `${formatNumber(cv.mean, decimals)}${interval}`;
}

/**
 * The scale that sets the digits shown: the pooled SD of a
 * comparison, else the widest interval, else the range of the values.
 */
function scaleOf(
  r: Results,
  metric: string,
  summary: string,
  cvs: readonly ConfigValue[],
  vs: readonly RunValue[],
): number | null {
  const c = r.comparisons.find((x) => x.metric === metric && x.summary === summary && x.detectable.sd !== null);
  if (c !== undefined) return c.detectable.sd;
  const halves = cvs
    .map((cv) => (cv.low === null || cv.high === null ? 0 : (cv.high - cv.low) / 2))
    .filter((h) => h > 0);
  if (halves.length > 0) return Math.max(...halves);
  const xs = vs.map((v) => v.value).filter((v): v is number => v !== null && Number.isFinite(v));
  if (xs.length === 0) return null;
  const range = Math.max(...xs) - Math.min(...xs);
  return range > 0 ? range / 4 : Math.abs(xs[0] ?? 0) / 100;
}

export const values: Cell = {
  name: 'values',
  usage: '{{values "METRIC"}} or {{values "METRIC" summary="last:10%"}}',
  arity: [1, 1],
  options: ['summary'],
  render(state, call) {
    const m = metricParam(state, call, 0);
    const summary = summaryOption(state, call, m.name);
    const r = state.results;
    const mine = r.values.filter((v) => v.metric === m.name && v.summary === summary);
    const cvs = (r.configValues ?? []).filter((cv) => cv.metric === m.name && cv.summary === summary);
    const decimals = decimalsFor(scaleOf(r, m.name, summary, cvs, mine));
    const kinds = [...new Set(cvs.map((cv) => formatIntervalKind(cv)))].join(' or ');
    const rows: TableCell[][] = [];
    for (const config of r.configs) {
      const vs = mine.filter((v) => v.config === config.id);
      if (vs.length === 0) continue;
      const usedCount = vs.filter((v) => v.usedInTests && v.value !== null).length;
      rows.push([
        { html: nameHtml(config.id) },
        `${usedCount} of ${vs.length}`,
        meanCell(
          cvs.find((cv) => cv.config === config.id),
          decimals,
        ),
        { html: valuesList(vs, decimals) },
      ]);
    }
    const caption = `The tests compare these per-run numbers (summary ${summary}); the table lists them by seed.`;
    const chart = figureHtml(
      state,
      r.settings.taskKey === null ? valuesChart(r, m.name, summary) : taskValuesChart(r, m.name, summary),
      caption,
      `No per-run values of ${m.name} under summary ${summary}.`,
    );
    if (rows.length === 0) return chart;
    const meanHead = kinds === '' ? 'Mean' : `Mean [${kinds}]`;
    // Many configs: the seeds' values stay in the chart and results.json; the table keeps the means.
    const bySeed = rows.length <= SEEDS_LISTED_UP_TO;
    const table = tableHtml({
      className: 'values',
      head: ['Config', 'Runs used', meanHead, ...(bySeed ? ['Values by seed'] : [])],
      rows: bySeed ? rows : rows.map((row) => row.slice(0, 3)),
      numeric: [1, 2],
    });
    return chart + foldWhenLong(table, rows.length, `Values of all ${rows.length} configs, by seed`);
  },
};
