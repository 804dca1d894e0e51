/**
 * Read what a log file says about its own shape before its rows are read: the column names (the
 * header line, or `--columns` for a headerless file), the delimiter of a text file (`.csv` is
 * `,`, `.tsv` tab, `.txt` sniffed by plan/sniff.ts) and, for Parquet, the column types.
 *
 * Only the head of a text file is read (64 KiB, more only if the header line is longer); a
 * gzipped file is decompressed just that far. A file that cannot be opened or decompressed is
 * `file-unreadable`; one with no line that is not blank is `file-empty` (a header without rows is
 * found to be empty later, when its rows are counted). Also `file-unreadable`: a first line with a
 * NUL byte (binary data, not text), a first line of more than `MAX_COLUMNS` fields, and a gzip
 * file that is truncated or damaged (gzipDamage.ts: checked in full, since DuckDB would read it up
 * to the damage without a word).
 *
 * Blank lines (empty or spaces only) before the header are skipped (`TextFormat.skip`, DuckDB's
 * `skip`); line numbers in problems still count them.
 *
 * Headerless files: with `--columns a,b,c`, a text file whose first line is exactly those names
 * is read with that line as its header; any other text file is read as headerless with those names.
 */
import { open, stat } from 'node:fs/promises';
import { constants, gunzipSync } from 'node:zlib';
import { sqlPath, type Engine } from '../load/duckdb.js';
import { gzipDamage } from './gzipDamage.js';
import { sniffDelimiter, whitespaceFields } from './sniff.js';
import type { RunSource } from '../types.js';

/** How to read a text file. */
export interface TextFormat {
  /** One-character delimiter, or null for runs of whitespace. */
  readonly delimiter: string | null;
  /** The first line that is not blank is a header (skipped as data). */
  readonly header: boolean;
  /** Blank lines (empty or spaces only) before the header or the first data line, skipped unread. */
  readonly skip: number;
}

/** A file's shape, read from its head. */
export interface FileHeader {
  readonly source: RunSource;
  /**
   * Column names as the file gives them (or `--columns`), before duplicates are renamed; empty names become `columnK`
   * (K from 1).
   */
  readonly names: readonly string[];
  /** DuckDB type of each column of a Parquet file; null for text. */
  readonly parquetTypes: readonly string[] | null;
  /** Null for Parquet. */
  readonly text: TextFormat | null;
  /** Size on disk in bytes. */
  readonly bytes: number;
  /**
   * Text files: columns with a cell that is not a number among the first lines (a hint for the reader's column types).
   */
  readonly textLike: readonly number[];
}

/** A header, or why there is none. */
export type HeaderResult =
  | { readonly ok: true; readonly header: FileHeader }
  | { readonly ok: false; readonly code: 'file-unreadable' | 'file-empty'; readonly reason: string };

const HEAD_BYTES = 65536;
const MAX_HEAD_BYTES = 16 * 1024 * 1024;
/**
 * Most columns a text log may have. DuckDB's time grows with the number of columns (measured: about
 * 1 s per 1,000 columns), so a file written without line breaks (a 5 MB first line of 600,000
 * fields) would hold ingest for minutes; a per-step log with more than this many columns is not
 * plausible. Such a file is `file-unreadable` with the count.
 */
export const MAX_COLUMNS = 10000;

/** Split one line on a one-character delimiter, double-quoted fields unquoted (`""` inside is `"`). */
function splitFields(line: string, char: string): string[] {
  const fields: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const c = line[i] as string;
    if (c === '"') {
      if (quoted && line[i + 1] === '"') {
        field += '"';
        i++;
      } else quoted = !quoted;
    } else if (c === char && !quoted) {
      fields.push(field);
      field = '';
    } else field += c;
  }
  fields.push(field);
  return fields;
}

/** Read the first bytes of a file (decompressed), growing until a line break or the end. */
async function readHead(file: string, gzip: boolean): Promise<{ text: string; complete: boolean }> {
  const handle = await open(file, 'r');
  try {
    for (let size = HEAD_BYTES; ; size *= 4) {
      const buffer = Buffer.alloc(size);
      const { bytesRead } = await handle.read(buffer, 0, size, 0);
      const complete = bytesRead < size;
      let bytes = buffer.subarray(0, bytesRead);
      if (gzip) bytes = gunzipSync(bytes, { finishFlush: constants.Z_SYNC_FLUSH });
      const text = bytes.toString('utf8');
      if (complete || /[\r\n]/.test(text) || size >= MAX_HEAD_BYTES) return { text, complete };
    }
  } finally {
    await handle.close();
  }
}

function reasonOf(error: unknown): string {
  const e = error as { code?: string; message?: string };
  if (e.code === 'Z_DATA_ERROR' || e.code === 'Z_BUF_ERROR') return 'not a valid gzip file';
  const first = String(e.message ?? error).split('\n')[0] as string;
  return first;
}

/** A cell that DuckDB will read as a number (or nan/inf), for the text-column hint. */
const NUMBER = /^\s*[+-]?(\d[\d_]*\.?\d*([eE][+-]?\d+)?|\.\d+([eE][+-]?\d+)?|nan|inf|infinity)\s*$/i;

/** Name empty header fields `columnK` (K = 1-based position). */
function nameColumns(names: readonly string[]): string[] {
  return names.map((n, k) => (n.trim() === '' ? `column${k + 1}` : n.trim()));
}

/**
 * The shape of one text file from its first lines. Pure. `format` decides the delimiter (`csv`
 * comma, `tsv` tab, `txt` sniffed). Returns null when there is no line that is not blank.
 * Example: `textHeader(['step;loss', '1;0.5'], 'txt', null)` gives names `['step', 'loss']`, delimiter `;`.
 */
export function textHeader(
  lines: readonly string[],
  format: 'csv' | 'tsv' | 'txt',
  columns: readonly string[] | null,
): { names: string[]; text: TextFormat; textLike: number[] } | null {
  const nonBlank = lines.filter((l) => l.trim().length > 0);
  if (nonBlank.length === 0) return null;
  const delimiter = format === 'csv' ? ',' : format === 'tsv' ? '\t' : sniffDelimiter(nonBlank.slice(0, 50)).char;
  const split = (line: string): string[] =>
    delimiter === null ? whitespaceFields(line) : splitFields(line, delimiter);
  const skip = lines.findIndex((l) => l.trim().length > 0);
  const fields = split(lines[skip] as string);
  const header =
    columns === null || (fields.length === columns.length && fields.every((f, k) => f.trim() === columns[k]));
  const names = columns === null ? nameColumns(fields) : [...columns];
  const textLike = new Set<number>();
  for (const line of lines
    .slice(header ? skip + 1 : skip)
    .filter((l) => l.trim().length > 0)
    .slice(0, 50)) {
    split(line).forEach((cell, k) => {
      if (k < names.length && cell.trim() !== '' && !NUMBER.test(cell)) textLike.add(k);
    });
  }
  return { names, text: { delimiter, header, skip }, textLike: [...textLike].sort((a, b) => a - b) };
}

/**
 * Read a file's header (see the module comment). Text files are read with Node (head only);
 * Parquet files are described by DuckDB. Never throws: failures are returned as
 * `file-unreadable` or `file-empty` with the reason. Cost: one small read per file, plus one full
 * streamed decompression of a gzipped one.
 * Example: for `runs/seed=1/log.csv` starting `step,loss` the names are `['step', 'loss']`.
 */
export async function readHeader(
  source: RunSource,
  columns: readonly string[] | null,
  engine: Engine,
): Promise<HeaderResult> {
  let bytes: number;
  try {
    bytes = (await stat(source.file)).size;
  } catch (error) {
    return { ok: false, code: 'file-unreadable', reason: reasonOf(error) };
  }
  if (source.format === 'parquet') {
    try {
      const reader = await engine.connection.runAndReadAll(
        `DESCRIBE SELECT * FROM read_parquet(${sqlPath(source.file)}, hive_partitioning=false)`,
      );
      const rows = reader.getRowsJS();
      const names = nameColumns(rows.map((r) => String(r[0])));
      return {
        ok: true,
        header: { source, names, parquetTypes: rows.map((r) => String(r[1])), text: null, bytes, textLike: [] },
      };
    } catch (error) {
      return { ok: false, code: 'file-unreadable', reason: reasonOf(error) };
    }
  }
  let head: { text: string; complete: boolean };
  try {
    head = await readHead(source.file, source.gzip);
  } catch (error) {
    return { ok: false, code: 'file-unreadable', reason: reasonOf(error) };
  }
  const text = head.text.startsWith('\uFEFF') ? head.text.slice(1) : head.text;
  const lines = text.split(/\r\n|\n|\r/);
  if (!head.complete && lines.length > 1) lines.pop();
  if ((lines[0] as string).includes('\u0000'))
    return { ok: false, code: 'file-unreadable', reason: 'binary data (a NUL byte on the first line), not a text log' };
  const parsed = textHeader(lines, source.format, columns);
  if (parsed === null)
    return {
      ok: false,
      code: 'file-empty',
      reason: bytes === 0 ? 'the file is empty (0 bytes)' : 'the file has only blank lines',
    };
  if (parsed.names.length > MAX_COLUMNS) {
    return {
      ok: false,
      code: 'file-unreadable',
      reason:
        `its first line has ${parsed.names.length} fields (more than ${MAX_COLUMNS}), so it is not read as a ` +
        `per-step log (rows written without line breaks?)`,
    };
  }
  if (source.gzip) {
    const damage = await gzipDamage(source.file);
    if (damage !== null) return { ok: false, code: 'file-unreadable', reason: damage };
  }
  return {
    ok: true,
    header: { source, names: parsed.names, parquetTypes: null, text: parsed.text, bytes, textLike: parsed.textLike },
  };
}
