/**
 * `{{runs}}`: every run: config, seed, status (ok, diverged, short, rejected), last step, where it
 * diverged, its files, and the problems that name it. Long lists fold away (`<details>`).
 */
import type { RunRecord } from '../../analysis/results.js';
import { formatNumber } from '../format.js';
import { codeHtml, listHtml, nameHtml, noteHtml, tableHtml, textHtml, type TableCell } from '../html.js';
import type { Cell } from './cell.js';

/** Runs shown unfolded; longer lists start folded. */
const OPEN_UP_TO = 40;

function files(run: RunRecord): TableCell {
  return { html: run.files.map(codeHtml).join('<br>') };
}

export const runs: Cell = {
  name: 'runs',
  usage: '{{runs}}',
  arity: [0, 0],
  options: [],
  render(state, call) {
    const r = state.results;
    if (r.runs.length === 0) return noteHtml('No runs were read.');
    const rows: TableCell[][] = r.runs.map((run) => [
      { html: nameHtml(run.config) },
      { html: nameHtml(run.seed) },
      { html: `<span class="status status-${run.status}">${textHtml(run.status)}</span>` },
      formatNumber(run.lastStep, 0),
      run.divergedAt === null ? null : formatNumber(run.divergedAt, 0),
      files(run),
      run.problems.length === 0 ? null : { html: listHtml(run.problems, 'run-problems') },
    ]);
    const counts = (['ok', 'diverged', 'short', 'rejected'] as const)
      .map((s) => [s, r.runs.filter((x) => x.status === s).length] as const)
      .filter(([, n]) => n > 0)
      .map(([s, n]) => `${n} ${s}`)
      .join(', ');
    const summary = `${r.runs.length} runs in ${r.configs.length} configs (${counts}); ${r.inputs.filesRead} of ${r.inputs.files} files read.`;
    const table = tableHtml({
      className: 'runs',
      head: ['Config', 'Seed', 'Status', 'Last step', 'Diverged at', 'Files', 'Problems'],
      rows,
      numeric: [3, 4],
      rowClasses: r.runs.map((x) => `status-${x.status}`),
    });
    return `<details class="fold"${r.runs.length <= OPEN_UP_TO ? ' open' : ''}><summary>${textHtml(summary)}</summary>${table}</details>`;
  },
};
