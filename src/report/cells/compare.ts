/**
 * `{{compare "val_acc"}}` (option `summary="last:10%"`): every comparison of one metric in full:
 * the difference chart (`compareChart`), then one column per comparison with the means, the
 * difference and its interval, the primary Welch test and the robustness checks beside it
 * (permutation, Mann-Whitney, paired tests when run), the adjusted p and verdict, effect sizes,
 * what the seeds can detect, and the caution lines. Everything is read from `Results`.
 */
import { cautionScope, groupCautions } from '../verdictWords.js';
import type { Comparison, Results } from '../../analysis/results.js';
import { compareChart } from '../charts/compareChart.js';
import {
  comparisonDecimals,
  formatDifference,
  formatIntervalKind,
  formatNumber,
  formatP,
  formatSeeds,
  formatSigned,
} from '../format.js';
import { listHtml, nameHtml, tableHtml, type TableCell } from '../html.js';
import { decidedFirst } from '../studyShape.js';
import { verdictHtml } from './verdicts.js';
import { figureHtml, metricParam, summaryOption, type Cell } from './cell.js';

const CORRECTION = { holm: 'Holm', bh: 'Benjamini-Hochberg', none: 'no' } as const;

function withInterval(x: number | null, low: number | null, high: number | null, decimals: number): string {
  if (x === null) return '—';
  return low === null || high === null
    ? formatSigned(x, decimals)
    : `${formatSigned(x, decimals)} [${formatNumber(low, decimals)}, ${formatNumber(high, decimals)}]`;
}

/** The quantities of one comparison, in display order: [label, cell]. */
function quantities(r: Results, c: Comparison): [string, TableCell][] {
  const d = comparisonDecimals(c);
  const t = c.tests;
  const out: [string, TableCell][] = [
    ['Mean (baseline v candidate)', `${formatNumber(c.mean.baseline, d)} v ${formatNumber(c.mean.candidate, d)}`],
    [
      'SD between seeds (baseline v candidate)',
      `${formatNumber(c.sd.baseline, d)} v ${formatNumber(c.sd.candidate, d)}`,
    ],
    ['Seeds (baseline v candidate)', formatSeeds(c, r.settings.diverged)],
    [`Difference [${formatIntervalKind(c.difference)}]`, formatDifference(c.difference, d)],
    [
      'Welch t-test (primary)',
      `t = ${formatNumber(t.welch.statistic, 2)}, df = ${formatNumber(t.welch.df, 1)}, p = ${formatP(t.welch.p)}`,
    ],
  ];
  if (t.paired !== undefined) {
    out.push([
      'Paired t-test and Wilcoxon signed-rank',
      `t = ${formatNumber(t.paired.t, 2)}, df = ${formatNumber(t.paired.df, 1)}, p = ${formatP(t.paired.p)}; Wilcoxon p = ${formatP(t.paired.wilcoxonP)} (${t.paired.pairs} pairs)`,
    ]);
  }
  out.push(
    [
      'Permutation test',
      `p = ${formatP(t.permutation.p)} (${t.permutation.exact ? 'exact, every split' : 'random relabelings'})`,
    ],
    [
      'Mann-Whitney U',
      `U = ${formatNumber(t.mannWhitney.u, 1)}, p = ${formatP(t.mannWhitney.p)} (${t.mannWhitney.exact ? 'exact' : 'normal approximation'})`,
    ],
    [`p adjusted (${CORRECTION[r.settings.correction]})`, formatP(c.pAdjusted)],
    ['Verdict', { html: verdictHtml(c) }],
    ["Hedges' g [interval]", withInterval(c.effect.hedgesG, c.effect.hedgesGLow, c.effect.hedgesGHigh, 2)],
    [
      'P(candidate better)',
      c.effect.probabilityOfImprovement === null ? null : formatNumber(c.effect.probabilityOfImprovement, 2),
    ],
    [
      "Cliff's delta [interval]",
      withInterval(c.effect.cliffsDelta, c.effect.cliffsDeltaLow, c.effect.cliffsDeltaHigh, 2),
    ],
    ['Smallest difference these seeds detect (80% power)', formatNumber(c.detectable.minimumEffect, d)],
    [
      'Seeds per arm to detect the observed difference (80% power)',
      c.detectable.seedsFor80 === null ? null : formatNumber(c.detectable.seedsFor80, 0),
    ],
  );
  return out;
}

export const compare: Cell = {
  name: 'compare',
  usage: '{{compare "METRIC"}} or {{compare "METRIC" summary="last:10%"}}',
  arity: [1, 1],
  options: ['summary'],
  render(state, call) {
    const m = metricParam(state, call, 0);
    const summary = summaryOption(state, call, m.name);
    const r = state.results;
    const all = r.comparisons.filter((c) => c.metric === m.name && c.summary === summary);
    const mine = detailedComparisons(all);
    const left = all.length - mine.length;
    const caption = `Candidate minus baseline (summary ${summary}); every statistic of each comparison is in the table below.${left > 0 ? ` ${left} more comparisons (inconclusive) are left out here: their rows are under All verdicts and every statistic in results.json.` : ''}`;
    const chart = figureHtml(
      state,
      compareChart(left > 0 ? { ...r, comparisons: mine } : r, m.name, summary),
      caption,
      `No comparisons of ${m.name} under summary ${summary}.`,
    );
    if (mine.length === 0) return chart;
    const columns = mine.map((c) => quantities(r, c));
    const labels = columns[0]?.map(([label]) => label) ?? [];
    const rows: TableCell[][] = labels.map((label, i) => [label, ...columns.map((col) => col[i]?.[1] ?? null)]);
    const head = ['', ...mine.map((c) => ({ html: comparisonTitleHtml(c) }))];
    const table = tableHtml({ className: 'compare', head, rows, numeric: mine.map((_, i) => i + 1) });
    const cautions = groupCautions(mine).map((c) => `${cautionScope(c, (n) => n)}: ${c.line}`);
    return chart + table + listHtml(cautions);
  },
};

/** Comparisons detailed in full before the rest are left to the verdict table. */
export const DETAILED_UP_TO = 12;

/**
 * The comparisons a compare cell details: all of them up to `DETAILED_UP_TO`; beyond, the decided
 * ones (smallest adjusted p first, at most `DETAILED_UP_TO`), or the first ones when none is decided.
 * Cost O(comparisons log comparisons). Never throws.
 */
export function detailedComparisons(all: readonly Comparison[]): Comparison[] {
  if (all.length <= DETAILED_UP_TO) return [...all];
  const decided = decidedFirst(all).filter((c) => c.verdict !== 'inconclusive');
  const chosen = new Set(decided.length > 0 ? decided.slice(0, DETAILED_UP_TO) : all.slice(0, DETAILED_UP_TO));
  return all.filter((c) => chosen.has(c));
}

/** The comparison's column title as HTML (names isolated). */
export function comparisonTitleHtml(c: Comparison): string {
  return `${nameHtml(c.candidate)} v ${nameHtml(c.baseline)}${c.task === null ? '' : ` (${nameHtml(c.task)})`}`;
}
