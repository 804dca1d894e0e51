/**
 * `{{overview}}` / `{{overview "METRIC"}}` (option `summary=`): the study's answer at the top of
 * the page. The primary metric's verdict counts and the family the p-values were adjusted over,
 * then a matrix of candidates by tasks (with `--task-key`) or by metrics: each cell the difference
 * with its interval and a verdict mark (shape and word, never colour alone). With many tasks the
 * matrix shows marks only (the numbers in each cell's title) and the decided comparisons are
 * listed beneath it with their numbers; with many candidates the inconclusive ones are folded.
 */
import type { Comparison, Results } from '../../analysis/results.js';
import { escapeAttr, visibleText } from '../escape.js';
import { comparisonDecimals, formatDifference, formatP } from '../format.js';
import { nameHtml, noteHtml, tableHtml, textHtml, type TableCell } from '../html.js';
import { familyWords, overviewModel, type OverviewModel, type OverviewRow } from '../overviewModel.js';
import { goalWords, sharedIntervalKind, VERDICT_LABELS } from '../verdictWords.js';
import { metricParam, summaryOption, type Cell } from './cell.js';

/** Up to this many columns, matrix cells show numbers; beyond, marks only. */
export const FULL_CELLS_UP_TO = 6;
/** Rows shown before the rest are folded. */
export const ROWS_SHOWN = 15;
/** Decided comparisons listed under a mark-only matrix. */
export const DECIDED_LISTED = 12;

const MARKS = { better: '▲', worse: '▼', inconclusive: '·' } as const;

function differenceText(c: Comparison): string {
  return formatDifference(c.difference, comparisonDecimals(c));
}

function fullCell(c: Comparison | undefined): TableCell {
  if (c === undefined) return null;
  const mark = `<span class="mark mark-${c.verdict}" aria-hidden="true">${MARKS[c.verdict]}</span>`;
  return {
    html:
      `${mark} ${textHtml(differenceText(c))}<br><span class="small">p ${textHtml(formatP(c.pAdjusted))} ` +
      `· ${textHtml(VERDICT_LABELS[c.verdict].slice(2))}</span>`,
  };
}

function markCell(column: string, c: Comparison | undefined): string {
  if (c === undefined) return '<td class="mark-cell"><span class="missing">–</span></td>';
  const title = `${visibleText(column)}: ${differenceText(c)}, p ${formatP(c.pAdjusted)}, ${c.verdict}`;
  return `<td class="mark-cell mark-${c.verdict}" title="${escapeAttr(title)}">${MARKS[c.verdict]}</td>`;
}

function rowLabel(model: OverviewModel, row: OverviewRow): string {
  const name =
    model.sharedBaseline === null
      ? `${nameHtml(row.candidate)} <span class="small">v ${nameHtml(row.baseline)}</span>`
      : nameHtml(row.candidate);
  const c = row.counts;
  const tally =
    model.mode === 'tasks'
      ? ` <span class="small tally-inline">▲${c.better} ▼${c.worse} ·${c.inconclusive}</span>`
      : '';
  return `${name}${tally}`;
}

function fullMatrix(model: OverviewModel, rows: readonly OverviewRow[]): string {
  const columns = model.columns.slice(0, FULL_CELLS_UP_TO);
  const shared = sharedIntervalKind(model.comparisons);
  const head = [
    model.sharedBaseline === null ? 'Candidate v baseline' : 'Candidate',
    ...columns.map((c) => ({ html: nameHtml(c) })),
  ];
  const table = tableHtml({
    className: 'overview-matrix',
    head,
    rows: rows.map((r) => [{ html: rowLabel(model, r) }, ...columns.map((col) => fullCell(r.cells.get(col)))]),
    numeric: columns.map((_, i) => i + 1),
  });
  const more =
    model.columns.length > columns.length
      ? noteHtml(`${model.columns.length - columns.length} more ${model.mode} in the details below.`, 'lead')
      : '';
  const kind =
    shared === null ? '' : noteHtml(`Cells: difference, candidate minus baseline [${shared}, unadjusted].`, 'lead');
  return kind + table + more;
}

function markMatrix(model: OverviewModel, rows: readonly OverviewRow[]): string {
  const head = model.columns
    .map((t, i) => `<th scope="col" class="mark-head" title="${escapeAttr(visibleText(t))}">${i + 1}</th>`)
    .join('');
  const body = rows
    .map(
      (r) =>
        `<tr><th scope="row">${rowLabel(model, r)}</th>` +
        `${model.columns.map((t) => markCell(t, r.cells.get(t))).join('')}</tr>`,
    )
    .join('');
  const first = model.columns[0] ?? '';
  const last = model.columns[model.columns.length - 1] ?? '';
  const key =
    `Columns: the ${model.columns.length} tasks in order (1 ` +
    `= ${visibleText(first, 40)}, ${model.columns.length} = ${visibleText(last, 40)}); ▲ better, ▼ worse, · ` +
    `inconclusive; hover a cell for its difference and p.`;
  return (
    `${noteHtml(key, 'lead')}<div class="table-wrap"><table class="mark-matrix"><thead><tr><th ` +
    `scope="col">${model.sharedBaseline === null ? 'Candidate v baseline' : 'Candidate'}</th>${head}` +
    `</tr></thead><tbody>${body}</tbody></table></div>`
  );
}

function decidedTable(model: OverviewModel): string {
  const decided = model.decided.filter((c) => c.verdict !== 'inconclusive');
  if (decided.length === 0) return noteHtml(`No comparison of ${model.metric.name} is decided at this alpha.`, 'lead');
  const shown = decided.slice(0, DECIDED_LISTED);
  const shared = sharedIntervalKind(model.comparisons);
  const table = tableHtml({
    className: 'overview-decided',
    head: [
      'Candidate',
      ...(model.sharedBaseline === null ? ['Baseline'] : []),
      'Task',
      shared === null ? 'Difference [interval]' : `Difference [${shared}, unadjusted]`,
      'p (adjusted)',
      'Verdict',
    ],
    rows: shown.map((c) => [
      { html: nameHtml(c.candidate) },
      ...(model.sharedBaseline === null ? [{ html: nameHtml(c.baseline) }] : []),
      c.task === null ? null : { html: nameHtml(c.task) },
      differenceText(c),
      formatP(c.pAdjusted),
      { html: `<span class="verdict verdict-${c.verdict}">${VERDICT_LABELS[c.verdict]}</span>` },
    ]),
    numeric: model.sharedBaseline === null ? [3, 4] : [2, 3],
  });
  const more = decided.length - shown.length;
  return (
    `<p class="overview-sub">Decided ` +
    `comparisons${more > 0 ? ` (the ${shown.length} with the smallest adjusted p of ${decided.length})` : ''}` +
    `</p>${table}${more > 0 ? noteHtml(`${more} more decided comparisons in the details below.`, 'lead') : ''}`
  );
}

/**
 * The overview HTML of one metric and summary (see the module comment).
 * Cost O(comparisons). Never throws.
 */
export function overviewHtml(results: Results, metric?: string, summary?: string): string {
  const model = overviewModel(results, metric, summary);
  if (model === null)
    return noteHtml('No comparisons: the runs hold fewer than two configs to compare, or no metric with values.');
  const m = model.metric;
  const against =
    model.sharedBaseline !== null
      ? `against ${visibleText(model.sharedBaseline, 80)}`
      : results.settings.baseline === null
        ? 'every pair of configs'
        : `each config against its counterpart with ${visibleText(results.settings.baseline, 80)}`;
  const question =
    `${m.name} (${goalWords(m.goal, m.goalSource, ', guessed from the name')}; ` +
    `summary ${model.summary}), ${against}`;
  const c = model.counts;
  const tally =
    `<p class="tally"><span class="verdict verdict-better">▲ ${c.better} better</span> <span ` +
    `class="verdict verdict-worse">▼ ${c.worse} worse</span> <span class="verdict ` +
    `verdict-inconclusive">● ${c.inconclusive} inconclusive</span> <span ` +
    `class="small">${textHtml(familyWords(results, model))}.</span></p>`;
  const marks = model.mode === 'tasks' && model.columns.length > FULL_CELLS_UP_TO;
  const shown = model.rows.slice(0, ROWS_SHOWN);
  const folded = model.rows.slice(shown.length);
  const foldedDecided = folded.filter((r) => r.counts.better + r.counts.worse > 0).length;
  const matrix = (rows: readonly OverviewRow[]): string => (marks ? markMatrix(model, rows) : fullMatrix(model, rows));
  const fold =
    folded.length === 0
      ? ''
      : `<details class="fold"><summary>` +
        textHtml(
          `${folded.length} more candidates (${foldedDecided === 0 ? 'none' : foldedDecided} decided on ${m.name})`,
        ) +
        `</summary>${matrix(folded)}</details>`;
  return (
    `<div class="overview-cell"><p ` +
    `class="overview-question">${textHtml(question)}</p>${tally}${matrix(shown)}${fold}` +
    `${marks ? decidedTable(model) : ''}</div>`
  );
}

export const overview: Cell = {
  name: 'overview',
  usage: '{{overview}} or {{overview "METRIC" summary="final"}}',
  arity: [0, 1],
  options: ['summary'],
  render(state, call) {
    const metric = call.params.length === 1 ? metricParam(state, call, 0).name : undefined;
    const summary = metric === undefined ? undefined : summaryOption(state, call, metric);
    return overviewHtml(state.results, metric, summary);
  },
};
