/**
 * The reading options (scan, report, digest, seeds): one table entry each (see `optionSpec.ts`),
 * resolved into `ReadingValues`: the reading-mode flags (`ReadingFlags`, from which
 * `readingMode` in src/ingest/readingMode.ts chooses and checks the one mode) and the rest of
 * `IngestOptions`. The table is typed by `ReadingValues`, so a field without an entry (or an
 * entry without a field) does not compile.
 */
import type { ReadingFlags } from '../ingest/readingMode.js';
import type { Goal, IngestOptions } from '../ingest/types.js';
import { SeedsiftError } from '../problems.js';
import { type CommandName, names, type OptionSpec, option, type RawValue, splitList, text } from './optionSpec.js';

const READERS: readonly CommandName[] = ['scan', 'report', 'digest', 'seeds'];

/** `NAME:max|min` specs into goals; throws naming the option on anything else. */
function goals(raw: RawValue, option: string): Readonly<Record<string, Goal>> {
  const out: Record<string, Goal> = {};
  for (const spec of typeof raw === 'object' ? raw : [String(raw)]) {
    const at = spec.lastIndexOf(':');
    const goal = spec.slice(at + 1);
    if (at <= 0 || (goal !== 'max' && goal !== 'min'))
      throw new SeedsiftError('usage', `${option}: expected NAME:max or NAME:min, got '${spec}'`);
    out[spec.slice(0, at)] = goal;
  }
  return out;
}

/** Goals from the front matter, then the command line's (which win per metric name). */
function mergeGoals(front: RawValue, cli: RawValue): RawValue {
  const byName = new Map<string, string>();
  for (const spec of [front, cli].flatMap((r) => (typeof r === 'object' ? r : [String(r)])))
    byName.set(spec.slice(0, spec.lastIndexOf(':')), spec);
  return [...byName.values()];
}

const textOrNull = (raw: RawValue, name: string): string | null => text()(raw, name);

/** What the reading options resolve to before the reading mode is chosen from the flags. */
export type ReadingValues = ReadingFlags & Pick<IngestOptions, 'step' | 'columns' | 'metricGoals'>;

/** The reading options, in the order `--help` lists them. */
export const READING_OPTIONS: { readonly [K in keyof ReadingValues]-?: OptionSpec<ReadingValues[K]> } = {
  layout: option<string | null>({
    flag: '--layout <template>',
    help: "path template with {field} captures, * and ** (e.g. '{model}/{task}_{seed}/eval.csv')",
    commands: READERS,
    front: 'layout',
    shape: 'text',
    fallback: null,
    parse: textOrNull,
  }),
  seedColumn: option<string | null>({
    flag: '--seed-column <name>',
    help: 'a column inside each file that holds the seed, one file many seeds (e.g. seed)',
    commands: READERS,
    front: 'seed-column',
    shape: 'text',
    fallback: null,
    parse: textOrNull,
  }),
  seedColumns: option<string | null>({
    flag: '--seed-columns <pattern>',
    help: "one column per seed in a wide file, e.g. 'acc:seed_{seed}_*'",
    commands: READERS,
    front: 'seed-columns',
    shape: 'text',
    fallback: null,
    // Its {seed} capture is checked by readingMode, with the other reading flags.
    parse: textOrNull,
  }),
  manifest: option<string | null>({
    flag: '--manifest <file>',
    help: 'a table with one row per log file: file, seed, and config columns (e.g. runs.csv)',
    commands: READERS,
    front: 'manifest',
    shape: 'text',
    fallback: null,
    parse: textOrNull,
  }),
  step: option<string | null>({
    flag: '--step <name>',
    help: 'the step column (default: first of step, global_step, iteration, iter, epoch, timestep, frame)',
    commands: READERS,
    front: 'step',
    shape: 'text',
    fallback: null,
    parse: textOrNull,
  }),
  columns: option<readonly string[] | null>({
    flag: '--columns <a,b,c>',
    help: 'column names for headerless files (e.g. step,loss,acc)',
    commands: READERS,
    front: 'columns',
    shape: 'csv',
    fallback: null,
    parse: names(),
  }),
  scores: option<string | null>({
    flag: '--scores <file>',
    help: 'a score table (one row per run, final numbers only) instead of per-step logs (e.g. scores.csv)',
    commands: READERS,
    front: 'scores',
    shape: 'text',
    fallback: null,
    parse: textOrNull,
  }),
  by: option<readonly string[] | null>({
    flag: '--by <a,b>',
    help: 'config columns of a score table, when they hold numbers (e.g. lr,width)',
    commands: READERS,
    front: 'by',
    shape: 'csv',
    fallback: null,
    parse: (raw) => splitList(raw),
  }),
  metricGoals: option<Readonly<Record<string, Goal>>>({
    flag: '--metric <name:max|min>',
    help: 'goal of a metric, repeatable (e.g. --metric ppl:min); otherwise taken from a name rule',
    commands: READERS,
    front: 'metrics',
    shape: 'goals',
    repeatable: true,
    fallback: {},
    parse: goals,
    merge: mergeGoals,
  }),
};
