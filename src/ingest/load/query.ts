/**
 * The SQL that reads one batch of same-shaped files (same format, compression, delimiter, header
 * and column names) with one DuckDB table function call over the file list, with explicit column
 * types (no type sniffing, no union by name: one shape per call is what makes it fast). Columns
 * are first read as DOUBLE by the CSV reader itself (the fast path; a cell that is not a number
 * then makes its row a CAST reject, and loadFiles.ts reads that file again with the column as
 * VARCHAR, where every cell is classified by the expression below).
 *
 * Every selected cell comes back as one DOUBLE encoding what the cell held (a column the CSV reader
 * parsed as DOUBLE is selected as it is, NULL for an empty cell, and `resultColumns` (duckdb.ts)
 * applies the same encoding while the numbers are copied out: measured, the SQL CASE on every cell cost
 * about 15% of DuckDB's time on the medium benchmark):
 *
 * | cell | value |
 * | --- | --- |
 * | a finite number | the number (DuckDB's correctly rounded parse) |
 * | empty, or spaces only | NaN |
 * | `nan`, `inf`, `-inf`, or a number beyond the double range | +Infinity |
 * | anything else (text) | -Infinity |
 *
 * `true` / `false` (any case) are read as 1 / 0 (for `correct` columns). The first column of the
 * result is the file's position in the batch (`file_index`); a `--seed-column` column comes back as
 * the 1-based position of its text in a list of the seeds found (0 for an empty cell); a
 * whitespace-separated batch adds a last column, 1 for a row whose number of fields is wrong.
 * Malformed rows of delimited files go to DuckDB's reject tables (`store_rejects`). Hive partitioning
 * is off: DuckDB would otherwise add a column for every `key=value` folder above a file, and one
 * named like a column of ours (`c0=5/`, `file_index=3/`) would replace it.
 */
import { sqlIdent, sqlPath, sqlString } from './duckdb.js';
import type { FileHeader } from '../plan/header.js';

/** Names of DuckDB's reject tables (temporary, per connection; dropped after each batch). */
export const REJECTS_TABLE = 'seedsift_rejects';
export const REJECTS_SCAN = 'seedsift_scans';
/** A delimiter that never occurs in a text log (ASCII unit separator): whitespace files are read one line per row. */
const LINE_DELIMITER = '\u001f';

const NUMERIC_TYPES =
  /^(TINYINT|SMALLINT|INTEGER|BIGINT|HUGEINT|UTINYINT|USMALLINT|UINTEGER|UBIGINT|UHUGEINT|FLOAT|DOUBLE|DECIMAL.*)$/;

/**
 * SQL for one cell encoded as in the module comment. `type` is the DuckDB type of the expression
 * (`VARCHAR` for text files). Pure. Example: `cellSql('"loss"', 'DOUBLE')` encodes a Parquet double column.
 */
export function cellSql(expr: string, type: string): string {
  if (NUMERIC_TYPES.test(type))
    return (
      `CASE WHEN ${expr} IS NULL THEN 'nan'::DOUBLE WHEN isfinite(${expr}::DOUBLE) THEN ${expr}::DOUBLE ` +
      `ELSE 'inf'::DOUBLE END`
    );
  if (type === 'BOOLEAN')
    return `CASE WHEN ${expr} IS NULL THEN 'nan'::DOUBLE WHEN ${expr} THEN 1::DOUBLE ELSE 0::DOUBLE END`;
  if (type !== 'VARCHAR') return `CASE WHEN ${expr} IS NULL THEN 'nan'::DOUBLE ELSE '-inf'::DOUBLE END`;
  const num = `TRY_CAST(${expr} AS DOUBLE)`;
  return (
    `CASE WHEN ${num} IS NOT NULL THEN (CASE WHEN isfinite(${num}) THEN ${num} ELSE 'inf'::DOUBLE END) ` +
    `WHEN ${expr} IS NULL OR regexp_full_match(${expr}, '\\s*') THEN 'nan'::DOUBLE ` +
    `WHEN lower(trim(${expr})) = 'true' THEN 1::DOUBLE WHEN lower(trim(${expr})) = 'false' THEN 0::DOUBLE ` +
    `ELSE '-inf'::DOUBLE END`
  );
}

/** What to select from a batch. */
export interface BatchSpec {
  readonly headers: readonly FileHeader[];
  /** Column indices (into the header's names) to return as encoded doubles, in this order. */
  readonly columns: readonly number[];
  /** `--seed-column` index and the seeds found in the batch, or null. */
  readonly seed: { readonly index: number; readonly values: readonly string[] } | null;
  /** Columns the CSV reader parses as DOUBLE (delimited text only); the others are VARCHAR. */
  readonly doubles: ReadonlySet<number>;
}

const NONE: ReadonlySet<number> = new Set();

function fileList(headers: readonly FileHeader[]): string {
  return `[${headers.map((h) => sqlPath(h.source.file)).join(', ')}]`;
}

/** The table function call that reads the batch with columns named c0, c1, ... (or `line`). */
function readCall(headers: readonly FileHeader[], doubles: ReadonlySet<number>): string {
  const first = headers[0] as FileHeader;
  if (first.text === null) return `read_parquet(${fileList(headers)}, hive_partitioning=false)`;
  const whitespace = first.text.delimiter === null;
  const columns = whitespace
    ? `{'line': 'VARCHAR'}`
    : `{${first.names.map((_, k) => `'c${k}': '${doubles.has(k) ? 'DOUBLE' : 'VARCHAR'}'`).join(', ')}}`;
  const delimiter = whitespace ? LINE_DELIMITER : (first.text.delimiter as string);
  const quote = whitespace ? `quote='', escape=''` : `quote='"', escape='"'`;
  return (
    `read_csv(${fileList(headers)}, header=${first.text.header}, skip=${first.text.skip}, ` +
    `delim=${sqlString(delimiter)}, ${quote}, columns=${columns}, ` +
    `auto_detect=false, hive_partitioning=false, compression=${first.source.gzip ? "'gzip'" : "'none'"}, ` +
    `store_rejects=true, ` +
    `rejects_table=${sqlString(REJECTS_TABLE)}, rejects_scan=${sqlString(REJECTS_SCAN)})`
  );
}

/** The expression for column k of the batch and its type. */
function column(first: FileHeader, k: number, doubles: ReadonlySet<number> = NONE): { expr: string; type: string } {
  if (first.text === null)
    return { expr: sqlIdent(first.names[k] as string), type: (first.parquetTypes as readonly string[])[k] as string };
  if (first.text.delimiter === null) return { expr: `p[${k + 1}]`, type: 'VARCHAR' };
  return { expr: `c${k}`, type: doubles.has(k) ? 'DOUBLE' : 'VARCHAR' };
}

/**
 * The query that reads a batch (see the module comment). Pure.
 * Example: for two CSV files with columns step, loss and `columns: [0, 1]` the query selects
 * `file_index` and the two encoded cells from `read_csv([...], header=true, delim=',', ...)`.
 */
export function batchSql(spec: BatchSpec): string {
  const first = spec.headers[0] as FileHeader;
  const select = ['file_index::DOUBLE'];
  const raw = rawColumns(spec);
  spec.columns.forEach((k, j) => {
    const c = column(first, k, spec.doubles);
    select.push(raw[j + 1] === true ? c.expr : cellSql(c.expr, c.type));
  });
  if (spec.seed !== null) {
    const c = column(first, spec.seed.index);
    const text = c.type === 'VARCHAR' ? c.expr : `${c.expr}::VARCHAR`;
    select.push(
      `COALESCE(list_position([${spec.seed.values.map(sqlString).join(', ')}]::VARCHAR[], trim(${text})), 0)::DOUBLE`,
    );
  }
  const whitespace = first.text !== null && first.text.delimiter === null;
  if (whitespace) {
    select.push(`(len(p) <> ${first.names.length})::DOUBLE`);
    return (
      `SELECT ${select.join(', ')} FROM (SELECT file_index, regexp_extract_all(line, '\\S+') AS p FROM ` +
      `${readCall(spec.headers, NONE)}) WHERE len(p) > 0`
    );
  }
  return `SELECT ${select.join(', ')} FROM ${readCall(spec.headers, spec.doubles)}`;
}

/**
 * Which columns of `batchSql`'s result are DOUBLE cells as the CSV reader parsed them (NULL for an
 * empty cell, NaN or an infinity for `nan`/`inf`), to be encoded by `resultColumns` as it copies them;
 * the others arrive encoded. Indexed like the result (file index first). Pure.
 * Example: a CSV batch with `columns: [0, 1]` and `doubles: {0, 1}` gives `[false, true, true]`.
 */
export function rawColumns(spec: BatchSpec): boolean[] {
  const first = spec.headers[0] as FileHeader;
  const delimited = first.text !== null && first.text.delimiter !== null;
  const out = [false, ...spec.columns.map((k) => delimited && spec.doubles.has(k))];
  if (spec.seed !== null) out.push(false);
  if (first.text !== null && first.text.delimiter === null) out.push(false);
  return out;
}

/**
 * The query listing the distinct seed texts of a batch's `--seed-column` (empty cells excluded),
 * sorted. Pure.
 */
export function seedValuesSql(headers: readonly FileHeader[], index: number): string {
  const first = headers[0] as FileHeader;
  const c = column(first, index);
  const text = c.type === 'VARCHAR' ? c.expr : `${c.expr}::VARCHAR`;
  const whitespace = first.text !== null && first.text.delimiter === null;
  const inner = whitespace
    ? `SELECT trim(${text}) AS seed FROM (SELECT regexp_extract_all(line, '\\S+') AS p FROM ` +
      `${readCall(headers, NONE)}) WHERE len(p) > 0`
    : `SELECT trim(${text}) AS seed FROM ${readCall(headers, NONE)}`;
  return `SELECT DISTINCT seed FROM (${inner}) WHERE seed IS NOT NULL AND seed <> '' ORDER BY seed`;
}

/** The query listing rejected rows of the last reads, with the file path of each. */
export const REJECTS_SQL =
  `SELECT s.file_path, e.line, e.column_name, e.error_type, e.error_message FROM ${REJECTS_TABLE} e ` +
  `JOIN ${REJECTS_SCAN} s ON e.scan_id = s.scan_id AND e.file_id = s.file_id ORDER BY s.file_path, e.line`;

/**
 * The query returning the given columns of one file as text (trimmed; NULL for an empty cell), in
 * the same rows and order as `batchSql` keeps (a whitespace file adds the malformed-row flag as a
 * last column, to be filtered the same way). For small tables (score tables). Pure.
 */
export function textSql(header: FileHeader, columns: readonly number[]): string {
  const select = columns.map((k) => {
    const c = column(header, k);
    return `NULLIF(trim(${c.type === 'VARCHAR' ? c.expr : `${c.expr}::VARCHAR`}), '')`;
  });
  if (header.text !== null && header.text.delimiter === null) {
    select.push(`(len(p) <> ${header.names.length})`);
    return (
      `SELECT ${select.join(', ')} FROM (SELECT regexp_extract_all(line, '\\S+') AS p FROM ` +
      `${readCall([header], NONE)}) WHERE len(p) > 0`
    );
  }
  return `SELECT ${select.join(', ')} FROM ${readCall([header], NONE)}`;
}
