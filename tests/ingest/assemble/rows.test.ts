import { describe, expect, it } from 'vitest';
import { ingestTree, opts, runById, withCode } from '../../fixtures/ingest/tree.js';

// DESIGN.md "Messy logs" (nothing dropped silently) and the problem table (`step-invalid`: step
// cells that are empty, not numbers or not finite; those rows dropped). Lines counted by hand.
describe('rows with an unusable step', () => {
  it('are dropped and reported with the lines of the first few', async () => {
    const log = ['step,loss', '1,0.5', 'abc,0.4', ',0.3', '4,0.2', 'nan,0.1', '6,0.05'].join('\n');
    const { set, at } = await ingestTree({ 'seed=1/log.csv': `${log}\n` });
    const loss = runById(set, 'seed=1').metrics.loss;
    expect(Array.from(loss?.steps ?? [])).toEqual([1, 4, 6]);
    expect(Array.from(loss?.values ?? [])).toEqual([0.5, 0.2, 0.05]);
    expect(withCode(set, 'step-invalid')).toEqual([
      {
        severity: 'warning',
        code: 'step-invalid',
        message:
          '3 row(s) have a step cell that is empty, not a number or not finite; ' +
          'those rows were dropped (lines 3, 4, 6)',
        file: at('seed=1/log.csv'),
        line: 3,
        run: 'seed=1',
      },
    ]);
  });

  it('lists at most five lines but counts every row', async () => {
    const rows = Array.from({ length: 8 }, (_, k) => `x${k},0.1`);
    const { set } = await ingestTree({ 'seed=1/log.csv': `step,loss\n1,0.5\n${rows.join('\n')}\n` });
    expect(withCode(set, 'step-invalid').map((p) => p.message)).toEqual([
      '8 row(s) have a step cell that is empty, not a number or not finite; those rows were dropped; the first 5 ' +
        '(lines 3, 4, 5, 6, 7)',
    ]);
  });

  it('with --seed-column, rows of two seeds stacked: lines still point at the file', async () => {
    const log = ['step,seed,acc', '1,a,0.1', '1,b,0.2', 'oops,b,0.3', '2,a,0.4'].join('\n');
    const { set } = await ingestTree({ 'm=x/runs.csv': `${log}\n` }, opts({ seedColumn: 'seed' }));
    expect(withCode(set, 'step-invalid').map((p) => [p.run, p.line])).toEqual([['m=x,seed=b', 4]]);
    expect(Array.from(runById(set, 'm=x,seed=b').metrics.acc?.values ?? [])).toEqual([0.2]);
  });
});
