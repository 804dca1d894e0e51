/**
 * Step 1 of ingest: locate the files (locate.ts), stop when a `--layout` matched none of them
 * (layoutMatched.ts), and set the digests among them aside for step 6.
 * A digest is a Parquet file whose metadata carries the digest marker (digest/digestFormat.ts); it
 * holds runs already read, so it is neither planned nor loaded like a log.
 */
import { findDigests } from '../digest/readDigest.js';
import type { Engine } from '../load/duckdb.js';
import type { IngestOptions } from '../types.js';
import { checkLayoutMatched } from './layoutMatched.js';
import { locate, type Located } from './locate.js';

/** What step 1 hands on: the log files to read, and the digests found beside them. */
export interface Inputs {
  /** Everything located, digests included, in the order found (step 6 orders the parts by it). */
  readonly found: Located;
  /** The log files: `found` without the digests and their problems. */
  readonly logs: Located;
  /** Digest files (path to marker value), in the order found. */
  readonly digests: ReadonlyMap<string, string>;
}

/**
 * Locate the inputs under `paths` (see the module comment). Throws what `locate` throws.
 * Cost: `locate`'s, plus one DuckDB metadata query over the plain (not gzipped) Parquet files.
 * Example: a folder with one CSV log and one digest gives one source in `logs` and one digest.
 */
export async function locateInputs(engine: Engine, paths: readonly string[], options: IngestOptions): Promise<Inputs> {
  const found = await locate(paths, options);
  checkLayoutMatched(options, found.sources, found.problems);
  const digests = await findDigests(
    engine,
    found.sources.filter((s) => s.format === 'parquet' && !s.gzip).map((s) => s.file),
  );
  const logs: Located =
    digests.size === 0
      ? found
      : {
          sources: found.sources.filter((s) => !digests.has(s.file)),
          files: found.files,
          problems: found.problems.filter((p) => p.file === undefined || !digests.has(p.file)),
        };
  return { found, logs, digests };
}
