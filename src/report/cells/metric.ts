/**
 * `{{metric "val_acc"}}`: a section heading for one metric, with its goal (and whether the goal
 * was given or guessed, so a wrong guess is visible), the step range
 * and the step its comparisons are made at (when they share one).
 * A heading written by a cell keeps a metric name from being read as Markdown (`*`, `_`, `[`).
 */
import { formatNumber } from '../format.js';
import { escapeAttr } from '../escape.js';
import { nameHtml, textHtml } from '../html.js';
import { GOAL_WORDS } from '../verdictWords.js';
import { metricParam, type Cell } from './cell.js';

export const metric: Cell = {
  name: 'metric',
  usage: '{{metric "METRIC"}}',
  arity: [1, 1],
  options: [],
  render(state, call) {
    const m = metricParam(state, call, 0);
    const id = state.slug(`metric ${m.name}`);
    const goal =
      m.goal === null
        ? `goal not known: comparisons say higher or lower only (say --metric ${m.name}:max or ${m.name}:min)`
        : m.goalSource === 'inferred'
          ? `${GOAL_WORDS[m.goal]} (guessed from the name; if wrong, say ` +
            `--metric ${m.name}:${m.goal === 'max' ? 'min' : 'max'})`
          : `${GOAL_WORDS[m.goal]} (as given)`;
    const parts = [goal];
    if (m.kind === 'tick') parts.push(`per-tick metric with ${m.ticks} ticks`);
    if (m.firstStep !== null && m.lastStep !== null)
      parts.push(`steps ${formatNumber(m.firstStep, 0)} to ${formatNumber(m.lastStep, 0)}`);
    if (m.horizon !== null) parts.push(`compared at step ${formatNumber(m.horizon, 0)}`);
    return (
      `<h2 id="${escapeAttr(id)}" class="metric-heading">${nameHtml(m.name)}</h2><p ` +
      `class="metric-meta">${textHtml(parts.join(' · '))}</p>`
    );
  },
};
