/**
 * The command line of the option tables (`src/analysis/readingOptions.ts`, `analysisOptions.ts`):
 * `addTableOptions` declares a command's entries on commander, and `tableValues` reads what was
 * typed back under the tables' keys, merged over the notebook front matter's values (the command
 * line wins; an entry's `merge` may combine the two, as `--metric` does per metric name; an older
 * name typed on the command line, such as `--diverged`, beats its option's front-matter value).
 */
import { type Command, Option } from 'commander';
import { ANALYSIS_OPTIONS } from '../analysis/analysisOptions.js';
import type { CommandName, OptionSpec, RawBy, RawValue } from '../analysis/optionSpec.js';
import { READING_OPTIONS } from '../analysis/readingOptions.js';

/** Both tables, reading options first (the order of `--help`). */
export const OPTION_TABLES = { ...READING_OPTIONS, ...ANALYSIS_OPTIONS };

const collect = (value: string, previous: string[] = []): string[] => [...previous, value];

/** The table entries a command takes, with their keys. */
export function commandEntries(name: CommandName, table: Record<string, OptionSpec<unknown>> = OPTION_TABLES) {
  return Object.entries(table).filter(([, spec]) => spec.commands.includes(name));
}

/** Declare the table's options of command `name` (in table order). */
export function addTableOptions(
  command: Command,
  name: CommandName,
  table: Record<string, OptionSpec<unknown>> = OPTION_TABLES,
): Command {
  for (const [, spec] of commandEntries(name, table)) {
    const opt = new Option(spec.flag, spec.help);
    command.addOption(spec.repeatable === true ? opt.argParser(collect) : opt);
  }
  return command;
}

/**
 * The values of a table's entries: commander's (`opts`, keyed by attribute name) over the front
 * matter's (keyed by table key). Entries the command does not declare take the front matter's value.
 */
export function tableValues<Table extends Record<string, OptionSpec<unknown>>>(
  table: Table,
  opts: Readonly<Record<string, unknown>>,
  front: Readonly<Record<string, RawValue | undefined>> = {},
): RawBy<Table> {
  const out: Record<string, RawValue> = {};
  for (const [key, spec] of Object.entries(table)) {
    const typed = opts[new Option(spec.flag).attributeName()] as RawValue | undefined;
    const written = front[key];
    const value =
      typed !== undefined && written !== undefined && spec.merge !== undefined
        ? spec.merge(written, typed)
        : (typed ?? written);
    if (value !== undefined) out[key] = value;
  }
  // An older name typed on the command line beats its option written in the front matter.
  for (const spec of Object.values(table)) {
    if (spec.aliasOf === undefined || opts[new Option(spec.flag).attributeName()] === undefined) continue;
    const target = table[spec.aliasOf];
    if (target !== undefined && opts[new Option(target.flag).attributeName()] === undefined) delete out[spec.aliasOf];
  }
  return out as RawBy<Table>;
}
