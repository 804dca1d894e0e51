/**
 * The ingest options shared by `scan`, `report` and `digest`: declared once, resolved once into an
 * `IngestOptions` with every field set; bad values are rejected with the option's name.
 */
import type { Command } from 'commander';
import { readingMode } from '../ingest/readingMode.js';
import type { Goal, IngestOptions } from '../ingest/types.js';
import { SeedsiftError } from '../problems.js';

/** Raw values as commander hands them over. */
export interface RawIngestOptions {
  layout?: string;
  seedColumn?: string;
  seedColumns?: string;
  manifest?: string;
  step?: string;
  columns?: string;
  scores?: string;
  by?: string;
  metric?: string[];
}

const collect = (value: string, previous: string[] = []): string[] => [...previous, value];

/** Declare the shared ingest options on a command. */
export function addIngestOptions(command: Command): Command {
  return command
    .option(
      '--layout <template>',
      "path template with {field} captures, * and ** (e.g. '{model}/{task}_{seed}/eval.csv')",
    )
    .option('--seed-column <name>', 'a column inside each file that holds the seed (one file, many seeds)')
    .option('--seed-columns <pattern>', "one column per seed in a wide file, e.g. 'acc:seed_{seed}_*'")
    .option('--manifest <file>', 'a table with one row per log file: file, seed, and config columns')
    .option(
      '--step <name>',
      'the step column (default: first of step, global_step, iteration, iter, epoch, timestep, frame)',
    )
    .option('--columns <a,b,c>', 'column names for headerless files')
    .option('--scores <file>', 'a score table (one row per run, final numbers only) instead of per-step logs')
    .option('--by <a,b>', 'config columns of a score table (when they hold numbers)')
    .option('--metric <name:max|min>', 'goal of a metric (repeatable); otherwise guessed from its name', collect);
}

const list = (value: string | undefined): string[] | null =>
  value === undefined
    ? null
    : value
        .split(',')
        .map((s) => s.trim())
        .filter((s) => s !== '');

/**
 * Resolve raw ingest options, the reading mode chosen and checked here (readingMode.ts); throws
 * SeedsiftError('usage') naming the option on a bad value or a contradictory combination.
 */
export function resolveIngestOptions(raw: RawIngestOptions): IngestOptions {
  const metricGoals: Record<string, Goal> = {};
  for (const spec of raw.metric ?? []) {
    const at = spec.lastIndexOf(':');
    const name = spec.slice(0, at);
    const goal = spec.slice(at + 1);
    if (at <= 0 || (goal !== 'max' && goal !== 'min')) {
      throw new SeedsiftError('usage', `--metric: expected NAME:max or NAME:min, got '${spec}'`);
    }
    metricGoals[name] = goal;
  }
  const mode = readingMode({
    layout: raw.layout ?? null,
    seedColumn: raw.seedColumn ?? null,
    seedColumns: raw.seedColumns ?? null,
    manifest: raw.manifest ?? null,
    scores: raw.scores ?? null,
    by: list(raw.by),
  });
  const columns = list(raw.columns);
  if (columns !== null && columns.length === 0)
    throw new SeedsiftError('usage', '--columns: expected a comma-separated list of names');
  return { mode, step: raw.step ?? null, columns, metricGoals };
}
