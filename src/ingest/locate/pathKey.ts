/**
 * Runs from different PATHs never merge silently. When two PATHs given on the command line hold
 * files with one config and seed (two method folders `runs/ours` and `runs/base`, each with
 * `seed=0/log.csv` and nothing in their names that seedsift reads as a config), the runs would be
 * one run stacked from both. Instead every file read from a PATH gets the config key `path` with
 * that PATH as given, so each PATH's runs form their own configs, and a `path-key` note says so.
 * This happens when the PATHs share two or more runs (config and seed): one shared run is taken
 * to be a run resumed in another folder, stacked as before with a `run-duplicate` warning.
 * Files of a manifest (no PATH of their own) are left as they are. Pure; cost O(files).
 */
import { problem, type Problem } from '../../problems.js';
import type { RunSource } from '../types.js';

/** The config key given to every file's PATH when PATHs would otherwise merge. */
export const PATH_KEY = 'path';

/**
 * Add the `path` key when runs of two PATHs share a config and seed (see the module comment).
 * `roots[i]` is the index into `paths` of `sources[i]`, or null for a manifest row. A seed that
 * comes from inside the files (null here) matches any seed.
 * Example: `runs/a/seed=0/log.csv` and `runs/b/seed=0/log.csv` from PATHs runs/a and runs/b get
 * params `{ path: 'runs/a' }` and `{ path: 'runs/b' }`.
 */
export function separatePaths(
  sources: readonly RunSource[],
  roots: readonly (number | null)[],
  paths: readonly string[],
): { sources: RunSource[]; problems: Problem[] } {
  const rootsOf = new Map<string, Set<number>>();
  sources.forEach((s, i) => {
    const root = roots[i];
    if (root === null || root === undefined || Object.hasOwn(s.params, PATH_KEY)) return;
    const key = JSON.stringify([Object.entries(s.params).sort(), s.seed]);
    rootsOf.set(key, (rootsOf.get(key) ?? new Set()).add(root));
  });
  const shared = [...rootsOf.values()].filter((r) => r.size > 1);
  if (shared.length < 2) return { sources: [...sources], problems: [] };
  const named = [...new Set(shared.flatMap((r) => [...r]))].sort((a, b) => a - b).map((k) => paths[k] as string);
  return {
    sources: sources.map((s, i) => {
      const root = roots[i];
      return root === null || root === undefined
        ? s
        : { ...s, params: { [PATH_KEY]: paths[root] as string, ...s.params } };
    }),
    problems: [
      problem(
        'path-key',
        `${named.join(' and ')} hold runs with the same config and seed; so that they do not merge into one run, ` +
          `each PATH's runs get the config key ${PATH_KEY}=PATH`,
      ),
    ],
  };
}
