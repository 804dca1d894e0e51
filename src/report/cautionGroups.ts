/**
 * Cautions grouped by kind (`Comparison.cautionKinds`): one entry per kind of concern with the
 * number of comparisons it touches and which ones, and under it the distinct lines (a line that
 * repeats over comparisons is said once). A study of hundreds of comparisons reads as a handful of
 * kinds ("failed runs, 12 comparisons") instead of hundreds of near-identical sentences. The same
 * grouping feeds the HTML verdict section, each metric's comparison details and summary.md;
 * `cautionGroupText` gives the words both formats use. Reads comparisons; computes no statistic.
 */
import type { CautionKind, Comparison } from '../analysis/results.js';
import { escapeMarkdown } from './escape.js';
import { textHtml } from './html.js';

/** A caution kind in words, as the heading of its group. */
export const CAUTION_KIND_WORDS: Readonly<Record<CautionKind, string>> = {
  'reach-summary': 'steps-to-reach summary',
  'goal-guessed': 'goal guessed from the name',
  'few-seeds': 'few seeds',
  skewed: 'skewed values',
  'unequal-seeds': 'unequal seed counts',
  'failed-runs': 'failed runs',
  'zero-spread': 'zero spread',
  'no-value': 'runs without a value',
  'not-run': 'tests or intervals not computed',
  'tests-disagree': 'tests disagree',
  fragile: 'fragile verdict',
};

/** One distinct caution line and the comparisons that carry it. */
export interface CautionLine {
  readonly line: string;
  readonly comparisons: readonly Comparison[];
}

/** The cautions of one kind over some comparisons. */
export interface CautionGroup {
  readonly kind: CautionKind;
  /** The comparisons concerned, each once, in the order given. */
  readonly comparisons: readonly Comparison[];
  /** True when it concerns every one of more than one comparison given. */
  readonly all: boolean;
  /** Its distinct lines, in first-seen order. */
  readonly lines: readonly CautionLine[];
}

/**
 * The cautions of `comparisons` grouped by kind, kinds in first-seen order.
 * Cost O(total cautions). Never throws.
 * Example: 15 comparisons of a guessed goal, 1 with a failed run → two groups, `goal-guessed`
 * (15 comparisons, all, one line) and `failed-runs` (1 comparison).
 */
export function groupCautionsByKind(comparisons: readonly Comparison[]): CautionGroup[] {
  const byKind = new Map<CautionKind, { comparisons: Set<Comparison>; lines: Map<string, Comparison[]> }>();
  for (const c of comparisons) {
    c.cautions.forEach((line, i) => {
      const kind = c.cautionKinds[i] ?? 'not-run';
      const g = byKind.get(kind) ?? { comparisons: new Set<Comparison>(), lines: new Map<string, Comparison[]>() };
      g.comparisons.add(c);
      g.lines.set(line, [...(g.lines.get(line) ?? []), c]);
      byKind.set(kind, g);
    });
  }
  return [...byKind].map(([kind, g]) => ({
    kind,
    comparisons: [...g.comparisons],
    all: g.comparisons.size === comparisons.length && comparisons.length > 1,
    lines: [...g.lines].map(([line, list]) => ({ line, comparisons: list })),
  }));
}

/** Comparisons named in one scope before the rest are counted. */
export const SCOPE_NAMES = 6;
/** Distinct lines shown under one kind before the rest are counted. */
export const KIND_LINES = 3;

/** A group in words: its heading and its items (scope, then line), names through `name`. */
export interface CautionGroupText {
  /** `failed runs: 2 comparisons` or `goal guessed from the name: all 15 comparisons`. */
  readonly head: string;
  /** `scope: line` for each distinct line shown (scope empty when it is every comparison), then `N more ...`. */
  readonly items: readonly { readonly scope: string; readonly line: string }[];
}

/**
 * The words of one group. `metricToo` names each comparison's metric (for a list over metrics).
 * Cost O(lines + comparisons). Never throws.
 * Example: `failed runs: 1 comparison`, item `{ scope: 'b v a (count)', line: '1 failed run ...' }`.
 */
export function cautionGroupText(g: CautionGroup, name: (text: string) => string, metricToo = false): CautionGroupText {
  const n = g.comparisons.length;
  const head = `${CAUTION_KIND_WORDS[g.kind]}: ${g.all ? 'all ' : ''}${n} comparison${n === 1 ? '' : 's'}`;
  const one = (c: Comparison): string =>
    `${metricToo ? `${name(c.metric)}, ` : ''}${name(c.candidate)} v ${name(c.baseline)}` +
    (c.task === null ? '' : ` (${name(c.task)})`);
  const scope = (list: readonly Comparison[]): string => {
    if (list.length === n && g.all) return '';
    const shown = list.slice(0, SCOPE_NAMES).map(one).join('; ');
    return list.length > SCOPE_NAMES ? `${shown}; and ${list.length - SCOPE_NAMES} more` : shown;
  };
  const items = g.lines.slice(0, KIND_LINES).map((l) => ({ scope: scope(l.comparisons), line: l.line }));
  const rest = g.lines.slice(KIND_LINES);
  if (rest.length > 0) {
    const touched = new Set(rest.flatMap((l) => l.comparisons)).size;
    items.push({
      scope: `${rest.length} more line${rest.length === 1 ? '' : 's'} of this kind`,
      line: `on ${touched} comparison${touched === 1 ? '' : 's'}, each in results.json and in its metric's details`,
    });
  }
  return { head, items };
}

/**
 * Cautions of some comparisons as an HTML list, one item per kind (its heading bold), its lines
 * inline when there is one and as a nested list otherwise. Empty string when there are none.
 * Cost O(total cautions). Never throws.
 */
export function cautionListHtml(comparisons: readonly Comparison[], metricToo = false): string {
  const groups = groupCautionsByKind(comparisons);
  if (groups.length === 0) return '';
  const items = groups.map((g) => {
    const t = cautionGroupText(g, (n) => n, metricToo);
    const line = (i: { scope: string; line: string }): string =>
      textHtml(i.scope === '' ? i.line : `${i.scope}: ${i.line}`);
    const first = t.items[0];
    const body =
      t.items.length === 1 && first !== undefined
        ? ` ${line(first)}`
        : `<ul>${t.items.map((i) => `<li>${line(i)}</li>`).join('')}</ul>`;
    return `<li><strong>${textHtml(t.head)}.</strong>${body}</li>`;
  });
  return `<ul class="cautions">${items.join('')}</ul>`;
}

/**
 * The same list in Markdown, names and lines through `name` and `escapeMarkdown`.
 * Cost O(total cautions). Never throws.
 * Example: `['- **failed runs: 1 comparison**. b v a (count): 1 failed run left out ...']`.
 */
export function cautionListMarkdown(comparisons: readonly Comparison[], name: (text: string) => string): string[] {
  return groupCautionsByKind(comparisons).flatMap((g) => {
    const t = cautionGroupText(g, name);
    const line = (i: { scope: string; line: string }): string =>
      `${i.scope === '' ? '' : `${i.scope}: `}${escapeMarkdown(i.line)}`;
    const first = t.items[0];
    if (t.items.length === 1 && first !== undefined) return [`- **${t.head}**. ${line(first)}`];
    return [`- **${t.head}**.`, ...t.items.map((i) => `  - ${line(i)}`)];
  });
}
