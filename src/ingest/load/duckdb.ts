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
 * (missing cells are encoded as non-finite doubles by `cellSql` in load/query.ts), because a
 * validity mask makes every `getItem` test a BigInt bit. DOUBLE columns are not read item by item
 * at all: `resultColumns` copies each chunk's data buffer in one call through DuckDB's C API
 * (`@duckdb/node-bindings`, the layer under the node API), about 5x faster than `getItem`.
 */
import { DuckDBInstance, DuckDBTypeId, type DuckDBConnection, type DuckDBMaterializedResult } from '@duckdb/node-api';
import bindings from '@duckdb/node-bindings';
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';

/** An open engine: the instance, its one connection, and the garbage collection it forces (`releaseResults`). */
export interface Engine {
  readonly instance: DuckDBInstance;
  readonly connection: DuckDBConnection;
  /** A full collection of the JavaScript heap (V8's `gc`, enabled at the first call). */
  readonly collect: () => void;
}

/**
 * Open an in-memory DuckDB instance with one connection (threads: DuckDB's default, one per core).
 * DuckDB's allocator keeps up to 128 MB of freed memory before handing it back; a lower threshold
 * (`allocator_flush_threshold` and `allocator_bulk_deallocation_flush_threshold` at 32 MB) lowered
 * the medium benchmark's peak from about 330 to 250 MiB but cost 0.2-0.25 s of CPU (about 7%) in
 * A/B runs in turns, so the default is kept: the time is what a user waits for.
 * Cost: a few milliseconds. Throws what DuckDB throws if the native library cannot load.
 * Example: `const engine = await openEngine(); ...; closeEngine(engine);`
 */
export async function openEngine(): Promise<Engine> {
  const instance = await DuckDBInstance.create(':memory:');
  const connection = await instance.connect();
  let gc: (() => void) | null = null;
  const collect = (): void => {
    if (gc === null) {
      setFlagsFromString('--expose-gc');
      gc = runInNewContext('gc') as () => void;
    }
    gc();
  };
  return { instance, connection, collect };
}

/**
 * Free the native memory of the DuckDB results that are no longer referenced. The node API
 * releases a result's memory only when its JavaScript object is garbage collected, and V8 does not
 * count that memory, so it would not hurry: read in batches, the results of every batch stayed
 * resident together (about 45 MB more peak memory on the medium benchmark). Ingest calls this after
 * each batch; it runs a full collection of the JavaScript heap (V8's `gc`, enabled at the first
 * call, one per engine), a few milliseconds while that heap holds only typed arrays.
 * Example: `releaseResults(engine)`.
 */
export function releaseResults(engine: Engine): void {
  engine.collect();
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
 * queries of ingest never return NULL (see the module comment). DOUBLE columns are copied a chunk
 * at a time from DuckDB's buffer (NULLs then set to NaN from the validity mask); other numeric
 * types go value by value. A DOUBLE column j with `encode[j]` true gets the cell encoding of
 * load/query.ts on the way: NaN and the infinities become +Infinity, then NULLs become NaN (for
 * cells the CSV reader parsed as DOUBLE: `nan`/`inf` cells, and empty ones).
 * Cost: O(rows x columns) plus one vector per column per chunk.
 * Example: for `SELECT 1::DOUBLE, 2::INTEGER` the result is `[Float64Array [1], Float64Array [2]]`.
 */
export function resultColumns(result: DuckDBMaterializedResult, encode: readonly boolean[] = []): Float64Array[] {
  const rows = result.rowCount;
  const columns = Array.from({ length: result.columnCount }, () => new Float64Array(rows));
  const isDouble = columns.map((_, j) => result.columnTypeId(j) === DuckDBTypeId.DOUBLE);
  const chunks = result.chunkCount;
  let offset = 0;
  for (let k = 0; k < chunks; k++) {
    const chunk = result.getChunk(k);
    const count = chunk.rowCount;
    for (let j = 0; j < columns.length; j++) {
      const out = columns[j] as Float64Array;
      if (isDouble[j] === true) {
        copyDoubles(bindings.data_chunk_get_vector(chunk.chunk, j), count, out, offset, encode[j] === true);
        continue;
      }
      const vector = chunk.getColumnVector(j);
      for (let i = 0; i < count; i++) {
        const value = vector.getItem(i);
        out[offset + i] = typeof value === 'number' ? value : value === null ? NaN : Number(value);
      }
    }
    offset += count;
  }
  return columns;
}

/**
 * Copy `count` doubles of a DOUBLE vector into `out` at `offset`, NULLs as NaN. DuckDB's validity
 * mask is an array of 64-bit words, bit i of the mask set when row i is valid (absent when every
 * row is valid); read here byte by byte (little-endian, as on every platform DuckDB ships for).
 */
function copyDoubles(vector: bindings.Vector, count: number, out: Float64Array, offset: number, encode: boolean): void {
  const bytes = bindings.vector_get_data(vector, count * Float64Array.BYTES_PER_ELEMENT);
  out.set(new Float64Array(bytes.buffer, bytes.byteOffset, count), offset);
  if (encode) {
    for (let i = offset; i < offset + count; i++) {
      const v = out[i] as number;
      if (v - v !== 0) out[i] = Infinity;
    }
  }
  const validity = bindings.vector_get_validity(vector, Math.ceil(count / 64) * 8);
  if (!validity) return;
  // Byte by byte: a byte of all ones is 8 valid rows (the common case), skipped at once.
  for (let byte = 0; byte * 8 < count; byte++) {
    const bits = validity[byte] as number;
    if (bits === 0xff) continue;
    for (let i = byte * 8; i < Math.min(count, byte * 8 + 8); i++)
      if (((bits >> (i & 7)) & 1) === 0) out[offset + i] = NaN;
  }
}
