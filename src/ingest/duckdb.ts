/**
 * The embedded DuckDB engine as ingest uses it: one in-memory instance per `ingest` call (default
 * thread count), SQL literal quoting, and a fast path that copies DOUBLE/INTEGER result columns
 * straight into `Float64Array`s.
 *
 * Reading columns out (measured on this project's 500-run benchmark): the node API builds a JS
 * vector object per column per 2,048-row chunk, and that construction (a native call for the type,
 * the data buffer and the validity mask) costs far more than reading the numbers. So ingest asks
 * for as few columns as it can, materialises the result (`run`, then synchronous `getChunk`; a
 * streamed result fetched chunk by chunk was 2-3x slower in CPU time), and never returns NULL
 * (missing cells are encoded as non-finite doubles by `cellSql` in loadQuery.ts), because a
 * validity mask makes every `getItem` test a BigInt bit.
 */
import { DuckDBInstance, type DuckDBConnection, type DuckDBMaterializedResult } from '@duckdb/node-api';

/** An open engine: the instance and its one connection. */
export interface Engine {
  readonly instance: DuckDBInstance;
  readonly connection: DuckDBConnection;
}

/**
 * Open an in-memory DuckDB instance with one connection (threads: DuckDB's default, one per core).
 * Cost: a few milliseconds. Throws what DuckDB throws if the native library cannot load.
 * Example: `const engine = await openEngine(); ...; closeEngine(engine);`
 */
export async function openEngine(): Promise<Engine> {
  const instance = await DuckDBInstance.create(':memory:');
  const connection = await instance.connect();
  return { instance, connection };
}

/**
 * Close the connection and the instance (their memory is released now, not at garbage
 * collection). Example: `closeEngine(engine)`.
 */
export function closeEngine(engine: Engine): void {
  engine.connection.closeSync();
  engine.instance.closeSync();
}

/**
 * A SQL string literal: the text in single quotes, inner quotes doubled. Pure, O(length).
 * Example: `sqlString("it's")` is `'it''s'`.
 */
export function sqlString(text: string): string {
  return `'${text.replaceAll("'", "''")}'`;
}

/**
 * A file path as a SQL string literal for DuckDB's readers, its glob characters made literal
 * (`*` as `[*]`, `?` as `[?]`, `[` as `[[]`): DuckDB expands globs in every path it reads, so a
 * file named `log?.csv` would also read `logX.csv` beside it, and the rows of a batch would be
 * given to the wrong files. Pure, O(length). Example: `sqlPath('runs/log[1].csv')` is `'runs/log[[]1].csv'`.
 */
export function sqlPath(path: string): string {
  return sqlString(path.replace(/[[*?]/g, (c) => `[${c}]`));
}

/**
 * A SQL identifier: the name in double quotes, inner double quotes doubled. Pure, O(length).
 * Example: `sqlIdent('val"acc')` is `"val""acc"`.
 */
export function sqlIdent(name: string): string {
  return `"${name.replaceAll('"', '""')}"`;
}

/**
 * Copy every column of a materialised result into its own `Float64Array` (one value per row, in
 * result order). Columns must be numeric (DOUBLE, INTEGER, ...); a NULL becomes NaN, but the
 * queries of ingest never return NULL (see the module comment). Cost: O(rows x columns) plus one
 * vector object per column per chunk. Example: for `SELECT 1::DOUBLE, 2::INTEGER` the result is
 * `[Float64Array [1], Float64Array [2]]`.
 */
export function resultColumns(result: DuckDBMaterializedResult): Float64Array[] {
  const rows = result.rowCount;
  const columns = Array.from({ length: result.columnCount }, () => new Float64Array(rows));
  const chunks = result.chunkCount;
  let offset = 0;
  for (let k = 0; k < chunks; k++) {
    const chunk = result.getChunk(k);
    const count = chunk.rowCount;
    for (let j = 0; j < columns.length; j++) {
      const vector = chunk.getColumnVector(j);
      const out = columns[j] as Float64Array;
      for (let i = 0; i < count; i++) {
        const value = vector.getItem(i);
        out[offset + i] = typeof value === 'number' ? value : value === null ? NaN : Number(value);
      }
    }
    offset += count;
  }
  return columns;
}
