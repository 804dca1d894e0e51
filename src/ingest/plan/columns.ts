/**
 * Recognise the columns of one file from its names alone (DESIGN "Inputs"): the step column, the
 * seed column, per-tick columns, per-seed columns, aggregate columns, and whether the file is a
 * per-sample tick dump. Which columns hold numbers is known only after reading (a column with no
 * number in any file is not a metric, `column-not-numeric`).
 *
 * - Duplicate names: the second `loss` becomes `loss_2`, the third `loss_3` (skipping names that
 *   exist), reported as `column-duplicated`.
 * - Step column: `--step NAME`, else the first of `step, global_step, iteration, iter, epoch,
 *   timestep, frame` present (exact, case-sensitive names).
 * - Per-tick columns: `name@k` with k a whole number; a long file has a `tick` column instead.
 * - Tick dump: a file with both `sample` and `tick` columns (tickDump.ts reads the rest).
 * - A column named `seed` is an identity column, never a metric.
 * - `--seed-columns` (the mode's patterns, readingMode.ts): columns matching a pattern hold one seed each; of the
 *   other columns (the step column aside) those that look like aggregates are ignored
 *   (`aggregate-columns-ignored`), the rest are listed as unmatched.
 */
import type { IngestOptions } from '../types.js';

/** Step column names tried in this order (DESIGN "Inputs"). */
export const STEP_NAMES = ['step', 'global_step', 'iteration', 'iter', 'epoch', 'timestep', 'frame'] as const;

/**
 * Words that mark an aggregate column in a wide per-seed file (ours, from the common spellings:
 * mean, average, standard deviation, standard error, extremes, median).
 */
export const AGGREGATE_WORDS = [
  'mean',
  'avg',
  'average',
  'sd',
  'std',
  'stdev',
  'stderr',
  'sem',
  'se',
  'min',
  'max',
  'median',
] as const;

/** A wide per-tick column `base@tick`. */
export interface WideTick {
  readonly base: string;
  readonly tick: number;
  readonly index: number;
}

/** A `--seed-columns` column: the metric it holds and the seed it belongs to. */
export interface SeedColumn {
  readonly metric: string;
  readonly seed: string;
  readonly index: number;
}

/** What each column of a file is. Indices refer to `names`. */
export interface ColumnPlan {
  /** Unique names (duplicates renamed). */
  readonly names: readonly string[];
  /** Names that occurred more than once in the file (as written). */
  readonly duplicated: readonly string[];
  readonly kind: 'log' | 'tick-dump';
  readonly step: number | null;
  /** The `--seed-column` column, when the option is given and the file has it. */
  readonly seed: number | null;
  /** The `tick` column of a long per-tick log. */
  readonly tick: number | null;
  /** Candidate scalar metric columns. */
  readonly scalars: readonly number[];
  readonly wideTicks: readonly WideTick[];
  readonly perSeed: readonly SeedColumn[];
  readonly aggregates: readonly string[];
  readonly unmatched: readonly string[];
}

/**
 * Words of a column or metric name: split at every character that is not a letter or digit and
 * at lower-to-upper case changes, lower-cased. Pure. Example: `nameWords('valLoss_top1')` is `['val', 'loss', 'top1']`.
 */
export function nameWords(name: string): string[] {
  return name
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .split(/[^A-Za-z0-9]+/)
    .filter((w) => w.length > 0)
    .map((w) => w.toLowerCase());
}

/** Rename duplicates: `loss, loss` gives `loss, loss_2`. */
function uniqueNames(names: readonly string[]): { names: string[]; duplicated: string[] } {
  const taken = new Set(names);
  const seen = new Set<string>();
  const duplicated = new Set<string>();
  const out = names.map((name) => {
    if (!seen.has(name)) {
      seen.add(name);
      return name;
    }
    duplicated.add(name);
    let k = 2;
    while (taken.has(`${name}_${k}`)) k++;
    const renamed = `${name}_${k}`;
    taken.add(renamed);
    return renamed;
  });
  return { names: out, duplicated: [...duplicated] };
}

/**
 * Plan the columns of one file (see the module comment). Pure, O(columns x patterns).
 * Example: `planColumns(['step', 'loss', 'acc@0', 'acc@1'], opts).wideTicks.length` is 2.
 */
export function planColumns(rawNames: readonly string[], options: Pick<IngestOptions, 'step' | 'mode'>): ColumnPlan {
  const { names, duplicated } = uniqueNames(rawNames);
  const find = (name: string): number | null => {
    const k = names.indexOf(name);
    return k < 0 ? null : k;
  };
  const kind = find('sample') !== null && find('tick') !== null ? 'tick-dump' : 'log';
  let step: number | null = null;
  if (options.step !== null) step = find(options.step);
  else {
    for (const candidate of STEP_NAMES) {
      step = find(candidate);
      if (step !== null) break;
    }
  }
  const mode = options.mode;
  const seed = mode.kind === 'seed-column' ? find(mode.column) : null;
  const tick = kind === 'log' ? find('tick') : null;
  const identity = new Set([step, seed, tick, find('seed')]);
  const scalars: number[] = [];
  const wideTicks: WideTick[] = [];
  const perSeed: SeedColumn[] = [];
  const aggregates: string[] = [];
  const unmatched: string[] = [];
  const patterns = mode.kind === 'seed-columns' ? mode.patterns : null;
  names.forEach((name, index) => {
    if (identity.has(index) || kind === 'tick-dump') return;
    if (patterns !== null) {
      for (const p of patterns) {
        const m = p.regex.exec(name);
        if (m !== null) {
          perSeed.push({ metric: p.metric, seed: m[1] as string, index });
          return;
        }
      }
      if (nameWords(name).some((w) => (AGGREGATE_WORDS as readonly string[]).includes(w))) aggregates.push(name);
      else unmatched.push(name);
      return;
    }
    const at = /^(.+)@(\d+)$/.exec(name);
    if (at !== null && tick === null) wideTicks.push({ base: at[1] as string, tick: Number(at[2]), index });
    else scalars.push(index);
  });
  return { names, duplicated, kind, step, seed, tick, scalars, wideTicks, perSeed, aggregates, unmatched };
}
