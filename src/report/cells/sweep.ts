/**
 * `{{sweep}}` / `{{sweep "METRIC"}}` (options `key=`, `summary=`): "does more of this help?". For
 * each numeric config key (`sweepKeys`; or the one named by `key=`), the metric's summary value
 * against that key, one line per combination of the other keys, with intervals
 * (`sweepModel`, `sweepChart`) with the same numbers as a small table (folded), under a heading of
 * its own. Renders nothing when the study has no
 * numeric key or uses a task key (sweeps across tasks are not drawn). Default metric: the primary one.
 */
import { escapeAttr } from '../escape.js';
import { formatNumber } from '../format.js';
import { nameHtml, noteHtml, tableHtml, textHtml } from '../html.js';
import { sweepChart } from '../charts/sweepChart.js';
import { primaryMetric, sweepKeys } from '../studyShape.js';
import { type Sweep, sweepDecimals, sweepModel } from '../sweepModel.js';
import { CellError, figureHtml, metricParam, quoted, summaryOption, type Cell } from './cell.js';

export const sweep: Cell = {
  name: 'sweep',
  usage: '{{sweep}} or {{sweep "METRIC" key="ticks" summary="final"}}',
  arity: [0, 1],
  options: ['key', 'summary'],
  render(state, call) {
    const r = state.results;
    const metric = call.params.length === 1 ? metricParam(state, call, 0).name : primaryMetric(r);
    if (metric === null) return '';
    const summary = summaryOption(state, call, metric);
    const keys = sweepKeys(r);
    const given = call.hash.key;
    if (given !== undefined && (typeof given !== 'string' || !keys.includes(given))) {
      const list = keys.map(quoted).join(', ');
      throw new CellError(
        `key: expected a numeric config key (${list === '' ? 'this study has none' : list}), ` +
          `got ${quoted(String(given))}`,
      );
    }
    if (r.settings.taskKey !== null) return '';
    const figures = (given === undefined ? keys : [given])
      .map((k) => sweepModel(r, metric, summary, k))
      .filter((s) => s !== null)
      .map(
        (s) =>
          figureHtml(
            state,
            sweepChart(s),
            'Intervals are for looking; the tests in the details decide.',
            `No ${s.key} sweep of ${s.metric}.`,
          ) + sweepTable(s),
      );
    if (figures.length === 0)
      return given === undefined ? '' : noteHtml(`No values of ${metric} to draw against ${given}.`);
    const id = state.slug(`sweeps ${metric}`);
    return (
      `<h2 id="${escapeAttr(id)}">${textHtml(`Sweeps: ${metric}`)}</h2><div ` +
      `class="sweep-cell">${figures.join('')}</div>`
    );
  },
};

/** The chart's numbers as a table, folded: one row per line, one column per key value, mean [interval]. */
function sweepTable(s: Sweep): string {
  const decimals = sweepDecimals(s);
  const rows = s.series.map((x) => [
    { html: nameHtml(x.label === '' ? 'all' : x.label) },
    ...s.xs.map((v) => {
      const p = x.points.find((q) => q.x === v);
      if (p === undefined) return null;
      return (
        `${formatNumber(p.mean, decimals)}` +
        (p.low === null || p.high === null
          ? ''
          : ` [${formatNumber(p.low, decimals)}, ${formatNumber(p.high, decimals)}]`)
      );
    }),
  ]);
  const table = tableHtml({
    className: 'sweep',
    head: [s.others.join(', ') || 'configs', ...s.xs.map((v) => `${s.key}=${v}`)],
    rows,
    numeric: s.xs.map((_, i) => i + 1),
  });
  return (
    `<details class="fold"><summary>${textHtml(`The numbers of ${s.metric} against ${s.key} as a table`)}` +
    `</summary>${table}</details>`
  );
}
