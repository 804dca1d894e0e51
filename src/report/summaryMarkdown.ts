/**
 * `summary.md`: the verdicts as GitHub-flavoured Markdown for a pull request. One table per metric
 * (and summary, and task): baseline, candidate, difference with its interval, adjusted p, verdict,
 * seeds; then the caution lines of those comparisons and the caution that a test is evidence, not
 * proof, after the overview (`overviewMarkdown`: the answer, aggregates, sweeps); the whole stays
 * within `SUMMARY_LIMIT` characters (`fitGroups`). Every name from the data is escaped
 * (`escapeMarkdown`: no emphasis, link, HTML, cell break or mention can form; newlines become spaces).
 * Renders `Results`; computes nothing statistical.
 */
import type { Comparison, Results } from '../analysis/results.js';
import { cautionListMarkdown } from './cautionGroups.js';
import { escapeMarkdown } from './escape.js';
import { fitGroups, SUMMARY_LIMIT } from './fitMarkdown.js';
import { overviewMarkdown } from './overviewMarkdown.js';
import { primaryMetric } from './studyShape.js';
import {
  comparisonDecimals,
  formatDifference,
  formatFailures,
  formatLevel,
  formatIntervalKind,
  formatNumber,
  formatP,
  formatSeeds,
  formatSigned,
} from './format.js';

/** The family of a group's comparisons in words. */
function familyText(comparisons: readonly Comparison[]): string {
  const c = comparisons[0];
  if (c === undefined) return '';
  const plural = c.family.size === 1 ? '' : 's';
  const scope = c.family.scope === 'study' ? (c.task === null ? '' : ' over all tasks') : ' in this task';
  return `family of ${c.family.size} comparison${plural}${scope}`;
}
import {
  comparisonGroups,
  goalWords,
  sharedIntervalKind,
  standardCaution,
  VERDICT_LABELS,
  type ComparisonGroup,
} from './verdictWords.js';

/** Longest name shown in a table cell (longer names are cut with their length noted). */
const NAME_LIMIT = 200;

const name = (text: string): string => escapeMarkdown(text, NAME_LIMIT);
const CORRECTION_WORDS = { holm: 'Holm-adjusted', bh: 'Benjamini-Hochberg-adjusted', none: 'unadjusted' } as const;
const PRIMARY = {
  welch: "Welch's t",
  'paired-t': 'paired t',
  permutation: 'exact permutation, zero spread',
  'log-rank': 'log-rank',
} as const;

function row(cells: readonly string[]): string {
  return `| ${cells.join(' | ')} |`;
}

function verdictCell(c: Comparison): string {
  const words = [VERDICT_LABELS[c.verdict], `(${PRIMARY[c.primary]})`];
  const failures = formatFailures(c);
  if (failures !== null) words.push(`(${failures})`);
  if (c.nonInferiority !== null) {
    words.push(
      c.nonInferiority.holds
        ? `(not worse by ${c.nonInferiority.margin}, ${PRIMARY[c.nonInferiority.test]}, ` +
            `p ${formatP(c.nonInferiority.p)})`
        : `(non-inferiority at margin ${c.nonInferiority.margin} not shown, ${PRIMARY[c.nonInferiority.test]})`,
    );
  }
  return words.join(' ');
}

function groupTable(results: Results, g: ComparisonGroup): string[] {
  const shared = sharedIntervalKind(g.comparisons);
  const withTask = g.task !== null;
  const head = [
    'Baseline',
    'Candidate',
    'Step',
    shared === null ? 'Difference [interval, unadjusted]' : `Difference [${shared}, unadjusted]`,
    `p (${CORRECTION_WORDS[results.settings.correction]})`,
    'Verdict',
    'Seeds',
  ];
  const lines = [row(head), row(head.map(() => '---'))];
  for (const c of g.comparisons) {
    const decimals = comparisonDecimals(c);
    const difference =
      formatDifference(c.difference, decimals) + (shared === null ? ` (${formatIntervalKind(c.difference)})` : '');
    lines.push(
      row([
        name(c.baseline),
        name(c.candidate),
        c.step === null ? '—' : formatNumber(c.step, 0),
        difference,
        formatP(c.pAdjusted),
        verdictCell(c),
        formatSeeds(c, results.settings.failed),
      ]),
    );
  }
  const title = [
    `### ${name(g.metric)}`,
    `(${goalWords(g.goal, g.goalSource, ', guessed from the name')}; summary ${name(g.summary)}` +
      `${withTask ? `; task ${name(g.task ?? '')}` : ''}; ${familyText(g.comparisons)})`,
  ];
  const cautions = cautionListMarkdown(g.comparisons, name);
  const means = g.comparisons.map((c) => {
    const d = comparisonDecimals(c);
    if (c.timeToEvent !== null) {
      const k = c.timeToEvent;
      const arm = (a: typeof k.baseline): string =>
        `${a.reached}/${a.runs} reached, ` +
        `median ${a.medianSteps === null ? 'not reached' : formatNumber(a.medianSteps, 0)} steps`;
      return (
        `${name(c.candidate)} ${arm(k.candidate)} v ${name(c.baseline)} ${arm(k.baseline)} ` +
        `(log-rank p ${formatP(k.logRank.p)})`
      );
    }
    return (
      `${name(c.candidate)} ${formatNumber(c.mean.candidate, d)} ` +
      `v ${name(c.baseline)} ${formatNumber(c.mean.baseline, d)}`
    );
  });
  const effects = g.comparisons
    .filter((c) => c.timeToEvent === null)
    .map(
      (c) =>
        `${name(c.candidate)} v ${name(c.baseline)}: Hedges' g ${formatSigned(c.effect.hedgesG, 2)}, ` +
        `Cliff's delta ${formatSigned(c.effect.cliffsDelta, 2)}, ` +
        `P(candidate better) ${formatNumber(c.effect.probabilityOfImprovement, 2)}`,
    );
  return [
    title.join(' '),
    '',
    ...lines,
    '',
    `Means: ${means.join('; ')}.`,
    ...(effects.length > 0
      ? [
          '',
          "Effect sizes (candidate minus baseline, in the metric's own direction; " +
            'P(candidate better) follows the goal): ' +
            `${effects.join('; ')}.`,
        ]
      : []),
    ...(cautions.length > 0 ? ['', 'Cautions:', '', ...cautions] : []),
    '',
  ];
}

function problemLine(results: Results): string | null {
  const counts = { error: 0, warning: 0, note: 0 };
  for (const p of results.problems) counts[p.severity] += 1;
  const parts = (['error', 'warning', 'note'] as const)
    .filter((s) => counts[s] > 0)
    .map((s) => `${counts[s]} ${s}${counts[s] === 1 ? '' : 's'}`);
  return parts.length === 0 ? null : `Input problems: ${parts.join(', ')} (listed in the report).`;
}

/**
 * Render the Markdown summary of `Results`.
 * Cost O(comparisons + problems). Never throws for a `Results` value.
 * Example: `summaryMarkdown(results)` → `'## seedsift verdicts\n\n...| memory=4 | memory=8 | +1.71 [0.06, 3.37] |
 * 0.088 | ● inconclusive | 7 v 5 |...'`.
 */
export function summaryMarkdown(results: Results): string {
  const s = results.settings;
  const out: string[] = ['## seedsift verdicts', ''];
  out.push(
    `${results.runs.length} runs in ${results.configs.length} configs, ` +
      `generated ${results.generated.slice(0, 10)} by seedsift ${escapeMarkdown(results.tool.version)}. ` +
      `${s.paired ? 'Paired t-test' : "Welch's t-test"} on per-run values ` +
      `(summary ${name(s.summary)}: ${escapeMarkdown(s.summaryDescription)}), each comparison at its own step, ` +
      `alpha ${s.alpha}, ${CORRECTION_WORDS[s.correction]} p-values over ` +
      `${s.family === 'study' ? 'each metric and summary across all tasks' : 'each task alone'}` +
      `${s.baseline === null ? ', every pair of configs' : `, baseline ${name(s.baseline)}`}. ` +
      `Intervals are ${formatLevel(s.level)} and unadjusted; the verdict accounts for the family.`,
    '',
  );
  out.push(...overviewMarkdown(results));
  const groups = comparisonGroups(results);
  if (groups.length === 0)
    out.push('No comparisons: the runs hold fewer than two configs to compare, or no metric with values.', '');
  // The whole file stays within SUMMARY_LIMIT (a pull-request comment); 2,000 characters are kept for the lines after.
  const used = out.reduce((n, l) => n + l.length + 1, 0);
  out.push(...fitGroups(groups, (g) => groupTable(results, g), SUMMARY_LIMIT - used - 2_000, primaryMetric(results)));
  const problems = problemLine(results);
  if (problems !== null) out.push(problems, '');
  out.push(`> ${standardCaution(s.alpha)}`, '');
  return out.join('\n');
}
