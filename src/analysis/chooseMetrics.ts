/**
 * The metrics a report compares, in the order every output shows them:
 *
 *   - `--metrics a,b` names them (and their order); without it, every metric found but the
 *     bookkeeping columns (`setAside.ts`), in the order found;
 *   - `--primary NAME` moves one metric first (default: the first of `--metrics`);
 *   - `--as-metric a,b` (or naming a bookkeeping column in `--metrics`) compares a column that
 *     would be set aside.
 *
 * A name covers both kinds of a metric: `val_acc` is the scalar column and the per-tick `val_acc@k`
 * columns. Every set-aside column becomes a `column-set-aside` note that says how to include it.
 * Pure; cost O(metrics) plus `setAsideColumns`. Names are checked beforehand (`checkOptions.ts`).
 */
import type { MetricInfo, RunSet } from '../ingest/types.js';
import { problem, type Problem } from '../problems.js';
import type { ResolvedOptions } from './options.js';
import { type SetAsideColumn, setAsideColumns } from './setAside.js';

export interface MetricChoice {
  /** The metrics compared, primary first. */
  readonly metrics: readonly MetricInfo[];
  /** Bookkeeping columns not compared, with why and how to include them. */
  readonly setAside: readonly SetAsideColumn[];
  readonly problems: readonly Problem[];
}

/**
 * Choose the metrics (see the module comment).
 * Example: with `metrics: ['val_acc']`, a run set with train_loss, val_acc and val_acc@k gives the
 * scalar and the per-tick val_acc only.
 */
export function chooseMetrics(
  runSet: RunSet,
  options: Pick<ResolvedOptions, 'metrics' | 'primary' | 'asMetric'>,
): MetricChoice {
  const wanted = [
    ...(options.metrics ?? []),
    ...options.asMetric,
    ...(options.primary === null ? [] : [options.primary]),
  ];
  const setAside = setAsideColumns(runSet, wanted);
  const aside = new Set(setAside.map((s) => s.name));
  const named = options.metrics;
  const chosen =
    named === null
      ? runSet.metrics.filter((m) => m.kind === 'tick' || !aside.has(m.name))
      : named.flatMap((name) => runSet.metrics.filter((m) => m.name === name));
  const primary = options.primary ?? named?.[0] ?? null;
  const metrics =
    primary === null
      ? chosen
      : [...chosen.filter((m) => m.name === primary), ...chosen.filter((m) => m.name !== primary)];
  return {
    metrics,
    setAside,
    problems: setAside.map((s) => problem('column-set-aside', s.message)),
  };
}
