import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeEngine, openEngine, resultColumns, sqlIdent, sqlString, type Engine } from '../../src/ingest/duckdb.js';

let engine: Engine;
beforeAll(async () => {
  engine = await openEngine();
});
afterAll(() => closeEngine(engine));

describe('sqlString and sqlIdent', () => {
  it('quote and double inner quotes (SQL standard), so DuckDB reads the text back unchanged', async () => {
    expect(sqlString("it's")).toBe("'it''s'");
    expect(sqlIdent('a"b')).toBe('"a""b"');
    const reader = await engine.connection.runAndReadAll(`SELECT ${sqlString("runs/it's/seed=1.csv")} AS ${sqlIdent('odd "name"')}`);
    expect(reader.getRowObjectsJS()).toEqual([{ 'odd "name"': "runs/it's/seed=1.csv" }]);
  });
});

describe('resultColumns', () => {
  it('copies numeric columns into Float64Arrays, NULL as NaN', async () => {
    const result = await engine.connection.run('SELECT range::DOUBLE / 4, (range * 2)::INTEGER, CASE WHEN range = 1 THEN NULL ELSE 1.5 END FROM range(3)');
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
});
