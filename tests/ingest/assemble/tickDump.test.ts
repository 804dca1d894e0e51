import { describe, expect, it } from 'vitest';
import { buildDumps, fromProbabilities, planDump, type DumpColumns } from '../../../src/ingest/assemble/tickDump.js';

// Certainty: 1 - H/ln C, METHODS.md "Tick-level analyses". Check values computed by hand from the
// definition (softmax, natural-log entropy), evaluated with Python's math module:
// logits [2, 1, 0] -> p = [0.6652409557748219, 0.24472847105479764, 0.09003057317038046],
// H = 0.8323955818399389, certainty = 1 - H/ln 3 = 0.24232088933841778, confidence = max p.
// p = [0.7, 0.2, 0.1, 0] (0 ln 0 = 0): H = 0.8018185525433372, certainty = 1 - H/ln 4 = 0.42161017527648026.

/** Entry `k` of `list`, failing the test loudly if it is missing (a checked index instead of `!`). */
function at<T>(list: readonly T[], k: number): T {
  const v = list[k];
  if (v === undefined) throw new Error(`no entry ${k} in a list of ${list.length}`);
  return v;
}

describe('fromProbabilities', () => {
  it('softmax of [2, 1, 0]: certainty 1 - H/ln C and confidence max p', () => {
    const e = [Math.exp(2), Math.exp(1), 1] as const;
    const s = e[0] + e[1] + e[2];
    const r = fromProbabilities(e.map((v) => v / s));
    expect(r?.certainty).toBeCloseTo(0.24232088933841778, 14);
    expect(r?.confidence).toBeCloseTo(0.6652409557748219, 15);
    expect(r?.predicted).toBe(0);
  });
  it('a zero probability contributes 0 ln 0 = 0', () => {
    expect(fromProbabilities([0.7, 0.2, 0.1, 0])?.certainty).toBeCloseTo(0.42161017527648026, 14);
  });
  it('uniform is certainty 0; one-hot is certainty 1 (the ends of [0, 1])', () => {
    expect(fromProbabilities([0.25, 0.25, 0.25, 0.25])?.certainty).toBeCloseTo(0, 15);
    expect(fromProbabilities([0, 1, 0])).toEqual({ certainty: 1, confidence: 1, predicted: 1 });
  });
  it('normalises by the sum (rounding in the file does not matter)', () => {
    expect(fromProbabilities([1.4, 0.4, 0.2])?.certainty).toBeCloseTo(
      fromProbabilities([0.7, 0.2, 0.1])?.certainty as number,
      15,
    );
  });
  it('ties go to the first class (as numpy argmax)', () => {
    expect(fromProbabilities([0.4, 0.4, 0.2])?.predicted).toBe(0);
  });
  it('rejects negative, non-finite, zero-sum and single-class input', () => {
    expect(fromProbabilities([0.5, -0.1])).toBeNull();
    expect(fromProbabilities([0.5, NaN])).toBeNull();
    expect(fromProbabilities([0, 0])).toBeNull();
    expect(fromProbabilities([1])).toBeNull();
  });
});

describe('planDump', () => {
  it('finds the required and optional columns', () => {
    expect(planDump(['sample', 'tick', 'correct', 'certainty', 'confidence', 'step'], 'step')).toEqual({
      sample: 0,
      tick: 1,
      correct: 2,
      certainty: 3,
      confidence: 4,
      step: 5,
      label: null,
      probabilities: [],
    });
  });
  it('accepts p0..pK with label (or target) instead of correct and certainty', () => {
    expect(planDump(['sample', 'tick', 'target', 'p0', 'p1', 'p2'], 'step')).toMatchObject({
      label: 2,
      probabilities: [3, 4, 5],
      correct: null,
      certainty: null,
    });
  });
  it('names what is missing', () => {
    expect(planDump(['sample', 'tick', 'correct'], 'step')).toEqual({ missing: 'certainty (or p0..pK)' });
  });
});

const f64 = (...x: number[]): Float64Array => Float64Array.from(x);

describe('buildDumps', () => {
  const cols: DumpColumns = {
    sample: 0,
    tick: 1,
    correct: 2,
    certainty: 3,
    confidence: null,
    step: null,
    label: null,
    probabilities: [],
  };
  it('fills samples x ticks sample-major, samples ordered by id', () => {
    // rows out of order: sample 7 before sample 3
    const cells = [f64(7, 7, 3, 3), f64(1, 0, 0, 1), f64(1, 0, 0, 1), f64(0.9, 0.2, 0.1, 0.8)];
    const r = buildDumps((k) => at(cells, k), 4, cols);
    expect('dumps' in r).toBe(true);
    const { dumps } = r as {
      dumps: { samples: number; ticks: number; correct: Uint8Array; certainty: Float64Array; step: number | null }[];
    };
    const d = at(dumps, 0);
    expect([d.samples, d.ticks, d.step]).toEqual([2, 2, null]);
    expect(Array.from(d.correct)).toEqual([0, 1, 0, 1]); // sample 3: ticks 0, 1; then sample 7
    expect(Array.from(d.certainty)).toEqual([0.1, 0.8, 0.2, 0.9]);
  });
  it('computes certainty, confidence and correct from probabilities and label', () => {
    const e = [Math.exp(2), Math.exp(1), 1] as const;
    const s = e[0] + e[1] + e[2];
    const pc = {
      sample: 0,
      tick: 1,
      correct: null,
      certainty: null,
      confidence: null,
      step: null,
      label: 2,
      probabilities: [3, 4, 5],
    };
    const cells = [f64(0, 0), f64(0, 1), f64(0, 1), f64(e[0] / s, 0.1), f64(e[1] / s, 0.8), f64(e[2] / s, 0.1)];
    const r = buildDumps((k) => at(cells, k), 2, pc) as {
      dumps: { correct: Uint8Array; certainty: Float64Array; confidence: Float64Array }[];
    };
    const d = at(r.dumps, 0);
    expect(Array.from(d.correct)).toEqual([1, 1]); // argmax 0 = label 0; argmax 1 = label 1
    expect(d.certainty[0]).toBeCloseTo(0.24232088933841778, 14);
    expect(d.confidence[0]).toBeCloseTo(0.6652409557748219, 15);
  });
  it('one dump per step value', () => {
    const c = { ...cols, step: 4 };
    const cells = [f64(0, 0), f64(0, 0), f64(1, 0), f64(0.5, 0.6), f64(200, 100)];
    const r = buildDumps((k) => at(cells, k), 2, c) as { dumps: { step: number | null }[] };
    expect(r.dumps.map((d) => d.step)).toEqual([100, 200]);
  });
  it('an incomplete grid, a repeated tick or a bad cell makes the dump invalid', () => {
    const hole = [f64(0, 0, 1), f64(0, 1, 0), f64(1, 1, 1), f64(0.1, 0.2, 0.3)];
    expect(buildDumps((k) => at(hole, k), 3, cols)).toEqual({
      invalid: { row: -1, reason: 'sample 1 lacks tick 1 (every sample needs ticks 0..1)' },
    });
    const twice = [f64(0, 0), f64(0, 0), f64(1, 1), f64(0.1, 0.2)];
    expect(buildDumps((k) => at(twice, k), 2, cols)).toEqual({
      invalid: { row: 1, reason: 'sample 0 has tick 0 twice' },
    });
    const bad = [f64(0), f64(0), f64(2), f64(0.1)];
    expect(buildDumps((k) => at(bad, k), 1, cols)).toEqual({ invalid: { row: 0, reason: 'correct is not 0 or 1' } });
    const over = [f64(0), f64(0), f64(1), f64(1.5)];
    expect(buildDumps((k) => at(over, k), 1, cols)).toEqual({
      invalid: { row: 0, reason: 'certainty is not a number in [0, 1]' },
    });
  });
});
