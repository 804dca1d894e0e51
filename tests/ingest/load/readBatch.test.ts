import { describe, expect, it } from 'vitest';
import { planColumns } from '../../../src/ingest/plan/columns.js';
import { columnsToRead } from '../../../src/ingest/load/readBatch.js';
import { none, opts } from '../../fixtures/ingest/tree.js';

// Expected values: DESIGN.md "Inputs" (the step, tick and metric columns of a log are read; a tick
// dump's columns are all read, its seed column as seed codes), column positions counted by hand.
describe('columnsToRead', () => {
  it('columnsToRead: step, tick and metric columns of a log; every column of a dump but the seed', () => {
    expect(columnsToRead(planColumns(['step', 'loss', 'acc@0', 'seed'], none))).toEqual([0, 1, 2]);
    expect(columnsToRead(planColumns(['sample', 'tick', 'correct', 'run'], opts({ seedColumn: 'run' })))).toEqual([
      0, 1, 2,
    ]);
  });
});
