import { describe, expect, it } from 'vitest';
import { configId, configKeys, runId } from '../../../src/ingest/assemble/runIds.js';
import { ingestTree, runById, withCode } from '../../fixtures/ingest/tree.js';

// Each case is a row of DESIGN.md "Messy logs" (policy, and "every case is reported"), checked
// end to end: the exact policy on the numbers, and the problem code with its file and line (lines
// counted by hand on the fixture, header = line 1).
const series = (s: { steps: Float64Array; values: Float64Array } | undefined): number[][] =>
  s === undefined ? [] : [Array.from(s.steps), Array.from(s.values)];

describe('ids', () => {
  it('configKeys, configId, runId', () => {
    expect(configKeys([{ params: { ticks: '8', memory: '4' } }, { params: { ticks: '16', lr: '0.1' } }])).toEqual([
      'ticks',
      'memory',
      'lr',
    ]);
    expect(configId({ memory: '4', ticks: '8' }, ['ticks', 'memory'])).toBe('ticks=8,memory=4');
    expect(runId('ticks=8', '3')).toBe('ticks=8,seed=3');
    expect(runId('', '3')).toBe('seed=3');
  });
});

describe('messy logs, end to end', () => {
  it('duplicated steps (resumed run): the last row in file order wins; count and line reported', async () => {
    const log = ['step,loss', '1,0.5', '2,0.4', '3,0.3', '2,0.45', '3,0.35', '4,0.2'].join('\n');
    const { set, at } = await ingestTree({ 'seed=1/log.csv': `${log}\n` });
    expect(series(runById(set, 'seed=1').metrics.loss)).toEqual([
      [1, 2, 3, 4],
      [0.5, 0.45, 0.35, 0.2],
    ]);
    expect(withCode(set, 'steps-duplicated')).toEqual([
      {
        severity: 'note',
        code: 'steps-duplicated',
        message: '2 step(s) logged more than once (first: step 2); the last row in file order was kept for each',
        file: at('seed=1/log.csv'),
        line: 5,
        run: 'seed=1',
      },
    ]);
    expect(withCode(set, 'steps-unsorted')).toEqual([]);
  });

  it('unsorted steps: sorted and reported at the first row that goes back', async () => {
    const { set, at } = await ingestTree({ 'seed=1/log.csv': 'step,loss\n1,0.5\n3,0.3\n2,0.4\n' });
    expect(series(runById(set, 'seed=1').metrics.loss)).toEqual([
      [1, 2, 3],
      [0.5, 0.4, 0.3],
    ]);
    expect(withCode(set, 'steps-unsorted')).toEqual([
      expect.objectContaining({ file: at('seed=1/log.csv'), line: 4, run: 'seed=1' }),
    ]);
  });

  it('train and eval rows mixed: each metric keeps its own rows; empty cells counted', async () => {
    const { set } = await ingestTree({
      'seed=1/log.csv': 'step,train_loss,val_acc\n10,0.9,\n20,0.8,\n20,,0.5\n30,0.7,\n',
    });
    const run = runById(set, 'seed=1');
    expect(series(run.metrics.train_loss)).toEqual([
      [10, 20, 30],
      [0.9, 0.8, 0.7],
    ]);
    expect(series(run.metrics.val_acc)).toEqual([[20], [0.5]]);
    expect(withCode(set, 'steps-duplicated')).toEqual([]); // different metrics at step 20
    expect(withCode(set, 'cells-missing').map((p) => p.message)).toEqual([
      'cells treated as missing: train_loss 1 (1 empty); val_acc 3 (3 empty)',
    ]);
    expect(run.metrics.val_acc?.missing).toBe(3);
  });

  it('nan, inf and text cells: missing, counted by kind', async () => {
    const { set } = await ingestTree({ 'seed=1/log.csv': 'step,loss\n1,0.5\n2,nan\n3,inf\n4,n/a\n5,0.1\n' });
    const loss = runById(set, 'seed=1').metrics.loss;
    expect(series(loss)).toEqual([
      [1, 5],
      [0.5, 0.1],
    ]);
    expect(loss?.missing).toBe(3);
    expect(withCode(set, 'cells-missing').map((p) => p.message)).toEqual([
      'cells treated as missing: loss 3 (2 nan/inf, 1 not a number)',
    ]);
    expect(runById(set, 'seed=1').status).toBe('ok');
  });

  it('a metric that goes non-finite and stays so: run diverged at that step', async () => {
    const log = ['step,loss,acc', '1,0.5,0.1', '2,0.4,0.2', '3,nan,0.3', '4,,0.4', '5,inf,0.5'].join('\n');
    const { set, at } = await ingestTree({ 'seed=1/log.csv': `${log}\n` });
    const run = runById(set, 'seed=1');
    expect(run.status).toBe('diverged');
    expect(run.divergedAt).toBe(3);
    expect(run.metrics.loss?.divergedAt).toBe(3);
    expect(run.metrics.acc?.divergedAt).toBeNull();
    expect(run.lastStep).toBe(5); // acc is finite at step 5
    expect(withCode(set, 'run-diverged')).toEqual([
      {
        severity: 'warning',
        code: 'run-diverged',
        message: 'went non-finite and stayed so: loss (step 3); the run is marked diverged at step 3',
        file: at('seed=1/log.csv'),
        line: 4,
        run: 'seed=1',
      },
    ]);
  });

  it('runs of different lengths: below 90% of the longest run of the config is short', async () => {
    const log = (last: number): string =>
      `step,acc\n${Array.from({ length: last / 10 }, (_, k) => `${(k + 1) * 10},0.5`).join('\n')}\n`;
    const { set } = await ingestTree({
      'c=a/seed=1/l.csv': log(100),
      'c=a/seed=2/l.csv': log(90),
      'c=a/seed=3/l.csv': log(80),
      'c=b/seed=1/l.csv': log(50),
    });
    expect(set.runs.map((r) => [r.id, r.status, r.lastStep])).toEqual([
      ['c=a,seed=1', 'ok', 100],
      ['c=a,seed=2', 'ok', 90], // 90 is not below 0.9 x 100
      ['c=a,seed=3', 'short', 80],
      ['c=b,seed=1', 'ok', 50], // compared within its own config only
    ]);
    expect(withCode(set, 'run-short').map((p) => [p.run, p.message])).toEqual([
      ['c=a,seed=3', 'the run ends at step 80, below 90% of the longest run of its config (step 100)'],
    ]);
  });

  it('the short-run threshold is exactly 90% of the longest: 900 of 1000 is ok, 899 (89.9%) is short', async () => {
    // DESIGN.md "Messy logs": below 0.9 x the longest run of the config is short. 0.9 x 1000 = 900 exactly
    // in binary floating point (the product rounds to 900), so 900 is not below it; 899 is.
    const log = (last: number): string => `step,acc\n1,0.5\n${last},0.5\n`;
    const { set } = await ingestTree({
      'c=a/seed=1/l.csv': log(1000),
      'c=a/seed=2/l.csv': log(900),
      'c=a/seed=3/l.csv': log(899),
    });
    expect(set.runs.map((r) => [r.id, r.status])).toEqual([
      ['c=a,seed=1', 'ok'],
      ['c=a,seed=2', 'ok'],
      ['c=a,seed=3', 'short'],
    ]);
  });

  it('two sources with one config and seed: run-duplicate, rows merged in order, later wins', async () => {
    const { set, at } = await ingestTree({
      'c=a/seed=1/a.csv': 'step,acc\n1,0.1\n2,0.2\n',
      'c=a/seed=1/b.csv': 'step,acc\n2,0.25\n3,0.3\n',
    });
    expect(series(runById(set, 'c=a,seed=1').metrics.acc)).toEqual([
      [1, 2, 3],
      [0.1, 0.25, 0.3],
    ]);
    expect(runById(set, 'c=a,seed=1').files).toEqual([at('c=a/seed=1/a.csv'), at('c=a/seed=1/b.csv')]);
    expect(withCode(set, 'run-duplicate')).toEqual([
      expect.objectContaining({ run: 'c=a,seed=1', file: at('c=a/seed=1/b.csv') }),
    ]);
  });

  it('a metric with no finite value in a run: metric-empty', async () => {
    const { set } = await ingestTree({
      'seed=1/l.csv': 'step,acc,loss\n1,0.5,\n',
      'seed=2/l.csv': 'step,acc,loss\n1,0.5,0.3\n',
    });
    expect(withCode(set, 'metric-empty').map((p) => [p.run, p.message])).toEqual([
      ['seed=1', 'loss has no finite value in this run'],
    ]);
    expect(runById(set, 'seed=1').metrics.loss?.values.length).toBe(0);
  });

  it('a file without a step column is skipped and its run rejected; nothing is dropped silently', async () => {
    const { set, at } = await ingestTree({ 'seed=1/l.csv': 'time,acc\n1,0.5\n' });
    expect(withCode(set, 'step-column-missing')).toEqual([
      expect.objectContaining({ file: at('seed=1/l.csv'), severity: 'error' }),
    ]);
    expect(set.files).toEqual([
      { file: at('seed=1/l.csv'), status: 'skipped', rows: 0, rejectedRows: 0, runs: [], kind: 'log' },
    ]);
    expect(set.runs.map((r) => [r.id, r.status, r.files])).toEqual([['seed=1', 'rejected', [at('seed=1/l.csv')]]]);
  });
});
