/**
 * The overview as plain text for the terminal (`seedsift report` prints it, so a CI log shows the
 * answer): the primary metric's verdict counts and family, then its decided comparisons first
 * (better, then worse, by adjusted p), then inconclusive ones while the screen lasts, at most
 * `SCREEN_LINES` lines in all, and what was left out counted. Names are shown with hidden
 * characters made visible. Reads `Results`; computes nothing.
 */
import { goalWords } from './verdictWords.js';
import type { Comparison, Results } from '../analysis/results.js';
import { visibleText } from './escape.js';
import { comparisonDecimals, formatDifference, formatP } from './format.js';
import { countsWords, familyWords, overviewModel } from './overviewModel.js';

/** Most lines the overview prints (a terminal screen, with room for the lines around it). */
export const SCREEN_LINES = 20;

const MARKS = { better: '▲', worse: '▼', inconclusive: '●' } as const;

function who(c: Comparison, sharedBaseline: boolean): string {
  const versus = sharedBaseline ? '' : ` v ${visibleText(c.baseline, 60)}`;
  const task = c.task === null ? '' : ` (${visibleText(c.task, 40)})`;
  return `${visibleText(c.candidate, 60)}${versus}${task}`;
}

function line(c: Comparison, sharedBaseline: boolean, width: number): string {
  const difference = formatDifference(c.difference, comparisonDecimals(c));
  const mark = `${MARKS[c.verdict]} ${c.verdict.padEnd(12)}`;
  return `  ${mark} ${who(c, sharedBaseline).padEnd(width)}  ${difference}  p ${formatP(c.pAdjusted)}`;
}

/**
 * The overview text, ending in a newline; '' when nothing was compared.
 * Cost O(comparisons log comparisons). Never throws.
 * Example: demo results → `'val_acc (higher is better; summary final) against ticks=8,memory=4: 14 better, ...'`,
 * then the family line and one line per comparison, decided ones first
 * (`'  ▲ better       ticks=32,memory=4 (count)  +0.04885 [0.04169, 0.05602]  p < 0.001'`).
 */
export function overviewText(results: Results): string {
  const model = overviewModel(results);
  if (model === null) return '';
  const shared = model.sharedBaseline !== null;
  const head = [
    `${visibleText(model.metric.name, 80)} (${goalWords(model.metric.goal, model.metric.goalSource, '')}; ` +
      `summary ${model.summary})${shared ? ` against ${visibleText(model.sharedBaseline ?? '', 80)}` : ''}: ` +
      countsWords(model.counts),
    `  ${familyWords(results, model)}`,
  ];
  const room = SCREEN_LINES - head.length - 1;
  const shown = model.decided.slice(0, room);
  const width = Math.max(0, ...shown.map((c) => who(c, shared).length));
  const lines = [...head, ...shown.map((c) => line(c, shared, width))];
  const left = model.decided.length - shown.length;
  if (left > 0) {
    const undecided = model.decided.slice(shown.length).filter((c) => c.verdict !== 'inconclusive').length;
    lines.push(`  ... ${left} more (${undecided} of them decided) in the report`);
  }
  return `${lines.join('\n')}\n`;
}
