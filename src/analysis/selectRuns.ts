/**
 * The runs a report compares, chosen by the selection options before anything is computed:
 *
 *   1. `--include-configs SEL` (any of them) and `--exclude-configs SEL` (none of them) keep or
 *      leave out whole configs, matched on every key as read;
 *   2. `--drop-keys a,b` / `--keep-keys a,b` remove config keys, so runs that differ only in a
 *      machine flag or a bookkeeping parameter form one config. Config and run ids are rebuilt
 *      as ingest builds them (src/ingest/runs.ts: `key=value` in key order joined by commas, then
 *      `,seed=S`). Two runs that now share a config and a seed are both kept (the second's id gets
 *      `#2`) and reported as `seed-repeated`.
 *
 * Pure; cost O(runs x keys). Names are checked beforehand (`checkOptions.ts`).
 */
import type { Run, RunSet, TickDump } from '../ingest/types.js';
import { problem, type Problem } from '../problems.js';
import type { ResolvedOptions } from './options.js';
import { matchesSelector } from './selectors.js';

export type SelectionOptions = Pick<ResolvedOptions, 'includeConfigs' | 'excludeConfigs' | 'dropKeys' | 'keepKeys'>;

/** The config keys left after `--drop-keys` and `--keep-keys`. */
export function keptKeys(keys: readonly string[], options: SelectionOptions): string[] {
  return keys.filter(
    (k) => !options.dropKeys.includes(k) && (options.keepKeys === null || options.keepKeys.includes(k)),
  );
}

/**
 * The selected run set (see the module comment) and its problems. Returns the same run set when no
 * selection option is set.
 * Example: runs keyed `algo, gpu` with `dropKeys: ['gpu']` come back keyed `algo` alone.
 */
export function selectRuns(runSet: RunSet, options: SelectionOptions): { runSet: RunSet; problems: Problem[] } {
  const keys = keptKeys(runSet.keys, options);
  const filtering = options.includeConfigs.length > 0 || options.excludeConfigs.length > 0;
  if (!filtering && keys.length === runSet.keys.length) return { runSet, problems: [] };
  const chosen = runSet.runs.filter(
    (r) =>
      (options.includeConfigs.length === 0 || options.includeConfigs.some((s) => matchesSelector(r.params, s))) &&
      !options.excludeConfigs.some((s) => matchesSelector(r.params, s)),
  );
  const problems: Problem[] = [];
  const renamed = new Map<string, { id: string; config: string }>();
  const taken = new Map<string, Run>();
  const runs = chosen.map((run) => {
    const params: Record<string, string> = {};
    for (const k of keys) if (run.params[k] !== undefined) params[k] = run.params[k] as string;
    const config = keys
      .filter((k) => params[k] !== undefined)
      .map((k) => `${k}=${params[k]}`)
      .join(',');
    const base = config === '' ? `seed=${run.seed}` : `${config},seed=${run.seed}`;
    let id = base;
    for (let n = 2; taken.has(id); n++) id = `${base}#${n}`;
    const first = taken.get(base);
    if (first !== undefined)
      problems.push(
        problem(
          'seed-repeated',
          `${id}: config ${config || '(none)'} has seed ${run.seed} twice once ` +
            `keys ${[...runSet.keys.filter((k) => !keys.includes(k))].join(', ')} are ignored ` +
            `(${first.files.join(', ')} and ${run.files.join(', ')}); both runs are kept`,
          { run: id },
        ),
      );
    const record = { ...run, id, config, params };
    taken.set(id, record);
    renamed.set(run.id, { id, config });
    return record;
  });
  const tickDumps: TickDump[] = [];
  for (const d of runSet.tickDumps) {
    const to = renamed.get(d.run);
    if (to !== undefined) tickDumps.push({ ...d, run: to.id, config: to.config });
  }
  const left = new Set(runSet.runs.filter((r) => !renamed.has(r.id)).map((r) => r.id));
  return {
    runSet: {
      ...runSet,
      keys,
      runs,
      tickDumps,
      problems: runSet.problems
        .filter((p) => p.run === undefined || !left.has(p.run))
        .map((p) => renameRun(p, renamed)),
    },
    problems,
  };
}

function renameRun(p: Problem, renamed: ReadonlyMap<string, { id: string }>): Problem {
  if (p.run === undefined) return p;
  const to = renamed.get(p.run);
  return to === undefined || to.id === p.run ? p : { ...p, run: to.id };
}
