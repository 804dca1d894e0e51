/**
 * `{{aggregates}}` / `{{aggregates "METRIC"}}`: the across-task aggregates of `--task-key`
 * (interquartile mean with its stratified bootstrap interval, probability of improvement averaged
 * over tasks, performance profiles; `Results.tasks`) under a heading of its own, as two charts and
 * a table, with how scores were normalised and which tasks were left out. Without aggregates it
 * renders nothing (a section without data is left out). Default metric: the primary one.
 */
import type { Results } from '../../analysis/results.js';
import { escapeAttr } from '../escape.js';
import { formatNumber } from '../format.js';
import { nameHtml, noteHtml, tableHtml, textHtml } from '../html.js';
import { aggregatesChart, profileChart } from '../charts/aggregatesChart.js';
import { primaryMetric } from '../studyShape.js';
import { figureHtml, metricParam, type Cell, type RenderState } from './cell.js';

/** Tasks named in the left-out note before the rest are counted. */
const NAMED = 12;

function leftOutNote(leftOut: readonly string[]): string {
  if (leftOut.length === 0) return 'Every task was aggregated.';
  const named = leftOut.slice(0, NAMED).join(', ');
  const more = leftOut.length > NAMED ? ` and ${leftOut.length - NAMED} more` : '';
  return `Left out (some compared config has no score there): ${named}${more}.`;
}

/**
 * The aggregates section of one metric, or '' when `Results.tasks` holds none for it.
 * Cost O(groups) plus two charts. Never throws.
 */
export function aggregatesHtml(state: RenderState, metric: string): string {
  const r: Results = state.results;
  const aggs = r.tasks.filter((t) => t.metric === metric);
  if (aggs.length === 0) return '';
  const id = state.slug(`across tasks ${metric}`);
  const tasks = Math.max(...aggs.map((a) => a.tasks));
  const normalised = aggs.some((a) => a.normalisation !== undefined);
  const leftOut = aggs.find((a) => a.leftOut !== undefined)?.leftOut ?? [];
  const how = normalised
    ? `Scores normalised per task (min-max over all runs of the task: 0 the worst run, 1 the best), so tasks on ` +
      `different scales weigh alike; ${tasks} tasks aggregated. ${leftOutNote(leftOut)}`
    : `Raw scores (not normalised); ${tasks} tasks.`;
  const table = tableHtml({
    className: 'aggregates',
    head: [
      'Config',
      'Interquartile mean [95% stratified bootstrap]',
      'P(candidate better), averaged over tasks',
      'Tasks',
    ],
    rows: aggs.map((a) => [
      { html: nameHtml(a.config) },
      a.interquartileMean === null
        ? null
        : `${formatNumber(a.interquartileMean, 3)}` +
          `${a.low === null || a.high === null ? '' : ` [${formatNumber(a.low, 3)}, ${formatNumber(a.high, 3)}]`}`,
      a.probabilityOfImprovement === null
        ? a.baseline === null
          ? 'baseline'
          : null
        : `${formatNumber(a.probabilityOfImprovement, 3)} v ${a.baseline ?? ''}`,
      String(a.tasks),
    ]),
    numeric: [1, 2, 3],
  });
  const charts =
    figureHtml(state, aggregatesChart(r, metric), '', `No aggregates of ${metric}.`) +
    figureHtml(state, profileChart(r, metric), '', `No performance profile of ${metric}.`);
  return (
    `<h2 id="${escapeAttr(id)}">${textHtml(`Across tasks: ${metric}`)}</h2><div ` +
    `class="aggregates-cell">${noteHtml(how, 'lead')}${charts}${table}</div>`
  );
}

export const aggregates: Cell = {
  name: 'aggregates',
  usage: '{{aggregates}} or {{aggregates "METRIC"}}',
  arity: [0, 1],
  options: [],
  render(state, call) {
    const metric = call.params.length === 1 ? metricParam(state, call, 0).name : primaryMetric(state.results);
    return metric === null ? '' : aggregatesHtml(state, metric);
  },
};
