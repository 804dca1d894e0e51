/**
 * The reading options shared by `scan`, `report`, `digest` and `seeds`: declared from their table
 * (`src/analysis/readingOptions.ts`) and resolved once into an `IngestOptions` with every field
 * set; bad values are rejected with the option's name.
 */
import type { Command } from 'commander';
import type { CommandName, RawBy } from '../analysis/optionSpec.js';
import { resolveTable } from '../analysis/optionSpec.js';
import { READING_OPTIONS } from '../analysis/readingOptions.js';
import { readingMode } from '../ingest/readingMode.js';
import type { IngestOptions } from '../ingest/types.js';
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

/**
 * Resolve raw reading options from their table, the reading mode chosen and checked from the
 * flags here, once (readingMode.ts); throws SeedsiftError('usage') naming the option on a bad
 * value or a contradictory combination.
 */
export function resolveIngestOptions(raw: RawIngestOptions): IngestOptions {
  const { layout, seedColumn, seedColumns, manifest, scores, by, step, columns, metricGoals } = resolveTable(
    READING_OPTIONS,
    raw,
  );
  const mode = readingMode({ layout, seedColumn, seedColumns, manifest, scores, by });
  return { mode, step, columns, metricGoals };
}
