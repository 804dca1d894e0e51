/**
 * The shape of a study as the page's overview needs it, read from `Results` (nothing statistical
 * is computed here): the primary metric, the tasks, the candidates, the sweep keys, and which
 * configs a page highlights once there are too many to tell apart by colour.
 *
 * - The **primary metric** is the metric the study is about: among scalar metrics with
 *   comparisons, the first whose goal the user gave (`--metric`) and whose name reads like a quality
 *   measure (acc, score, return, reward, success, solved, f1, bleu, auc), else the first whose goal
 * the user gave, else the first named like a quality measure, else the
 * first. A metric named by the notebook's cell wins over all of these.
 * - **Tasks** come from `Settings.taskKey`; a config's **group** is its id without the task key
 *   (`method=base`), as the across-task aggregates name them.
 * - A **sweep key** is a config key (not the task key) with at least two distinct values, all of
 *   them numbers.
 */
import type { Comparison, Results } from '../analysis/results.js';

/** Beyond this many configs, charts colour only the baseline and the decided candidates. */
export const HIGHLIGHT_FROM = 13;

const QUALITY_NAME = /acc|score|return|reward|success|solved|f1|bleu|auc/i;

/**
 * The metric the overview answers for (see the module comment), or null when nothing was compared.
 * Cost O(metrics + comparisons). Never throws.
 * Example: demo results → `'val_acc'` (named like a quality measure; val_loss and train_loss are not).
 */
export function primaryMetric(results: Results): string | null {
  const compared = new Set(results.comparisons.map((c) => c.metric));
  const candidates = results.metrics.filter((m) => m.kind === 'scalar' && compared.has(m.name));
  const pick =
    candidates.find((m) => m.goalSource === 'option' && QUALITY_NAME.test(m.name)) ??
    candidates.find((m) => m.goalSource === 'option') ??
    candidates.find((m) => QUALITY_NAME.test(m.name)) ??
    candidates[0] ??
    results.metrics.find((m) => compared.has(m.name));
  return pick?.name ?? null;
}

/** The config id without the task key: `task=a,method=x` → `method=x`. */
export function groupOf(config: string, params: Readonly<Record<string, string>>, taskKey: string | null): string {
  if (taskKey === null || !(taskKey in params)) return config;
  return Object.entries(params)
    .filter(([k]) => k !== taskKey)
    .map(([k, v]) => `${k}=${v}`)
    .join(',');
}

/** Task values in the order their configs appear (empty without a task key). */
export function taskNames(results: Results): string[] {
  const key = results.settings.taskKey;
  if (key === null) return [];
  const out = new Set<string>();
  for (const c of results.configs) {
    const t = c.params[key];
    if (t !== undefined) out.add(t);
  }
  return [...out];
}

/** Config keys whose values are all numbers (at least two distinct), task key excluded, in key order. */
export function sweepKeys(results: Results): string[] {
  const values = new Map<string, Set<string>>();
  for (const c of results.configs) {
    for (const [k, v] of Object.entries(c.params)) {
      if (k === results.settings.taskKey) continue;
      values.set(k, (values.get(k) ?? new Set()).add(v));
    }
  }
  return [...values]
    .filter(([, vs]) => vs.size >= 2 && [...vs].every((v) => v.trim() !== '' && Number.isFinite(Number(v))))
    .map(([k]) => k);
}

/** Comparisons ordered for reading: decided first (better, then worse), then by adjusted p. */
export function decidedFirst(comparisons: readonly Comparison[]): Comparison[] {
  const rank = { better: 0, worse: 1, inconclusive: 2 } as const;
  return [...comparisons].sort((a, b) => rank[a.verdict] - rank[b.verdict] || (a.pAdjusted ?? 2) - (b.pAdjusted ?? 2));
}

/** Counts of verdicts. */
export interface VerdictCounts {
  readonly better: number;
  readonly worse: number;
  readonly inconclusive: number;
}

export function verdictCounts(comparisons: readonly Comparison[]): VerdictCounts {
  const out = { better: 0, worse: 0, inconclusive: 0 };
  for (const c of comparisons) out[c.verdict] += 1;
  return out;
}

/** Each config's group (its id without the task key), in `Results.configs` order. */
export function configGroups(results: Results): Map<string, string> {
  const key = results.settings.taskKey;
  return new Map(results.configs.map((c) => [c.id, groupOf(c.id, c.params, key)]));
}

/**
 * The groups (configs, or methods across tasks) a page with `HIGHLIGHT_FROM` or more of them
 * highlights: the baseline(s), then candidates with a decided verdict (primary metric first, then
 * by adjusted p), at most `HIGHLIGHT_FROM - 1` in all, in that order. Null when there are fewer
 * groups (every group keeps its own colour).
 * Cost O(comparisons log comparisons). Never throws.
 */
export function highlightedGroups(results: Results): string[] | null {
  const groups = new Set(configGroups(results).values());
  if (groups.size < HIGHLIGHT_FROM) return null;
  const primary = primaryMetric(results);
  const ordered = decidedFirst(results.comparisons);
  const out: string[] = [];
  const add = (g: string): void => {
    if (out.length < HIGHLIGHT_FROM - 1 && !out.includes(g)) out.push(g);
  };
  for (const c of ordered) add(c.baseline);
  for (const c of ordered) if (c.verdict !== 'inconclusive' && c.metric === primary) add(c.candidate);
  for (const c of ordered) if (c.verdict !== 'inconclusive') add(c.candidate);
  return out;
}
