/**
 * Split a read file into the runs it holds (DESIGN "Inputs", identity 3 and 4):
 *
 * - `--seed-column NAME`: one part per distinct seed in the column; rows with an empty seed cell
 *   belong to no run and are reported (`seed-missing`, with their lines).
 * - `--seed-columns PATTERN`: one part per seed captured from the column names; every part has
 *   all the rows, and its metrics are the columns of its seed.
 * - otherwise the whole file is one part with the seed its location gave. When the seed was to
 *   come from inside the file but the file has no such column, the seed its path named (kept by
 *   locate as information) is used, else one of its own (`auto:` + its relative path), reported.
 */
import type { SeedColumn } from '../plan/columns.js';
import type { FileData } from '../load/loadFiles.js';
import { draft, type Draft, type RowRef } from '../lines/drafts.js';

/** The rows of one file that belong to one run. */
export interface Part {
  readonly data: FileData;
  readonly seed: string;
  /** Row positions in the file's arrays, ascending; null for all rows. */
  readonly rows: Int32Array | null;
  /** `--seed-columns`: this seed's columns (metric name, column index). */
  readonly perSeed: readonly SeedColumn[];
}

/** How many row lines a problem lists at most. */
export const LISTED_ROWS = 5;

/**
 * The parts of one file (see the module comment), with problems for rows or files that belong to
 * no run. Pure, O(rows). Example: a file whose seed column holds 1, 1, 2 gives parts for seeds
 * '1' (rows 0, 1) and '2' (row 2).
 */
export function splitParts(data: FileData): { parts: Part[]; drafts: Draft[] } {
  const source = data.header.source;
  const file = source.file;
  const plan = data.plan;
  if (data.seedCodes !== null) {
    const codes = data.seedCodes;
    const byCode = new Map<number, number[]>();
    const empty: number[] = [];
    for (let i = 0; i < data.rows; i++) {
      const code = codes[i] as number;
      if (code === 0) empty.push(i);
      else {
        const list = byCode.get(code) ?? [];
        list.push(i);
        byCode.set(code, list);
      }
    }
    const parts = [...byCode.entries()]
      .sort((a, b) => (a[1][0] as number) - (b[1][0] as number))
      .map(([code, rows]) => ({
        data,
        seed: data.seedValues[code - 1] as string,
        rows: Int32Array.from(rows),
        perSeed: [],
      }));
    const drafts =
      empty.length === 0
        ? []
        : [
            draft(
              'seed-missing',
              `${empty.length} row(s) have an empty ${plan.names[plan.seed as number] as string} cell, so they ` +
                `belong to no run and were not used`,
              { file, rows: empty.slice(0, LISTED_ROWS).map((n): RowRef => ({ data, kind: 'row', n })) },
            ),
          ];
    return { parts, drafts };
  }
  if (plan.perSeed.length > 0) {
    const seeds = [...new Set(plan.perSeed.map((c) => c.seed))];
    return {
      parts: seeds.map((seed) => ({ data, seed, rows: null, perSeed: plan.perSeed.filter((c) => c.seed === seed) })),
      drafts: [],
    };
  }
  if (source.seed !== null) return { parts: [{ data, seed: source.seed, rows: null, perSeed: [] }], drafts: [] };
  const fromPath = source.info.seed;
  const seed = fromPath ?? `auto:${source.relPath}`;
  const wanted = source.identity === 'seed-columns' ? 'no column matches --seed-columns' : 'it has no seed column';
  const drafts = [
    draft(
      'seed-missing',
      `the seed was to come from inside the file, but ${wanted}; ` +
        `${fromPath === undefined ? 'given a seed of its own' : 'the seed its path names was used'}: ${seed}`,
      { file },
    ),
  ];
  return { parts: [{ data, seed, rows: null, perSeed: [] }], drafts };
}
