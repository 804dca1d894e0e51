/**
 * `{{runs}}`: every run: config, seed, status (ok, diverged, short, rejected), last step, where it
 * diverged, its files, and the problems that name it. Runs that are not ok lead; routine notes
 * about a run (severity note, such as expected missing cells) are counted, not repeated on every
 * row. Long lists fold away (`<details>`); from `COMPACT_FROM` runs on, the ok runs are listed one
 * line per config (their files are in results.json).
 */
import type { Results, RunRecord } from '../../analysis/results.js';
import { formatNumber } from '../format.js';
import { codeHtml, listHtml, nameHtml, noteHtml, tableHtml, textHtml, type TableCell } from '../html.js';
import type { Cell } from './cell.js';

/** Runs shown unfolded; longer lists start folded. */
const OPEN_UP_TO = 40;
/** From this many runs on, ok runs are listed one line per config. */
export const COMPACT_FROM = 200;
const STATUS_ORDER = { diverged: 0, rejected: 1, short: 2, ok: 3 } as const;

/** Messages of notes (routine problems) naming each run. */
function routineByRun(r: Results): Map<string, Set<string>> {
  const out = new Map<string, Set<string>>();
  for (const p of r.problems)
    if (p.severity === 'note' && p.run !== undefined) out.set(p.run, (out.get(p.run) ?? new Set()).add(p.message));
  return out;
}

function problemsCell(run: RunRecord, routine: ReadonlySet<string> | undefined): TableCell {
  const serious = run.problems.filter((m) => routine?.has(m) !== true);
  const notes = run.problems.length - serious.length;
  if (serious.length === 0 && notes === 0) return null;
  const folded =
    notes === 0
      ? ''
      : `<span class="small">${textHtml(`${notes} routine note${notes === 1 ? '' : 's'} (see Problems)`)}</span>`;
  return { html: listHtml(serious, 'run-problems') + folded };
}

function okByConfig(list: readonly RunRecord[]): string {
  const byConfig = new Map<string, RunRecord[]>();
  for (const run of list) byConfig.set(run.config, [...(byConfig.get(run.config) ?? []), run]);
  const rows: TableCell[][] = [...byConfig].map(([config, rs]) => {
    const steps = rs.map((x) => x.lastStep);
    const low = Math.min(...steps);
    const high = Math.max(...steps);
    return [
      { html: nameHtml(config) },
      rs.map((x) => x.seed).join(', '),
      low === high ? formatNumber(low, 0) : `${formatNumber(low, 0)} to ${formatNumber(high, 0)}`,
    ];
  });
  return tableHtml({ className: 'runs', head: ['Config', 'Seeds (ok)', 'Last step'], rows, numeric: [2] });
}

function files(run: RunRecord): TableCell {
  return { html: run.files.map(codeHtml).join('<br>') };
}

export const runs: Cell = {
  name: 'runs',
  usage: '{{runs}}',
  arity: [0, 0],
  options: [],
  render(state) {
    const r = state.results;
    if (r.runs.length === 0) return noteHtml('No runs were read.');
    const routine = routineByRun(r);
    const ordered = [...r.runs].sort((a, b) => STATUS_ORDER[a.status] - STATUS_ORDER[b.status]);
    const compact = r.runs.length >= COMPACT_FROM;
    const full = compact ? ordered.filter((x) => x.status !== 'ok') : ordered;
    const rows: TableCell[][] = full.map((run) => [
      { html: nameHtml(run.config) },
      { html: nameHtml(run.seed) },
      { html: `<span class="status status-${run.status}">${textHtml(run.status)}</span>` },
      formatNumber(run.lastStep, 0),
      run.divergedAt === null ? null : formatNumber(run.divergedAt, 0),
      files(run),
      problemsCell(run, routine.get(run.id)),
    ]);
    const counts = (['ok', 'diverged', 'short', 'rejected'] as const)
      .map((s) => [s, r.runs.filter((x) => x.status === s).length] as const)
      .filter(([, n]) => n > 0)
      .map(([s, n]) => `${n} ${s}`)
      .join(', ');
    const summary =
      `${r.runs.length} runs in ${r.configs.length} configs (${counts}); ${r.inputs.filesRead} ` +
      `of ${r.inputs.files} files read.`;
    const table =
      rows.length === 0
        ? ''
        : tableHtml({
            className: 'runs',
            head: ['Config', 'Seed', 'Status', 'Last step', 'Diverged at', 'Files', 'Problems'],
            rows,
            numeric: [3, 4],
            rowClasses: full.map((x) => `status-${x.status}`),
          });
    if (!compact)
      return (
        `<details class="fold"${r.runs.length <= OPEN_UP_TO ? ' open' : ''}><summary>${textHtml(summary)}` +
        `</summary>${table}</details>`
      );
    const ok = ordered.filter((x) => x.status === 'ok');
    const head =
      rows.length === 0
        ? noteHtml('Every run is ok.', 'lead')
        : `${noteHtml(`${rows.length} runs are not ok:`, 'lead')}${table}`;
    return (
      `<p class="lead">${textHtml(summary)}</p>${head}<details ` +
      `class="fold"><summary>${textHtml(`${ok.length} ok runs, one line per config`)}</summary>${okByConfig(ok)}` +
      `</details>`
    );
  },
};
