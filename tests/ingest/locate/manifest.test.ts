import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { readManifest } from '../../../src/ingest/locate/manifest.js';
import { SeedsiftError } from '../../../src/problems.js';
import { makeTree, removeTree, type Tree } from '../../fixtures/locate/tree.js';

const made: string[] = [];
afterEach(async () => {
  await Promise.all(made.splice(0).map(removeTree));
});
async function tree(t: Tree): Promise<string> {
  const root = await makeTree(t);
  made.push(root);
  return root;
}

async function thrown(p: Promise<unknown>): Promise<SeedsiftError> {
  try {
    await p;
  } catch (e) {
    if (e instanceof SeedsiftError) return e;
    throw e;
  }
  throw new Error('expected a SeedsiftError');
}

// Expected values: DESIGN.md "Inputs" item 5 (one row per file, a file column, a seed column,
// other columns are config parameters) and RFC 4180 CSV (header row, quoted fields).
describe('readManifest', () => {
  it('reads rows with the file relative to the manifest folder, seed and params', async () => {
    const root = await tree({
      'study/runs.csv': 'File,Seed,ticks,memory,_note\na/log.csv,1,8,4,first\n"b/log, v2.csv",2,16,,\n',
      'study/a/log.csv': '',
      'study/b/log, v2.csv': '',
    });
    const manifest = join(root, 'study', 'runs.csv');
    const { rows, skipped, problems } = await readManifest(manifest);
    expect(problems).toEqual([]);
    expect(skipped).toEqual([]);
    expect(
      rows.map((r) => ({
        file: r.file,
        relPath: r.relPath,
        line: r.line,
        seed: r.seed,
        params: r.params,
        info: r.info,
      })),
    ).toEqual([
      {
        file: join(root, 'study', 'a', 'log.csv'),
        relPath: 'a/log.csv',
        line: 2,
        seed: '1',
        params: { ticks: '8', memory: '4' },
        info: { _note: 'first' },
      },
      {
        file: join(root, 'study', 'b', 'log, v2.csv'),
        relPath: 'b/log, v2.csv',
        line: 3,
        seed: '2',
        params: { ticks: '16' },
        info: {},
      },
    ]);
  });

  it('reports a missing file with the manifest line and reads the other rows', async () => {
    const root = await tree({ 'runs.csv': 'file,seed\n\na.csv,1\ngone.csv,2\nb.csv,3\n', 'a.csv': '', 'b.csv': '' });
    const manifest = join(root, 'runs.csv');
    const { rows, skipped, problems } = await readManifest(manifest);
    expect(rows.map((r) => r.relPath)).toEqual(['a.csv', 'b.csv']);
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatchObject({ code: 'manifest-file-missing', severity: 'error', file: manifest, line: 4 });
    expect(problems[0]?.message).toContain('gone.csv');
    expect(skipped).toEqual([
      { file: join(root, 'gone.csv'), status: 'unreadable', rows: 0, rejectedRows: 0, runs: [], kind: 'log' },
    ]);
  });

  it('throws an input error at line 1 when there is no file column', async () => {
    const root = await tree({ 'runs.csv': 'path,seed\na.csv,1\n' });
    const manifest = join(root, 'runs.csv');
    const error = await thrown(readManifest(manifest));
    expect(error.code).toBe('input');
    expect(error.file).toBe(manifest);
    expect(error.line).toBe(1);
    expect(error.message).toBe(`manifest: expected a column named file, got columns path, seed (${manifest}:1)`);
  });

  it('throws a usage error for a manifest that does not exist', async () => {
    const root = await tree({});
    const error = await thrown(readManifest(join(root, 'none.csv')));
    expect(error.code).toBe('usage');
    expect(error.message).toMatch(/--manifest: expected a CSV table of runs, got no such file/);
  });

  it('throws an input error with the line for an unclosed quote', async () => {
    const root = await tree({ 'runs.csv': 'file,seed\na.csv,1\n"b.csv,2\n' });
    const error = await thrown(readManifest(join(root, 'runs.csv')));
    expect(error.code).toBe('input');
    expect(error.line).toBeGreaterThanOrEqual(3);
  });

  it('throws for a repeated or empty column name', async () => {
    const root = await tree({ 'a.csv': 'file,seed,ticks,ticks\n', 'b.csv': 'file,seed,\n' });
    expect((await thrown(readManifest(join(root, 'a.csv')))).message).toMatch(
      /expected each column once, got ticks twice/,
    );
    expect((await thrown(readManifest(join(root, 'b.csv')))).message).toMatch(/empty name for column 3/);
  });

  it('reports rows with the wrong number of cells or an empty file cell', async () => {
    const root = await tree({ 'runs.csv': 'file,seed\na.csv\n,2\na.csv,3\n', 'a.csv': '' });
    const { rows, problems } = await readManifest(join(root, 'runs.csv'));
    expect(rows.map((r) => r.line)).toEqual([4]);
    expect(problems.map((p) => [p.code, p.line])).toEqual([
      ['manifest-invalid', 2],
      ['manifest-invalid', 3],
    ]);
  });

  it('leaves the seed null when the seed cell is empty or there is no seed column', async () => {
    const root = await tree({ 'a.csv': 'file,seed\nx.csv,\n', 'b.csv': 'file\nx.csv\n', 'x.csv': '' });
    expect((await readManifest(join(root, 'a.csv'))).rows.map((r) => r.seed)).toEqual([null]);
    expect((await readManifest(join(root, 'b.csv'))).rows.map((r) => r.seed)).toEqual([null]);
  });

  it('reads a tab-separated manifest by its .tsv name', async () => {
    const root = await tree({ 'runs.tsv': 'file\tseed\tlr\nx.csv\t4\t0.1\n', 'x.csv': '' });
    const { rows } = await readManifest(join(root, 'runs.tsv'));
    expect(rows.map((r) => [r.seed, r.params])).toEqual([['4', { lr: '0.1' }]]);
  });
});
