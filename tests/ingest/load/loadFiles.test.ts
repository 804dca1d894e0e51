import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gunzipSync } from 'node:zlib';
import { parse } from 'csv-parse/sync';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { planColumns } from '../../../src/ingest/plan/columns.js';
import { closeEngine, openEngine, type Engine } from '../../../src/ingest/load/duckdb.js';
import { loadFiles, type FileData, type FileToRead } from '../../../src/ingest/load/loadFiles.js';
import { readHeader } from '../../../src/ingest/plan/header.js';
import type { RunSource } from '../../../src/ingest/types.js';
import { createRandom } from '../../../src/stats/random.js';
import { gz, makeTree, none, removeTree, source } from '../../fixtures/ingest/tree.js';

let engine: Engine;
beforeAll(async () => {
  engine = await openEngine();
});
afterAll(() => closeEngine(engine));
const made: string[] = [];
afterEach(async () => {
  await Promise.all(made.splice(0).map(removeTree));
});

async function items(sources: readonly RunSource[]): Promise<FileToRead[]> {
  const out: FileToRead[] = [];
  for (const s of sources) {
    const h = await readHeader(s, null, engine);
    if (!h.ok) throw new Error(`${s.file}: ${h.reason}`);
    out.push({ header: h.header, plan: planColumns(h.header.names, none) });
  }
  return out;
}

const values = (d: FileData | undefined, k: number): number[] => Array.from(d?.cells.get(k) ?? []);

describe('loadFiles', () => {
  it('reads same-shaped files in one call and returns them in the order given', async () => {
    const root = await makeTree({
      'a.csv': 'step,loss\n1,0.5\n2,0.25\n',
      'b.csv': 'step,loss\n1,0.75\n',
      'c.tsv': 'step\tloss\n3\t1.5\n',
    });
    made.push(root);
    const loaded = await loadFiles(engine, await items(['a.csv', 'c.tsv', 'b.csv'].map((f) => source(root, f))));
    expect(loaded.failed).toEqual([]);
    expect(loaded.data.map((d) => d.header.source.relPath)).toEqual(['a.csv', 'c.tsv', 'b.csv']);
    expect(loaded.data.map((d) => values(d, 1))).toEqual([[0.5, 0.25], [1.5], [0.75]]);
  });

  it('a text cell in a number column: that file is read again with the column as text; the row stays', async () => {
    const root = await makeTree({ 'a.csv': 'step,loss\n1,0.5\n2,oops\n3,0.25\n', 'b.csv': 'step,loss\n1,0.75\n' });
    made.push(root);
    const loaded = await loadFiles(engine, await items([source(root, 'a.csv'), source(root, 'b.csv')]));
    expect(values(loaded.data[0], 1)).toEqual([0.5, -Infinity, 0.25]);
    expect(values(loaded.data[1], 1)).toEqual([0.75]);
    expect(loaded.data[0]?.rejects).toEqual([]);
  });

  it('small batches give the same result as one', async () => {
    const tree: Record<string, string> = {};
    for (let k = 0; k < 7; k++) tree[`f${k}.csv`] = `step,acc\n${k},${k / 8}\n${k + 1},${k / 16}\n`;
    const root = await makeTree(tree);
    made.push(root);
    const list = await items(Object.keys(tree).map((f) => source(root, f)));
    const one = await loadFiles(engine, list);
    const many = await loadFiles(engine, list, 1);
    expect(many.data.map((d) => values(d, 1))).toEqual(one.data.map((d) => values(d, 1)));
    expect(one.data.map((d) => values(d, 0))).toEqual([0, 1, 2, 3, 4, 5, 6].map((k) => [k, k + 1]));
  });

  it('one corrupt gzip file fails alone; the others of its batch are read', async () => {
    const bad = gz('step,loss\n1,0.5\n2,0.4\n').subarray(0, 30);
    const root = await makeTree({
      'a.csv.gz': gz('step,loss\n1,0.5\n'),
      'b.csv.gz': Buffer.concat([Buffer.from(gz('step,loss\n').subarray(0, 10)), bad]),
      'c.csv.gz': gz('step,loss\n2,0.125\n'),
    });
    made.push(root);
    const list: FileToRead[] = [];
    for (const f of ['a.csv.gz', 'b.csv.gz', 'c.csv.gz']) {
      const h = await readHeader(source(root, f), null, engine);
      if (h.ok) list.push({ header: h.header, plan: planColumns(h.header.names, none) });
      else
        list.push({
          header: {
            source: source(root, f),
            names: ['step', 'loss'],
            parquetTypes: null,
            text: { delimiter: ',', header: true, skip: 0 },
            bytes: 40,
            textLike: [],
          },
          plan: planColumns(['step', 'loss'], none),
        });
    }
    const loaded = await loadFiles(engine, list);
    expect(loaded.data.map((d) => d.header.source.relPath)).toEqual(['a.csv.gz', 'c.csv.gz']);
    expect(loaded.failed.map((f) => f.header.source.relPath)).toEqual(['b.csv.gz']);
    expect(values(loaded.data[1], 1)).toEqual([0.125]);
  });
});

// Differential check: an independent parser (csv-parse) and JavaScript's parseFloat must give
// exactly the numbers DuckDB gave (both are correctly rounded decimal-to-double conversions).
describe('DuckDB numbers equal csv-parse + parseFloat, exactly', () => {
  function mismatches(text: string, data: FileData): string[] {
    const rows = parse(text, { skip_empty_lines: true }) as string[][];
    const header = rows.shift() as string[];
    const out: string[] = [];
    expect(data.rows).toBe(rows.length);
    header.forEach((_, k) => {
      const cells = data.cells.get(k) as Float64Array;
      rows.forEach((row, i) => {
        const cell = row[k] as string;
        const parsed = parseFloat(cell);
        // Encoding of load/query.ts: empty -> NaN, nan/inf -> +Infinity, text -> -Infinity.
        const want =
          cell === ''
            ? NaN
            : Number.isNaN(parsed)
              ? /^[+-]?nan$/i.test(cell)
                ? Infinity
                : -Infinity
              : Number.isFinite(parsed)
                ? parsed
                : Infinity;
        const got = cells[i] as number;
        if (!Object.is(got, want)) out.push(`${header[k] as string} row ${i}: '${cell}' -> ${got}, expected ${want}`);
      });
    });
    return out;
  }

  it('the demo study tick dumps (sample-runs/**/ticks.csv.gz)', async () => {
    const base = fileURLToPath(new URL('../../../sample-runs/', import.meta.url));
    const dumps: string[] = [];
    const walk = (dir: string): void => {
      for (const name of readdirSync(dir)) {
        const path = join(dir, name);
        if (statSync(path).isDirectory()) walk(path);
        else if (name.endsWith('.csv.gz')) dumps.push(path);
      }
    };
    walk(base);
    expect(dumps.length).toBeGreaterThan(0);
    const list = await items(
      dumps.map((file) => ({
        file,
        relPath: file,
        format: 'csv',
        gzip: true,
        params: {},
        info: {},
        seed: '0',
        identity: 'hive',
      })),
    );
    const loaded = await loadFiles(engine, list);
    for (const d of loaded.data)
      expect(mismatches(gunzipSync(readFileSync(d.header.source.file)).toString(), d)).toEqual([]);
  });

  it('20,000 random numbers in many spellings (seeded)', async () => {
    const random = createRandom(20240601);
    const spell = (x: number, how: number): string => {
      switch (how) {
        case 0:
          return x.toPrecision(17);
        case 1:
          return x.toExponential(random.int(17));
        case 2:
          return Math.abs(x) < 1e15 ? x.toFixed(random.int(12)) : String(x);
        case 3:
          return String(x).toUpperCase();
        case 4:
          return x >= 0 ? `+${x}` : String(x);
        default:
          return String(Math.round(x));
      }
    };
    const lines = ['step,a,b,c,d'];
    for (let i = 0; i < 5000; i++) {
      const cells = [String(i)];
      for (let j = 0; j < 4; j++) {
        const x = (random.next() - 0.5) * 10 ** (random.int(80) - 40);
        cells.push(spell(x, random.int(6)));
      }
      lines.push(cells.join(','));
    }
    lines.push('5000,4.9e-324,2.2250738585072014e-308,1.7976931348623157e308,-0');
    const text = `${lines.join('\n')}\n`;
    // The same numbers once more with a text cell in every column, so that every column is read
    // as VARCHAR and converted by TRY_CAST (the slow path) instead of by the CSV reader.
    const withText = `${text}x,x,x,x,x\n`;
    const root = await makeTree({ 'r.csv': text, 's.csv': withText });
    made.push(root);
    const loaded = await loadFiles(engine, await items([source(root, 'r.csv'), source(root, 's.csv')]));
    expect(mismatches(text, loaded.data[0] as FileData)).toEqual([]);
    expect(mismatches(withText, loaded.data[1] as FileData)).toEqual([]);
  });
});
