import { describe, expect, it } from 'vitest';
import { cleanSeries, firstBackwardRow, stepOrder } from '../../../src/ingest/assemble/messy.js';

// Expected values follow DESIGN.md "Messy logs" (the policy table), worked by hand here.
// Cell encoding (load/query.ts): NaN empty, +Infinity nan/inf, -Infinity text.
const E = NaN;
const NF = Infinity;
const TXT = -Infinity;
const f64 = (...x: number[]): Float64Array => Float64Array.from(x);

function clean(steps: number[], cells: number[]) {
  const s = f64(...steps);
  return cleanSeries(s, f64(...cells), stepOrder(s));
}

describe('stepOrder', () => {
  it('is null when steps strictly increase (no sort, no copy)', () => {
    expect(stepOrder(f64(1, 2, 10))).toBeNull();
  });
  it('sorts stably: equal steps keep file order', () => {
    expect(Array.from(stepOrder(f64(3, 1, 3, 2)) as Int32Array)).toEqual([1, 3, 0, 2]);
  });
});

describe('firstBackwardRow', () => {
  it('finds the first kept row whose step is below an earlier kept step', () => {
    expect(firstBackwardRow(f64(10, 30, 20), Uint8Array.of(1, 1, 1))).toBe(2);
    expect(firstBackwardRow(f64(10, 30, 20), Uint8Array.of(1, 0, 1))).toBe(-1);
  });
});

describe('cleanSeries: the policies of DESIGN "Messy logs"', () => {
  it('clean input: shares the arrays, nothing missing', () => {
    const steps = f64(1, 2, 3);
    const cells = f64(0.1, 0.2, 0.3);
    const c = cleanSeries(steps, cells, null);
    expect(c.series.steps).toBe(steps);
    expect(c.series.values).toBe(cells);
    expect(c.series).toMatchObject({ divergedAt: null, missing: 0 });
  });

  it('duplicated steps: the last row in file order wins, duplicated steps counted', () => {
    // A resumed run: 1, 2, 3, then 2, 3 again with new values.
    const c = clean([1, 2, 3, 2, 3, 4], [0.1, 0.2, 0.3, 0.25, 0.35, 0.4]);
    expect(Array.from(c.series.steps)).toEqual([1, 2, 3, 4]);
    expect(Array.from(c.series.values)).toEqual([0.1, 0.25, 0.35, 0.4]);
    expect(c.duplicateSteps).toEqual([2, 3]);
    expect(c.firstDuplicateRow).toBe(3);
    // Once the earlier rows lost, the winners are in file order: not "unsorted".
    expect(c.firstUnsortedRow).toBe(-1);
  });

  it('unsorted steps: sorted, and the first row that goes backwards is named', () => {
    const c = clean([1, 3, 2, 4], [0.1, 0.3, 0.2, 0.4]);
    expect(Array.from(c.series.steps)).toEqual([1, 2, 3, 4]);
    expect(Array.from(c.series.values)).toEqual([0.1, 0.2, 0.3, 0.4]);
    expect(c.firstUnsortedRow).toBe(2);
    expect(c.duplicateSteps).toEqual([]);
  });

  it('empty cells: the metric keeps its own rows; a row not logging it is no duplicate', () => {
    // train row and eval row at step 2: this metric is only on the eval row.
    const c = clean([1, 2, 2, 3], [E, E, 0.7, E]);
    expect(Array.from(c.series.steps)).toEqual([2]);
    expect(Array.from(c.series.values)).toEqual([0.7]);
    expect(c.duplicateSteps).toEqual([]);
    expect(c.series.missing).toBe(3);
    expect(c).toMatchObject({ empty: 3, nonFinite: 0, text: 0 });
  });

  it('nan/inf and text cells are missing and counted by kind', () => {
    const c = clean([1, 2, 3, 4], [0.1, NF, TXT, 0.4]);
    expect(Array.from(c.series.values)).toEqual([0.1, 0.4]);
    expect(c).toMatchObject({ empty: 0, nonFinite: 1, text: 1 });
    expect(c.series.missing).toBe(2);
    expect(c.series.divergedAt).toBeNull(); // finite again at step 4
  });

  it('divergence: non-finite to the end marks the first step of that stretch', () => {
    const c = clean([10, 20, 30, 40, 50], [0.5, 0.4, NF, E, NF]);
    expect(c.series.divergedAt).toBe(30);
    expect(c.divergedRow).toBe(2);
    expect(Array.from(c.series.steps)).toEqual([10, 20]);
  });

  it('divergence ignores rows that do not log the metric and text cells', () => {
    const c = clean([10, 20, 30], [NF, 0.3, TXT]);
    expect(c.series.divergedAt).toBeNull();
  });

  it('a later finite duplicate of a non-finite step undoes divergence (last row wins first)', () => {
    const c = clean([1, 2, 2], [0.1, NF, 0.2]);
    expect(c.series.divergedAt).toBeNull();
    expect(Array.from(c.series.values)).toEqual([0.1, 0.2]);
  });

  it(
    'a metric never finite did not diverge (DESIGN: "goes non-finite and stays so" needs a finite stretch first); ' +
      'it has no values',
    () => {
      const c = clean([5, 6], [NF, NF]);
      expect(c.series.divergedAt).toBeNull();
      expect(c.series.values.length).toBe(0);
      // After a finite start, the same tail is a divergence.
      expect(clean([4, 5, 6], [0.5, NF, NF]).series.divergedAt).toBe(5);
    },
  );

  it('does not mutate its inputs', () => {
    // (typed arrays cannot be frozen: compare copies instead)
    const steps = f64(2, 1);
    const cells = f64(0.2, 0.1);
    const copy = Array.from(cells);
    cleanSeries(steps, cells, stepOrder(steps));
    expect(Array.from(steps)).toEqual([2, 1]);
    expect(Array.from(cells)).toEqual(copy);
  });
});
