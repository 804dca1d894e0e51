/**
 * `--manifest FILE`: a small table naming each run's file, its seed and its parameters, for logs
 * whose paths say nothing. One row per file; a `file` column (relative to the manifest's folder,
 * or absolute), a `seed` column, and any other columns are config parameters (`_`-prefixed columns
 * are information, as with --layout). `file` and `seed` are recognised in any letter case.
 *
 * Format: CSV (comma), or tab-separated when the manifest's name ends in `.tsv`; a header row;
 * cells trimmed; empty lines ignored; a UTF-8 byte-order mark allowed. An empty parameter cell
 * means "no value": the key is left out of that row's params. An empty or absent seed leaves the
 * seed to `locate` (a `seed-missing` problem). The manifest is small, so csv-parse reads it whole.
 */
import { readFile, realpath, stat } from 'node:fs/promises';
import { dirname, isAbsolute, join, normalize, relative, resolve, sep } from 'node:path';
import { parse } from 'csv-parse/sync';
import { problem, SeedsiftError, type Problem } from '../../problems.js';
import { fileFormat } from './fileFormat.js';
import type { FileRecord } from '../types.js';
import { skippedFile } from './walk.js';

/** One usable row of a manifest. */
export interface ManifestRow {
  /** Path as seedsift opens it (the manifest's folder joined with the `file` cell). */
  readonly file: string;
  /** `/`-separated path relative to the manifest's folder. */
  readonly relPath: string;
  readonly realPath: string;
  /** 1-based line of the row in the manifest (the line where the row ends, for a quoted multi-line cell). */
  readonly line: number;
  readonly seed: string | null;
  readonly params: Readonly<Record<string, string>>;
  readonly info: Readonly<Record<string, string>>;
}

interface Parsed {
  readonly record: string[];
  readonly info: { readonly lines: number };
}

function toSlashes(p: string): string {
  return p.split(sep).join('/');
}

/**
 * Read a manifest. Returns its usable rows in file order, FileRecords for rows whose file is
 * missing or not a log file, and a problem for each such row. Cost: one read of the manifest, one
 * `stat` per row. Throws SeedsiftError('usage') when the manifest does not exist, and
 * SeedsiftError('input') (with the line) when it cannot be parsed as CSV, is empty, has no `file`
 * column, or has an empty or repeated column name.
 * Example: a manifest `file,seed,ticks` / `a.csv,1,8` gives one row
 * `{ relPath: 'a.csv', seed: '1', params: { ticks: '8' } }`.
 */
export async function readManifest(
  manifest: string,
): Promise<{ rows: ManifestRow[]; skipped: FileRecord[]; problems: Problem[] }> {
  let text: string;
  try {
    text = await readFile(manifest, 'utf8');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code ?? String(error);
    const what = code === 'ENOENT' ? 'no such file' : `a file that cannot be read (${code})`;
    throw new SeedsiftError('usage', `--manifest: expected a CSV table of runs, got ${what}`, { file: manifest });
  }
  let parsed: Parsed[];
  try {
    parsed = parse(text, {
      bom: true,
      delimiter: manifest.toLowerCase().endsWith('.tsv') ? '\t' : ',',
      info: true,
      relax_column_count: true,
      skip_empty_lines: true,
      trim: true,
    }) as unknown as Parsed[];
  } catch (error) {
    const line = (error as { lines?: number }).lines;
    throw new SeedsiftError(
      'input',
      `manifest: not a readable CSV table (${(error as Error).message})`,
      line === undefined ? { file: manifest } : { file: manifest, line },
    );
  }
  const header = parsed[0];
  if (header === undefined)
    throw new SeedsiftError('input', 'manifest: expected a header row with a file column, got an empty file', {
      file: manifest,
      line: 1,
    });
  const names = header.record;
  const where = { file: manifest, line: header.info.lines };
  names.forEach((name, k) => {
    if (name === '')
      throw new SeedsiftError(
        'input',
        `manifest: expected a name for every column, got an empty name for column ${k + 1}`,
        where,
      );
    if (names.indexOf(name) !== k)
      throw new SeedsiftError('input', `manifest: expected each column once, got ${name} twice`, where);
  });
  const fileColumn = names.findIndex((n) => n.toLowerCase() === 'file');
  const seedColumn = names.findIndex((n) => n.toLowerCase() === 'seed');
  if (fileColumn < 0)
    throw new SeedsiftError('input', `manifest: expected a column named file, got columns ${names.join(', ')}`, where);

  const folder = dirname(manifest);
  const rows: ManifestRow[] = [];
  const skipped: FileRecord[] = [];
  const problems: Problem[] = [];
  for (const { record, info } of parsed.slice(1)) {
    const line = info.lines;
    if (record.length !== names.length) {
      problems.push(
        problem(
          'manifest-invalid',
          `manifest row: expected ${names.length} cells, got ${record.length}; row not used`,
          { file: manifest, line },
        ),
      );
      continue;
    }
    const cell = record[fileColumn] as string;
    if (cell === '') {
      problems.push(
        problem('manifest-invalid', 'manifest row: expected a file name, got an empty file cell; row not used', {
          file: manifest,
          line,
        }),
      );
      continue;
    }
    const file = isAbsolute(cell) ? cell : join(folder, cell);
    const relPath = toSlashes(isAbsolute(cell) ? relative(resolve(folder), cell) : normalize(cell));
    let isFile = false;
    try {
      isFile = (await stat(file)).isFile();
    } catch {
      isFile = false;
    }
    if (!isFile) {
      skipped.push(skippedFile(file, 'unreadable'));
      problems.push(
        problem('manifest-file-missing', `manifest names ${cell}, but there is no such file (looked for ${file})`, {
          file: manifest,
          line,
        }),
      );
      continue;
    }
    if (fileFormat(file) === null) {
      skipped.push(skippedFile(file, 'skipped'));
      problems.push(
        problem(
          'file-skipped',
          `manifest names ${cell}, which is not a log file (.csv, .tsv, .txt, .parquet, optionally .gz); not read`,
          { file: manifest, line },
        ),
      );
      continue;
    }
    const params: Record<string, string> = {};
    const infoFields: Record<string, string> = {};
    names.forEach((name, k) => {
      const value = record[k] as string;
      if (k === fileColumn || k === seedColumn || value === '') return;
      if (name.startsWith('_')) infoFields[name] = value;
      else params[name] = value;
    });
    const seedCell = seedColumn < 0 ? '' : (record[seedColumn] as string);
    rows.push({
      file,
      relPath,
      realPath: await realpath(file),
      line,
      seed: seedCell === '' ? null : seedCell,
      params,
      info: infoFields,
    });
  }
  return { rows, skipped, problems };
}
