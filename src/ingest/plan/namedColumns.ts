/**
 * Reading options that name something must name something that exists: a `--step` or
 * `--seed-column` that is a column of no file read, a `--metric NAME:GOAL` whose NAME is no
 * metric, stops the command (exit 2) with what exists and a
 * "did you mean" line, instead of a report built on nothing. A name found in some files but not in
 * others is a per-file problem as before (`step-column-missing`, `seed-missing`). Pure.
 */
import { unknownName } from '../../didYouMean.js';
import type { IngestOptions, RunSet } from '../types.js';

/**
 * Check `--step` and `--seed-column` against the column names of every file whose header was
 * read (`seen`; nothing is checked when no header was read).
 * Example: `--step stpe` with files of columns step, loss stops: "did you mean step?".
 */
export function checkNamedColumns(options: Pick<IngestOptions, 'step' | 'mode'>, seen: ReadonlySet<string>): void {
  if (seen.size === 0) return;
  const names = [...seen];
  if (options.step !== null && !seen.has(options.step)) throw unknownName('--step', 'column', options.step, names);
  const mode = options.mode;
  if (mode.kind === 'seed-column' && !seen.has(mode.column))
    throw unknownName('--seed-column', 'column', mode.column, names);
}

/** Check the names of `--metric NAME:GOAL` against the metrics read. */
export function checkGoalNames(options: Pick<IngestOptions, 'metricGoals'>, runSet: RunSet): void {
  const metrics = [...new Set(runSet.metrics.map((m) => m.name))];
  if (runSet.runs.length === 0) return;
  for (const name of Object.keys(options.metricGoals))
    if (!metrics.includes(name)) throw unknownName('--metric', 'metric', name, metrics);
}
