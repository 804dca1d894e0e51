import { describe, expect, it } from 'vitest';
import { coarsenLine, lineStride } from '../../../src/report/charts/coarsenLine.js';

// Checked by hand: group means of consecutive points (arithmetic only).
describe('coarsenLine', () => {
  it('averages steps and the non-null values of each group of `stride` points', () => {
    expect(coarsenLine([0, 1, 2, 3, 4], [1, 3, null, 5, 7], 2)).toEqual({ steps: [0.5, 2.5, 4], values: [2, 5, 7] });
  });
  it('keeps a break where a whole group is null, and returns a copy at stride 1', () => {
    expect(coarsenLine([0, 1, 2, 3], [null, null, 4, 6], 2)).toEqual({ steps: [0.5, 2.5], values: [null, 5] });
    const steps = [1, 2];
    const out = coarsenLine(steps, [3, null], 1);
    expect(out).toEqual({ steps: [1, 2], values: [3, null] });
    expect(out.steps).not.toBe(steps);
  });
  it('refuses a stride that is not a whole number >= 1', () => {
    expect(() => coarsenLine([1], [1], 0)).toThrow(RangeError);
    expect(() => coarsenLine([1], [1], 1.5)).toThrow(RangeError);
  });
});

describe('lineStride', () => {
  it('is the smallest stride keeping all lines within the budget', () => {
    expect(lineStride(400, 400, 24000)).toBe(7);
    expect(lineStride(30, 400, 24000)).toBe(1);
    expect(lineStride(60, 400, 24000)).toBe(1);
    expect(lineStride(61, 400, 24000)).toBe(2);
  });
});
