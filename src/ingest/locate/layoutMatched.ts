/**
 * A `--layout` that matches no file at all stops the command (exit 2) instead of a report built
 * on nothing: every file found was `layout-unmatched`. A layout that matches some files leaves the
 * others as per-file problems. Pure.
 */
import { SeedsiftError, type Problem } from '../../problems.js';
import type { IngestOptions, RunSource } from '../types.js';
import { modeLayout } from './identity.js';

/**
 * Check that the layout of `options.mode` matched a file (see the module comment), showing one
 * path it was matched against.
 * Example: `--layout '{algo}/run{seed}.csv'` over files named `log.csv` only stops.
 */
export function checkLayoutMatched(
  options: Pick<IngestOptions, 'mode'>,
  sources: readonly RunSource[],
  problems: readonly Problem[],
): void {
  const layout = modeLayout(options.mode);
  if (layout === null || sources.length > 0) return;
  const first = problems.find((p) => p.code === 'layout-unmatched');
  if (first === undefined) return;
  const count = problems.filter((p) => p.code === 'layout-unmatched').length;
  throw new SeedsiftError(
    'usage',
    `--layout: '${layout.template}' matches none of the ${count} files found (first: ${first.file ?? '?'}); ` +
      'the template is matched against the path below PATH, file name included',
  );
}
