/**
 * The short-run policy (DESIGN "Messy logs"): a run that ends well before the others of its config.
 */
import { draft, type Draft } from '../lines/drafts.js';
import type { Run, RunStatus } from '../types.js';

/**
 * Mark runs short (see the module comment): an `ok` run whose lastStep is below 0.9 x the largest
 * lastStep of its config's runs that are not rejected becomes `short`, with a `run-short` draft.
 * Mutates the runs' status; also used after merging digests (mergeRunSets.ts). Cost O(runs).
 * Example: lastSteps 1300 and 2000 in one config mark the first short.
 */
export function markShort(runs: (Omit<Run, 'status'> & { status: RunStatus })[], drafts: Draft[]): void {
  const longest = new Map<string, number>();
  for (const r of runs)
    if (r.status !== 'rejected') longest.set(r.config, Math.max(longest.get(r.config) ?? -Infinity, r.lastStep));
  for (const r of runs) {
    const max = longest.get(r.config);
    // `< max` too: with a negative last step, 0.9 x max lies above max and the longest run itself would be short.
    if (r.status !== 'ok' || max === undefined || !(r.lastStep < max && r.lastStep < 0.9 * max)) continue;
    r.status = 'short';
    const where = r.files.length === 1 ? { run: r.id, file: r.files[0] as string } : { run: r.id };
    drafts.push(
      draft(
        'run-short',
        `the run ends at step ${r.lastStep}, below 90% of the longest run of its config (step ${max})`,
        where,
      ),
    );
  }
}
