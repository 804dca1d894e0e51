/**
 * Options checked against what was read: every option that names a metric, a config key or a
 * value must name one that exists, or the command stops (exit 2) with what exists and a "did you
 * mean" line (`src/didYouMean.ts`). Nothing that names nothing passes silently. Pure; cost
 * O(runs x keys + metrics).
 */
import { didYouMean, unknownName } from '../didYouMean.js';
import type { RunSet } from '../ingest/types.js';
import { SeedsiftError } from '../problems.js';
import { inventory } from './inventory.js';
import type { ResolvedOptions } from './options.js';
import { checkSelector } from './selectors.js';
import { keptKeys, selectRuns } from './selectRuns.js';

/**
 * Check resolved options against a run set; throws SeedsiftError('usage') on the first name that
 * exists nowhere (see the module comment).
 * Example: `--metrics val_ac` on runs with val_acc stops with "did you mean val_acc?".
 */
export function checkOptions(options: ResolvedOptions, runSet: RunSet): void {
  const metricNames = [...new Set(runSet.metrics.map((m) => m.name))];
  for (const name of options.metrics ?? [])
    if (!metricNames.includes(name)) throw unknownName('--metrics', 'metric', name, metricNames);
  for (const name of options.asMetric)
    if (!metricNames.includes(name)) throw unknownName('--as-metric', 'metric', name, metricNames);
  if (options.primary !== null) {
    const among = options.metrics ?? metricNames;
    if (!among.includes(options.primary))
      throw unknownName(
        '--primary',
        options.metrics === null ? 'metric' : 'metric of --metrics',
        options.primary,
        among,
      );
  }
  for (const key of [...options.dropKeys, ...(options.keepKeys ?? [])])
    if (!runSet.keys.includes(key))
      throw unknownName(options.dropKeys.includes(key) ? '--drop-keys' : '--keep-keys', 'config key', key, runSet.keys);
  const configs = inventory(runSet).configs;
  for (const s of options.includeConfigs) checkSelector(s, configs, runSet.keys, null, '--include-configs');
  for (const s of options.excludeConfigs) checkSelector(s, configs, runSet.keys, null, '--exclude-configs');
  const kept = keptKeys(runSet.keys, options);
  if (options.taskKey !== null && !kept.includes(options.taskKey)) {
    if (runSet.keys.includes(options.taskKey))
      throw new SeedsiftError('usage', `--task-key: '${options.taskKey}' is dropped by --drop-keys or --keep-keys`);
    throw new SeedsiftError(
      'usage',
      `--task-key: expected one of the config keys (${kept.join(', ') || 'none'}), got ` +
        `'${options.taskKey}'; ${didYouMean(options.taskKey, kept)}`,
    );
  }
  const selected = selectRuns(runSet, options).runSet;
  if (selected.runs.length === 0 && runSet.runs.length > 0)
    throw new SeedsiftError('usage', '--include-configs, --exclude-configs: expected some runs left, got none');
  const left = inventory(selected).configs;
  if (options.baseline !== null) checkSelector(options.baseline, left, selected.keys, options.taskKey);
  if (options.candidates.length > 0 && options.baseline === null)
    throw new SeedsiftError(
      'usage',
      '--candidate: expected --baseline too (candidates are compared with the baseline)',
    );
  for (const s of options.candidates) checkSelector(s, left, selected.keys, options.taskKey, '--candidate');
}
