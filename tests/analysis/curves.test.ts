import { describe, expect, it } from 'vitest';
import { learningCurves, stepGrid } from '../../src/analysis/curves.js';
import { runSet, series, type RunSpec } from './runSetBuilder.js';
import { at } from '../support/at.js';

const settings = {
  bins: 400,
  level: 0.95,
  interval: 'bca',
  bandResamples: 2000,
  seed: 1,
  failed: 'exclude',
} as const;
const steps = (last: number): number[] => Array.from({ length: last / 10 + 1 }, (_, i) => i * 10);

describe('stepGrid', () => {
  it('spans the smallest first to the largest last step with at most `bins` bins', () => {
    const g = stepGrid([series(steps(100), steps(100)), series([0, 50], [0, 1])], 400);
    expect(g?.bins).toBe(11); // the longest run has 11 points
    expect(g?.first).toBe(0);
    expect(g?.width).toBeCloseTo(100 / 11, 14);
    expect(stepGrid([series(steps(100), steps(100))], 5)?.bins).toBe(5);
    expect(stepGrid([series([7], [1])], 400)).toEqual({ first: 7, width: 0, bins: 1, centres: [7] });
    expect(stepGrid([], 400)).toBeNull();
  });
});

describe('learningCurves', () => {
  it('never extrapolates: a run is null past its last step, and n counts the runs per bin', () => {
    const set = runSet(
      ['m'],
      [
        {
          params: { m: 'a' },
          seed: 1,
          metrics: { acc: { steps: steps(100), values: steps(100).map((s) => s / 100) } },
        },
        { params: { m: 'a' }, seed: 2, metrics: { acc: { steps: steps(50), values: steps(50).map((s) => s / 50) } } },
      ],
      [{ name: 'acc', goal: 'max' }],
    );
    const [curve] = learningCurves(set.runs, 'acc', settings);
    expect(curve?.steps).toHaveLength(11);
    expect(curve?.n).toEqual([2, 2, 2, 2, 2, 2, 1, 1, 1, 1, 1]);
    const short = curve?.runs.find((r) => r.seed === '2');
    expect(short?.values.slice(6)).toEqual([null, null, null, null, null]);
    expect(curve?.mean[10]).toBe(1); // only the long run
    expect(curve?.low[10]).toBeNull(); // one run: no band
    expect(curve?.bandByBin?.[10]).toBe('none');
    expect(curve?.mean[5]).toBeCloseTo((0.5 + 1) / 2, 14);
  });

  it(
    'band: t-interval of the mean at every n by default ' + '(scipy t.interval); BCa from 4 runs under --interval bca',
    () => {
      const specs: RunSpec[] = [];
      // 4 runs with these values in one bin; scipy 1.10.1 stats.t.interval(0.95, 3, mean, sem) of
      // [0.61, 0.64, 0.58, 0.66] is (0.5668071896575351, 0.678192810342465)
      // to 1e-14 (tests/reference/analysis_reference.py)
      [0.61, 0.64, 0.58, 0.66].forEach((v, i) => {
        specs.push({ params: { m: 'small' }, seed: i, metrics: { acc: { steps: [0], values: [v] } } });
      });
      // 20 runs over steps 0 and 10; the 20th stops at step 0, so step 10 has 19 runs
      for (let i = 0; i < 20; i++) {
        const v = [0.5 + i / 100, 0.6 + ((i * 7) % 20) / 100];
        specs.push({
          params: { m: 'big' },
          seed: i,
          metrics: { acc: i === 19 ? { steps: [0], values: [at(v, 0)] } : { steps: [0, 10], values: v } },
        });
      }
      const set = runSet(['m'], specs, [{ name: 'acc', goal: 'max' }]);
      const [small, big] = learningCurves(set.runs, 'acc', { ...settings, interval: 'welch' });
      expect(small?.config).toBe('m=small');
      expect(small?.n[0]).toBe(4);
      expect(small?.low[0]).toBeCloseTo(0.5668071896575351, 12);
      expect(small?.high[0]).toBeCloseTo(0.678192810342465, 12);
      expect(small?.band).toBe('t');
      expect(big?.n).toEqual([20, 19]);
      expect(big?.bandByBin).toEqual(['t', 't']);
      const [, boot] = learningCurves(set.runs, 'acc', settings);
      expect(boot?.bandByBin).toEqual(['bca', 'bca']);
      expect(boot?.low[0]).toBeLessThan(boot?.mean[0] as number);
      expect(boot?.high[0]).toBeGreaterThan(boot?.mean[0] as number);
    },
  );

  it('leaves diverged runs out of mean and n under exclude, keeps their thin line', () => {
    const set = runSet(
      ['m'],
      [
        { params: { m: 'a' }, seed: 1, metrics: { acc: { steps: [0, 10], values: [0.2, 0.4] } } },
        { params: { m: 'a' }, seed: 2, metrics: { acc: { steps: [0, 10], values: [0.4, 0.6] } } },
        { params: { m: 'a' }, seed: 3, metrics: { acc: { steps: [0], values: [0.9], divergedAt: 10 } } },
      ],
      [{ name: 'acc', goal: 'max' }],
    );
    const [ex] = learningCurves(set.runs, 'acc', settings);
    expect(ex?.n).toEqual([2, 2]);
    expect(ex?.mean[0]).toBeCloseTo(0.3, 14);
    expect(ex?.runs).toHaveLength(3);
    const [worst] = learningCurves(set.runs, 'acc', { ...settings, failed: 'worst' });
    expect(worst?.n).toEqual([3, 2]);
  });

  it('is deterministic for bootstrap bands (seeded per curve)', () => {
    const specs: RunSpec[] = Array.from({ length: 25 }, (_, i) => ({
      params: { m: 'a' },
      seed: i,
      metrics: { acc: { steps: [0], values: [Math.sin(i)] } },
    }));
    const set = runSet(['m'], specs, [{ name: 'acc', goal: 'max' }]);
    expect(learningCurves(set.runs, 'acc', settings)).toEqual(learningCurves(set.runs, 'acc', settings));
  });
});

describe('learningCurves: bootstrap bands at 20 runs or more', () => {
  // 25 runs, two points each: bin 0 holds v, bin 1 holds 2v + 1. The seeds are resampled as whole
  // curves (one table of positions per curve), so bin 1's resamples are bin 0's mapped by 2v + 1,
  // and BCa respects increasing affine maps (Efron 1987: z0 and the acceleration are unchanged):
  // bin 1's band is bin 0's band mapped the same way. Independent draws per bin would break this.
  it('resamples seeds as whole curves: an affine image of a bin gets the affine image of its band', () => {
    const specs: RunSpec[] = Array.from({ length: 25 }, (_, i) => {
      const v = Math.sin(i * 1.7) + i / 10;
      return { params: { m: 'a' }, seed: i, metrics: { acc: { steps: [0, 10], values: [v, 2 * v + 1] } } };
    });
    const set = runSet(['m'], specs, [{ name: 'acc', goal: 'max' }]);
    const [curve] = learningCurves(set.runs, 'acc', settings);
    expect(curve?.bandByBin).toEqual(['bca', 'bca']);
    const [low0, low1] = [curve?.low[0] as number, curve?.low[1] as number];
    const [high0, high1] = [curve?.high[0] as number, curve?.high[1] as number];
    expect(low1).toBeCloseTo(2 * low0 + 1, 12);
    expect(high1).toBeCloseTo(2 * high0 + 1, 12);
    expect(high0 - low0).toBeGreaterThan(0);
  });
});
