/**
 * The reading options shared by `scan`, `report`, `digest` and `seeds`: declared from their table
 * (`src/analysis/readingOptions.ts`) and resolved once into an `IngestOptions` with every field
 * set; bad values are rejected with the option's name.
 */
import type { Command } from 'commander';
import type { RawBy } from '../analysis/optionSpec.js';
import { resolveTable } from '../analysis/optionSpec.js';
import { READING_OPTIONS } from '../analysis/readingOptions.js';
import type { CommandName } from '../analysis/optionSpec.js';
import type { IngestOptions } from '../ingest/types.js';
import { SeedsiftError } from '../problems.js';
import { addTableOptions, tableValues } from './tableOptions.js';

/** Raw reading values, keyed like the table. */
export type RawIngestOptions = RawBy<typeof READING_OPTIONS>;

/** Declare the reading options on a command. */
export function addIngestOptions(command: Command, name: CommandName): Command {
  return addTableOptions(command, name, READING_OPTIONS);
}

/** The reading values typed on a command line (commander's `opts`), over the front matter's. */
export function rawIngestOptions(
  opts: Readonly<Record<string, unknown>>,
  front: Readonly<Record<string, unknown>> = {},
): RawIngestOptions {
  return tableValues(READING_OPTIONS, opts, front as Record<string, never>);
}

/** Resolve raw reading options; throws SeedsiftError('usage') naming the option on a bad value. */
export function resolveIngestOptions(raw: RawIngestOptions): IngestOptions {
  const resolved = resolveTable(READING_OPTIONS, raw);
  const identity = [resolved.seedColumn, resolved.seedColumns, resolved.manifest].filter((v) => v !== null);
  if (identity.length > 1)
    throw new SeedsiftError('usage', '--seed-column, --seed-columns and --manifest: expected at most one of them');
  return resolved;
}
