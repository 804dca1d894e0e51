import { describe, expect, it } from 'vitest';
import { certainty, certaintyFromLogits, confidence, confidenceFromLogits } from '../../src/stats/certainty.js';

/*
 * Worked by hand from the definitions (softmax p_i = e^{z_i} / sum_j e^{z_j}; Shannon entropy in nats
 * H = -sum p_i ln p_i; certainty = 1 - H / ln C), logits z = [2, 1, 0], C = 3:
 *   e^2 = 7.389056099, e^1 = 2.718281828, e^0 = 1;  sum = 11.107337927,  ln(sum) = 2.407605964
 *   ln p_i = z_i - ln(sum) = -0.407605964, -1.407605964, -2.407605964
 *   p_i    = 0.665240956,  0.244728471,  0.090030573
 *   -p ln p = 0.271156181 + 0.344481256 + 0.216758145 = H = 0.832395582 nats
 *   ln 3 = 1.098612289;  H / ln 3 = 0.757679111;  certainty = 0.242320889
 * Cross-checked with scipy.stats.entropy (scipy 1.10.1, Debian python3-scipy; tests/reference/ticks_reference.py):
 *   1 - entropy(softmax([2,1,0])) / log(3) = 0.24232088933841778 (to 3e-16).
 */
const HAND_CERTAINTY = 0.24232088933841778;
const HAND_TOP = 0.6652409557748219; // e^2 / 11.107337927389695

describe('certainty and confidence', () => {
  it('matches the hand-worked softmax [2, 1, 0]', () => {
    expect(certaintyFromLogits([2, 1, 0])).toBeCloseTo(HAND_CERTAINTY, 12);
    expect(confidenceFromLogits([2, 1, 0])).toBeCloseTo(HAND_TOP, 12);
    const p = [0.6652409557748219, 0.24472847105479767, 0.09003057317038046];
    expect(certainty(p)).toBeCloseTo(HAND_CERTAINTY, 12);
    expect(confidence(p)).toBeCloseTo(HAND_TOP, 15);
  });

  it(
    'is 0 for a uniform distribution and 1 for a one-hot ' + 'one (H ranges over [0, ln C]; Cover & Thomas thm 2.6.4)',
    () => {
      expect(certainty([0.25, 0.25, 0.25, 0.25])).toBeCloseTo(0, 15);
      expect(certainty([0, 1, 0])).toBe(1);
      expect(certaintyFromLogits([3, 3, 3])).toBeCloseTo(0, 15);
      expect(certaintyFromLogits([0, -Infinity, -Infinity])).toBe(1);
    },
  );

  it(
    'is shift-invariant in the logits and stable for large ' + 'logits (softmax(z + c) = softmax(z), common practice)',
    () => {
      expect(certaintyFromLogits([1002, 1001, 1000])).toBeCloseTo(HAND_CERTAINTY, 12);
      expect(confidenceFromLogits([-998, -999, -1000])).toBeCloseTo(HAND_TOP, 12);
    },
  );

  it('averages over positions (METHODS.md: several positions -> mean)', () => {
    // Two positions of 3 classes: the hand example and a uniform row -> (0.242320889 + 0) / 2.
    expect(certaintyFromLogits([2, 1, 0, 5, 5, 5], 3)).toBeCloseTo(HAND_CERTAINTY / 2, 12);
    expect(confidence([0.2, 0.7, 0.1, 0.5, 0.3, 0.2], 3)).toBeCloseTo(0.6, 15);
  });

  it('does not mutate its input', () => {
    const z = Object.freeze([2, 1, 0]);
    expect(() => certaintyFromLogits(z)).not.toThrow();
  });

  it('throws a RangeError on invalid input', () => {
    expect(() => certainty([1])).toThrow(RangeError);
    expect(() => certainty([0.5, 0.5, 0.5], 2)).toThrow(/multiple of 2/);
    expect(() => certainty([0.7, 0.7])).toThrow(/sum to 1/);
    expect(() => certainty([1.5, -0.5])).toThrow(/non-negative/);
    expect(() => certainty([Number.NaN, 1])).toThrow(RangeError);
    expect(() => certaintyFromLogits([Number.NaN, 1])).toThrow(RangeError);
    expect(() => certaintyFromLogits([Infinity, 1])).toThrow(RangeError);
    expect(() => certaintyFromLogits([-Infinity, -Infinity])).toThrow(/all -Infinity/);
    expect(() => confidence([])).toThrow(RangeError);
  });
});
