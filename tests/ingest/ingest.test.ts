import { mkdir } from 'node:fs/promises';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { closeEngine, openEngine } from '../../src/ingest/load/duckdb.js';
import { ingest } from '../../src/ingest/ingest.js';
import type { RunSet } from '../../src/ingest/types.js';
import { gz, ingestTree, makeTree, none, opts, removeTree, runById, withCode } from '../fixtures/ingest/tree.js';

// Expected values follow DESIGN.md "Inputs" (formats, step column, headerless files, metrics and
// goals, per-tick metrics, tick dumps, seed column(s)); the numbers are the fixtures' own.
const values = (set: RunSet, id: string, metric: string): number[][] => {
  const s = runById(set, id).metrics[metric];
  return s === undefined ? [] : [Array.from(s.steps), Array.from(s.values)];
};

const made: string[] = [];
afterEach(async () => {
  await Promise.all(made.splice(0).map(removeTree));
});

describe('formats', () => {
  it('csv, tsv, sniffed txt (; and aligned whitespace), csv.gz: the same numbers', async () => {
    const { set } = await ingestTree({
      'fmt=csv/seed=1/log.csv': 'step,loss,acc\n1,0.5,0.25\n2,0.4,0.5\n',
      'fmt=tsv/seed=1/log.tsv': 'step\tloss\tacc\n1\t0.5\t0.25\n2\t0.4\t0.5\n',
      'fmt=semi/seed=1/log.txt': 'step;loss;acc\n1;0.5;0.25\n2;0.4;0.5\n',
      'fmt=ws/seed=1/log.txt': 'step   loss   acc\n   1   0.5    0.25\n   2   0.4    0.5\n',
      'fmt=gz/seed=1/log.csv.gz': gz('step,loss,acc\n1,0.5,0.25\n2,0.4,0.5\n'),
    });
    expect(set.runs.map((r) => r.id).sort()).toEqual([
      'fmt=csv,seed=1',
      'fmt=gz,seed=1',
      'fmt=semi,seed=1',
      'fmt=tsv,seed=1',
      'fmt=ws,seed=1',
    ]);
    for (const run of set.runs) {
      expect(values(set, run.id, 'loss')).toEqual([
        [1, 2],
        [0.5, 0.4],
      ]);
      expect(values(set, run.id, 'acc')).toEqual([
        [1, 2],
        [0.25, 0.5],
      ]);
      expect(run.status).toBe('ok');
    }
    expect(set.problems.filter((p) => p.severity !== 'note')).toEqual([]);
  });

  it('parquet written by DuckDB (typed columns, NULL cells missing)', async () => {
    const root = await makeTree({});
    made.push(root);
    const file = join(root, 'seed=7', 'log.parquet');
    const engine = await openEngine();
    try {
      await mkdir(join(root, 'seed=7'));
      await engine.connection.run(
        `COPY (SELECT * FROM (VALUES (10::BIGINT, 0.5::DOUBLE, 'a'), (20, NULL, 'b'), (30, 'nan'::DOUBLE, 'c')) ` +
          `t(step, loss, tag)) TO '${file}' (FORMAT parquet)`,
      );
    } finally {
      closeEngine(engine);
    }
    const set = await ingest([join(root, 'seed=7')], none);
    const run = runById(set, 'seed=7');
    expect(Array.from(run.metrics.loss?.values ?? [])).toEqual([0.5]);
    expect(run.metrics.loss?.missing).toBe(2);
    expect(run.status).toBe('diverged'); // the last value is nan
    expect(run.divergedAt).toBe(30);
    expect(withCode(set, 'column-not-numeric').map((p) => p.message)).toEqual([
      expect.stringContaining('column tag holds no numbers'),
    ]);
    const diverged = withCode(set, 'run-diverged')[0];
    expect(diverged?.message).toMatch(/\(row 3\)$/); // Parquet has rows, not lines
    expect(diverged?.line).toBeUndefined();
  });

  it('headerless files with --columns; a first line equal to the names is a header', async () => {
    const { set } = await ingestTree(
      { 'seed=1/a.csv': '1,0.5\n2,0.25\n', 'seed=2/b.csv': 'iter,loss\n1,0.75\n' },
      opts({ columns: ['iter', 'loss'] }),
    );
    expect(values(set, 'seed=1', 'loss')).toEqual([
      [1, 2],
      [0.5, 0.25],
    ]);
    expect(values(set, 'seed=2', 'loss')).toEqual([[1], [0.75]]);
  });

  it('--step names the step column', async () => {
    const { set } = await ingestTree(
      { 'seed=1/a.csv': 'wallclock,step,loss\n5,100,0.5\n6,101,0.25\n' },
      opts({ step: 'wallclock' }),
    );
    expect(values(set, 'seed=1', 'loss')).toEqual([
      [5, 6],
      [0.5, 0.25],
    ]);
    expect(Object.keys(runById(set, 'seed=1').metrics)).toEqual(['step', 'loss']);
  });
});

describe('metrics and goals', () => {
  it('every other numeric column is a metric; goals from --metric or the name, guesses noted', async () => {
    const { set } = await ingestTree(
      { 'seed=1/a.csv': 'step,val_loss,top1_err,acc,phase\n1,0.5,0.1,0.9,train\n' },
      opts({ metricGoals: { acc: 'min' } }),
    );
    expect(set.metrics).toEqual([
      { name: 'val_loss', goal: 'min', goalSource: 'inferred', bookkeeping: false, kind: 'scalar', ticks: 0 },
      { name: 'top1_err', goal: 'min', goalSource: 'inferred', bookkeeping: false, kind: 'scalar', ticks: 0 },
      { name: 'acc', goal: 'min', goalSource: 'option', bookkeeping: false, kind: 'scalar', ticks: 0 },
    ]);
    expect(withCode(set, 'goal-inferred').map((p) => p.message.split(':')[0])).toEqual(['val_loss', 'top1_err']);
    expect(withCode(set, 'column-not-numeric')).toHaveLength(1);
  });
});

describe('run ids and keys', () => {
  it('keys in first-seen order; id = config then seed; empty config gives seed=S', async () => {
    const { set } = await ingestTree({
      'ticks=8/memory=4/seed=1/a.csv': 'step,acc\n1,0.5\n',
      'ticks=8/lr=0.1/seed=2/a.csv': 'step,acc\n1,0.5\n',
    });
    expect(set.keys).toEqual(['ticks', 'lr', 'memory']);
    expect(set.runs.map((r) => [r.id, r.config, r.seed])).toEqual([
      ['ticks=8,lr=0.1,seed=2', 'ticks=8,lr=0.1', '2'],
      ['ticks=8,memory=4,seed=1', 'ticks=8,memory=4', '1'],
    ]);
    const bare = await ingestTree({ 'seed=3/a.csv': 'step,acc\n1,0.5\n' });
    expect(bare.set.runs.map((r) => [r.id, r.config])).toEqual([['seed=3', '']]);
  });
});

describe('blank lines before the header', () => {
  // DESIGN.md "Inputs": a log is a per-step table; blank lines carry nothing, so leading ones are
  // skipped, and problems still name the physical line (counted by hand in each fixture).
  it('are skipped in csv, crlf csv, whitespace txt and gzip, and lines are still counted from the top', async () => {
    const { set, at } = await ingestTree({
      'f=csv/seed=1/log.csv': '\n  \nstep,loss\n1,0.5\nx,0.4\n3,0.3\n',
      'f=crlf/seed=1/log.csv': '\r\n\r\nstep,loss\r\n1,0.5\r\n2,0.4,7\r\n3,0.3\r\n',
      'f=ws/seed=1/log.txt': '\n   \nstep loss\n1 0.5\n2 0.4 9\n3 0.3\n',
      'f=gz/seed=1/log.csv.gz': gz('\n\nstep,loss\n1,0.5\n2,0.4\n'),
    });
    expect(withCode(set, 'step-column-missing')).toEqual([]);
    expect(values(set, 'f=csv,seed=1', 'loss')).toEqual([
      [1, 3],
      [0.5, 0.3],
    ]);
    expect(values(set, 'f=crlf,seed=1', 'loss')).toEqual([
      [1, 3],
      [0.5, 0.3],
    ]);
    expect(values(set, 'f=ws,seed=1', 'loss')).toEqual([
      [1, 3],
      [0.5, 0.3],
    ]);
    expect(values(set, 'f=gz,seed=1', 'loss')).toEqual([
      [1, 2],
      [0.5, 0.4],
    ]);
    expect(withCode(set, 'step-invalid')).toEqual([
      expect.objectContaining({ file: at('f=csv/seed=1/log.csv'), line: 5 }),
    ]);
    const malformed = withCode(set, 'row-malformed').map((p) => [p.file, p.line]);
    expect(malformed).toEqual(
      expect.arrayContaining([
        [at('f=crlf/seed=1/log.csv'), 5],
        [at('f=ws/seed=1/log.txt'), 5],
      ]),
    );
  });
});

describe('seed column and seed columns', () => {
  it('--seed-column: one file holds many seeds, one run per seed', async () => {
    const { set, at } = await ingestTree(
      { 'method=a/runs.csv': 'step,seed,acc\n1,1,0.5\n1,2,0.6\n2,1,0.55\n2,2,0.65\n3,,0.7\n' },
      opts({ seedColumn: 'seed' }),
    );
    expect(set.runs.map((r) => [r.id, r.identity])).toEqual([
      ['method=a,seed=1', 'seed-column'],
      ['method=a,seed=2', 'seed-column'],
    ]);
    expect(values(set, 'method=a,seed=2', 'acc')).toEqual([
      [1, 2],
      [0.6, 0.65],
    ]);
    expect(withCode(set, 'seed-missing')).toEqual([
      expect.objectContaining({ file: at('method=a/runs.csv'), line: 6 }),
    ]);
    expect(set.files.find((f) => f.file === at('method=a/runs.csv'))?.runs).toEqual([
      'method=a,seed=1',
      'method=a,seed=2',
    ]);
  });

  it('--seed-columns: one column per seed; aggregate columns ignored and reported', async () => {
    const { set, at } = await ingestTree(
      {
        'task=x/wide.csv':
          'step,seed_1_acc,seed_2_acc,acc_mean,acc_std,lr\n1,0.5,0.6,0.55,0.05,0.1\n2,0.7,0.8,0.75,0.05,0.1\n',
      },
      opts({ seedColumns: 'acc:seed_{seed}_*' }),
    );
    expect(set.runs.map((r) => r.id)).toEqual(['task=x,seed=1', 'task=x,seed=2']);
    expect(values(set, 'task=x,seed=2', 'acc')).toEqual([
      [1, 2],
      [0.6, 0.8],
    ]);
    expect(withCode(set, 'aggregate-columns-ignored')).toEqual([
      expect.objectContaining({
        file: at('task=x/wide.csv'),
        message: 'columns that look like aggregates were ignored: acc_mean, acc_std',
      }),
    ]);
    expect(withCode(set, 'column-unused')).toEqual([
      expect.objectContaining({ message: 'columns matching no --seed-columns pattern were not used: lr' }),
    ]);
  });
});

describe('per-tick metrics', () => {
  it('wide name@k columns become a TickSeries; the scalar of the same name stays', async () => {
    const { set } = await ingestTree({
      'seed=1/a.csv': 'step,acc,acc@0,acc@1,acc@2\n10,0.9,0.3,0.6,0.9\n20,,,,\n30,0.95,0.4,,0.95\n',
    });
    const run = runById(set, 'seed=1');
    expect(Array.from(run.tickMetrics.acc?.steps ?? [])).toEqual([10, 30]);
    expect(run.tickMetrics.acc?.values.map((v) => Array.from(v))).toEqual([
      [0.3, 0.4],
      [0.6, NaN],
      [0.9, 0.95],
    ]);
    expect(set.metrics.map((m) => [m.name, m.kind, m.ticks])).toEqual([
      ['acc', 'scalar', 0],
      ['acc', 'tick', 3],
    ]);
  });

  it('a long file with a tick column', async () => {
    const { set } = await ingestTree({ 'seed=1/ticks.csv': 'step,tick,acc\n10,0,0.3\n10,1,0.6\n20,0,0.4\n20,1,0.7\n' });
    const t = runById(set, 'seed=1').tickMetrics.acc;
    expect(Array.from(t?.steps ?? [])).toEqual([10, 20]);
    expect(t?.values.map((v) => Array.from(v))).toEqual([
      [0.3, 0.4],
      [0.6, 0.7],
    ]);
  });
});

describe('tick dumps', () => {
  it('sample, tick, correct, certainty, confidence, step -> sample-major arrays', async () => {
    const dump =
      'sample,tick,correct,certainty,confidence,step\n' +
      '1,0,0,0.2,0.5,100\n1,1,1,0.9,0.8,100\n0,0,1,0.4,0.6,100\n0,1,1,0.95,0.9,100\n';
    const { set, at } = await ingestTree({
      'ticks=2/seed=1/log.csv': 'step,acc\n100,0.5\n',
      'ticks=2/seed=1/dump.csv.gz': gz(dump),
    });
    expect(set.tickDumps).toHaveLength(1);
    const d = set.tickDumps[0];
    expect(d).toMatchObject({
      run: 'ticks=2,seed=1',
      config: 'ticks=2',
      seed: '1',
      file: at('ticks=2/seed=1/dump.csv.gz'),
      step: 100,
      samples: 2,
      ticks: 2,
    });
    expect(Array.from(d?.correct ?? [])).toEqual([1, 1, 0, 1]);
    expect(Array.from(d?.certainty ?? [])).toEqual([0.4, 0.95, 0.2, 0.9]);
    expect(Array.from(d?.confidence ?? [])).toEqual([0.6, 0.9, 0.5, 0.8]);
    expect(set.files.find((f) => f.file === at('ticks=2/seed=1/dump.csv.gz'))?.kind).toBe('tick-dump');
    expect(withCode(set, 'run-duplicate')).toEqual([]); // a dump is not a second log of the run
  });

  it(
    'probability columns: certainty = 1 - H/ln C (METHODS.md), ' + 'confidence = max p, correct = argmax == label',
    async () => {
      // softmax of logits [2, 1, 0]: p below; certainty 0.24232088933841778 (computed by hand, see tickDump.test.ts)
      const p = [0.6652409557748219, 0.24472847105479764, 0.09003057317038046];
      const dump = `sample,tick,label,p0,p1,p2\n0,0,0,${p.join(',')}\n0,1,2,${p.join(',')}\n`;
      const { set } = await ingestTree({ 'seed=1/dump.csv': dump });
      const d = set.tickDumps[0];
      expect(d?.certainty[0]).toBeCloseTo(0.24232088933841778, 14);
      expect(d?.confidence?.[0]).toBeCloseTo(0.6652409557748219, 15);
      expect(Array.from(d?.correct ?? [])).toEqual([1, 0]);
    },
  );

  it('a dump with a hole is not used and says why', async () => {
    const { set, at } = await ingestTree({
      'seed=1/dump.csv': 'sample,tick,correct,certainty\n0,0,1,0.5\n0,1,1,0.6\n1,0,0,0.2\n',
    });
    expect(set.tickDumps).toEqual([]);
    expect(withCode(set, 'tick-dump-invalid')).toEqual([
      expect.objectContaining({
        file: at('seed=1/dump.csv'),
        message: 'tick dump not used: sample 1 lacks tick 1 (every sample needs ticks 0..1)',
      }),
    ]);
  });
});

describe('robustness', () => {
  it('ingest returns with the problem when a file cannot be read; the other runs are fine', async () => {
    const { set, at } = await ingestTree({
      'seed=1/a.csv.gz': Buffer.from('this is not gzip'),
      'seed=2/a.csv': 'step,acc\n1,0.5\n',
    });
    expect(withCode(set, 'file-unreadable')).toEqual([
      expect.objectContaining({ file: at('seed=1/a.csv.gz'), message: 'cannot be read: not a valid gzip file' }),
    ]);
    expect(set.files.find((f) => f.file === at('seed=1/a.csv.gz'))?.status).toBe('unreadable');
    expect(runById(set, 'seed=1').status).toBe('rejected');
    expect(runById(set, 'seed=2').status).toBe('ok');
  });
});
