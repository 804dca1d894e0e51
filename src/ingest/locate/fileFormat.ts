/**
 * Which log format a file name announces: `.csv`, `.tsv`, `.txt` (delimiter sniffed by the
 * loader), `.parquet`, each optionally followed by `.gz`. The extension is matched without regard
 * to case (`LOG.CSV.GZ` is a gzipped CSV). Nothing is read from the file: this is the name only.
 */
import type { FileFormat } from '../types.js';

/** What a file name says about how to read the file. */
export interface FileKind {
  readonly format: FileFormat;
  readonly gzip: boolean;
}

const PATTERN = /\.(csv|tsv|txt|parquet)(\.gz)?$/i;

/**
 * The format and compression of a log file, from its name (a base name or a whole path).
 * Returns null when the name has no log extension. Cost O(length of the name); never throws.
 * Example: `fileFormat('runs/seed=3/log.CSV.gz')` is `{ format: 'csv', gzip: true }`.
 */
export function fileFormat(name: string): FileKind | null {
  const m = PATTERN.exec(name);
  if (m === null || m.index === 0 || name[m.index - 1] === '/') return null;
  return { format: (m[1] as string).toLowerCase() as FileFormat, gzip: m[2] !== undefined };
}

/**
 * A file's base name without its log extension (`seed=3.csv.gz` gives `seed=3`), or the name
 * unchanged when it has none. Used to read a `key=value` pair from a file name.
 * Example: `logStem('seed=3.csv.gz')` is `'seed=3'`.
 */
export function logStem(baseName: string): string {
  const m = PATTERN.exec(baseName);
  return m === null || m.index === 0 ? baseName : baseName.slice(0, m.index);
}
