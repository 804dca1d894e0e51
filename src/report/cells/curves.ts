/**
 * `{{curves "val_acc"}}`: the learning curves of one metric (mean across seeds, its band, one thin
 * line per seed), drawn from `Results.curves` by `curvesChart`; with a task key, one small panel per
 * task (`taskCurvesChart`).
 */
import { curvesChart } from '../charts/curvesChart.js';
import { taskCurvesChart } from '../charts/taskPanels.js';
import { formatIntervalKind, formatNumber } from '../format.js';
import { figureHtml, metricParam, type Cell } from './cell.js';

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
      `The ${bands} band shows the spread between seeds: it is for looking, the tests decide. No ` +
      `curve runs past a run's last step.${horizon}`;
    return figureHtml(
      state,
      state.results.settings.taskKey === null
        ? curvesChart(state.results, m.name)
        : taskCurvesChart(state.results, m.name),
      caption,
      `No learning curves of ${m.name} in these results (a score table holds final numbers only).`,
    );
  },
};
