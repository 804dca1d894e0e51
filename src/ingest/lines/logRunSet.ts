/**
 * Step 5 of ingest: the RunSet of the logs. The problem drafts of steps 2-4 are given exact lines
 * (drafts.ts, which re-reads only the files that have a problem on a row), the metrics found get
 * their goals (plan/goals.ts), and every file gets its record, in the order the files were found.
 *
 * Problems come in this order: those of locating, then the drafts of planning, loading and
 * assembling (each in its own order), then the `goal-inferred` notes.
 */
import type { Assembly } from '../assemble/assembleRuns.js';
import type { Loaded } from '../load/loadPlanned.js';
import type { Located } from '../locate/locate.js';
import { metricInfos } from '../plan/goals.js';
import type { Planned } from '../plan/planFiles.js';
import type { FileRecord, IngestOptions, RunSet } from '../types.js';
import { finishDrafts } from './drafts.js';

/** What steps 1-4 handed on. */
export interface Steps {
  readonly located: Located;
  readonly planned: Planned;
  readonly loaded: Loaded;
  readonly assembly: Assembly;
}

/**
 * The logs' RunSet (see the module comment). Cost: O(runs + files + problems), plus re-reading the
 * files whose problems name rows. Example: one clean log gives one `read` file record and no problems.
 */
export async function logRunSet(steps: Steps, options: Pick<IngestOptions, 'metricGoals'>): Promise<RunSet> {
  const { located, planned, loaded, assembly } = steps;
  const read = loaded.data.map(
    (d): FileRecord => ({
      file: d.header.source.file,
      status: 'read',
      rows: d.rows,
      rejectedRows: d.rejects.length + d.malformed.length,
      runs: assembly.fileRuns.get(d.header.source.file) ?? [],
      kind: d.plan.kind,
    }),
  );
  const order = new Map(located.sources.map((s, k) => [s.file, k]));
  const records = [...planned.records, ...loaded.records, ...read].sort(
    (a, b) => (order.get(a.file) ?? 0) - (order.get(b.file) ?? 0),
  );
  const { metrics, problems } = metricInfos(assembly.runs, options);
  const lines = await finishDrafts([...planned.drafts, ...loaded.drafts, ...assembly.drafts]);
  return {
    mode: 'logs',
    keys: assembly.keys,
    runs: assembly.runs,
    metrics,
    tickDumps: assembly.dumps,
    files: [...located.files, ...records],
    problems: [...located.problems, ...lines, ...problems],
  };
}
