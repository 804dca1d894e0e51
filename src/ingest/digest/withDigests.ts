/**
 * Step 6 of ingest: read the digests found in step 1 and merge them with the runs read from logs
 * (mergeRunSets.ts), the parts in the order their first file was found.
 */
import type { Inputs } from '../locate/locateInputs.js';
import type { Engine } from '../load/duckdb.js';
import type { IngestOptions, RunSet } from '../types.js';
import { mergeRunSets, type RunSetPart } from './mergeRunSets.js';
import { readDigest } from './readDigest.js';

/**
 * The RunSet of the logs merged with the digests of `inputs` (see the module comment). Throws
 * SeedsiftError('input') for a digest that cannot be used (readDigest.ts, mergeRunSets.ts).
 * Cost: reading each digest (a row group per query) and merging, O(numbers).
 */
export async function withDigests(
  engine: Engine,
  inputs: Inputs,
  logs: RunSet,
  options: IngestOptions,
): Promise<RunSet> {
  const { found, digests } = inputs;
  const order = new Map(found.sources.map((s, k) => [s.file, k]));
  const parts: { at: number; part: RunSetPart }[] = [
    { at: found.sources.findIndex((s) => !digests.has(s.file)), part: { digest: null, runSet: logs } },
  ];
  for (const file of digests.keys())
    parts.push({ at: order.get(file) ?? -1, part: { digest: file, runSet: await readDigest(engine, file) } });
  parts.sort((a, b) => a.at - b.at);
  return await mergeRunSets(
    parts.map((p) => p.part),
    options,
  );
}
