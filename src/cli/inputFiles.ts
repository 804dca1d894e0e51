/**
 * The files a command read or may have read, which writeOutput must never write over: every file
 * found under the PATHs (logs, and the files skipped there), the `params.json` beside each of them
 * (ingest reads it when present, and does not list it among the files), and the files that options
 * name: the manifest, the score table, the notebook.
 */
import { dirname, join } from 'node:path';
import { SIDECAR_NAME } from '../ingest/locate/sidecar.js';
import type { RunSet } from '../ingest/types.js';

/**
 * Paths of the input files of a run (see the module comment); `named` may hold nulls for options
 * not given. Pure, O(files). Example: a RunSet with `runs/seed=1/log.csv` and the manifest
 * `runs.csv` give `['runs/seed=1/log.csv', 'runs/seed=1/params.json', 'runs.csv']`.
 */
export function inputFiles(runSet: RunSet, named: readonly (string | null | undefined)[]): string[] {
  const files = runSet.files.map((f) => f.file);
  const sidecars = [...new Set(files.map((f) => join(dirname(f), SIDECAR_NAME)))];
  return [...files, ...sidecars, ...named.filter((f): f is string => typeof f === 'string')];
}
