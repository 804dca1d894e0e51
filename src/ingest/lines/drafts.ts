/**
 * Problems that point at rows. The policies find rows by their position among the rows DuckDB
 * returned; a user needs the line in the file. A `Draft` is a problem whose rows are still
 * positions; `finishDrafts` turns them into exact line numbers (lines/records.ts), re-reading only the
 * files that some problem points into, once each. Parquet files have no lines: their rows are
 * named `row N` (1-based) in the message and `line` is left out.
 */
import { problem, type Problem, type ProblemCode } from '../../problems.js';
import type { FileData } from '../load/loadFiles.js';
import { dataRowLines, fileBytes, scanRecords } from './records.js';

/**
 * A row of a read file: `row` = position among kept rows (FileData arrays), `dataRow` = position
 * among the rows DuckDB accepted, `record` = DuckDB's reject line number.
 */
export interface RowRef {
  readonly data: FileData;
  readonly kind: 'row' | 'dataRow' | 'record';
  readonly n: number;
}

/**
 * A problem whose rows are not yet line numbers. The first row's line becomes `line`; with several
 * rows the message gets ` (lines 3, 7)` appended, and rows without lines (Parquet) ` (row 4)`; a
 * rejected record that spans several lines (a quoted line break, a quote never closed) names them all.
 */
export interface Draft {
  readonly code: ProblemCode;
  readonly message: string;
  readonly file?: string;
  readonly run?: string;
  readonly rows?: readonly RowRef[];
}

/** Build a draft; `where` may name a file, a run and rows. Pure. */
export function draft(
  code: ProblemCode,
  message: string,
  where: { file?: string; run?: string; rows?: readonly RowRef[] } = {},
): Draft {
  const d: { -readonly [K in keyof Draft]: Draft[K] } = { code, message };
  if (where.file !== undefined) d.file = where.file;
  if (where.run !== undefined) d.run = where.run;
  if (where.rows !== undefined && where.rows.length > 0) d.rows = where.rows;
  return d;
}

/** Line of each data row and of each DuckDB record (where it starts and ends), for one text file. */
interface LineMap {
  readonly dataRow: Int32Array;
  readonly record: Int32Array;
  readonly recordEnd: Int32Array;
}

async function lineMap(data: FileData): Promise<LineMap | null> {
  const text = data.header.text;
  if (text === null) return null;
  try {
    const bytes = await fileBytes(data.header.source.file, data.header.source.gzip);
    const whitespace = text.delimiter === null;
    const records = scanRecords(bytes, { quoted: !whitespace, whitespace });
    const rejected = new Set(data.rejects.map((r) => r.record));
    return {
      dataRow: dataRowLines(records, text.header, rejected, text.skip),
      record: records.start,
      recordEnd: records.end,
    };
  } catch {
    return null; // the file changed or vanished since it was read: fall back to row numbers
  }
}

function dataRowOf(ref: RowRef): number {
  if (ref.kind !== 'row') return ref.n;
  return ref.data.rowIds === null ? ref.n : (ref.data.rowIds[ref.n] as number);
}

/**
 * Turn drafts into problems with exact lines (see the module comment). Cost: one read and scan of
 * each text file that a draft points into. Never throws.
 * Example: a draft of `step-invalid` pointing at row 0 of a CSV with a header gives `line: 2`.
 */
export async function finishDrafts(drafts: readonly Draft[]): Promise<Problem[]> {
  const maps = new Map<FileData, LineMap | null>();
  for (const d of drafts) for (const r of d.rows ?? []) if (!maps.has(r.data)) maps.set(r.data, await lineMap(r.data));
  return drafts.map((d) => {
    const rows = d.rows ?? [];
    const place = rows.map((r) => {
      const map = maps.get(r.data) ?? null;
      const line = map === null ? undefined : r.kind === 'record' ? map.record[r.n - 1] : map.dataRow[dataRowOf(r)];
      return line === undefined
        ? { line: undefined, text: r.kind === 'record' ? `record ${r.n}` : `row ${dataRowOf(r) + 1}` }
        : { line, text: String(line) };
    });
    let message = d.message;
    const lines = place.every((p) => p.line !== undefined);
    if (place.length > 1 || (place.length === 1 && !lines))
      message += ` (${lines ? 'lines ' : ''}${place.map((p) => p.text).join(', ')})`;
    // A rejected record that spans lines (a quote never closed swallows the lines after it): say so.
    const only = rows.length === 1 ? (rows[0] as RowRef) : null;
    const start = only?.kind === 'record' ? maps.get(only.data)?.record[only.n - 1] : undefined;
    const end = only?.kind === 'record' ? maps.get(only.data)?.recordEnd[only.n - 1] : undefined;
    if (start !== undefined && end !== undefined && end > start)
      message += ` (the rejected row spans lines ${start} to ${end})`;
    const where: { file?: string; line?: number; run?: string } = {};
    if (d.file !== undefined) where.file = d.file;
    else if (rows.length > 0) where.file = (rows[0] as RowRef).data.header.source.file;
    const first = place[0]?.line;
    if (first !== undefined) where.line = first;
    if (d.run !== undefined) where.run = d.run;
    return problem(d.code, message, where);
  });
}
