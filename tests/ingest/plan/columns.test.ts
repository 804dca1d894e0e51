import { describe, expect, it } from 'vitest';
import { nameWords, planColumns } from '../../../src/ingest/plan/columns.js';
import { none, opts } from '../../fixtures/ingest/tree.js';

// Expected values: DESIGN.md "Inputs" (step column order, name@k tick columns, seed column,
// --seed-columns with {seed} and *, aggregates ignored) and the problem table in src/problems.ts.

describe('planColumns', () => {
  it('step column: the first of step, global_step, iteration, iter, epoch, timestep, frame present', () => {
    expect(planColumns(['epoch', 'iteration', 'loss'], none).step).toBe(1); // iteration comes before epoch in the list
    expect(planColumns(['frame', 'loss'], none).step).toBe(0);
    expect(planColumns(['Step', 'loss'], none).step).toBeNull(); // exact names
    expect(planColumns(['t', 'loss'], { ...none, step: 't' }).step).toBe(0);
    expect(planColumns(['step', 'loss'], { ...none, step: 't' }).step).toBeNull(); // --step wins, even if absent
  });

  it('metrics are the other columns; name@k are per-tick columns; a seed column is never a metric', () => {
    const p = planColumns(['step', 'loss', 'acc@0', 'acc@1', 'seed', 'lr@x'], none);
    expect(p.scalars).toEqual([1, 5]);
    expect(p.wideTicks).toEqual([
      { base: 'acc', tick: 0, index: 2 },
      { base: 'acc', tick: 1, index: 3 },
    ]);
    expect(p.kind).toBe('log');
  });

  it('a tick column makes a long per-tick log; sample and tick make a tick dump', () => {
    expect(planColumns(['step', 'tick', 'acc'], none)).toMatchObject({ kind: 'log', tick: 1, scalars: [2] });
    expect(planColumns(['sample', 'tick', 'correct', 'certainty'], none)).toMatchObject({
      kind: 'tick-dump',
      scalars: [],
      tick: null,
    });
  });

  it('duplicate names: later ones get _2, _3 (skipping names that exist)', () => {
    const p = planColumns(['step', 'loss', 'loss', 'loss_2', 'loss'], none);
    expect(p.names).toEqual(['step', 'loss', 'loss_3', 'loss_2', 'loss_4']);
    expect(p.duplicated).toEqual(['loss']);
  });

  it('--seed-column: found by name', () => {
    expect(planColumns(['step', 'run_seed', 'acc'], opts({ seedColumn: 'run_seed' }))).toMatchObject({
      seed: 1,
      scalars: [2],
    });
  });

  it('--seed-columns: per-seed columns, aggregates ignored, others unused', () => {
    const p = planColumns(
      ['step', 'seed_1_acc', 'seed_2_acc', 'acc_mean', 'acc_std', 'lr'],
      opts({ seedColumns: 'acc:seed_{seed}_*' }),
    );
    expect(p.perSeed).toEqual([
      { metric: 'acc', seed: '1', index: 1 },
      { metric: 'acc', seed: '2', index: 2 },
    ]);
    expect(p.aggregates).toEqual(['acc_mean', 'acc_std']);
    expect(p.unmatched).toEqual(['lr']);
    expect(p.scalars).toEqual([]);
  });
});

describe('nameWords', () => {
  it('splits at non-alphanumerics and lower-to-upper case changes', () => {
    expect(nameWords('valLoss_top1-err')).toEqual(['val', 'loss', 'top1', 'err']);
  });
});
