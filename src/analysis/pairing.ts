/**
 * Which configurations are compared with which (DESIGN.md, `--baseline` and `--task-key`).
 *
 * - With a selector, every config that does not match it is compared with its counterpart: the
 *   config that has the selector's values for the keys it names and the same values for all other
 *   keys. A selector naming every key picks one baseline for all; one naming fewer keys
 *   (`--baseline memory=4` with keys ticks, memory) compares each memory != 4 config with the
 *   memory=4 config of the same ticks. Configs without a counterpart are returned in `missing`.
 * - Without a selector, every pair of configs (the earlier one in config order as the baseline).
 * - With a task key, the key is not part of the comparison: configs are grouped by their other
 *   keys (the *group* id, e.g. `method=ours`) and pairs are formed within each task value.
 * - Keys of the arm: with a selector naming fewer keys, a key whose value is fixed by the values
 *   of the selector's keys and differs between them (`lr` when each `algo` has its own `lr`) is an
 *   attribute of the arm, not a condition to match: counterparts are matched ignoring it, and it
 *   is returned in `armKeys` for the report to say so.
 * - Candidates (`--candidate`): only configs that match one of them are compared with the baseline.
 *
 * Pure; cost O(configs^2) at most.
 */
import { naturalCompare } from './inventory.js';
import { matchesSelector, type Selector } from './selectors.js';

export interface ConfigLike {
  readonly id: string;
  readonly params: Readonly<Record<string, string>>;
}

/** One comparison to run: group ids (config ids without the task key) and the full config ids. */
export interface Pair {
  readonly task: string | null;
  readonly baseline: string;
  readonly candidate: string;
  readonly baselineConfig: string;
  readonly candidateConfig: string;
}

export interface MissingCounterpart {
  readonly task: string | null;
  /** The group id of the config left without a counterpart. */
  readonly config: string;
  /** The counterpart it would need, as `key=value,...`. */
  readonly counterpart: string;
}

export interface Pairing {
  readonly pairs: readonly Pair[];
  readonly missing: readonly MissingCounterpart[];
  /** Task values in natural order ([null] without a task key). */
  readonly tasks: readonly (string | null)[];
  /** Keys ignored in counterpart matching because they belong to the arm (see the module comment). */
  readonly armKeys: readonly string[];
}

/**
 * Keys whose value is fixed by the values of the selector's keys, and not the same everywhere
 * (see the module comment). Empty without a selector or when it names every key but the task key.
 * Example: configs (algo=a, lr=1), (algo=b, lr=2), with selector algo=a, give ['lr'].
 */
export function armKeys(
  configs: readonly ConfigLike[],
  keys: readonly string[],
  selector: Selector | null,
  taskKey: string | null,
): string[] {
  if (selector === null) return [];
  const named = selector.pairs.map((p) => p.key);
  const arm = (c: ConfigLike): string => JSON.stringify(named.map((k) => c.params[k] ?? null));
  return keys.filter((key) => {
    if (key === taskKey || named.includes(key)) return false;
    const byArm = new Map<string, Set<string>>();
    for (const c of configs) byArm.set(arm(c), (byArm.get(arm(c)) ?? new Set()).add(c.params[key] ?? ''));
    const all = new Set(configs.map((c) => c.params[key] ?? ''));
    return all.size > 1 && [...byArm.values()].every((values) => values.size === 1);
  });
}

/** The group id of a config: its `key=value` pairs in key order, without the task key. */
export function groupId(
  params: Readonly<Record<string, string>>,
  keys: readonly string[],
  taskKey: string | null,
): string {
  const parts: string[] = [];
  for (const key of keys) {
    const v = params[key];
    if (key !== taskKey && v !== undefined) parts.push(`${key}=${v}`);
  }
  return parts.join(',');
}

/**
 * Form the pairs to compare. `configs` must be in config order (they are kept in it).
 * Example: configs memory=4, memory=8, memory=12 with selector memory=4 give pairs
 * (memory=4, memory=8) and (memory=4, memory=12).
 */
export function pairConfigs(
  configs: readonly ConfigLike[],
  keys: readonly string[],
  selector: Selector | null,
  taskKey: string | null,
  candidates: readonly Selector[] = [],
): Pairing {
  const ignored = armKeys(configs, keys, selector, taskKey);
  const tasks =
    taskKey === null ? [null] : [...new Set(configs.map((c) => c.params[taskKey] ?? ''))].sort(naturalCompare);
  const pairs: Pair[] = [];
  const missing: MissingCounterpart[] = [];
  const groupKeys = keys.filter((k) => k !== taskKey && !ignored.includes(k));
  for (const task of tasks) {
    const inTask = taskKey === null ? configs : configs.filter((c) => (c.params[taskKey] ?? '') === task);
    const groups = inTask.map((c) => ({ config: c, id: taskKey === null ? c.id : groupId(c.params, keys, taskKey) }));
    if (selector === null) {
      for (let i = 0; i < groups.length; i++) {
        for (let j = i + 1; j < groups.length; j++) {
          const a = groups[i] as (typeof groups)[number];
          const b = groups[j] as (typeof groups)[number];
          pairs.push({
            task,
            baseline: a.id,
            candidate: b.id,
            baselineConfig: a.config.id,
            candidateConfig: b.config.id,
          });
        }
      }
      continue;
    }
    for (const g of groups) {
      if (matchesSelector(g.config.params, selector)) continue;
      if (candidates.length > 0 && !candidates.some((c) => matchesSelector(g.config.params, c))) continue;
      const wanted: Record<string, string> = {};
      for (const key of groupKeys) {
        const v = g.config.params[key];
        if (v !== undefined) wanted[key] = v;
      }
      for (const p of selector.pairs) wanted[p.key] = p.value;
      const found = groups.find((h) => sameParams(h.config.params, wanted, groupKeys));
      if (found === undefined) {
        missing.push({
          task,
          config: g.id,
          counterpart: groupKeys
            .filter((k) => wanted[k] !== undefined)
            .map((k) => `${k}=${wanted[k]}`)
            .join(','),
        });
      } else {
        pairs.push({
          task,
          baseline: found.id,
          candidate: g.id,
          baselineConfig: found.config.id,
          candidateConfig: g.config.id,
        });
      }
    }
  }
  return { pairs, missing, tasks, armKeys: ignored };
}

function sameParams(
  params: Readonly<Record<string, string>>,
  wanted: Readonly<Record<string, string>>,
  keys: readonly string[],
): boolean {
  return keys.every((k) => params[k] === wanted[k]);
}
