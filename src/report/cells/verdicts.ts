/**
 * `{{verdicts}}` / `{{verdicts "val_acc"}}`: the verdict table, the first thing a reviewer reads.
 * One row per comparison: metric, baseline, candidate, difference with its interval, adjusted p,
 * verdict (word and shape, never colour alone), seeds (n v n, diverged runs noted); then each
 * comparison's caution lines and the caution that a test is evidence, not proof.
 */
import type { Comparison, Results } from '../../analysis/results.js';
import { comparisonDecimals, formatDifference, formatIntervalKind, formatP, formatSeeds } from '../format.js';
import { listHtml, nameHtml, noteHtml, tableHtml, textHtml, type TableCell } from '../html.js';
import {
  cautionScope,
  comparisonGroups,
  groupCautions,
  goalWords,
  sharedIntervalKind,
  standardCaution,
  VERDICT_LABELS,
} from '../verdictWords.js';
import { metricParam, type Cell } from './cell.js';

const CORRECTION_HEAD = { holm: 'p (Holm)', bh: 'p (BH)', none: 'p' } as const;

/** The verdict badge of a comparison, with the non-inferiority result when a margin was set. */
export function verdictHtml(c: Comparison): string {
  const badge = `<span class="verdict verdict-${c.verdict}">${VERDICT_LABELS[c.verdict]}</span>`;
  if (c.nonInferiority === null) return badge;
  const ni = c.nonInferiority;
  const words = ni.holds
    ? `not worse by more than ${ni.margin} (p ${formatP(ni.p)})`
    : `not shown to be within ${ni.margin} (p ${formatP(ni.p)})`;
  return `${badge}<br><span class="small">${textHtml(words)}</span>`;
}

function rows(
  results: Results,
  metric: string | undefined,
): { rows: TableCell[][]; classes: string[]; cautions: string[]; withTask: boolean; interval: string | null } {
  const groups = comparisonGroups(results, metric);
  const all = groups.flatMap((g) => g.comparisons);
  const interval = sharedIntervalKind(all);
  const withTask = groups.some((g) => g.task !== null);
  const out: TableCell[][] = [];
  const classes: string[] = [];
  const cautions: string[] = [];
  for (const g of groups) {
    g.comparisons.forEach((c, i) => {
      const d = comparisonDecimals(c);
      const goal = goalWords(g.goal, g.goalSource);
      const metricCell: TableCell =
        i === 0
          ? {
              html: `${nameHtml(g.metric)}<br><span class="small">${textHtml(goal)};<br>${textHtml(`summary ${g.summary}`)}</span>`,
            }
          : { html: '' };
      const difference =
        formatDifference(c.difference, d) + (interval === null ? ` (${formatIntervalKind(c.difference)})` : '');
      out.push([
        metricCell,
        ...(withTask ? [c.task === null ? null : { html: nameHtml(c.task) }] : []),
        { html: nameHtml(c.baseline) },
        { html: nameHtml(c.candidate) },
        difference,
        formatP(c.pAdjusted),
        { html: verdictHtml(c) },
        formatSeeds(c, results.settings.diverged),
      ]);
      classes.push(i === 0 ? `row-${c.verdict} group-start` : `row-${c.verdict}`);
    });
    for (const c of groupCautions(g.comparisons)) cautions.push(`${g.metric}, ${cautionScope(c, (n) => n)}: ${c.line}`);
  }
  return { rows: out, classes, cautions, withTask, interval };
}

export const verdicts: Cell = {
  name: 'verdicts',
  usage: '{{verdicts}} or {{verdicts "METRIC"}}',
  arity: [0, 1],
  options: [],
  render(state, call) {
    const metric = call.params.length === 1 ? metricParam(state, call, 0).name : undefined;
    const r = state.results;
    const t = rows(r, metric);
    if (t.rows.length === 0) {
      return noteHtml(
        metric === undefined
          ? 'No comparisons: the runs hold fewer than two configs to compare, or no metric with values.'
          : `No comparisons of ${metric}.`,
      );
    }
    const head = [
      'Metric',
      ...(t.withTask ? ['Task'] : []),
      'Baseline',
      'Candidate',
      t.interval === null ? 'Difference [interval]' : `Difference [${t.interval}]`,
      CORRECTION_HEAD[r.settings.correction],
      'Verdict',
      'Seeds',
    ];
    const offset = t.withTask ? 1 : 0;
    const table = tableHtml({
      className: 'verdicts',
      head,
      rows: t.rows,
      numeric: [3 + offset, 4 + offset],
      rowClasses: t.classes,
    });
    const lead = `Candidate minus baseline on per-run values; verdict at alpha ${r.settings.alpha} on the adjusted p of Welch's t-test${r.settings.paired ? ' (paired t under --paired)' : ''}.`;
    return `<div class="verdicts-cell">${noteHtml(lead, 'lead')}${table}${listHtml(t.cautions)}${noteHtml(standardCaution(r.settings.alpha), 'caution')}</div>`;
  },
};
