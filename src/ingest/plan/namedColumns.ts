/**
 * Reading options that name something must name something that exists: a `--step` or
 * `--seed-column` that is a column of no file read, a `--seed-columns` pattern that matches no
 * column of any file, a `--metric NAME:GOAL` whose NAME is no metric, stops the command (exit 2)
 * with what exists and a "did you mean" line, instead of a report built on nothing. A name found
 * in some files but not in others is a per-file problem as before (`step-column-missing`,
 * `seed-missing`, `column-unused`). Pure.
 */
import { didYouMean, unknownName } from '../../didYouMean.js';
import { SeedsiftError } from '../../problems.js';
import { type SeedPattern, seedPatterns } from '../readingMode.js';
import type { IngestOptions, RunSet } from '../types.js';

/**
 * Check `--step` and `--seed-column` against the column names of every file whose header was
 * read (`seen`; nothing is checked when no header was read).
 * Example: `--step stpe` with files of columns step, loss stops: "did you mean step?".
 */
export function checkNamedColumns(options: Pick<IngestOptions, 'step' | 'mode'>, seen: ReadonlySet<string>): void {
  if (seen.size === 0) return;
  const names = [...seen];
  if (options.step !== null && !seen.has(options.step)) throw unknownName('--step', 'column', options.step, names);
  const mode = options.mode;
  if (mode.kind === 'seed-column' && !seen.has(mode.column))
    throw unknownName('--seed-column', 'column', mode.column, names);
  if (mode.kind === 'seed-columns')
    for (const pattern of mode.patterns)
      if (!names.some((name) => pattern.regex.test(name))) throw unmatchedPattern(pattern, names);
}

/** Columns shown in an error: the first few, then how many there are in all. */
const SHOWN = 8;

/**
 * The usage error of a `--seed-columns` pattern that matches no column: the pattern as written,
 * a few of the columns, and as "did you mean" the pattern that would match when one is near
 * (`patternHint`), else the closest column names.
 */
function unmatchedPattern(pattern: SeedPattern, names: readonly string[]): SeedsiftError {
  const shown =
    names.length > SHOWN ? `${names.slice(0, SHOWN).join(', ')}, ... (${names.length} in all)` : names.join(', ');
  const hint = patternHint(pattern, names);
  const mean =
    hint === null
      ? didYouMean(pattern.text, names)
      : `did you mean '${hint.written}' (it matches ${hint.count} column${hint.count === 1 ? '' : 's'})?`;
  return new SeedsiftError(
    'usage',
    `--seed-columns: '${pattern.written}' matches no column (columns: ${shown}); ${mean}`,
  );
}

/**
 * A pattern that would match, when the columns carry text before the pattern (a prefix such as
 * `acc:` in `acc:seed_0_x`) or after it (a suffix, matched by a trailing `*`): for each column,
 * the shortest prefix, with or without a trailing `*`, that makes the pattern match it; of these
 * candidates, the one matching the most columns (the shorter on ties). The metric's name is kept
 * (written as `NAME:`). Null when no candidate exists. Cost O(columns x name length) regex tests.
 * Example: pattern `acc:seed_{seed}_*` and columns step, acc:seed_0_x, acc:seed_1_x give
 * `acc:acc:seed_{seed}_*`, matching 2 columns.
 */
export function patternHint(
  pattern: SeedPattern,
  names: readonly string[],
): { readonly written: string; readonly count: number } | null {
  const candidates = new Set<string>();
  for (const name of names)
    search: for (let k = 0; k < name.length; k++) {
      const prefix = name.slice(0, k);
      if (/[*,]|\{seed\}/.test(prefix)) break;
      for (const star of k === 0 ? ['*'] : ['', '*']) {
        const written = `${pattern.metric}:${prefix}${pattern.text}${star}`;
        if ((seedPatterns(written)[0] as SeedPattern).regex.test(name)) {
          candidates.add(written);
          break search;
        }
      }
    }
  let best: { written: string; count: number } | null = null;
  for (const written of candidates) {
    const regex = (seedPatterns(written)[0] as SeedPattern).regex;
    const count = names.filter((name) => regex.test(name)).length;
    if (best === null || count > best.count || (count === best.count && written.length < best.written.length))
      best = { written, count };
  }
  return best;
}

/** Check the names of `--metric NAME:GOAL` against the metrics read. */
export function checkGoalNames(options: Pick<IngestOptions, 'metricGoals'>, runSet: RunSet): void {
  const metrics = [...new Set(runSet.metrics.map((m) => m.name))];
  if (runSet.runs.length === 0) return;
  for (const name of Object.keys(options.metricGoals))
    if (!metrics.includes(name)) throw unknownName('--metric', 'metric', name, metrics);
}
