/**
 * Generating the benchmark data sets with bench/peer/make_runs.py (run with Debian's
 * /usr/bin/python3 and its numpy), cached under bench/.data/<name>/ with a stamp of the arguments.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import type { RunsSpec } from './sizes.js';

/** Debian's interpreter, which has python3-numpy, -pandas and -scipy (not a pyenv `python3`). */
export const SYSTEM_PYTHON = '/usr/bin/python3';

const STAMP = '.make_runs.json';

/**
 * Make sure `dir` holds make_runs.py's output for `spec` (deterministic, make_runs.py's default
 * --rng 7): reuse it when its stamp matches, else delete the folder and generate it again.
 * Returns whether it generated. Throws Error when make_runs.py fails.
 * Example: ensureDataset('bench/peer/make_runs.py', 'bench/.data/small', spec) → true.
 */
export function ensureDataset(makeRuns: string, dir: string, spec: RunsSpec): boolean {
  const stamp = JSON.stringify(spec);
  const stampFile = join(dir, STAMP);
  if (existsSync(stampFile) && readFileSync(stampFile, 'utf8') === stamp) return false;
  rmSync(dir, { recursive: true, force: true });
  const args = [
    makeRuns,
    '--out',
    dir,
    '--configs',
    String(spec.configs),
    '--seeds',
    String(spec.seeds),
    '--steps',
    String(spec.steps),
    '--metrics',
    String(spec.metrics),
    '--ticks',
    String(spec.ticks),
  ];
  const result = spawnSync(SYSTEM_PYTHON, args, { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
  if (result.status !== 0) {
    throw new Error(
      `make_runs.py failed (exit ${result.status ?? result.signal}): ${result.stderr || result.error?.message}`,
    );
  }
  writeFileSync(stampFile, stamp);
  return true;
}

/**
 * Config names of a make_runs.py folder as the peer forms them: the key=value folders above each
 * seed=<s> folder, joined with commas in path order ('ticks=8,memory=4'). Cost: one directory walk.
 */
export function configsOnDisk(root: string): string[] {
  const configs = new Set<string>();
  const walk = (dir: string): void => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      if (!entry.isDirectory()) continue;
      const path = join(dir, entry.name);
      if (entry.name.startsWith('seed=')) configs.add(relative(root, dir).split(/[\\/]/).join(','));
      else walk(path);
    }
  };
  walk(root);
  return [...configs];
}

/** Total bytes of the files under `root` (to print the size of a data set). */
export function bytesOnDisk(root: string): number {
  let total = 0;
  for (const entry of readdirSync(root, { withFileTypes: true, recursive: true })) {
    if (entry.isFile()) total += statSync(join(entry.parentPath, entry.name)).size;
  }
  return total;
}
