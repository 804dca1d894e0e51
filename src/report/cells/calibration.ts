/**
 * `{{calibration}}`: expected calibration error by tick per config (`calibrationChart`), the
 * reliability diagram at the last tick per config (`reliabilityChart`), and a table of the error
 * at the first and last tick.
 */
import type { CalibrationCurve } from '../../analysis/results.js';
import { calibrationChart } from '../charts/calibrationChart.js';
import { reliabilityChart } from '../charts/reliabilityChart.js';
import { formatLevel, formatNumber } from '../format.js';
import { nameHtml, noteHtml, tableHtml, type TableCell } from '../html.js';
import { figureHtml, type Cell } from './cell.js';
import { NO_TICK_DATA } from './noTickData.js';

function ece(point: CalibrationCurve['ece'][number] | undefined): string | null {
  if (point === undefined || point.mean === null) return null;
  const band =
    point.low === null || point.high === null ? '' : ` [${formatNumber(point.low, 3)}, ${formatNumber(point.high, 3)}]`;
  return `${formatNumber(point.mean, 3)}${band} (tick ${point.tick})`;
}

export const calibration: Cell = {
  name: 'calibration',
  usage: '{{calibration}}',
  arity: [0, 0],
  options: [],
  render(state) {
    const r = state.results;
    if (r.calibration.length === 0) return noteHtml(NO_TICK_DATA.calibration);
    const level = formatLevel(r.settings.level);
    const bins = [...new Set(r.calibration.map((c) => c.bins))].join(' or ');
    const caption =
      `Expected calibration error over ${bins} equal-width confidence bins; lower is better ` +
      `calibrated. Which noise: the band is the ${level} interval across seeds (the spread between training ` +
      `runs). The reliability diagrams below pool every seed's samples, so their whiskers show only the ` +
      `between-example noise of each bin.`;
    let html = figureHtml(state, calibrationChart(r), caption, 'No calibration curves.');
    const rows: TableCell[][] = r.calibration.map((c) => [
      { html: nameHtml(c.config) },
      c.seeds === undefined ? null : `${c.seeds}`,
      `${c.bins}`,
      ece(c.ece[0]),
      ece(c.ece[c.ece.length - 1]),
    ]);
    html += tableHtml({
      className: 'calibration',
      head: [
        'Config',
        'Seeds',
        'Bins',
        `ECE first tick [${level} across seeds]`,
        `ECE last tick [${level} across seeds]`,
      ],
      rows,
      numeric: [1, 2, 3, 4],
    });
    for (const c of r.calibration) {
      html += figureHtml(state, reliabilityChart(r, c.config), '', `No reliability diagram for ${c.config}.`);
    }
    return html;
  },
};
