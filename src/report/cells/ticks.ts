/**
 * `{{ticks}}` (every per-tick metric) or `{{ticks "val_acc"}}`: accuracy (or any per-tick metric)
 * against the internal tick, per config (`ticksChart`), and a table of the earliest good tick and
 * the ticks at which a config differs from the baseline (consecutive ticks with the same verdict
 * as one range). Says which noise the band shows (between seeds), and either shows the
 * between-example spread of one evaluation (when Results knows it) or says that it is not known.
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
  const spread =
    e.low === null || e.high === null ? '' : ` (seeds: ${formatNumber(e.low, 1)} to ${formatNumber(e.high, 1)})`;
  return `tick ${e.tick}${spread}, within ${formatNumber(e.tolerance, 4)} of the best`;
}

type TickVerdict = NonNullable<TickCurve['versusBaseline']>[number];

/**
 * Runs of consecutive ticks with the same decided verdict, as words: `worse at ticks 0–7
 * (adjusted p < 0.001 at each)`, `better at tick 9 (adjusted p 0.012)`.
 */
function verdictRanges(decided: readonly TickVerdict[]): string[] {
  const runs: TickVerdict[][] = [];
  for (const v of decided) {
    const run = runs[runs.length - 1];
    const last = run?.[run.length - 1];
    if (run !== undefined && last !== undefined && last.verdict === v.verdict && last.tick + 1 === v.tick) run.push(v);
    else runs.push([v]);
  }
  return runs.map((run) => {
    const first = run[0] as TickVerdict;
    const last = run[run.length - 1] as TickVerdict;
    const ps = run.map((v) => v.pAdjusted).filter((p): p is number => p !== null);
    const largest = ps.length === 0 ? null : Math.max(...ps);
    if (run.length === 1) return `${first.verdict} at tick ${first.tick} (adjusted p ${formatP(largest)})`;
    const p =
      largest === null
        ? ''
        : largest < 0.001
          ? ' (adjusted p < 0.001 at each)'
          : ` (adjusted p ≤ ${formatP(largest)} at each)`;
    return `${first.verdict} at ticks ${first.tick}–${last.tick}${p}`;
  });
}

/** `compared`: some curve of the metric was compared, so the one that was not is the baseline. */
function differing(t: TickCurve, compared: boolean): string | null {
  if (t.versusBaseline === null) return compared ? 'baseline' : 'not compared (no single baseline config)';
  const decided = t.versusBaseline.filter((v) => v.verdict !== 'inconclusive');
  if (decided.length === 0) return 'no tick differs after Holm adjustment';
  return verdictRanges(decided).join('; ');
}

function oneMetric(state: RenderState, metric: string): string {
  const mine = state.results.ticks.filter((t) => t.metric === metric);
  if (mine.length === 0) return noteHtml(`${metric} has no per-tick values in these runs.`);
  const compared = mine.some((t) => t.versusBaseline !== null);
  const rows: TableCell[][] = mine.map((t) => [
    { html: nameHtml(t.config) },
    t.step === null ? 'each run’s last (they differ)' : formatNumber(t.step, 0),
    `${Math.max(0, ...t.n)}${(t.diverged ?? 0) > 0 ? ` (${t.diverged ?? 0} diverged, left out)` : ''}`,
    earliest(t),
    differing(t, compared),
  ]);
  const bands = [
    ...new Set(mine.map((t) => formatIntervalKind({ level: state.results.settings.level, method: t.band }))),
  ].join(' or ');
  const known = mine.filter((t) => t.exampleHalfWidth !== null).length;
  const examples =
    known === 0
      ? ` The between-example spread of one evaluation (how much ${metric} would move on other examples) is not ` +
        'shown: the logs do not say on how many examples it was measured.'
      : ' The dotted whiskers are the between-example spread of one evaluation, ' +
        '±1 standard error √(p(1−p)/m) for m examples: a different noise, how much the number would move ' +
        'on other examples of the same size, not ' +
        `with another seed${known < mine.length ? ` (known for ${known} of ${mine.length} configs)` : ''}.`;
  const caption =
    `Which noise: the ${bands} band is the spread between seeds (training the same config again), ` +
    `the noise the tests weigh.${examples}`;
  const chart = figureHtml(state, ticksChart(state.results, metric), caption, `No tick curves of ${metric}.`);
  return (
    chart +
    tableHtml({
      className: 'ticks',
      head: ['Config', 'At step', 'Seeds', 'Earliest good tick', 'Ticks that differ from the baseline'],
      rows,
      numeric: [1, 2],
    })
  );
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
