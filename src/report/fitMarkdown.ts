/**
 * Keeping `summary.md` inside a pull-request comment. A comment holds about 65,536 characters;
 * `SUMMARY_LIMIT` leaves room for the lines around the tables. When every comparison group's table
 * fits, all are written as they are. Otherwise the decided comparisons come first (per metric and
 * task, as their groups), then the inconclusive ones folded per metric in `<details>`, as many as
 * fit, and the rest are counted: "N more comparisons in report.html". When trimming, the primary
 * metric's groups come first.
 */
import type { Comparison } from '../analysis/results.js';
import { escapeMarkdown } from './escape.js';
import type { ComparisonGroup } from './verdictWords.js';

/** Most characters of a whole summary.md. */
export const SUMMARY_LIMIT = 60_000;

const size = (lines: readonly string[]): number => lines.reduce((n, l) => n + l.length + 1, 0);
const decided = (c: Comparison): boolean => c.verdict !== 'inconclusive';

/**
 * The group tables that fit in `budget` characters (see the module comment). `render` turns a
 * group (possibly a subset of its comparisons) into lines.
 * Cost O(groups x render). Never throws.
 * Example: 400 groups of 4 comparisons, 30 decided, budget 50,000 → the 30 decided in their groups,
 * then inconclusive ones in `<details>` per metric until the budget, then "N more comparisons in report.html".
 */
export function fitGroups(
  given: readonly ComparisonGroup[],
  render: (g: ComparisonGroup) => string[],
  budget: number,
  primary: string | null = null,
): string[] {
  const all = given.flatMap(render);
  if (size(all) <= budget) return all;
  // The primary metric's groups first (stable otherwise).
  const groups = [...given.filter((g) => g.metric === primary), ...given.filter((g) => g.metric !== primary)];
  const out: string[] = [];
  let left = 0;
  const take = (lines: readonly string[], count: number, reserve = 0): boolean => {
    if (size(out) + size(lines) + reserve > budget) {
      left += count;
      return false;
    }
    out.push(...lines);
    return true;
  };
  for (const g of groups) {
    const some = g.comparisons.filter(decided);
    if (some.length > 0) take(render({ ...g, comparisons: some }), some.length);
  }
  const metrics = [...new Set(groups.map((g) => g.metric))];
  for (const metric of metrics) {
    const rest = groups
      .filter((g) => g.metric === metric)
      .map((g) => ({ ...g, comparisons: g.comparisons.filter((c) => !decided(c)) }))
      .filter((g) => g.comparisons.length > 0);
    const total = rest.reduce((n, g) => n + g.comparisons.length, 0);
    if (total === 0) continue;
    const open = ['<details>', `<summary>${total} inconclusive comparisons of ${escapeMarkdown(metric)}</summary>`, ''];
    const close = ['</details>', ''];
    const [first, ...others] = rest;
    const firstLines = first === undefined ? [] : render(first);
    // A fold is opened only when at least its first group fits in it.
    if (first === undefined || !take([...open, ...firstLines], 0, size(close))) {
      left += total;
      continue;
    }
    for (const g of others) take(render(g), g.comparisons.length, size(close));
    out.push(...close);
  }
  if (left > 0) out.push(`${left} more comparisons in report.html (and every one in results.json).`, '');
  return out;
}
