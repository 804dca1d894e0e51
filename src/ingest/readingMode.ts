/**
 * The reading mode: how the identity of a run (its config and its seed) is read. One mode is
 * chosen from the reading options and checked here, once, at the edge; every step of ingest after
 * that asks the mode, never the options.
 *
 * | mode           | config from                                    | seed from                                      |
 * | -------------- | ---------------------------------------------- | ---------------------------------------------- |
 * | `paths`        | `key=value` path segments, `--layout` fields   | a `seed=` segment or the layout's `{seed}`     |
 * | `seed-column`  | as `paths`                                     | a column inside the file (one file, many seeds) |
 * | `seed-columns` | as `paths`                                     | column names (one column per seed)             |
 * | `manifest`     | the manifest's columns                         | the manifest's `seed` column                   |
 * | `scores`       | the score table's text columns, or `--by`      | its `seed` column, or `--seed-column`          |
 *
 * In every mode but `scores`, a `params.json` beside a file adds parameters and, when nothing else
 * names it, the seed (locate/sidecar.ts). Where the identity is then decided: locate/identity.ts for
 * what a file's location says, assemble/parts.ts for a seed read from inside a file,
 * scores/readScores.ts for a score table.
 */
import { SeedsiftError } from '../problems.js';
import { compileLayout, type Layout } from './locate/layout.js';

/** One `--seed-columns` pattern, compiled. */
export interface SeedPattern {
  /** The `NAME:PATTERN` (or bare PATTERN) as written in the option. */
  readonly written: string;
  readonly metric: string;
  readonly text: string;
  readonly regex: RegExp;
}

export type ReadingMode =
  | { readonly kind: 'paths'; readonly layout: Layout | null }
  | { readonly kind: 'seed-column'; readonly layout: Layout | null; readonly column: string }
  | { readonly kind: 'seed-columns'; readonly layout: Layout | null; readonly patterns: readonly SeedPattern[] }
  | { readonly kind: 'manifest'; readonly file: string }
  | {
      readonly kind: 'scores';
      readonly file: string;
      /** The seed column's name (`seed` unless `--seed-column` says otherwise). */
      readonly seedColumn: string;
      /** `--by`: the config columns, when they hold numbers; null to take every text column. */
      readonly by: readonly string[] | null;
    };

/** The reading options as given (null when not given). */
export interface ReadingFlags {
  readonly layout: string | null;
  readonly seedColumn: string | null;
  readonly seedColumns: string | null;
  readonly manifest: string | null;
  readonly scores: string | null;
  readonly by: readonly string[] | null;
}

export const NO_FLAGS: ReadingFlags = {
  layout: null,
  seedColumn: null,
  seedColumns: null,
  manifest: null,
  scores: null,
  by: null,
};

const FLAG = {
  layout: '--layout',
  seedColumn: '--seed-column',
  seedColumns: '--seed-columns',
  manifest: '--manifest',
  by: '--by',
} as const;

/**
 * Choose and check the reading mode (see the module comment). Pure apart from compiling patterns.
 * Throws SeedsiftError('usage') naming the options for a combination that contradicts itself
 * (two seed sources; `--manifest` with `--layout`; `--scores` with an option that reads paths;
 * `--by` without `--scores`), a malformed `--layout` or a `--seed-columns` pattern without exactly
 * one `{seed}`. Example: `readingMode({ ...NO_FLAGS, seedColumn: 'run' })` is
 * `{ kind: 'seed-column', layout: null, column: 'run' }`.
 */
export function readingMode(flags: ReadingFlags): ReadingMode {
  const seedSources = [flags.seedColumn, flags.seedColumns, flags.manifest].filter((v) => v !== null);
  if (seedSources.length > 1)
    throw new SeedsiftError('usage', '--seed-column, --seed-columns and --manifest: expected at most one of them');
  if (flags.seedColumns !== null && !flags.seedColumns.includes('{seed}'))
    throw new SeedsiftError(
      'usage',
      `--seed-columns: expected a pattern with a {seed} capture, got '${flags.seedColumns}'`,
    );
  if (flags.scores !== null) {
    const paths = (['layout', 'seedColumns', 'manifest'] as const).filter((k) => flags[k] !== null);
    if (paths.length > 0)
      throw new SeedsiftError(
        'usage',
        `--scores: a score table names its runs in its own columns, so it cannot be combined with ` +
          `${paths.map((k) => FLAG[k]).join(', ')}`,
      );
    return { kind: 'scores', file: flags.scores, seedColumn: flags.seedColumn ?? 'seed', by: flags.by };
  }
  if (flags.by !== null)
    throw new SeedsiftError('usage', '--by: names the config columns of a score table, so it needs --scores');
  if (flags.manifest !== null) {
    if (flags.layout !== null)
      throw new SeedsiftError(
        'usage',
        "options: --manifest names every file's seed and params, so it cannot be combined with --layout",
      );
    return { kind: 'manifest', file: flags.manifest };
  }
  const layout = flags.layout === null ? null : compileLayout(flags.layout);
  if (flags.seedColumn !== null) return { kind: 'seed-column', layout, column: flags.seedColumn };
  if (flags.seedColumns !== null) return { kind: 'seed-columns', layout, patterns: seedPatterns(flags.seedColumns) };
  return { kind: 'paths', layout };
}

/**
 * The files a mode reads besides the PATHs (the manifest, the score table): outputs must never
 * be written over them. Example: `modeFiles({ kind: 'manifest', file: 'runs.csv' })` is `['runs.csv']`.
 */
export function modeFiles(mode: ReadingMode): string[] {
  return mode.kind === 'manifest' || mode.kind === 'scores' ? [mode.file] : [];
}

/**
 * Compile `--seed-columns`: a comma-separated list of `NAME:PATTERN` (NAME is the metric, PATTERN
 * matches whole column names, `{seed}` captures the seed, `*` matches any text). Without `NAME:`,
 * the metric is named by the pattern's text with `{seed}` and `*` removed and separators trimmed
 * (`val_acc_seed{seed}` gives `val_acc_seed`), or `value` when nothing is left.
 * Throws SeedsiftError('usage') when a pattern has no `{seed}` or more than one.
 * Example: `seedPatterns('acc:seed_{seed}_*')[0].regex.exec('seed_3_final')[1]` is `'3'`.
 */
export function seedPatterns(option: string): SeedPattern[] {
  return option.split(',').map((raw) => {
    const part = raw.trim();
    const colon = part.indexOf(':');
    const text = colon >= 0 ? part.slice(colon + 1) : part;
    const count = text.split('{seed}').length - 1;
    if (count !== 1)
      throw new SeedsiftError('usage', `--seed-columns: expected a pattern with one {seed} capture, got '${part}'`);
    const derived = text
      .replace('{seed}', '')
      .replaceAll('*', '')
      .replace(/^[^A-Za-z0-9]+|[^A-Za-z0-9]+$/g, '')
      .replace(/[_\-. ]{2,}/g, '_');
    const metric = colon >= 0 ? part.slice(0, colon).trim() : derived === '' ? 'value' : derived;
    const source = text
      .split('{seed}')
      .map((piece) =>
        piece
          .split('*')
          .map((lit) => lit.replace(/[.*+?^${}()|[\]\\]/g, '\\$&'))
          .join('.*'),
      )
      .join('(.+?)');
    return { written: part, metric, text, regex: new RegExp(`^${source}$`) };
  });
}
