import { describe, expect, it } from 'vitest';
import { gz, ingestTree, runById, withCode } from '../../fixtures/ingest/tree.js';

// DESIGN.md "Messy logs" (malformed rows rejected with file and line, the run keeps its other
// rows; every case reported) and "Inputs" (header drift is read by name); the problem table in
// src/problems.ts. Lines are counted by hand on each fixture (header = line 1).
describe('malformed rows', () => {
  it('are rejected with their exact line, even after a blank line and a field spanning two lines', async () => {
    const log = [
      'step,loss,note', // 1
      '1,0.5,a', // 2
      '', // 3
      '2,0.4,"two', // 4
      'lines"', // 5
      '3,0.3', // 6  too few fields
      '4,0.2,b,extra', // 7  too many fields
      '5,0.1,c', // 8
    ].join('\n');
    const { set, at } = await ingestTree({ 'seed=1/log.csv': `${log}\n` });
    const file = at('seed=1/log.csv');
    expect(withCode(set, 'row-malformed').map((p) => [p.file, p.line])).toEqual([
      [file, 6],
      [file, 7],
    ]);
    expect(withCode(set, 'row-malformed')[0]?.message).toBe(
      'row rejected, the run keeps its other rows: missing columns: Expected Number of Columns: 3 Found: 2 ' +
        '(column note)',
    );
    expect(Array.from(runById(set, 'seed=1').metrics.loss?.steps ?? [])).toEqual([1, 2, 5]);
    expect(set.files.find((f) => f.file === file)).toMatchObject({ status: 'read', rows: 3, rejectedRows: 2 });
  });

  it('in a gzipped file with CR LF line ends', async () => {
    const { set, at } = await ingestTree({ 'seed=1/log.csv.gz': gz('step,loss\r\n1,0.5\r\n2\r\n3,0.3\r\n') });
    expect(withCode(set, 'row-malformed').map((p) => [p.file, p.line])).toEqual([[at('seed=1/log.csv.gz'), 3]]);
  });

  it('in a whitespace-separated file', async () => {
    const { set, at } = await ingestTree({ 'seed=1/log.txt': 'step  loss\n1     0.5\n\n2     0.4  9\n3     0.3\n' });
    expect(withCode(set, 'row-malformed')).toEqual([
      expect.objectContaining({
        file: at('seed=1/log.txt'),
        line: 4,
        message: 'row rejected, the run keeps its other rows: expected 2 whitespace-separated fields',
      }),
    ]);
    expect(Array.from(runById(set, 'seed=1').metrics.loss?.values ?? [])).toEqual([0.5, 0.3]);
  });

  it('beyond 20 per file, the rest are counted in one problem', async () => {
    const rows = Array.from({ length: 25 }, (_, k) => `${k}`);
    const { set } = await ingestTree({ 'seed=1/log.csv': `step,loss\n${rows.join('\n')}\n` });
    const malformed = withCode(set, 'row-malformed');
    expect(malformed).toHaveLength(21);
    expect(malformed[20]?.message).toBe('5 more malformed row(s) were rejected (25 in all)');
    expect(runById(set, 'seed=1').status).toBe('rejected');
  });
});

describe('file-level problems', () => {
  it('empty and header-only files: file-empty, no run', async () => {
    const { set, at } = await ingestTree({
      'seed=1/a.csv': '',
      'seed=2/a.csv': 'step,loss\n',
      'seed=3/a.csv': 'step,loss\n1,0.5\n',
    });
    expect(withCode(set, 'file-empty').map((p) => p.file)).toEqual([at('seed=1/a.csv'), at('seed=2/a.csv')]);
    expect(set.runs.map((r) => r.id)).toEqual(['seed=3']);
  });

  it('duplicate column names: renamed with a suffix and reported', async () => {
    const { set, at } = await ingestTree({ 'seed=1/a.csv': 'step,loss,loss\n1,0.5,0.6\n' });
    expect(withCode(set, 'column-duplicated')).toEqual([
      expect.objectContaining({ file: at('seed=1/a.csv'), severity: 'warning' }),
    ]);
    expect(Object.keys(runById(set, 'seed=1').metrics)).toEqual(['loss', 'loss_2']);
    expect(Array.from(runById(set, 'seed=1').metrics.loss_2?.values ?? [])).toEqual([0.6]);
  });

  it('header drift: files are read by name and the drift is reported', async () => {
    const { set, at } = await ingestTree({
      'seed=1/a.csv': 'step,loss,acc\n1,0.5,0.1\n',
      'seed=2/a.csv': 'step,loss,acc\n1,0.6,0.2\n',
      'seed=3/a.csv': 'acc,step,val_loss\n0.3,1,0.7\n',
    });
    expect(withCode(set, 'header-drift')).toEqual([
      expect.objectContaining({
        file: at('seed=3/a.csv'),
        message:
          `1 file(s) have other columns than the 2 file(s) like ${at('seed=1/a.csv')} (missing: loss; extra: ` +
          `val_loss); columns were matched by name`,
      }),
    ]);
    expect(Array.from(runById(set, 'seed=3').metrics.acc?.values ?? [])).toEqual([0.3]);
    expect(Object.keys(runById(set, 'seed=3').metrics)).toEqual(['acc', 'val_loss']);
  });

  it('per-tick columns of different tick counts are not drift', async () => {
    const { set } = await ingestTree({
      'ticks=2/seed=1/a.csv': 'step,acc@0,acc@1\n1,0.1,0.2\n',
      'ticks=3/seed=1/a.csv': 'step,acc@0,acc@1,acc@2\n1,0.1,0.2,0.3\n',
    });
    expect(withCode(set, 'header-drift')).toEqual([]);
  });

  it('a column without a number anywhere is not a metric', async () => {
    const { set } = await ingestTree({
      'seed=1/a.csv': 'step,phase,acc\n1,train,0.5\n',
      'seed=2/a.csv': 'step,phase,acc\n1,eval,0.6\n',
    });
    expect(withCode(set, 'column-not-numeric').map((p) => p.message)).toEqual([
      expect.stringMatching(/^column phase holds no numbers in any file and is not a metric/),
    ]);
    expect(set.metrics.map((m) => m.name)).toEqual(['acc']);
  });
});
