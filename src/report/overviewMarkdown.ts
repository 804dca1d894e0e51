/**
 * The top of `summary.md`: the answer first, in Markdown. The primary metric's verdict counts and
 * family, its decided comparisons (or, without tasks, the candidates by metrics), the across-task
 * aggregates (`--task-key`) and a table per sweep of the primary metric against each numeric key.
 * Every name from the data is escaped (`escapeMarkdown`). Long lists are cut at a fixed number of
 * rows with "N more in report.html", so this part stays a few thousand characters at any scale.
 */
import type { Comparison, Results } from '../analysis/results.js';
import { escapeMarkdown } from './escape.js';
import { comparisonDecimals, formatDifference, formatNumber, formatP, withInterval } from './format.js';
import { countsWords, familyWords, overviewModel, type OverviewModel } from './overviewModel.js';
import { sweepKeys } from './studyShape.js';
import { sweepDecimals, sweepModel } from './sweepModel.js';
import { goalWords, sharedIntervalKind, VERDICT_LABELS } from './verdictWords.js';

/** Rows of the overview tables before the rest are counted. */
export const OVERVIEW_ROWS = 15;
/** Sweep tables: most series (rows) and key values (columns) shown. */
const SWEEP_ROWS = 12;
const SWEEP_COLUMNS = 8;

const name = (text: string): string => escapeMarkdown(text, 120);
const row = (cells: readonly string[]): string => `| ${cells.join(' | ')} |`;
const rule = (n: number): string => row(Array.from({ length: n }, () => '---'));

function cell(c: Comparison | undefined): string {
  if (c === undefined) return '—';
  return `${VERDICT_LABELS[c.verdict].slice(0, 1)} ${formatDifference(c.difference, comparisonDecimals(c))}`;
}

function decidedTable(model: OverviewModel): string[] {
  const decided = model.decided.filter((c) => c.verdict !== 'inconclusive');
  if (decided.length === 0) return [`No comparison of ${name(model.metric.name)} is decided at this alpha.`, ''];
  const shown = decided.slice(0, OVERVIEW_ROWS);
  const kind = sharedIntervalKind(model.comparisons);
  const withBaseline = model.sharedBaseline === null;
  const head = [
    'Candidate',
    ...(withBaseline ? ['Baseline'] : []),
    'Task',
    `Difference [${kind ?? 'interval'}]`,
    'p (adjusted)',
    'Verdict',
  ];
  const lines = [row(head), rule(head.length)];
  for (const c of shown) {
    lines.push(
      row([
        name(c.candidate),
        ...(withBaseline ? [name(c.baseline)] : []),
        name(c.task ?? ''),
        formatDifference(c.difference, comparisonDecimals(c)),
        formatP(c.pAdjusted),
        VERDICT_LABELS[c.verdict],
      ]),
    );
  }
  const more = decided.length - shown.length;
  return [
    `Decided comparisons${more > 0 ? ` (the ${shown.length} with the smallest adjusted p)` : ''}:`,
    '',
    ...lines,
    ...(more > 0 ? ['', `${more} more decided comparisons in report.html.`] : []),
    '',
  ];
}

function metricsMatrix(model: OverviewModel): string[] {
  const columns = model.columns.slice(0, 4);
  const withBaseline = model.sharedBaseline === null;
  const head = [withBaseline ? 'Candidate v baseline' : 'Candidate', ...columns.map(name)];
  const lines = [row(head), rule(head.length)];
  const shown = model.rows.slice(0, OVERVIEW_ROWS);
  for (const r of shown) {
    const label = withBaseline ? `${name(r.candidate)} v ${name(r.baseline)}` : name(r.candidate);
    lines.push(row([label, ...columns.map((col) => cell(r.cells.get(col)))]));
  }
  const more = model.rows.length - shown.length;
  const kind = sharedIntervalKind(model.comparisons);
  return [
    `Cells: ▲ better, ▼ worse, ● inconclusive; difference, candidate minus baseline${
      kind === null ? '' : ` [${kind}, unadjusted]`
    }.`,
    '',
    ...lines,
    ...(more > 0 ? ['', `${more} more candidates in report.html.`] : []),
    '',
  ];
}

function aggregatesLines(results: Results, metric: string): string[] {
  const aggs = results.tasks.filter((t) => t.metric === metric);
  if (aggs.length === 0) return [];
  const tasks = Math.max(...aggs.map((a) => a.tasks));
  const leftOut = aggs.find((a) => a.leftOut !== undefined)?.leftOut ?? [];
  const normalised = aggs.some((a) => a.normalisation !== undefined);
  const scores = normalised ? 'Scores normalised per task (min-max over all runs of the task)' : 'Raw scores';
  const listed = leftOut.slice(0, 12).map(name).join(', ');
  const more = leftOut.length > 12 ? ` and ${leftOut.length - 12} more` : '';
  const left = leftOut.length > 0 ? ` Left out (some config has no score there): ${listed}${more}.` : '';
  const lines = [
    `### Across ${tasks} tasks: ${name(metric)}`,
    '',
    `${scores}; interquartile mean with its 95% stratified bootstrap interval; ` +
      `P(candidate better) averaged over tasks.${left}`,
    '',
    row(['Config', 'Interquartile mean [interval]', 'P(candidate better)', 'Tasks']),
    rule(4),
  ];
  for (const a of aggs.slice(0, OVERVIEW_ROWS)) {
    const iqm = a.interquartileMean === null ? '—' : withInterval(a.interquartileMean, a.low, a.high, 3);
    const poi =
      a.probabilityOfImprovement === null
        ? a.baseline === null
          ? 'baseline'
          : '—'
        : formatNumber(a.probabilityOfImprovement, 3);
    lines.push(row([name(a.config), iqm, poi, String(a.tasks)]));
  }
  if (aggs.length > OVERVIEW_ROWS) lines.push('', `${aggs.length - OVERVIEW_ROWS} more configs in report.html.`);
  return [...lines, ''];
}

/** One table per numeric key: rows are the other keys' values, columns the key's values, cells mean [interval]. */
export function sweepLines(results: Results, metric: string, summary: string): string[] {
  const out: string[] = [];
  for (const key of sweepKeys(results)) {
    const sweep = sweepModel(results, metric, summary, key);
    if (sweep === null || sweep.xs.length < 2) continue;
    const xs = sweep.xs.slice(0, SWEEP_COLUMNS);
    const decimals = sweepDecimals(sweep);
    const rowKeys = sweep.taskKey === null ? sweep.others : [...sweep.others, sweep.taskKey];
    out.push(
      `### ${name(metric)} against ${name(key)}`,
      '',
      `Mean across seeds of each config's ${name(summary)} value [its interval between seeds], one row per ${
        rowKeys.map(name).join(', ') || 'config'
      }.`,
      '',
      row([rowKeys.map(name).join(', ') || 'configs', ...xs.map((x) => `${name(key)}=${x}`)]),
      rule(xs.length + 1),
    );
    for (const s of sweep.series.slice(0, SWEEP_ROWS)) {
      const cells = xs.map((x) => {
        const p = s.points.find((q) => q.x === x);
        if (p === undefined) return '—';
        return withInterval(p.mean, p.low, p.high, decimals);
      });
      out.push(row([name(s.label === '' ? 'all' : s.label), ...cells]));
    }
    const more = sweep.series.length - Math.min(sweep.series.length, SWEEP_ROWS);
    const moreX = sweep.xs.length - xs.length;
    if (more > 0 || moreX > 0)
      out.push(
        '',
        `${[more > 0 ? `${more} more rows` : '', moreX > 0 ? `${moreX} more values of ${name(key)}` : '']
          .filter((x) => x !== '')
          .join(' and ')} in report.html.`,
      );
    out.push('');
  }
  return out;
}

/**
 * The overview lines of summary.md (empty when nothing was compared).
 * Cost O(comparisons log comparisons + configs). Never throws.
 * Example: demo results → `['### Overview: val_acc', '',
 * '**8 better, 0 worse, 7 inconclusive** on val_acc (higher is better, ...', ...]`.
 */
export function overviewMarkdown(results: Results): string[] {
  const model = overviewModel(results);
  if (model === null) return [];
  const m = model.metric;
  const against =
    model.sharedBaseline !== null
      ? `against ${name(model.sharedBaseline)}`
      : results.settings.baseline === null
        ? 'every pair of configs'
        : `each config against its counterpart with ${name(results.settings.baseline)}`;
  return [
    `### Overview: ${name(m.name)}`,
    '',
    `**${countsWords(model.counts)}** on ${name(m.name)} ` +
      `(${goalWords(m.goal, m.goalSource, ', guessed from the name')}; ` +
      `summary ${name(model.summary)}), ${against}; ${escapeMarkdown(familyWords(results, model))}.`,
    '',
    ...(model.mode === 'tasks' ? decidedTable(model) : metricsMatrix(model)),
    ...aggregatesLines(results, m.name),
    ...sweepLines(results, m.name, model.summary),
  ];
}
