/**
 * `{{curves "val_acc"}}`: the learning curves of one metric (mean across seeds, its band, one thin
 * line per seed), drawn from `Results.curves` by `curvesChart`; with a task key, one small panel per
 * task (`taskCurvesChart`). Under the chart, folded, its numbers as a table: per config the last
 * step with a mean, that mean with its band, and the runs it rests on.
 */
import type { Curve } from '../../analysis/results.js';
import { curvesChart } from '../charts/curvesChart.js';
import { taskCurvesChart } from '../charts/taskPanels.js';
import { decimalsFor, formatIntervalKind, formatNumber, withInterval } from '../format.js';
import { nameHtml, noteHtml, tableHtml, textHtml, type TableCell } from '../html.js';
import { figureHtml, metricParam, type Cell } from './cell.js';

/** Curves listed in the folded table; the rest are counted (all are in results.json). */
export const CURVE_ROWS = 60;

export const curves: Cell = {
  name: 'curves',
  usage: '{{curves "METRIC"}}',
  arity: [1, 1],
  options: [],
  render(state, call) {
    const m = metricParam(state, call, 0);
    const mine = state.results.curves.filter((c) => c.metric === m.name);
    const bands = [...new Set(mine.map((c) => formatIntervalKind({ level: c.level, method: c.band })))].join(' or ');
    const horizon =
      m.horizon === null
        ? ' Each comparison is made at its own step (see the verdicts).'
        : ` Its comparisons are made at step ${formatNumber(m.horizon, 0)}.`;
    const caption =
      `The ${bands} band shows the spread between seeds: it is for looking, the tests decide. ` +
      `No curve runs past a run's last step.${horizon}`;
    const chart = figureHtml(
      state,
      state.results.settings.taskKey === null
        ? curvesChart(state.results, m.name)
        : taskCurvesChart(state.results, m.name),
      caption,
      `No learning curves of ${m.name} in these results (a score table holds final numbers only).`,
    );
    return mine.length === 0 ? chart : chart + curvesTable(m.name, mine, bands);
  },
};

/** The last bin of a curve with a mean, or -1. */
function lastBin(c: Curve): number {
  for (let i = c.mean.length - 1; i >= 0; i--) if (c.mean[i] !== null) return i;
  return -1;
}

/** The curves' final numbers, folded: config, last step with a mean, the mean [band], runs. */
function curvesTable(metric: string, mine: readonly Curve[], bands: string): string {
  const halves = mine.flatMap((c) => {
    const i = lastBin(c);
    const low = c.low[i];
    const high = c.high[i];
    return i < 0 || low == null || high == null ? [] : [(high - low) / 2];
  });
  const decimals = decimalsFor(halves.length > 0 ? Math.max(...halves) : null);
  const rows: TableCell[][] = mine.slice(0, CURVE_ROWS).map((c) => {
    const i = lastBin(c);
    return [
      { html: nameHtml(c.config) },
      i < 0 ? null : formatNumber(c.steps[i] ?? null, 0),
      i < 0 ? null : withInterval(c.mean[i] ?? null, c.low[i] ?? null, c.high[i] ?? null, decimals),
      i < 0 ? null : String(c.n[i] ?? 0),
    ];
  });
  const table = tableHtml({
    className: 'curves',
    head: ['Config', 'Last bin (step)', `Mean [${bands}]`, 'Runs'],
    rows,
    numeric: [1, 2, 3],
  });
  const more = mine.length - rows.length;
  const note = more > 0 ? noteHtml(`${more} more curves in results.json.`) : '';
  const summary = textHtml(`The numbers of the curves of ${metric} as a table (the last step of each)`);
  return `<details class="fold"><summary>${summary}</summary>${table}${note}</details>`;
}
