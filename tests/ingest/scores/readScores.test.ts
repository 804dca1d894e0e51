import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { ingest } from '../../../src/ingest/ingest.js';
import { SeedsiftError } from '../../../src/problems.js';
import { makeTree, opts, removeTree, runById } from '../../fixtures/ingest/tree.js';

// DESIGN.md "Inputs", score tables: one row per run; config columns are the non-numeric ones or
// those named by --by; a seed column; metric columns; an empty cell means no value for that run.
const made: string[] = [];
afterEach(async () => {
  await Promise.all(made.splice(0).map(removeTree));
});
async function table(name: string, text: string): Promise<string> {
  const root = await makeTree({ [name]: text });
  made.push(root);
  return join(root, name);
}

describe('score tables', () => {
  it('text columns are the config; other numeric columns are metrics at step 0', async () => {
    const file = await table(
      'scores.csv',
      'method,task,seed,acc,loss\nours,a,1,0.9,0.2\nours,a,2,0.85,\nbase,a,1,0.8,0.3\n',
    );
    const set = await ingest([], opts({ scores: file }));
    expect(set.mode).toBe('scores');
    expect(set.keys).toEqual(['method', 'task']);
    expect(set.runs.map((r) => [r.id, r.identity, r.lastStep, r.status])).toEqual([
      ['method=ours,task=a,seed=1', 'scores', 0, 'ok'],
      ['method=ours,task=a,seed=2', 'scores', 0, 'ok'],
      ['method=base,task=a,seed=1', 'scores', 0, 'ok'],
    ]);
    const run = runById(set, 'method=ours,task=a,seed=1');
    expect(Array.from(run.metrics.acc?.steps ?? [])).toEqual([0]);
    expect(Array.from(run.metrics.acc?.values ?? [])).toEqual([0.9]);
    expect(Object.keys(runById(set, 'method=ours,task=a,seed=2').metrics)).toEqual(['acc']);
    expect(set.problems.filter((p) => p.code === 'score-missing')).toEqual([
      {
        severity: 'note',
        code: 'score-missing',
        message: 'loss is empty for this run',
        file,
        line: 3,
        run: 'method=ours,task=a,seed=2',
      },
    ]);
    expect(set.metrics.map((m) => [m.name, m.goal])).toEqual([
      ['acc', 'max'],
      ['loss', 'min'],
    ]);
    expect(set.files).toEqual([
      { file, status: 'read', rows: 3, rejectedRows: 0, runs: set.runs.map((r) => r.id), kind: 'scores' },
    ]);
  });

  it('--by names config columns that hold numbers', async () => {
    const file = await table('s.tsv', 'ticks\tseed\tacc\n8\t1\t0.7\n16\t1\t0.8\n');
    const set = await ingest([], opts({ scores: file, by: ['ticks'] }));
    expect(set.runs.map((r) => r.id)).toEqual(['ticks=8,seed=1', 'ticks=16,seed=1']);
    expect(set.metrics.map((m) => m.name)).toEqual(['acc']);
  });

  it('a repeated config and seed: run-duplicate, the later row wins', async () => {
    const file = await table('s.csv', 'm,seed,acc\na,1,0.5\na,1,0.6\n');
    const set = await ingest([], opts({ scores: file }));
    expect(set.runs).toHaveLength(1);
    expect(Array.from(runById(set, 'm=a,seed=1').metrics.acc?.values ?? [])).toEqual([0.6]);
    expect(set.problems.filter((p) => p.code === 'run-duplicate').map((p) => p.line)).toEqual([3]);
  });

  it(
    'a table of numbers only (no config, no seed column): ' + 'one run per row, each seed-missing with its line',
    async () => {
      const file = await table('n.csv', 'a,b\n1,2\n3,4\n');
      const set = await ingest([], opts({ scores: file }));
      expect(set.runs.map((r) => r.id)).toEqual(['seed=auto-1', 'seed=auto-2']);
      expect(set.problems.filter((p) => p.code === 'seed-missing').map((p) => p.line)).toEqual([2, 3]);
      expect(Array.from(runById(set, 'seed=auto-2').metrics.b?.values ?? [])).toEqual([4]);
    },
  );

  it('a missing score table is a usage error; --by must name a column', async () => {
    await expect(ingest([], opts({ scores: '/nonexistent/scores.csv' }))).rejects.toThrow(SeedsiftError);
    const file = await table('s.csv', 'm,seed,acc\na,1,0.5\n');
    await expect(ingest([], opts({ scores: file, by: ['nope'] }))).rejects.toThrow(/--by: expected a column/);
  });
});
