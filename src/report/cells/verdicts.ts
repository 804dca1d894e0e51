/**
 * `{{verdicts}}` / `{{verdicts "val_acc"}}`: the verdict table, the first thing a reviewer reads.
 * One row per comparison: metric, baseline, candidate, difference with its interval, adjusted p,
 * verdict (word and shape, never colour alone), seeds (n v n, diverged runs noted); then each
 * comparison's caution lines and the caution that a test is evidence, not proof.
 */
import type { Comparison, Results } from '../../analysis/results.js';
import {
  comparisonDecimals,
  formatDifference,
  formatFailures,
  formatIntervalKind,
  formatLevel,
  formatNumber,
  formatP,
  formatSeeds,
} from '../format.js';
import { nameHtml, noteHtml, tableHtml, textHtml, type TableCell } from '../html.js';
import { cautionListHtml } from '../cautionGroups.js';
import { comparisonGroups, goalWords, sharedIntervalKind, standardCaution, VERDICT_LABELS } from '../verdictWords.js';
import { metricParam, type Cell } from './cell.js';

const CORRECTION_HEAD = { holm: 'p (Holm)', bh: 'p (BH)', none: 'p (unadjusted)' } as const;

/** Which test decided, in a few words under the verdict. */
export const PRIMARY_WORDS: Readonly<Record<Comparison['primary'], string>> = {
  welch: "Welch's t",
  'paired-t': 'paired t',
  permutation: 'exact permutation (zero spread)',
  'log-rank': 'log-rank',
};

/** The verdict badge of a comparison, with the non-inferiority result (and its test) when a margin was set. */
export function verdictHtml(c: Comparison): string {
  const badge = `<span class="verdict verdict-${c.verdict}">${VERDICT_LABELS[c.verdict]}</span>`;
  const notes: string[] = [PRIMARY_WORDS[c.primary]];
  const failures = formatFailures(c);
  if (failures !== null) notes.push(failures);
  const ni = c.nonInferiority;
  if (ni !== null)
    notes.push(
      ni.holds
        ? `not worse by more than ${ni.margin} (${PRIMARY_WORDS[ni.test]}, p ${formatP(ni.p)})`
        : `not shown to be within ${ni.margin} (${PRIMARY_WORDS[ni.test]}, p ${formatP(ni.p)})`,
    );
  return `${badge}${notes.map((n) => `<br><span class="small">${textHtml(n)}</span>`).join('')}`;
}

function rows(
  results: Results,
  metric: string | undefined,
): { rows: TableCell[][]; classes: string[]; cautions: string; withTask: boolean; interval: string | null } {
  const groups = comparisonGroups(results, metric);
  const all = groups.flatMap((g) => g.comparisons);
  const interval = sharedIntervalKind(all);
  const withTask = groups.some((g) => g.task !== null);
  const out: TableCell[][] = [];
  const classes: string[] = [];
  for (const g of groups) {
    // The baseline is said once per group when the group has one (else beside each candidate).
    const baselines = new Set(g.comparisons.map((c) => c.baseline));
    const shared = baselines.size === 1 ? (g.comparisons[0]?.baseline ?? null) : null;
    g.comparisons.forEach((c, i) => {
      const d = comparisonDecimals(c);
      const goal = goalWords(g.goal, g.goalSource);
      const words = [goal, `summary ${g.summary}`, familyWords(c)].map(textHtml).join(';<br>');
      const against = shared === null ? '' : `<br><span class="small">against</span> ${nameHtml(shared)}`;
      const metricCell: TableCell =
        i === 0 ? { html: `${nameHtml(g.metric)}<br><span class="small">${words}</span>${against}` } : { html: '' };
      const versus = shared === null ? `<br><span class="small">v</span> ${nameHtml(c.baseline)}` : '';
      const difference =
        formatDifference(c.difference, d) + (interval === null ? ` (${formatIntervalKind(c.difference)})` : '');
      out.push([
        metricCell,
        ...(withTask ? [c.task === null ? null : { html: nameHtml(c.task) }] : []),
        { html: `${nameHtml(c.candidate)} ${verdictHtml(c)}${versus}` },
        c.step === null ? null : formatNumber(c.step, 0),
        difference,
        formatP(c.pAdjusted),
        formatSeeds(c, results.settings.failed),
      ]);
      classes.push(i === 0 ? `row-${c.verdict} group-start` : `row-${c.verdict}`);
    });
  }
  const cautions = cautionListHtml(all, new Set(all.map((c) => c.metric)).size > 1);
  return { rows: out, classes, cautions, withTask, interval };
}

/** The family a comparison was adjusted in: `family: 6 comparisons over all tasks`. */
export function familyWords(c: Comparison): string {
  const plural = c.family.size === 1 ? '' : 's';
  const scope = c.family.scope === 'study' ? (c.task === null ? '' : ' over all tasks') : ' of this task';
  return `family: ${c.family.size} comparison${plural}${scope}`;
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
      'Metric and baseline',
      ...(t.withTask ? ['Task'] : []),
      'Candidate and verdict',
      'Step',
      {
        html:
          textHtml(t.interval === null ? 'Difference [interval]' : `Difference [${t.interval}]`) +
          `<br>${textHtml('unadjusted')}`,
      },
      CORRECTION_HEAD[r.settings.correction],
      'Seeds',
    ];
    const offset = t.withTask ? 1 : 0;
    const table = tableHtml({
      className: 'verdicts',
      head,
      rows: t.rows,
      numeric: [2 + offset, 3 + offset, 4 + offset],
      rowClasses: t.classes,
    });
    const lead =
      'Candidate minus baseline on per-run values, each comparison at its own step; ' +
      `verdict at alpha ${r.settings.alpha} on the adjusted p of the test named under it. ` +
      `The interval is unadjusted (${formatLevel(r.settings.level)}): ` +
      'the verdict, not the interval, accounts for the family.';
    const caution = noteHtml(standardCaution(r.settings.alpha), 'caution');
    return `<div class="verdicts-cell">${noteHtml(lead, 'lead')}${table}${t.cautions}${caution}</div>`;
  },
};
