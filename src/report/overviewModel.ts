/**
 * The study's answer at a glance, as plain records that the page (`cells/overview.ts`), the
 * Markdown summary and the terminal all render: the primary metric's comparisons as a matrix of
 * candidates by tasks (with `--task-key`) or by metrics (without), the verdict counts, the family
 * the p-values were adjusted over, and the decided comparisons first. Reads `Results`; computes
 * no statistic.
 */
import type { Comparison, MetricRecord, Results } from '../analysis/results.js';
import { decidedFirst, primaryMetric, taskNames, verdictCounts, type VerdictCounts } from './studyShape.js';

/** One row of the matrix: a candidate (and its baseline), with its comparisons by column. */
export interface OverviewRow {
  readonly candidate: string;
  readonly baseline: string;
  /** Column name (task, or metric) → comparison. */
  readonly cells: ReadonlyMap<string, Comparison>;
  readonly counts: VerdictCounts;
}

export interface OverviewModel {
  readonly metric: MetricRecord;
  readonly summary: string;
  /** Columns are tasks (with a task key) or metrics (primary first). */
  readonly mode: 'tasks' | 'metrics';
  readonly columns: readonly string[];
  readonly rows: readonly OverviewRow[];
  /** Comparisons of the primary metric and summary (the family of the adjustment, METHODS.md). */
  readonly comparisons: readonly Comparison[];
  readonly counts: VerdictCounts;
  /** The same comparisons, decided first (better, worse), then by adjusted p. */
  readonly decided: readonly Comparison[];
  /** One baseline for every row (said once), or null when rows have different baselines. */
  readonly sharedBaseline: string | null;
}

/**
 * The overview of `metric` (default: `primaryMetric`) under `summary` (default: the report's).
 * Rows: one per candidate (per pair without a baseline), ordered by their decided comparisons of
 * the metric (most decided first), then by their smallest adjusted p,
 * ties in `Results` order. Null when nothing of that metric was compared.
 * Cost O(comparisons log comparisons). Never throws.
 * Example: demo results → metric val_acc, mode 'metrics', 5 rows, counts { better: 4, worse: 0, inconclusive: 1 }.
 */
export function overviewModel(results: Results, metric?: string, summary?: string): OverviewModel | null {
  const name = metric ?? primaryMetric(results);
  const record = results.metrics.find((m) => m.name === name);
  if (record === undefined) return null;
  const wanted = summary ?? results.settings.summary;
  const comparisons = results.comparisons.filter((c) => c.metric === record.name && c.summary === wanted);
  if (comparisons.length === 0) return null;
  const tasks = taskNames(results);
  const mode = tasks.length > 0 && comparisons.some((c) => c.task !== null) ? 'tasks' : 'metrics';
  const pool =
    mode === 'tasks' ? comparisons : results.comparisons.filter((c) => c.summary === wanted && c.task === null);
  const columns =
    mode === 'tasks'
      ? tasks.filter((t) => comparisons.some((c) => c.task === t))
      : [
          record.name,
          ...results.metrics.map((m) => m.name).filter((m) => m !== record.name && pool.some((c) => c.metric === m)),
        ];
  const byRow = new Map<
    string,
    { candidate: string; baseline: string; cells: Map<string, Comparison>; order: number }
  >();
  for (const c of pool) {
    const key = `${c.candidate}\u0000${c.baseline}`;
    const row = byRow.get(key) ?? { candidate: c.candidate, baseline: c.baseline, cells: new Map(), order: byRow.size };
    row.cells.set(mode === 'tasks' ? (c.task ?? '') : c.metric, c);
    byRow.set(key, row);
  }
  const primaryOf = (cells: ReadonlyMap<string, Comparison>): Comparison[] =>
    [...cells.values()].filter((c) => c.metric === record.name);
  const rows = [...byRow.values()]
    .map((r) => ({ ...r, counts: verdictCounts(primaryOf(r.cells)) }))
    .sort(
      (a, b) =>
        b.counts.better + b.counts.worse - (a.counts.better + a.counts.worse) ||
        smallestP(a.cells, record.name) - smallestP(b.cells, record.name) ||
        a.order - b.order,
    )
    .map(({ order: _order, ...r }) => r);
  const baselines = new Set(rows.map((r) => r.baseline));
  return {
    metric: record,
    summary: wanted,
    mode,
    columns,
    rows,
    comparisons,
    counts: verdictCounts(comparisons),
    decided: decidedFirst(comparisons),
    sharedBaseline: baselines.size === 1 ? ([...baselines][0] ?? null) : null,
  };
}

function smallestP(cells: ReadonlyMap<string, Comparison>, metric: string): number {
  let p = 2;
  for (const c of cells.values()) if (c.metric === metric && c.pAdjusted !== null) p = Math.min(p, c.pAdjusted);
  return p;
}

/** "19 better, 11 worse, 370 inconclusive" (zero counts kept: a reader looks for each word). */
export function countsWords(counts: VerdictCounts): string {
  return `${counts.better} better, ${counts.worse} worse, ${counts.inconclusive} inconclusive`;
}

/** Words for the family the p-values were adjusted over (METHODS.md: one metric and summary, all tasks). */
export function familyWords(results: Results, model: OverviewModel): string {
  const n = model.comparisons.length;
  const how = { holm: 'Holm-adjusted', bh: 'Benjamini-Hochberg-adjusted', none: 'not adjusted' }[
    results.settings.correction
  ];
  const tasks = model.mode === 'tasks' ? ` over ${model.columns.length} tasks` : '';
  return (
    `p-values ${how} within the family of ${n} comparison${n === 1 ? '' : 's'} of ${model.metric.name} ` +
    `(summary ${model.summary}${tasks}), alpha ${results.settings.alpha}`
  );
}
