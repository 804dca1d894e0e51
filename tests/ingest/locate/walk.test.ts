import { join, relative } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { comparePaths, walk } from '../../../src/ingest/locate/walk.js';
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

// Expected values: the walking rules written in src/ingest/locate/walk.ts and DESIGN.md "Inputs"
// (deterministic order, symbolic links followed safely, nothing dropped without a record).
describe('comparePaths', () => {
  it('orders segment by segment, by code units (a folder b before a file b.csv)', () => {
    const paths = ['b.csv', 'a-c/x.csv', 'a/b.csv', 'a/B.csv', 'a/b/c.csv', 'seed=10/x.csv', 'seed=2/x.csv'];
    expect([...paths].sort(comparePaths)).toEqual([
      'a/B.csv',
      'a/b/c.csv',
      'a/b.csv',
      'a-c/x.csv',
      'b.csv',
      'seed=10/x.csv',
      'seed=2/x.csv',
    ]);
  });
});

describe('walk', () => {
  it('lists files recursively in sorted order with / separated relative paths', async () => {
    const root = await tree({ 'b.csv': '', 'a/z.csv': '', 'a/b/y.csv': '', 'a-c/x.csv': '', 'empty/': '' });
    const result = await walk([root]);
    expect(result.files.map((f) => f.relPath)).toEqual(['a/b/y.csv', 'a/z.csv', 'a-c/x.csv', 'b.csv']);
    expect(result.files[0]?.file).toBe(join(root, 'a', 'b', 'y.csv'));
    expect(result.roots).toEqual(['folder']);
    expect(result.problems).toEqual([]);
  });

  it('keeps a relative PATH relative in the file paths', async () => {
    const root = await tree({ 'seed=1/log.csv': '' });
    const given = relative(process.cwd(), root);
    const result = await walk([given]);
    expect(result.files.map((f) => f.file)).toEqual([join(given, 'seed=1', 'log.csv')]);
  });

  it('takes a file PATH as a file whose relative path is its name', async () => {
    const root = await tree({ 'ticks=8/seed=1/log.csv': '' });
    const file = join(root, 'ticks=8', 'seed=1', 'log.csv');
    const result = await walk([file]);
    expect(result.files.map((f) => [f.file, f.relPath])).toEqual([[file, 'log.csv']]);
    expect(result.roots).toEqual(['file']);
  });

  it('throws a usage error naming a PATH that does not exist', async () => {
    const root = await tree({ 'a.csv': '' });
    const missing = join(root, 'nope');
    await expect(walk([root, missing])).rejects.toThrow(SeedsiftError);
    await expect(walk([missing])).rejects.toMatchObject({ code: 'usage', file: missing });
    await expect(walk([missing])).rejects.toThrow(/no such file or folder/);
  });

  it('stops at a symbolic link loop with a problem', async () => {
    const root = await tree({ 'a/log.csv': '', 'a/back': { link: '..' }, 'a/self': { link: '.' } });
    const result = await walk([root]);
    expect(result.files.map((f) => f.relPath)).toEqual(['a/log.csv']);
    const loops = result.problems.filter((p) => /symbolic link loop/.test(p.message));
    expect(loops.map((p) => [p.code, p.file])).toEqual([
      ['file-skipped', join(root, 'a', 'back')],
      ['file-skipped', join(root, 'a', 'self')],
    ]);
  });

  it('stops at a loop between two folders', async () => {
    const root = await tree({
      'x/log.csv': '',
      'x/to-y': { link: '../y' },
      'y/log.csv': '',
      'y/to-x': { link: '../x' },
    });
    const result = await walk([root]);
    expect(result.files.map((f) => f.relPath)).toEqual(['x/log.csv', 'y/log.csv']);
    expect(result.problems.map((p) => p.file)).toEqual([join(root, 'x', 'to-y'), join(root, 'y', 'to-x')]);
    expect(result.problems.every((p) => p.code === 'file-skipped' && /already searched/.test(p.message))).toBe(true);
  });

  it('follows a link to a folder outside the PATH, under the link name', async () => {
    const outside = await tree({ 'seed=1/log.csv': '' });
    const root = await tree({ 'ticks=8': { link: outside } });
    const result = await walk([root]);
    expect(result.files.map((f) => [f.relPath, f.viaLink])).toEqual([['ticks=8/seed=1/log.csv', true]]);
  });

  it('reads a file reached by a link and by its own path once, under its own path', async () => {
    const root = await tree({
      latest: { link: 'run_2' },
      'run_2/log.csv': '',
      'a-link.csv': { link: 'run_2/log.csv' },
    });
    const result = await walk([root]);
    expect(result.files.map((f) => f.relPath)).toEqual(['run_2/log.csv']);
    // The file link is a second path to a file read once: listed as skipped, with a note.
    expect(result.skipped.map((r) => [r.file, r.status])).toEqual([[join(root, 'a-link.csv'), 'skipped']]);
    // The folder link is not followed (its folder is searched already).
    expect(result.problems.map((p) => [p.code, p.file, p.message])).toEqual([
      [
        'file-skipped',
        join(root, 'latest'),
        `folder not searched again: it was already searched as ${join(root, 'run_2')}`,
      ],
      [
        'file-skipped',
        join(root, 'a-link.csv'),
        `same file as ${join(root, 'run_2', 'log.csv')} (reached by a second path); taken once, under that path`,
      ],
    ]);
  });

  it('lists hidden files as skipped and does not search hidden folders', async () => {
    const root = await tree({ '.git/objects/x.csv': '', '._log.csv': '', 'log.csv': '' });
    const result = await walk([root]);
    expect(result.files.map((f) => f.relPath)).toEqual(['log.csv']);
    expect(result.skipped).toEqual([
      { file: join(root, '._log.csv'), status: 'skipped', rows: 0, rejectedRows: 0, runs: [], kind: 'log' },
    ]);
    expect(result.problems.map((p) => [p.code, p.file, p.message])).toEqual([
      ['file-skipped', join(root, '._log.csv'), 'hidden file not read'],
      ['file-skipped', join(root, '.git'), 'hidden folder not searched'],
    ]);
  });

  it('records a broken link to a log file as unreadable', async () => {
    const root = await tree({ 'log.csv': { link: 'gone.csv' }, notes: { link: 'gone' } });
    const result = await walk([root]);
    expect(result.files).toEqual([]);
    expect(result.skipped.map((r) => [r.file, r.status, r.kind])).toEqual([
      [join(root, 'log.csv'), 'unreadable', 'log'],
      [join(root, 'notes'), 'skipped', 'unknown'],
    ]);
    expect(result.problems.map((p) => p.code)).toEqual(['file-unreadable', 'file-skipped']);
  });

  it('searches a folder once when PATHs overlap', async () => {
    const root = await tree({ 'a/log.csv': '', 'b.csv': '' });
    const result = await walk([root, join(root, 'a')]);
    expect(result.files.map((f) => f.relPath)).toEqual(['a/log.csv', 'b.csv']);
    expect(result.roots).toEqual(['folder', 'repeated']);
    expect(result.problems.map((p) => p.file)).toEqual([join(root, 'a')]);
  });
});
