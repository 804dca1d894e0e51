import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { planColumns } from '../../../src/ingest/plan/columns.js';
import { closeEngine, openEngine, type Engine } from '../../../src/ingest/load/duckdb.js';
import { loadFiles, type FileData } from '../../../src/ingest/load/loadFiles.js';
import { readHeader } from '../../../src/ingest/plan/header.js';
import { dataRowLines, fileBytes, scanRecords } from '../../../src/ingest/lines/records.js';
import { makeTree, none, removeTree, source } from '../../fixtures/ingest/tree.js';

// The expected lines are counted by hand on the fixtures below (1-based physical lines, as an
// editor shows them). The point: DuckDB numbers records, not lines (a blank line is a record, a
// quoted field spanning lines is one record), and accepted rows carry no line at all.
const TRICKY = [
  'step,loss,note', // 1 header
  '1,0.5,a', // 2 data row 0
  '', // 3 blank
  '2,0.4,"multi', // 4 data row 1 (a quoted field over two lines)
  'line"', // 5
  '3,0.3', // 6 too few fields: rejected, DuckDB record 5
  '4,0.2,"x"', // 7 data row 2
  '', // 8
  '', // 9
  '5,"0.1",y', // 10 data row 3
].join('\n');

const WHITESPACE = ['step  loss', '1     0.5', '', '   ', '2  0.4  9', '3\t0.3'].join('\n');

let engine: Engine;
let root: string;
beforeAll(async () => {
  engine = await openEngine();
  root = await makeTree({
    'a/tricky.csv': `${TRICKY}\n`,
    'b/tricky.csv': `${TRICKY.replaceAll('\n', '\r\n')}\r\n`,
    'c/ws.txt': `${WHITESPACE}\n`,
  });
});
afterAll(async () => {
  closeEngine(engine);
  await removeTree(root);
});

async function load(rel: string): Promise<FileData> {
  const h = await readHeader(source(root, rel), null, engine);
  if (!h.ok) throw new Error(h.reason);
  const loaded = await loadFiles(engine, [{ header: h.header, plan: planColumns(h.header.names, none) }]);
  return loaded.data[0] as FileData;
}

describe('scanRecords and dataRowLines against DuckDB', () => {
  it.each(['a/tricky.csv', 'b/tricky.csv'])(
    '%s: DuckDB rejects record 5, which is line 6; accepted rows are lines 2, 4, 7, 10',
    async (rel) => {
      const data = await load(rel);
      expect(Array.from(data.cells.get(0) as Float64Array)).toEqual([1, 2, 4, 5]);
      expect(data.rejects.map((r) => [r.record, r.type])).toEqual([[5, 'MISSING COLUMNS']]);
      const records = scanRecords(await fileBytes(data.header.source.file, false), { quoted: true, whitespace: false });
      expect(records.start[4]).toBe(6);
      expect(Array.from(dataRowLines(records, true, new Set([5])))).toEqual([2, 4, 7, 10]);
    },
  );

  it('whitespace mode: blank and space-only lines skipped, a row with a wrong field count flagged', async () => {
    const data = await load('c/ws.txt');
    expect(data.malformed).toEqual([1]);
    expect(Array.from(data.rowIds as Int32Array)).toEqual([0, 2]);
    expect(Array.from(data.cells.get(1) as Float64Array)).toEqual([0.5, 0.3]);
    const records = scanRecords(await fileBytes(data.header.source.file, false), { quoted: false, whitespace: true });
    expect(Array.from(dataRowLines(records, true, new Set()))).toEqual([2, 5, 6]);
  });
});

describe('scanRecords', () => {
  it('quoted newlines, CR LF and a last line without a line break', () => {
    const r = scanRecords(Buffer.from('a\r\n"x\r\ny"\r\n\r\nb'), { quoted: true, whitespace: false });
    expect(Array.from(r.start)).toEqual([1, 2, 4, 5]);
    expect(Array.from(r.blank)).toEqual([0, 0, 1, 0]);
  });
  it('a doubled quote inside quotes does not end the field', () => {
    const r = scanRecords(Buffer.from('"a""\nb"\nc\n'), { quoted: true, whitespace: false });
    expect(Array.from(r.start)).toEqual([1, 3]);
  });
});
