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
  formatFailures,
  formatIntervalKind,
  formatLevel,
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

const PRIMARY_LABEL: Readonly<Record<Comparison['primary'], string>> = {
  welch: 'Welch t-test (decides)',
  'paired-t': 'Welch t-test (beside the paired test)',
  permutation: 'Welch t-test (undefined: zero spread)',
  'log-rank': 'Welch t-test (not run: time to event)',
};

/** The quantities of one comparison, in display order: [label, cell]. */
function quantities(r: Results, c: Comparison): [string, TableCell][] {
  const d = comparisonDecimals(c);
  const t = c.tests;
  const out: [string, TableCell][] = [
    ['Step compared at', c.step === null ? null : formatNumber(c.step, 0)],
    ['Mean (baseline v candidate)', `${formatNumber(c.mean.baseline, d)} v ${formatNumber(c.mean.candidate, d)}`],
    [
      'SD between seeds (baseline v candidate)',
      `${formatNumber(c.sd.baseline, d)} v ${formatNumber(c.sd.candidate, d)}`,
    ],
    ['Seeds (baseline v candidate)', formatSeeds(c, r.settings.failed)],
    ['Failed runs (Fisher exact test)', formatFailures(c)],
    [
      `Difference, candidate minus baseline [${formatIntervalKind(c.difference)}, unadjusted]`,
      formatDifference(c.difference, d),
    ],
    [
      `Simultaneous bounds [` +
        (c.difference.simultaneous === null ? 'Bonferroni' : formatLevel(c.difference.simultaneous.level)) +
        `, family of ${c.family.size}]`,
      c.difference.simultaneous === null
        ? null
        : `[${formatNumber(c.difference.simultaneous.low, d)}, ${formatNumber(c.difference.simultaneous.high, d)}]`,
    ],
    [
      `BCa bootstrap interval beside (from ${r.settings.bootstrapFrom} runs per arm; does not decide)`,
      c.difference.bca === null
        ? null
        : `[${formatNumber(c.difference.bca.low, d)}, ${formatNumber(c.difference.bca.high, d)}]`,
    ],
  ];
  if (c.timeToEvent !== null) {
    const k = c.timeToEvent;
    const arm = (a: typeof k.baseline): string =>
      `${a.reached} of ${a.runs} reached ` +
      `(Kaplan-Meier ${a.fraction === null ? '—' : formatNumber(a.fraction, 2)}), ` +
      `median ${a.medianSteps === null ? 'not reached' : formatNumber(a.medianSteps, 0)} steps`;
    out.push(
      ['Baseline: reached', arm(k.baseline)],
      ['Candidate: reached', arm(k.candidate)],
      [
        `Log-rank test (decides; ` +
          (k.logRank.method === 'chi-square'
            ? 'chi-square, 1 df'
            : k.logRank.method === 'exact-permutation'
              ? 'exact permutation p'
              : 'random relabelings') +
          `)`,
        `chi-square = ${formatNumber(k.logRank.statistic, 2)}, p = ${formatP(k.logRank.p)}; candidate ` +
          `reached ${formatNumber(k.logRank.observed, 0)} times, ${formatNumber(k.logRank.expected, 2)} expected`,
      ],
    );
  } else {
    out.push([
      PRIMARY_LABEL[c.primary],
      `t = ${formatNumber(t.welch.statistic, 2)}, df = ${formatNumber(t.welch.df, 1)}, p = ${formatP(t.welch.p)}`,
    ]);
  }
  if (t.paired !== undefined) {
    out.push([
      'Paired t-test (decides) and Wilcoxon signed-rank',
      `t = ${formatNumber(t.paired.t, 2)}, df = ${formatNumber(t.paired.df, 1)}, p = ${formatP(t.paired.p)}; ` +
        `Wilcoxon p = ${formatP(t.paired.wilcoxonP)} (${t.paired.pairs} pairs)`,
    ]);
  }
  out.push(
    [
      c.primary === 'permutation' ? 'Permutation test (decides: zero spread)' : 'Permutation test',
      `p = ${formatP(t.permutation.p)} (${t.permutation.exact ? 'exact, every split' : 'random relabelings'})`,
    ],
    [
      'Mann-Whitney U',
      `U = ${formatNumber(t.mannWhitney.u, 1)}, p = ${formatP(t.mannWhitney.p)} ` +
        `(${t.mannWhitney.exact ? 'exact' : 'normal approximation'})`,
    ],
    [
      `p adjusted (${CORRECTION[r.settings.correction]}, ` +
        `${c.family.scope === 'study' ? 'all tasks' : 'this task'}: family of ${c.family.size})`,
      formatP(c.pAdjusted),
    ],
    ['Verdict', { html: verdictHtml(c) }],
    [
      "Hedges' g, candidate minus baseline [interval]",
      withInterval(c.effect.hedgesG, c.effect.hedgesGLow, c.effect.hedgesGHigh, 2),
    ],
    [
      'P(candidate better)',
      c.effect.probabilityOfImprovement === null ? null : formatNumber(c.effect.probabilityOfImprovement, 2),
    ],
    [
      "Cliff's delta, candidate minus baseline [interval]",
      withInterval(c.effect.cliffsDelta, c.effect.cliffsDeltaLow, c.effect.cliffsDeltaHigh, 2),
    ],
    ['Smallest difference these seeds detect (80% power)', formatNumber(c.detectable.minimumEffect, d)],
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
    const caption =
      `Candidate minus baseline, in the metric's own units (summary ${summary}); each comparison at its own step; ` +
      `every statistic of each comparison is in the table below.` +
      (left > 0
        ? ` ${left} more comparisons (inconclusive) are left out here: their rows are under All verdicts and ` +
          `every statistic in results.json.`
        : '');
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
