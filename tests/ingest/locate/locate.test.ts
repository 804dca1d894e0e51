import { join, relative } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { locate } from '../../../src/ingest/locate/locate.js';
import { SeedsiftError } from '../../../src/problems.js';
import { none, opts } from '../../fixtures/ingest/tree.js';
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

const LOG = 'step,acc\n1,0.5\n';

// Expected values: DESIGN.md "Inputs" (identity sources in order of preference, params.json,
// every case reported) and the brief for the locate stage; each test states the rule it checks.
describe('locate: key=value folders', () => {
  it('reads nested keys, the seed, format and gzip, in sorted order', async () => {
    const root = await tree({
      'ticks=32/memory=12/seed=3/log.csv': LOG,
      'ticks=32/memory=12/seed=10/log.csv.gz': '',
      'ticks=8/memory=4/seed=1/eval.parquet': '',
    });
    const { sources, files, problems } = await locate([root], none);
    expect(problems).toEqual([]);
    expect(files).toEqual([]);
    expect(sources).toEqual([
      {
        file: join(root, 'ticks=32/memory=12/seed=10/log.csv.gz'),
        relPath: 'ticks=32/memory=12/seed=10/log.csv.gz',
        format: 'csv',
        gzip: true,
        params: { ticks: '32', memory: '12' },
        info: {},
        seed: '10',
        identity: 'hive',
      },
      {
        file: join(root, 'ticks=32/memory=12/seed=3/log.csv'),
        relPath: 'ticks=32/memory=12/seed=3/log.csv',
        format: 'csv',
        gzip: false,
        params: { ticks: '32', memory: '12' },
        info: {},
        seed: '3',
        identity: 'hive',
      },
      {
        file: join(root, 'ticks=8/memory=4/seed=1/eval.parquet'),
        relPath: 'ticks=8/memory=4/seed=1/eval.parquet',
        format: 'parquet',
        gzip: false,
        params: { ticks: '8', memory: '4' },
        info: {},
        seed: '1',
        identity: 'hive',
      },
    ]);
    expect(Object.keys(sources[0]?.params ?? {})).toEqual(['ticks', 'memory']);
  });

  it('takes the seed from a seed=N file name', async () => {
    const root = await tree({ 'ticks=8/seed=3.csv': LOG, 'ticks=8/seed=4.tsv.gz': '' });
    const { sources, problems } = await locate([root], none);
    expect(problems).toEqual([]);
    expect(sources.map((s) => [s.params, s.seed, s.format])).toEqual([
      [{ ticks: '8' }, '3', 'csv'],
      [{ ticks: '8' }, '4', 'tsv'],
    ]);
  });

  it("keeps the PATH's own key=value segments", async () => {
    const root = await tree({ 'ticks=32/seed=1/log.csv': LOG, 'ticks=64/seed=1/log.csv': LOG });
    const { sources } = await locate([join(root, 'ticks=32'), join(root, 'ticks=64')], none);
    expect(sources.map((s) => [s.relPath, s.params.ticks, s.seed])).toEqual([
      ['seed=1/log.csv', '32', '1'],
      ['seed=1/log.csv', '64', '1'],
    ]);
  });

  it('keeps a relative PATH relative in files and problems', async () => {
    const root = await tree({ 'seed=1/log.csv': LOG, 'seed=1/model.pt': 'x' });
    const given = relative(process.cwd(), root);
    const { sources, files, problems } = await locate([given], none);
    expect(sources.map((s) => s.file)).toEqual([join(given, 'seed=1', 'log.csv')]);
    expect(files.map((f) => f.file)).toEqual([join(given, 'seed=1', 'model.pt')]);
    expect(problems.map((p) => p.file)).toEqual([join(given, 'seed=1', 'model.pt')]);
  });
});

describe('locate: --layout', () => {
  it('reads the DESIGN example and skips files that do not match', async () => {
    const root = await tree({
      'looped/looped_glyph-count-v2_3_20260301120000/eval.csv': LOG,
      'looped/looped_glyph-count-v2_4_20260301130000/eval.csv': LOG,
      'looped/looped_glyph-count-v2_4_20260301130000/train.csv': LOG,
    });
    const layout = '{model}/{model2}_{task}_{seed}_{_stamp}/eval.csv';
    const { sources, files, problems } = await locate([root], opts({ layout }));
    expect(sources.map((s) => [s.params, s.info, s.seed, s.identity])).toEqual([
      [{ model: 'looped', model2: 'looped', task: 'glyph-count-v2' }, { _stamp: '20260301120000' }, '3', 'layout'],
      [{ model: 'looped', model2: 'looped', task: 'glyph-count-v2' }, { _stamp: '20260301130000' }, '4', 'layout'],
    ]);
    const train = join(root, 'looped/looped_glyph-count-v2_4_20260301130000/train.csv');
    expect(files).toEqual([{ file: train, status: 'skipped', rows: 0, rejectedRows: 0, runs: [], kind: 'log' }]);
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatchObject({ code: 'layout-unmatched', severity: 'warning', file: train });
    expect(problems[0]?.message).toContain(layout);
  });

  it('gives a problem for every file when the layout matches nothing', async () => {
    const root = await tree({ 'a/1.csv': LOG, 'b/2.csv': LOG });
    const { sources, files, problems } = await locate([root], opts({ layout: '{model}_{seed}/log.csv' }));
    expect(sources).toEqual([]);
    expect(files.map((f) => f.status)).toEqual(['skipped', 'skipped']);
    expect(problems.map((p) => [p.code, p.file])).toEqual([
      ['layout-unmatched', join(root, 'a/1.csv')],
      ['layout-unmatched', join(root, 'b/2.csv')],
    ]);
  });

  it('adds key=value segments, keeping their value over a layout field of the same name', async () => {
    const root = await tree({ 'task=parity/ctm_7/log.csv': LOG });
    const { sources } = await locate([root], opts({ layout: '{task}/{model}_{seed}/*.csv' }));
    expect(sources.map((s) => [s.params, s.seed, s.identity])).toEqual([
      [{ task: 'parity', model: 'ctm' }, '7', 'layout'],
    ]);
  });

  it('throws a usage error for a malformed template (when the options are resolved, before locate)', () => {
    let error: unknown = null;
    try {
      opts({ layout: '{model/{seed}.csv' });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(SeedsiftError);
    expect(error).toMatchObject({ code: 'usage' });
  });
});

describe('locate: seed inside the file', () => {
  it('--seed-column leaves the seed to the loader and keeps the path config', async () => {
    const root = await tree({ 'ticks=8/all.csv': 'step,seed,acc\n', 'ticks=16/seed=9/all.csv': 'step,seed,acc\n' });
    const { sources, problems } = await locate([root], opts({ seedColumn: 'seed' }));
    expect(problems).toEqual([]);
    expect(sources.map((s) => [s.params, s.info, s.seed, s.identity])).toEqual([
      [{ ticks: '16' }, { seed: '9' }, null, 'seed-column'],
      [{ ticks: '8' }, {}, null, 'seed-column'],
    ]);
  });

  it('--seed-columns does the same with its own identity', async () => {
    const root = await tree({ 'model=ctm/wide.csv': 'step,acc:seed_1,acc:seed_2\n' });
    const { sources, problems } = await locate([root], opts({ seedColumns: 'acc:seed_{seed}' }));
    expect(problems).toEqual([]);
    expect(sources.map((s) => [s.params, s.seed, s.identity])).toEqual([[{ model: 'ctm' }, null, 'seed-columns']]);
  });

  it('rejects --seed-column together with --seed-columns (when the options are resolved, before locate)', () => {
    expect(() => opts({ seedColumn: 'seed', seedColumns: '{seed}' })).toThrow(SeedsiftError);
  });
});

describe('locate: --manifest', () => {
  it('takes sources from the manifest and lists unlisted logs as skipped', async () => {
    const root = await tree({
      'runs.csv': 'file,seed,ticks\nx/log.csv,1,8\ny/log.csv,2,16\nmissing.csv,3,8\n',
      'x/log.csv': LOG,
      'y/log.csv': LOG,
      'z/log.csv': LOG,
    });
    const manifest = join(root, 'runs.csv');
    const { sources, files, problems } = await locate([root], opts({ manifest }));
    expect(sources.map((s) => [s.file, s.relPath, s.params, s.seed, s.identity])).toEqual([
      [join(root, 'x/log.csv'), 'x/log.csv', { ticks: '8' }, '1', 'manifest'],
      [join(root, 'y/log.csv'), 'y/log.csv', { ticks: '16' }, '2', 'manifest'],
    ]);
    expect(files.map((f) => [f.file, f.status])).toEqual([
      [join(root, 'missing.csv'), 'unreadable'],
      [join(root, 'z/log.csv'), 'skipped'],
    ]);
    expect(problems.map((p) => [p.code, p.file, p.line])).toEqual([
      ['manifest-file-missing', manifest, 4],
      ['file-skipped', join(root, 'z/log.csv'), undefined],
    ]);
  });

  it(
    'works without PATHs, checks params.json against the ' + 'manifest, and reports a seedless row with its line',
    async () => {
      const root = await tree({
        'runs.csv': 'file,seed,ticks\na/log.csv,,8\n',
        'a/log.csv': LOG,
        'a/params.json': '{"ticks": 16}',
      });
      const manifest = join(root, 'runs.csv');
      const { sources, problems } = await locate([], opts({ manifest }));
      expect(sources.map((s) => [s.params, s.seed])).toEqual([[{ ticks: '8' }, 'auto-1']]);
      expect(problems.map((p) => [p.code, p.file, p.line])).toEqual([
        ['params-mismatch', join(root, 'a/params.json'), 1],
        ['seed-missing', manifest, 2],
      ]);
    },
  );

  it('throws an input error when the manifest has no file column', async () => {
    const root = await tree({ 'runs.csv': 'seed,ticks\n1,8\n' });
    await expect(locate([root], opts({ manifest: join(root, 'runs.csv') }))).rejects.toMatchObject({
      code: 'input',
      line: 1,
    });
  });

  it('rejects --manifest with --layout (when the options are resolved, before locate)', () => {
    expect(() => opts({ manifest: 'runs.csv', layout: '{seed}.csv' })).toThrow(/cannot be combined with --layout/);
  });
});

describe('locate: params.json', () => {
  it('agrees silently (equal numbers in other spellings) and adds its keys after the path keys', async () => {
    const root = await tree({
      'ticks=32/lr=1e-4/seed=1/log.csv': LOG,
      'ticks=32/lr=1e-4/seed=1/params.json': '{"lr": 0.0001, "ticks": 32, "seed": 1, "width": 256, "_host": "n1"}',
    });
    const { sources, files, problems } = await locate([root], none);
    expect(problems).toEqual([]);
    expect(files).toEqual([]);
    expect(sources.map((s) => [s.params, s.info, s.seed])).toEqual([
      [{ ticks: '32', lr: '1e-4', width: '256' }, { _host: 'n1' }, '1'],
    ]);
    expect(Object.keys(sources[0]?.params ?? {})).toEqual(['ticks', 'lr', 'width']);
  });

  it("reports a disagreement with the params.json line and keeps the path's value", async () => {
    const root = await tree({
      'ticks=32/seed=1/log.csv': LOG,
      'ticks=32/seed=1/eval.csv': LOG,
      'ticks=32/seed=1/params.json': '{\n  "seed": 1,\n  "ticks": 16\n}\n',
    });
    const { sources, problems } = await locate([root], none);
    expect(sources.map((s) => s.params.ticks)).toEqual(['32', '32']);
    // One problem for the params.json, not one per log file beside it.
    expect(problems).toEqual([
      {
        severity: 'warning',
        code: 'params-mismatch',
        file: join(root, 'ticks=32/seed=1/params.json'),
        line: 3,
        message: "params.json says ticks=16 but the path says ticks=32; the path's value was kept",
      },
    ]);
  });

  it('reports invalid JSON with its file and keeps the path values', async () => {
    const root = await tree({ 'ticks=8/seed=2/log.csv': LOG, 'ticks=8/seed=2/params.json': '{"ticks": 8,' });
    const { sources, problems } = await locate([root], none);
    expect(sources.map((s) => [s.params, s.seed])).toEqual([[{ ticks: '8' }, '2']]);
    expect(problems.map((p) => [p.code, p.file])).toEqual([
      ['file-unreadable', join(root, 'ticks=8/seed=2/params.json')],
    ]);
  });

  it('supplies the seed when nothing else does', async () => {
    const root = await tree({ 'ticks=8/run_a/log.csv': LOG, 'ticks=8/run_a/params.json': '{"seed": 5}' });
    const { sources, problems } = await locate([root], none);
    expect(problems).toEqual([]);
    expect(sources.map((s) => [s.params, s.seed, s.identity])).toEqual([[{ ticks: '8' }, '5', 'hive']]);
  });

  it('reads only the params.json in the same folder, not a parent folder', async () => {
    const root = await tree({ 'ticks=8/params.json': '{"ticks": 99, "extra": 1}', 'ticks=8/seed=1/log.csv': LOG });
    const { sources, problems } = await locate([root], none);
    expect(problems).toEqual([]);
    expect(sources.map((s) => s.params)).toEqual([{ ticks: '8' }]);
  });
});

describe('locate: files that are not runs', () => {
  it('gives each file without a seed a distinct seed in path order, with a problem', async () => {
    const root = await tree({ 'ticks=8/b/log.csv': LOG, 'ticks=8/a/log.csv': LOG, 'plain.csv': LOG });
    const { sources, problems } = await locate([root], none);
    expect(sources.map((s) => [s.relPath, s.seed, s.identity])).toEqual([
      ['plain.csv', 'auto-1', 'none'],
      ['ticks=8/a/log.csv', 'auto-2', 'hive'],
      ['ticks=8/b/log.csv', 'auto-3', 'hive'],
    ]);
    expect(problems.map((p) => [p.code, p.file])).toEqual([
      ['seed-missing', join(root, 'plain.csv')],
      ['seed-missing', join(root, 'ticks=8/a/log.csv')],
      ['seed-missing', join(root, 'ticks=8/b/log.csv')],
    ]);
    expect(problems[0]?.message).toContain('auto-1');
  });

  it('lists files with other extensions as skipped, each with a note', async () => {
    const root = await tree({
      'seed=1/log.csv': LOG,
      'seed=1/model.pt': 'x',
      'seed=1/config.yaml': 'x',
      'seed=1/params.json': '{}',
    });
    const { sources, files, problems } = await locate([root], none);
    expect(sources.map((s) => s.relPath)).toEqual(['seed=1/log.csv']);
    expect(files).toEqual([
      {
        file: join(root, 'seed=1/config.yaml'),
        status: 'skipped',
        rows: 0,
        rejectedRows: 0,
        runs: [],
        kind: 'unknown',
      },
      { file: join(root, 'seed=1/model.pt'), status: 'skipped', rows: 0, rejectedRows: 0, runs: [], kind: 'unknown' },
    ]);
    expect(problems.map((p) => [p.code, p.severity, p.file])).toEqual([
      ['file-skipped', 'note', join(root, 'seed=1/config.yaml')],
      ['file-skipped', 'note', join(root, 'seed=1/model.pt')],
    ]);
  });

  it('reports no-logs for a folder without log files and for a non-log file PATH', async () => {
    const root = await tree({ 'empty/': '', 'docs/notes.md': 'x', 'runs/seed=1/log.csv': LOG });
    const notes = join(root, 'docs/notes.md');
    const { sources, files, problems } = await locate([join(root, 'empty'), join(root, 'runs'), notes], none);
    expect(sources).toHaveLength(1);
    expect(files.map((f) => [f.file, f.status])).toEqual([[notes, 'skipped']]);
    expect(problems.map((p) => [p.code, p.severity, p.file])).toEqual([
      ['no-logs', 'error', join(root, 'empty')],
      ['no-logs', 'error', notes],
    ]);
  });

  it('ends on a symbolic link loop with a problem', async () => {
    const root = await tree({ 'seed=1/log.csv': LOG, 'seed=1/again': { link: '..' } });
    const { sources, problems } = await locate([root], none);
    expect(sources.map((s) => s.relPath)).toEqual(['seed=1/log.csv']);
    expect(problems.map((p) => [p.code, p.file])).toEqual([['file-skipped', join(root, 'seed=1/again')]]);
    expect(problems[0]?.message).toMatch(/symbolic link loop/);
  });

  it('throws a usage error naming a PATH that does not exist', async () => {
    const root = await tree({});
    const missing = join(root, 'no-such-runs');
    const error = await locate([missing], none).then(
      () => null,
      (e: unknown) => e,
    );
    expect(error).toBeInstanceOf(SeedsiftError);
    expect(error).toMatchObject({ code: 'usage', file: missing });
    expect((error as Error).message).toContain(missing);
  });
});
