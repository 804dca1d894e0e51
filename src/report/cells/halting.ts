/**
 * `{{halting}}`: certainty-threshold halting. The trade-off between mean exit tick and accuracy at
 * exit over the threshold grid (`haltingChart`), the histogram of exit ticks at the reference
 * threshold per config (`exitHistogramChart`), and a table at the reference threshold.
 */
import { exitHistogramChart } from '../charts/exitHistogramChart.js';
import { haltingChart } from '../charts/haltingChart.js';
import { formatLevel, formatNumber } from '../format.js';
import { nameHtml, noteHtml, tableHtml, type TableCell } from '../html.js';
import { figureHtml, type Cell } from './cell.js';
import { NO_TICK_DATA } from './noTickData.js';

function interval(x: { readonly mean: number | null; readonly low: number | null; readonly high: number | null } | undefined, decimals: number): string | null {
  if (x === undefined || x.mean === null) return null;
  const band = x.low === null || x.high === null ? '' : ` [${formatNumber(x.low, decimals)}, ${formatNumber(x.high, decimals)}]`;
  return `${formatNumber(x.mean, decimals)}${band}`;
}

export const halting: Cell = {
  name: 'halting',
  usage: '{{halting}}',
  arity: [0, 0],
  options: [],
  render(state, call) {
    const r = state.results;
    if (r.halting.length === 0) return noteHtml(NO_TICK_DATA.halting);
    const level = formatLevel(r.settings.level);
    const caption = 'Up and to the left is better: more accurate at exit, and earlier. The table gives the reference threshold.';
    let html = figureHtml(state, haltingChart(r), caption, 'No halting curves.');
    const rows: TableCell[][] = r.halting.map((h) => {
      const at = h.thresholds.indexOf(h.exitHistogram.threshold);
      return [
        { html: nameHtml(h.config) },
        `${h.seeds}`,
        `${h.samples}`,
        `${h.ticks}`,
        formatNumber(h.exitHistogram.threshold, 2),
        interval(at < 0 ? undefined : h.accuracy[at], 3),
        interval(at < 0 ? undefined : h.exitTick[at], 2),
      ];
    });
    html += tableHtml({ className: 'halting', head: ['Config', 'Seeds', 'Samples', 'Ticks', 'Threshold', `Accuracy at exit [${level}]`, `Mean exit tick [${level}]`], rows, numeric: [1, 2, 3, 4, 5, 6] });
    for (const h of r.halting) {
      html += figureHtml(state, exitHistogramChart(r, h.config), '', `No exit histogram for ${h.config}.`);
    }
    return html;
  },
};
