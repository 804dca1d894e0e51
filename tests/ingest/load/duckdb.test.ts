import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  closeEngine,
  openEngine,
  resultColumns,
  sqlIdent,
  sqlString,
  type Engine,
} from '../../../src/ingest/load/duckdb.js';
import { cellSql } from '../../../src/ingest/load/query.js';

let engine: Engine;
beforeAll(async () => {
  engine = await openEngine();
});
afterAll(() => closeEngine(engine));

describe('sqlString and sqlIdent', () => {
  it('quote and double inner quotes (SQL standard), so DuckDB reads the text back unchanged', async () => {
    expect(sqlString("it's")).toBe("'it''s'");
    expect(sqlIdent('a"b')).toBe('"a""b"');
    const reader = await engine.connection.runAndReadAll(
      `SELECT ${sqlString("runs/it's/seed=1.csv")} AS ${sqlIdent('odd "name"')}`,
    );
    expect(reader.getRowObjectsJS()).toEqual([{ 'odd "name"': "runs/it's/seed=1.csv" }]);
  });
});

describe('resultColumns', () => {
  it('copies numeric columns into Float64Arrays, NULL as NaN', async () => {
    const result = await engine.connection.run(
      'SELECT range::DOUBLE / 4, (range * 2)::INTEGER, CASE WHEN range = 1 THEN NULL ELSE 1.5 END FROM range(3)',
    );
    expect(resultColumns(result).map((c) => Array.from(c))).toEqual([
      [0, 0.25, 0.5],
      [0, 2, 4],
      [1.5, NaN, 1.5],
    ]);
  });
  it('spans chunks (DuckDB returns 2,048 rows per chunk)', async () => {
    const result = await engine.connection.run('SELECT range::DOUBLE FROM range(5000)');
    const [col] = resultColumns(result);
    expect(col?.length).toBe(5000);
    expect(col?.[4999]).toBe(4999);
    expect(col?.[2048]).toBe(2048);
  });
  it(
    'reads DOUBLE columns from the chunk buffers exactly as the node API reads them, NULLs at any bit of the mask ' +
      'as NaN',
    async () => {
      const sql =
        'SELECT CASE WHEN range % 7 = 3 OR range IN (63, 64, 2047, 2048) THEN NULL ' +
        'ELSE range::DOUBLE * 0.1 - 1e300 * (range = 5)::DOUBLE END, (range % 3)::DOUBLE FROM range(5000)';
      const [a, b] = resultColumns(await engine.connection.run(sql));
      const rows = (await engine.connection.runAndReadAll(sql)).getRows();
      expect(a?.length).toBe(5000);
      rows.forEach((row, i) => {
        expect(Object.is(a?.[i], row[0] === null ? NaN : row[0])).toBe(true);
        expect(b?.[i]).toBe(row[1]);
      });
      expect(Number.isNaN(a?.[63])).toBe(true);
      expect(a?.[62]).toBe(62 * 0.1);
    },
  );
  it('encodes DOUBLE cells on request exactly as cellSql does in SQL (NULL as NaN, nan/inf as +Infinity)', async () => {
    const values =
      `(VALUES (0, 1.5::DOUBLE), (1, NULL), (2, 'nan'::DOUBLE), (3, 'inf'::DOUBLE), (4, ` +
      `'-inf'::DOUBLE), (5, -0.0::DOUBLE), (6, 1e308::DOUBLE)) t(i, x)`;
    const [raw] = resultColumns(await engine.connection.run(`SELECT x FROM ${values} ORDER BY i`), [true]);
    const [sql] = resultColumns(
      await engine.connection.run(`SELECT ${cellSql('x', 'DOUBLE')} FROM ${values} ORDER BY i`),
    );
    expect(Array.from(raw ?? [])).toEqual([1.5, NaN, Infinity, Infinity, Infinity, -0, 1e308]);
    expect(Array.from(raw ?? [])).toEqual(Array.from(sql ?? []));
  });
});
