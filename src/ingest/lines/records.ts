/**
 * Exact line numbers for text logs. DuckDB returns the accepted rows of a file in order but not
 * their line numbers, and its reject table numbers *records* (a blank line is a record; a quoted
 * field spanning several lines makes one record), not lines. This file re-reads a file's bytes
 * and finds where every record starts, so that
 *
 * - DuckDB's reject line r is physical line `start[r - 1]`, and
 * - accepted data row i is the i-th record that is not the header, not blank and not rejected.
 *
 * DuckDB's rules mirrored here (checked against DuckDB 1.5 in tests/ingest/loadLines.test.ts):
 * records end at `\n`, `\r\n` or `\r` outside double quotes; with a delimiter, a record of zero
 * length is skipped and one of spaces only is rejected (so it is in the reject table); in
 * whitespace mode (no quoting) ingest itself skips records of whitespace only. Used only for files
 * that have something to report, so clean files are never read twice.
 */
import { readFile } from 'node:fs/promises';
import { gunzipSync } from 'node:zlib';

/** Where each record of a text file starts, and which records are blank. */
export interface Records {
  /** 1-based physical line on which record k starts (record k is DuckDB's line k + 1). */
  readonly start: Int32Array;
  /**
   * 1-based physical line on which record k ends (after `start` when a quoted field holds line breaks, or a quote is
   * never closed).
   */
  readonly end: Int32Array;
  /** 1 when record k is blank: zero length (delimited) or whitespace only (whitespace mode). */
  readonly blank: Uint8Array;
}

const LF = 0x0a;
const CR = 0x0d;
const QUOTE = 0x22;

function isSpace(b: number): boolean {
  return b === 0x20 || b === 0x09 || b === 0x0b || b === 0x0c;
}

/**
 * Find the records of a text file (see the module comment). `quoted`: double quotes group a field
 * (delimited files); false in whitespace mode. Pure, O(bytes).
 * Example: for `'a\n"x\ny"\n\nb\n'` with quoting, the starts are `[1, 2, 4, 5]`, the ends `[1, 3, 4, 5]`
 * and only record 2 is blank.
 */
export function scanRecords(bytes: Uint8Array, options: { quoted: boolean; whitespace: boolean }): Records {
  const starts: number[] = [];
  const ends: number[] = [];
  const blanks: number[] = [];
  const n = bytes.length;
  let line = 1;
  let i = 0;
  while (i < n) {
    const startLine = line;
    let quoted = false;
    let length = 0;
    let visible = 0;
    let endLine = line;
    while (i < n) {
      const b = bytes[i] as number;
      if (b === LF || b === CR) {
        if (b === CR && bytes[i + 1] === LF) i++;
        endLine = line;
        line++;
        i++;
        if (!quoted) break;
        length++;
        visible++;
        continue;
      }
      if (options.quoted && b === QUOTE) quoted = !quoted;
      endLine = line;
      length++;
      if (!isSpace(b)) visible++;
      i++;
    }
    starts.push(startLine);
    ends.push(endLine);
    blanks.push(options.whitespace ? (visible === 0 ? 1 : 0) : length === 0 ? 1 : 0);
  }
  return { start: Int32Array.from(starts), end: Int32Array.from(ends), blank: Uint8Array.from(blanks) };
}

/**
 * Physical line of every accepted data row: records after the `skip` leading blank lines and the
 * header (record `skip` when `header`), neither blank nor rejected (`rejected` holds DuckDB's
 * reject line numbers, i.e. record k + 1: DuckDB numbers lines from the start of the file, skipped
 * lines included).
 * Pure, O(records). Example: records starting at lines [1, 2, 3, 4] with record 3 (line 3) blank
 * and DuckDB line 2 rejected give `[4]`.
 */
export function dataRowLines(records: Records, header: boolean, rejected: ReadonlySet<number>, skip = 0): Int32Array {
  const out: number[] = [];
  for (let k = skip + (header ? 1 : 0); k < records.start.length; k++) {
    if (records.blank[k] === 1 || rejected.has(k + 1)) continue;
    out.push(records.start[k] as number);
  }
  return Int32Array.from(out);
}

/**
 * The whole content of a file, decompressed when gzipped. Throws what the file system or zlib
 * throws. Cost: the file's size in memory. Example: `await fileBytes('log.csv.gz', true)`.
 */
export async function fileBytes(file: string, gzip: boolean): Promise<Uint8Array> {
  const raw = await readFile(file);
  return gzip ? gunzipSync(raw) : raw;
}
