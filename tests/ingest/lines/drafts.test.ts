import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { planColumns } from '../../../src/ingest/plan/columns.js';
import { closeEngine, openEngine, type Engine } from '../../../src/ingest/load/duckdb.js';
import { loadFiles, type FileData } from '../../../src/ingest/load/loadFiles.js';
import { readHeader } from '../../../src/ingest/plan/header.js';
import { draft, finishDrafts } from '../../../src/ingest/lines/drafts.js';
import { makeTree, none, removeTree, source } from '../../fixtures/ingest/tree.js';

// Lines counted by hand on the fixture (header = line 1); Parquet has rows, not lines.
let engine: Engine;
let root: string;
let csv: FileData;
let parquet: FileData;
beforeAll(async () => {
  engine = await openEngine();
  root = await makeTree({ 'a.csv': 'step,loss\n1,0.5\n\n2\n3,0.3\n' });
  await engine.connection.run(`COPY (SELECT range AS step FROM range(3)) TO '${root}/p.parquet' (FORMAT parquet)`);
  const read = async (rel: string): Promise<FileData> => {
    const h = await readHeader(source(root, rel), null, engine);
    if (!h.ok) throw new Error(h.reason);
    return (await loadFiles(engine, [{ header: h.header, plan: planColumns(h.header.names, none) }]))
      .data[0] as FileData;
  };
  csv = await read('a.csv');
  parquet = await read('p.parquet');
});
afterAll(async () => {
  closeEngine(engine);
  await removeTree(root);
});

describe('finishDrafts', () => {
  it('kept rows, DuckDB records and Parquet rows become lines or row numbers', async () => {
    const problems = await finishDrafts([
      draft('step-invalid', 'two rows', {
        run: 'seed=1',
        rows: [
          { data: csv, kind: 'row', n: 0 },
          { data: csv, kind: 'row', n: 1 },
        ],
      }),
      draft('row-malformed', 'bad', { rows: [{ data: csv, kind: 'record', n: 4 }] }),
      draft('run-diverged', 'x', { rows: [{ data: parquet, kind: 'row', n: 2 }] }),
      draft('goal-inferred', 'no rows'),
    ]);
    expect(problems).toEqual([
      {
        severity: 'warning',
        code: 'step-invalid',
        message: 'two rows (lines 2, 5)',
        file: csv.header.source.file,
        line: 2,
        run: 'seed=1',
      },
      { severity: 'warning', code: 'row-malformed', message: 'bad', file: csv.header.source.file, line: 4 },
      { severity: 'warning', code: 'run-diverged', message: 'x (row 3)', file: parquet.header.source.file },
      { severity: 'note', code: 'goal-inferred', message: 'no rows' },
    ]);
  });
});
