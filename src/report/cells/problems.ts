/**
 * `{{problems}}`: everything seedsift noticed about the input, errors first: severity, code,
 * message, where (file:line, run), and what to do (from the table of problem codes). When there
 * are many, they are grouped by code: one row per code with its count and a few examples (every
 * one is in results.json), and the notes (expected things, such as train and eval rows sharing a
 * file) fold away under a line that counts them by code, so errors and warnings stay in view.
 */
import { PROBLEM_CODES, type Problem, type Severity } from '../../problems.js';
import { codeHtml, nameHtml, noteHtml, tableHtml, textHtml, type TableCell } from '../html.js';
import type { Cell } from './cell.js';

const ORDER: Readonly<Record<Severity, number>> = { error: 0, warning: 1, note: 2 };

/** Problems shown in one open table; above this many, notes fold away. */
const OPEN_UP_TO = 12;

const HEAD = ['Severity', 'Code', 'Message', 'Where', 'What to do'];

/** Above this many problems of one severity group, they are shown one row per code. */
const GROUP_FROM = 30;
/** Examples shown per code when grouped. */
export const EXAMPLES = 3;

/** One row per code: severity, code, count, the first `EXAMPLES` messages with where, what to do. */
function grouped(list: readonly Problem[]): string {
  const byCode = new Map<string, Problem[]>();
  for (const p of list) byCode.set(p.code, [...(byCode.get(p.code) ?? []), p]);
  const codes = [...byCode];
  const rows: TableCell[][] = codes.map(([code, ps]) => {
    const first = ps[0] as Problem;
    const examples = ps
      .slice(0, EXAMPLES)
      .map((p) => {
        const w = where(p);
        return (
          `<li>${textHtml(p.message)}` +
          `${w === null ? '' : ` <span class="small">(${typeof w === 'string' ? textHtml(w) : w.html})</span>`}</li>`
        );
      })
      .join('');
    const more =
      ps.length > EXAMPLES
        ? `<li class="small">${textHtml(`${ps.length - EXAMPLES} more like these (all in results.json)`)}</li>`
        : '';
    return [
      { html: `<span class="severity severity-${first.severity}">${textHtml(first.severity)}</span>` },
      { html: `<code>${textHtml(code)}</code>` },
      String(ps.length),
      { html: `<ul class="cautions">${examples}${more}</ul>` },
      PROBLEM_CODES[first.code]?.action ?? null,
    ];
  });
  return tableHtml({
    className: 'problems',
    head: ['Severity', 'Code', 'Count', 'Examples', 'What to do'],
    rows,
    numeric: [2],
    rowClasses: codes.map(([, ps]) => `severity-${ps[0]?.severity ?? 'note'}`),
  });
}

function table(list: readonly Problem[]): string {
  const rows: TableCell[][] = list.map((p) => [
    { html: `<span class="severity severity-${p.severity}">${textHtml(p.severity)}</span>` },
    { html: `<code>${textHtml(p.code)}</code>` },
    p.message,
    where(p),
    PROBLEM_CODES[p.code]?.action ?? null,
  ]);
  return tableHtml({ className: 'problems', head: HEAD, rows, rowClasses: list.map((p) => `severity-${p.severity}`) });
}

/** "40 notes: cells-missing 38, steps-unsorted 2". */
function noteSummary(notes: readonly Problem[]): string {
  const counts = new Map<string, number>();
  for (const p of notes) counts.set(p.code, (counts.get(p.code) ?? 0) + 1);
  return `${notes.length} notes: ${[...counts].map(([code, n]) => `${code} ${n}`).join(', ')}`;
}

function where(p: Problem): TableCell {
  const parts: string[] = [];
  if (p.file !== undefined) parts.push(codeHtml(p.file + (p.line === undefined ? '' : `:${p.line}`)));
  else if (p.line !== undefined) parts.push(textHtml(`line ${p.line}`));
  if (p.run !== undefined) parts.push(`run ${nameHtml(p.run)}`);
  return parts.length === 0 ? null : { html: parts.join('<br>') };
}

export const problems: Cell = {
  name: 'problems',
  usage: '{{problems}}',
  arity: [0, 0],
  options: [],
  render(state) {
    const list = state.results.problems
      .map((p, i) => ({ p, i }))
      .sort((a, b) => ORDER[a.p.severity] - ORDER[b.p.severity] || a.i - b.i)
      .map(({ p }) => p);
    if (list.length === 0) return noteHtml('No problems found in the input.');
    const notes = list.filter((p) => p.severity === 'note');
    if (list.length <= OPEN_UP_TO || notes.length === 0) return table(list);
    const serious = list.filter((p) => p.severity !== 'note');
    const show = (ps: readonly Problem[]): string => (ps.length > GROUP_FROM ? grouped(ps) : table(ps));
    const open = serious.length === 0 ? noteHtml('No errors or warnings; only notes.') : show(serious);
    return `${open}<details class="fold"><summary>${textHtml(noteSummary(notes))}</summary>${show(notes)}</details>`;
  },
};
