import { describe, expect, it } from 'vitest';
import { calibrationBin, calibrationFromBinSums, expectedCalibrationError } from '../../src/stats/calibrationError.js';

/*
 * Worked by hand from the published definition (Naeini, Cooper & Hauskrecht 2015; Guo et al. 2017,
 * sec. 2: ECE = sum_b |B_b|/n |acc(B_b) - conf(B_b)|, bins I_m = ((m-1)/M, m/M]), M = 5 bins, n = 10;
 * we put confidence 0 into the first bin.
 *   bin 0 [0, .2]   : 0 (wrong)                      n=1 conf 0       acc 0    |gap| x n = 0
 *   bin 1 (.2, .4]  : .3 (wrong)                     n=1 conf .3      acc 0    |0 - .3|      = .3
 *   bin 2 (.4, .6]  : .45 (wrong), .55 (right)       n=2 conf .5      acc .5   |1 - 1|       = 0
 *   bin 3 (.6, .8]  : .8 (right; edge -> lower bin), .65 (wrong), .7 (right)
 *                                                    n=3 conf .716667 acc .666667 |2 - 2.15| = .15
 *   bin 4 (.8, 1]   : .95 (right), .85 (right), .9 (wrong)
 *                                                    n=3 conf .9      acc .666667 |2 - 2.7|  = .7
 *   ECE = (0 + .3 + 0 + .15 + .7) / 10 = 0.115
 */
const CONF = Object.freeze([0.95, 0.85, 0.9, 0.8, 0.65, 0.7, 0.55, 0.45, 0.3, 0]);
const CORRECT = Object.freeze([1, 1, 0, 1, 0, 1, 1, 0, 0, 0]);

describe('expectedCalibrationError', () => {
  it('reproduces the hand-worked example', () => {
    const r = expectedCalibrationError(CONF, CORRECT, 5);
    expect(r.ece).toBeCloseTo(0.115, 14);
    expect(r.n).toBe(10);
    expect(r.bins.map((b) => b.count)).toEqual([1, 1, 2, 3, 3]);
    expect(r.bins[3]?.confidence).toBeCloseTo(2.15 / 3, 14);
    expect(r.bins[3]?.accuracy).toBeCloseTo(2 / 3, 14);
    expect(r.bins[4]?.confidence).toBeCloseTo(0.9, 14);
    expect(r.bins[2]?.low).toBeCloseTo(0.4, 15);
    expect(r.bins[2]?.high).toBeCloseTo(0.6, 15);
  });

  it('with one bin is |overall accuracy - mean confidence| (definition with M = 1)', () => {
    // mean confidence 6.15/10 = .615, accuracy .5
    expect(expectedCalibrationError(CONF, CORRECT, 1).ece).toBeCloseTo(0.115, 14);
    expect(expectedCalibrationError([0.9, 0.6], [1, 0], 1).ece).toBeCloseTo(0.25, 15);
    // Both in (.5, 1] with 2 bins: the same single-bin answer; .9 and .3 fall apart: .1/2 + .3/2 = .2
    expect(expectedCalibrationError([0.9, 0.6], [1, 0], 2).ece).toBeCloseTo(0.25, 15);
    expect(expectedCalibrationError([0.9, 0.3], [1, 0], 2).ece).toBeCloseTo(0.2, 15);
  });

  it('is 0 for calibrated bins and reports empty bins as null', () => {
    const r = expectedCalibrationError([0.5, 0.5, 1, 1], [1, 0, 1, 1]);
    expect(r.ece).toBe(0);
    expect(r.bins).toHaveLength(15);
    expect(r.bins[0]?.confidence).toBeNull();
    expect(r.bins[0]?.accuracy).toBeNull();
  });

  it('puts a confidence on an edge into the bin below, and 0 into the first bin (Guo et al. (lo, hi])', () => {
    expect(calibrationBin(0, 15)).toBe(0);
    expect(calibrationBin(1, 15)).toBe(14);
    expect(calibrationBin(0.5, 2)).toBe(0);
    expect(calibrationBin(0.5000001, 2)).toBe(1);
    for (let k = 1; k <= 15; k++) {
      const edge = k / 15;
      expect(calibrationBin(edge, 15)).toBe(k - 1);
      if (k < 15) expect(calibrationBin(edge + Number.EPSILON, 15)).toBe(k);
    }
  });

  it('gives the same ECE from per-bin sums of the hand-worked example', () => {
    const r = calibrationFromBinSums({
      count: [1, 1, 2, 3, 3],
      confidenceSum: [0, 0.3, 1, 2.15, 2.7],
      correctSum: [0, 0, 1, 2, 2],
    });
    expect(r.ece).toBeCloseTo(0.115, 14);
    expect(r.n).toBe(10);
    expect(() => calibrationFromBinSums({ count: [0, 0], confidenceSum: [0, 0], correctSum: [0, 0] })).toThrow(
      /at least 1/,
    );
    expect(() => calibrationFromBinSums({ count: [1], confidenceSum: [0.5, 0], correctSum: [1] })).toThrow(RangeError);
  });

  it('throws a RangeError on invalid input', () => {
    expect(() => expectedCalibrationError([], [])).toThrow(RangeError);
    expect(() => expectedCalibrationError([0.5], [1, 0])).toThrow(/differ in length/);
    expect(() => expectedCalibrationError([1.5], [1])).toThrow(/\[0, 1\]/);
    expect(() => expectedCalibrationError([Number.NaN], [1])).toThrow(RangeError);
    expect(() => expectedCalibrationError([0.5], [2])).toThrow(/0 or 1/);
    expect(() => expectedCalibrationError([0.5], [1], 0)).toThrow(/positive integer/);
  });
});
