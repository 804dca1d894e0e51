import { describe, expect, it } from 'vitest';
import { stepOrder } from '../../../src/ingest/assemble/messy.js';
import { longTickSeries, wideTickSeries } from '../../../src/ingest/assemble/ticks.js';

// Expected values: DESIGN.md "Inputs" (per-tick metrics, wide `name@k` or long with a `tick`
// column) with the per-cell policies of "Messy logs", worked by hand.
const f64 = (...x: number[]): Float64Array => Float64Array.from(x);
const arrays = (v: readonly Float64Array[]): number[][] => v.map((a) => Array.from(a));

describe('wideTickSeries', () => {
  it('keeps the steps where any tick was logged; NaN where a tick is missing', () => {
    const steps = f64(10, 20, 30);
    // tick 0 and tick 1; step 20 is a train row with no tick cells.
    const t = wideTickSeries(steps, stepOrder(steps), [f64(0.1, NaN, 0.3), f64(0.2, NaN, Infinity)]);
    expect(Array.from(t.series.steps)).toEqual([10, 30]);
    expect(arrays(t.series.values)).toEqual([
      [0.1, 0.3],
      [0.2, NaN],
    ]);
    expect(t).toMatchObject({ empty: 2, nonFinite: 1, text: 0, duplicateSteps: [] });
  });

  it('per cell, the last row in file order wins on a repeated step', () => {
    const steps = f64(1, 2, 2);
    const t = wideTickSeries(steps, stepOrder(steps), [f64(0.1, 0.2, 0.25), f64(0.5, 0.6, NaN)]);
    expect(arrays(t.series.values)).toEqual([
      [0.1, 0.25],
      [0.5, 0.6],
    ]);
    expect(t.duplicateSteps).toEqual([2]);
    expect(t.firstDuplicateRow).toBe(2);
  });

  it('a tick with no column (name@0 and name@2 only) is all NaN', () => {
    const steps = f64(1);
    const t = wideTickSeries(steps, null, [f64(0.1), undefined, f64(0.3)]);
    expect(arrays(t.series.values)).toEqual([[0.1], [NaN], [0.3]]);
  });
});

describe('longTickSeries', () => {
  it('gathers one value per step and tick, sorted by step', () => {
    const steps = f64(20, 20, 10, 10);
    const ticks = f64(0, 1, 0, 1);
    const t = longTickSeries(steps, ticks, stepOrder(steps), f64(0.3, 0.4, 0.1, 0.2));
    expect(Array.from(t.series.steps)).toEqual([10, 20]);
    expect(arrays(t.series.values)).toEqual([
      [0.1, 0.3],
      [0.2, 0.4],
    ]);
    expect(t.duplicateSteps).toEqual([]);
    expect(t.firstUnsortedRow).toBe(2); // step 10 comes after step 20 in the file
  });

  it('repeated (step, tick): the last row wins and the step counts as duplicated', () => {
    const steps = f64(5, 5, 5);
    const t = longTickSeries(steps, f64(0, 1, 0), stepOrder(steps), f64(0.2, 0.4, 0.25));
    expect(arrays(t.series.values)).toEqual([[0.25], [0.4]]);
    expect(t.duplicateSteps).toEqual([5]);
  });

  it('rows whose tick is not a whole number >= 0 are listed and not used', () => {
    const steps = f64(1, 1, 1);
    const t = longTickSeries(steps, f64(0, 1.5, -1), stepOrder(steps), f64(0.1, 0.2, 0.3));
    expect(t.invalidTickRows).toEqual([1, 2]);
    expect(arrays(t.series.values)).toEqual([[0.1]]);
  });
});
