/**
 * Shared words of the verdict tables (HTML and Markdown say the same thing): verdict labels, goal
 * phrases, the caution every report carries, and the grouping of comparisons by metric.
 */
import type { Comparison, Results, Verdict } from '../analysis/results.js';
import type { Goal, GoalSource } from '../ingest/types.js';
import { formatIntervalKind } from './format.js';

/** Verdict labels with a shape, so a verdict never rests on colour alone. */
export const VERDICT_LABELS: Readonly<Record<Verdict, string>> = {
  better: '▲ better',
  worse: '▼ worse',
  inconclusive: '● inconclusive',
};

/** How a goal reads. */
export const GOAL_WORDS: Readonly<Record<Goal, string>> = { max: 'higher is better', min: 'lower is better' };

/** How a goal of a metric reads, with where it came from when that matters (a name rule, or no goal known). */
export function goalWords(goal: Goal | null, source: GoalSource | null, guessed = ' (guessed)'): string {
  if (goal === null || source === 'unknown') return 'goal not known (direction only)';
  return `${GOAL_WORDS[goal]}${source === 'inferred' ? guessed : ''}`;
}

/**
 * The caution every report and summary ends its verdicts with.
 * Cost O(1). Never throws.
 * Example: `standardCaution(0.05)` → `'A statistical test is evidence, not proof: ...'`.
 */
export function standardCaution(alpha: number): string {
  return (
    `A statistical test is evidence, not proof: with no real difference, a test at alpha ${alpha} still calls ` +
    `one about ` +
    `${Math.round(alpha * 1000) / 10}% of the time, and a verdict from 3 seeds per arm is fragile (one more ` +
    `seed can overturn it).`
  );
}

/** The comparisons of one metric, summary and task, in `Results` order. */
export interface ComparisonGroup {
  readonly metric: string;
  readonly goal: Goal;
  readonly goalSource: GoalSource | null;
  readonly summary: string;
  readonly task: string | null;
  readonly comparisons: readonly Comparison[];
}

/**
 * Group comparisons by metric (in `Results.metrics` order, unknown metrics after), then summary and
 * task (in order of appearance). With `metric`, only that metric's groups.
 * Cost O(comparisons * groups). Never throws.
 */
export function comparisonGroups(results: Results, metric?: string): ComparisonGroup[] {
  const order = results.metrics.map((m) => m.name);
  const groups: {
    key: string;
    metric: string;
    summary: string;
    task: string | null;
    goal: Goal;
    items: Comparison[];
  }[] = [];
  for (const c of results.comparisons) {
    if (metric !== undefined && c.metric !== metric) continue;
    const key = JSON.stringify([c.metric, c.summary, c.task]);
    let g = groups.find((x) => x.key === key);
    if (g === undefined) {
      g = { key, metric: c.metric, summary: c.summary, task: c.task, goal: c.goal, items: [] };
      groups.push(g);
    }
    g.items.push(c);
  }
  const rank = (name: string): number => {
    const i = order.indexOf(name);
    return i < 0 ? order.length : i;
  };
  return groups
    .map((g, i) => ({ g, i }))
    .sort((a, b) => rank(a.g.metric) - rank(b.g.metric) || a.i - b.i)
    .map(({ g }) => ({
      metric: g.metric,
      goal: g.goal,
      goalSource: results.metrics.find((m) => m.name === g.metric)?.goalSource ?? null,
      summary: g.summary,
      task: g.task,
      comparisons: g.items,
    }));
}

/**
 * The interval kind shared by a group's differences (`95% Welch t-interval`), or null when the
 * rows differ (each row then names its own).
 * Cost O(comparisons). Never throws.
 */
export function sharedIntervalKind(comparisons: readonly Comparison[]): string | null {
  const kinds = new Set(comparisons.map((c) => formatIntervalKind(c.difference)));
  return kinds.size === 1 ? ([...kinds][0] ?? null) : null;
}
