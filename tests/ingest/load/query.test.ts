import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeEngine, openEngine, resultColumns, sqlString, type Engine } from '../../../src/ingest/load/duckdb.js';
import { cellSql } from '../../../src/ingest/load/query.js';

// The encoding table of src/ingest/load/query.ts (finite -> the number, empty -> NaN,
// nan/inf -> +Infinity, text -> -Infinity), evaluated by DuckDB itself.
let engine: Engine;
beforeAll(async () => {
  engine = await openEngine();
});
afterAll(() => closeEngine(engine));

async function encode(values: readonly (string | null)[], type = 'VARCHAR'): Promise<number[]> {
  const list = values.map((v) => (v === null ? 'NULL' : sqlString(v))).join(', ');
  const result = await engine.connection.run(
    `SELECT ${cellSql('x', type)} FROM (SELECT unnest([${list}]::${type}[]) AS x, ` +
      `generate_subscripts([${list}]::${type}[], 1) AS i) ORDER BY i`,
  );
  return Array.from(resultColumns(result)[0] as Float64Array);
}

describe('cellSql', () => {
  it('VARCHAR cells', async () => {
    const cells = [
      '0.5',
      '',
      null,
      '  ',
      'nan',
      'NaN',
      'inf',
      '-inf',
      '1e999',
      'abc',
      'TRUE',
      'false',
      ' 2.5 ',
      '-0',
      '1e-320',
    ];
    expect(await encode(cells)).toEqual([
      0.5,
      NaN,
      NaN,
      NaN,
      Infinity,
      Infinity,
      Infinity,
      Infinity,
      Infinity,
      -Infinity,
      1,
      0,
      2.5,
      -0,
      1e-320,
    ]);
  });
  it('DOUBLE cells (Parquet, or the CSV fast path)', async () => {
    expect(await encode(['1.5', null, 'nan', '-inf'], 'DOUBLE')).toEqual([1.5, NaN, Infinity, Infinity]);
  });
  it('BOOLEAN cells are 1/0; other types are not numbers', async () => {
    expect(await encode(['true', 'false', null], 'BOOLEAN')).toEqual([1, 0, NaN]);
    expect(await encode(['2024-01-01', null], 'DATE')).toEqual([-Infinity, NaN]);
  });
});
