import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeEngine, openEngine, type Engine } from '../../../src/ingest/load/duckdb.js';
import { readHeader, textHeader } from '../../../src/ingest/plan/header.js';
import { gz, makeTree, removeTree, source } from '../../fixtures/ingest/tree.js';

// DESIGN.md "Inputs": .csv (comma), .tsv (tab), .txt (delimiter sniffed), gzipped or not,
// .parquet; headerless files with --columns. The fixtures' names are the expected values.
let engine: Engine;
let root: string;
const wide = Array.from({ length: 9000 }, (_, k) => `metric_${k}`);
beforeAll(async () => {
  engine = await openEngine();
  root = await makeTree({
    'a.csv': '\uFEFFstep,"val acc",\n1,2,3\n',
    'b.csv.gz': gz('step\tloss\n'),
    'c.tsv.gz': gz('step\tloss\n1\t0.5\n'),
    'd.txt': 'step | loss\n1 | 2\n',
    'e.csv': '',
    'f.csv': '\n\n',
    'g.csv.gz': 'not gzip at all',
    'h.csv': `${wide.join(',')}\n`,
  });
  await engine.connection.run(
    `COPY (SELECT 1::INTEGER AS step, 0.5::FLOAT AS loss, 'x' AS tag) TO '${join(root, 'p.parquet')}' (FORMAT parquet)`,
  );
});
afterAll(async () => {
  closeEngine(engine);
  await removeTree(root);
});

describe('textHeader', () => {
  it('csv is comma, tsv is tab, whatever the content', () => {
    expect(textHeader(['a\tb,c'], 'csv', null)?.names).toEqual(['a\tb', 'c']);
    expect(textHeader(['a\tb,c'], 'tsv', null)?.names).toEqual(['a', 'b,c']);
  });
  it('--columns: headerless unless the first line is exactly those names', () => {
    expect(textHeader(['1,2'], 'csv', ['step', 'loss'])).toEqual({
      names: ['step', 'loss'],
      text: { delimiter: ',', header: false, skip: 0 },
      textLike: [],
    });
    expect(textHeader(['step,loss', '1,2'], 'csv', ['step', 'loss'])).toEqual({
      names: ['step', 'loss'],
      text: { delimiter: ',', header: true, skip: 0 },
      textLike: [],
    });
  });

  it('blank lines (empty or spaces) before the header are counted to be skipped', () => {
    expect(textHeader(['', '  ', 'step,loss', '1,2'], 'csv', null)).toEqual({
      names: ['step', 'loss'],
      text: { delimiter: ',', header: true, skip: 2 },
      textLike: [],
    });
  });

  it('columns with text among the first lines are hinted (nan, inf, 1e-3, quoted numbers are numbers)', () => {
    expect(
      textHeader(['step,phase,loss,note', '1,train,nan,"0.5"', '2,eval,1e-3,', '3,,inf,x'], 'csv', null)?.textLike,
    ).toEqual([1, 3]);
  });
  it('nothing but blank lines: null', () => {
    expect(textHeader(['', ' '], 'csv', null)).toBeNull();
  });
});

describe('readHeader', () => {
  it('strips a byte-order mark, unquotes names, names an empty one columnK', async () => {
    const h = await readHeader(source(root, 'a.csv'), null, engine);
    expect(h.ok && h.header.names).toEqual(['step', 'val acc', 'column3']);
  });
  it('gzipped files (decompressed only as far as needed)', async () => {
    const h = await readHeader(source(root, 'c.tsv.gz'), null, engine);
    expect(h.ok && [h.header.names, h.header.text]).toEqual([
      ['step', 'loss'],
      { delimiter: '\t', header: true, skip: 0 },
    ]);
  });
  it('a .txt file: delimiter sniffed', async () => {
    const h = await readHeader(source(root, 'd.txt'), null, engine);
    expect(h.ok && [h.header.names, h.header.text?.delimiter]).toEqual([['step', 'loss'], '|']);
  });
  it('a header line longer than the first read', async () => {
    const h = await readHeader(source(root, 'h.csv'), null, engine);
    expect(h.ok && h.header.names.length).toBe(9000);
  });
  it('Parquet: names and DuckDB types', async () => {
    const h = await readHeader(source(root, 'p.parquet'), null, engine);
    expect(h.ok && [h.header.names, h.header.parquetTypes, h.header.text]).toEqual([
      ['step', 'loss', 'tag'],
      ['INTEGER', 'FLOAT', 'VARCHAR'],
      null,
    ]);
  });
  it('empty, blank-only, not gzip, missing: failures with the reason', async () => {
    expect(await readHeader(source(root, 'e.csv'), null, engine)).toEqual({
      ok: false,
      code: 'file-empty',
      reason: 'the file is empty (0 bytes)',
    });
    expect(await readHeader(source(root, 'f.csv'), null, engine)).toEqual({
      ok: false,
      code: 'file-empty',
      reason: 'the file has only blank lines',
    });
    expect(await readHeader(source(root, 'g.csv.gz'), null, engine)).toEqual({
      ok: false,
      code: 'file-unreadable',
      reason: 'not a valid gzip file',
    });
    const missing = await readHeader(source(root, 'nope.csv'), null, engine);
    expect(missing.ok === false && missing.code).toBe('file-unreadable');
  });
  it('a gzipped header-only file reads (its emptiness is found when rows are counted)', async () => {
    const h = await readHeader(source(root, 'b.csv.gz'), null, engine);
    expect(h.ok && h.header.names).toEqual(['step\tloss']);
  });
});
