/**
 * `{{ticks}}` (every per-tick metric) or `{{ticks "val_acc"}}`: accuracy (or any per-tick metric)
 * against the internal tick, per config (`ticksChart`), and a table of the earliest good tick and
 * the ticks at which a config differs from the baseline. Says which noise the band shows
 * (between seeds) and gives the between-example half-width when Results knows it.
 */
import type { TickCurve } from '../../analysis/results.js';
import { ticksChart } from '../charts/ticksChart.js';
import { formatIntervalKind, formatNumber, formatP } from '../format.js';
import { nameHtml, noteHtml, tableHtml, type TableCell } from '../html.js';
import { figureHtml, metricParam, type Cell, type RenderState } from './cell.js';
import { NO_TICK_DATA } from './noTickData.js';

function earliest(t: TickCurve): string | null {
  const e = t.earliestGood;
  if (e === null) return null;
  const spread = e.low === null || e.high === null ? '' : ` (seeds: ${formatNumber(e.low, 1)} to ${formatNumber(e.high, 1)})`;
  return `tick ${e.tick}${spread}, within ${formatNumber(e.tolerance, 4)} of the best`;
}

function differing(t: TickCurve): string | null {
  if (t.versusBaseline === null) return 'baseline';
  const decided = t.versusBaseline.filter((v) => v.verdict !== 'inconclusive');
  if (decided.length === 0) return 'no tick differs after Holm adjustment';
  return decided.map((v) => `tick ${v.tick}: ${v.verdict} (p ${formatP(v.pAdjusted)})`).join('; ');
}

function oneMetric(state: RenderState, metric: string): string {
  const mine = state.results.ticks.filter((t) => t.metric === metric);
  if (mine.length === 0) return noteHtml(`${metric} has no per-tick values in these runs.`);
  const rows: TableCell[][] = mine.map((t) => [
    { html: nameHtml(t.config) },
    t.step === null ? null : formatNumber(t.step, 0),
    `${Math.max(0, ...t.n)}${(t.diverged ?? 0) > 0 ? ` (${t.diverged ?? 0} diverged, left out)` : ''}`,
    earliest(t),
    differing(t),
  ]);
  const bands = [...new Set(mine.map((t) => formatIntervalKind({ level: state.results.settings.level, method: t.band })))].join(' or ');
  const examples = mine.some((t) => t.exampleHalfWidth !== null)
    ? ' The whiskers are the between-example spread of one evaluation, a different noise from the seeds.'
    : '';
  const caption = `The ${bands} band is the spread between seeds.${examples}`;
  const chart = figureHtml(state, ticksChart(state.results, metric), caption, `No tick curves of ${metric}.`);
  return chart + tableHtml({ className: 'ticks', head: ['Config', 'At step', 'Seeds', 'Earliest good tick', 'Ticks that differ from the baseline'], rows, numeric: [1, 2] });
}

export const ticks: Cell = {
  name: 'ticks',
  usage: '{{ticks}} or {{ticks "METRIC"}}',
  arity: [0, 1],
  options: [],
  render(state, call) {
    if (call.params.length === 1) {
      const m = metricParam(state, call, 0);
      if (state.results.ticks.length === 0) return noteHtml(NO_TICK_DATA.ticks);
      return oneMetric(state, m.name);
    }
    const names = [...new Set(state.results.ticks.map((t) => t.metric))];
    if (names.length === 0) return noteHtml(NO_TICK_DATA.ticks);
    return names.map((name) => oneMetric(state, name)).join('');
  },
};
