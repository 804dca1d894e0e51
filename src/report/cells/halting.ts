/**
 * `{{halting}}`: certainty-threshold halting. The trade-off between mean exit tick and accuracy at
 * exit over the threshold grid (`haltingChart`), the histogram of exit ticks at the reference
 * threshold per config (`exitHistogramChart`), and a table at the reference threshold. Two noises
 * are kept apart and named: the intervals are across seeds (what another training run would
 * change); beside them, the between-example standard error √(p(1−p)/m) of one run's accuracy on
 * its m samples (what evaluating on other samples would change), computed here from the accuracy
 * and the sample count that `HaltingCurve` carries (`binomialHalfWidth`).
 */
import { exitHistogramChart } from '../charts/exitHistogramChart.js';
import { haltingChart } from '../charts/haltingChart.js';
import { binomialHalfWidth } from '../../stats/binomialHalfWidth.js';
import { formatLevel, formatNumber } from '../format.js';
import { nameHtml, noteHtml, tableHtml, type TableCell } from '../html.js';
import { figureHtml, type Cell } from './cell.js';
import { NO_TICK_DATA } from './noTickData.js';

function interval(
  x: { readonly mean: number | null; readonly low: number | null; readonly high: number | null } | undefined,
  decimals: number,
): string | null {
  if (x === undefined || x.mean === null) return null;
  const band =
    x.low === null || x.high === null ? '' : ` [${formatNumber(x.low, decimals)}, ${formatNumber(x.high, decimals)}]`;
  return `${formatNumber(x.mean, decimals)}${band}`;
}

/**
 * ±1 between-example standard error of an accuracy p measured
 * on m samples, or null when either is missing or out of range.
 */
function exampleSe(p: number | null | undefined, m: number): string | null {
  if (p === null || p === undefined || !(p >= 0 && p <= 1) || !Number.isInteger(m) || m < 1) return null;
  return formatNumber(binomialHalfWidth(p, m), 3);
}

export const halting: Cell = {
  name: 'halting',
  usage: '{{halting}}',
  arity: [0, 0],
  options: [],
  render(state) {
    const r = state.results;
    if (r.halting.length === 0) return noteHtml(NO_TICK_DATA.halting);
    const level = formatLevel(r.settings.level);
    const caption =
      `Up and to the left is better: more accurate at exit, and earlier. Which noise: the bars ` +
      `are ${level} intervals across seeds (the spread between training runs). The table gives the reference ` +
      `threshold, with the between-example standard error √(p(1−p)/m) of one run's accuracy on its m samples ` +
      `beside the interval: a different noise, how much one evaluation would move on other samples.`;
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
        exampleSe(at < 0 ? null : h.accuracy[at]?.mean, h.samples),
        interval(at < 0 ? undefined : h.exitTick[at], 2),
      ];
    });
    const head = [
      'Config',
      'Seeds',
      'Samples per run',
      'Ticks',
      'Threshold',
      `Accuracy at exit [${level} across seeds]`,
      'Between-example SE (one run)',
      `Mean exit tick [${level} across seeds]`,
    ];
    html += tableHtml({ className: 'halting', head, rows, numeric: [1, 2, 3, 4, 5, 6, 7] });
    for (const h of r.halting) {
      html += figureHtml(state, exitHistogramChart(r, h.config), '', `No exit histogram for ${h.config}.`);
    }
    return html;
  },
};
