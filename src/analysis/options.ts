/**
 * Report options, resolved once at the edge: `ReportOptions` (every field optional, as typed on
 * the command line or written in notebook front matter, so strings or numbers) becomes
 * `ResolvedOptions` (every field set) in `resolveOptions`. Both types are derived from the one
 * table of analysis options (`analysisOptions.ts`), which also holds the defaults. Bad values are
 * rejected with the option's name: "--alpha: expected a number in (0, 1), got 2".
 */
import type { RunSet } from '../ingest/types.js';
import { ANALYSIS_OPTIONS } from './analysisOptions.js';
import { checkOptions } from './checkOptions.js';
import { describeSummary } from './summaryKinds.js';
import { type RawBy, type ResolvedBy, resolveTable, type SettingsBy, settingsOfTable } from './optionSpec.js';

/** Options as given: strings from the command line, numbers or strings from YAML front matter. */
export type ReportOptions = RawBy<typeof ANALYSIS_OPTIONS>;

/**
 * Every option set (one field per entry of the table, `level` filled in: 1 - alpha unless given,
 * so the intervals are unadjusted), plus `summaryText`, the summary as typed.
 */
export type ResolvedOptions = Omit<ResolvedBy<typeof ANALYSIS_OPTIONS>, 'level'> & {
  readonly level: number;
  readonly summaryText: string;
};

/** The settings block of results.json: the table's entries with a `setting`. */
export type OptionSettings = SettingsBy<typeof ANALYSIS_OPTIONS>;

/**
 * What ran, as results.json records it: the table's settings (`level` as used, 1 - alpha unless
 * given) and the summary in words.
 */
export type Settings = Omit<OptionSettings, 'level'> & { readonly level: number; readonly summaryDescription: string };

/** The defaults, from the table. */
export const DEFAULT_OPTIONS = Object.fromEntries(
  Object.entries(ANALYSIS_OPTIONS)
    .filter(([, spec]) => !('aliasOf' in spec))
    .map(([key, spec]) => [key, spec.fallback]),
) as ResolvedBy<typeof ANALYSIS_OPTIONS>;

/**
 * Resolve report options: fill defaults, parse and check every value. With a `runSet`, the task
 * key must be a config key and the baseline selector must match a config (the message lists what
 * is available). Throws SeedsiftError('usage') naming the option on the first bad value.
 * Cost O(runs) with a run set, O(1) without.
 * Example: `resolveOptions({ alpha: '0.01' }).alpha` is 0.01.
 */
export function resolveOptions(input: ReportOptions, runSet?: RunSet): ResolvedOptions {
  const table = resolveTable(ANALYSIS_OPTIONS, input);
  const resolved: ResolvedOptions = {
    ...table,
    level: table.level ?? 1 - table.alpha,
    summaryText: table.summary.text,
  };
  if (runSet !== undefined) checkOptions(resolved, runSet);
  return resolved;
}

/**
 * The settings block of results.json for resolved options: the table's settings in table order,
 * with the summary in words (`summaryDescription`, from the summary kinds table) after `summary`.
 */
export function optionSettings(options: ResolvedOptions): Settings {
  const { alpha, seed, correction, summary, ...rest } = settingsOfTable(ANALYSIS_OPTIONS, options);
  const summaryDescription = describeSummary(options.summary);
  return { alpha, seed, correction, summary, summaryDescription, ...rest, level: options.level };
}
