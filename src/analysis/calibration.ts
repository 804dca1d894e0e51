/**
 * Calibration by tick (METHODS.md, tick-level analyses): per run and per tick, the expected
 * calibration error of the top-class probability against correctness, with equal-width bins
 * (`calibrationBin`, `calibrationFromBinSums`: Naeini, Cooper & Hauskrecht 2015; Guo et al. 2017); per config, the
 * mean ECE across seeds with a t-interval per tick, and reliability-diagram data at the last tick.
 *
 * Conventions:
 * - ECE is defined on the top-class probability (confidence), not on normalised certainty, so dumps
 *   without a confidence column are skipped; a config none of whose dumps has confidence gets no
 *   curve (the caller can tell which configs are missing from the returned list).
 * - One dump per run: among a run's dumps that have confidence, the one at the largest step
 *   (`latestDumpPerRun`, same rule as halting).
 * - A sample whose confidence is NaN at a tick is left out of that tick's ECE; a tick with no
 *   finite confidence in a run gives that run no value at that tick.
 * - "Last tick" is each run's own last tick; reliability bins pool the runs' predictions at it
 *   (counts, confidence sums and correct counts are summed over runs, then divided).
 *
 * Cost O(samples x ticks + ticks x bins) per dump: one sample-major pass (the dump's memory order)
 * into three ticks x bins sum arrays.
 */
import type { TickDump } from '../ingest/types.js';
import { calibrationBin, calibrationFromBinSums } from '../stats/calibrationError.js';
import type { CalibrationBinSums, ReliabilityBin } from '../stats/calibrationError.js';
import { latestDumpPerRun } from './halting.js';
import type { CalibrationCurve } from './results.js';
import { seedMeanInterval } from './seedMeanInterval.js';

interface RunCalibration {
  /** ECE per tick, NaN where the tick had no finite confidence. */
  readonly ece: Float64Array;
  /** Per-bin sums at the run's last tick. */
  readonly lastTick: CalibrationBinSums;
}

/**
 * One sample-major pass over a dump, accumulating per (tick, bin) sums; then ECE per tick from its
 * bin sums (`calibrationFromBinSums`, the same formula as `expectedCalibrationError`).
 */
function calibrateRun(d: TickDump, confidence: Float64Array, bins: number): RunCalibration {
  const K = d.ticks;
  const count = new Float64Array(K * bins);
  const confidenceSum = new Float64Array(K * bins);
  const correctSum = new Float64Array(K * bins);
  const { correct } = d;
  for (let s = 0; s < d.samples; s++) {
    for (let t = 0, i = s * K; t < K; t++, i++) {
      const c = confidence[i] as number;
      if (Number.isNaN(c)) continue;
      const k = correct[i] as number;
      if (k > 1) throw new RangeError(`tick dump of run ${d.run}: correct must be 0 or 1, got ${k}`);
      const cell = t * bins + calibrationBin(c, bins);
      count[cell] = (count[cell] as number) + 1;
      confidenceSum[cell] = (confidenceSum[cell] as number) + c;
      correctSum[cell] = (correctSum[cell] as number) + k;
    }
  }
  const ece = new Float64Array(K).fill(Number.NaN);
  const sumsAt = (t: number): { count: Float64Array; confidenceSum: Float64Array; correctSum: Float64Array } => ({
    count: count.subarray(t * bins, (t + 1) * bins),
    confidenceSum: confidenceSum.subarray(t * bins, (t + 1) * bins),
    correctSum: correctSum.subarray(t * bins, (t + 1) * bins),
  });
  for (let t = 0; t < K; t++) {
    const sums = sumsAt(t);
    if (sums.count.every((m) => m === 0)) continue;
    ece[t] = calibrationFromBinSums(sums).ece;
  }
  return { ece, lastTick: sumsAt(K - 1) };
}

/**
 * Calibration curves per config (configs in order of first appearance) from per-sample tick dumps.
 * Cost O(total cells). Throws a RangeError when `bins` is not a positive integer, when a dump's
 * arrays do not hold samples x ticks cells, or when a confidence lies outside [0, 1]
 * (from `calibrationBin`) or a correctness value is not 0 or 1.
 * Example: `calibrationCurves(dumps, { bins: 15, level: 0.95 })`.
 */
export function calibrationCurves(
  dumps: readonly TickDump[],
  opts: { bins: number; level: number },
): CalibrationCurve[] {
  const { bins, level } = opts;
  if (!Number.isInteger(bins) || bins < 1)
    throw new RangeError(`calibration bins must be a positive integer, got ${bins}`);
  const byConfig = new Map<string, RunCalibration[]>();
  for (const d of latestDumpPerRun(dumps.filter((x) => x.confidence !== null))) {
    const confidence = d.confidence;
    if (confidence === null || d.samples === 0 || d.ticks === 0) continue;
    const cells = d.samples * d.ticks;
    if (confidence.length !== cells || d.correct.length !== cells) {
      throw new RangeError(`tick dump of run ${d.run}: arrays must hold samples x ticks = ${cells} cells`);
    }
    const list = byConfig.get(d.config) ?? [];
    list.push(calibrateRun(d, confidence, bins));
    byConfig.set(d.config, list);
  }

  const curves: CalibrationCurve[] = [];
  for (const [config, runs] of byConfig) {
    const ticks = Math.max(...runs.map((r) => r.ece.length));
    const ece: CalibrationCurve['ece'][number][] = [];
    for (let t = 0; t < ticks; t++) {
      const values: number[] = [];
      for (const r of runs) {
        const v = r.ece[t];
        if (v !== undefined && !Number.isNaN(v)) values.push(v);
      }
      ece.push({ tick: t, ...seedMeanInterval(values, level) });
    }
    const count = new Float64Array(bins);
    const confidenceSum = new Float64Array(bins);
    const correctSum = new Float64Array(bins);
    for (const r of runs) {
      for (let b = 0; b < bins; b++) {
        count[b] = (count[b] as number) + (r.lastTick.count[b] as number);
        confidenceSum[b] = (confidenceSum[b] as number) + (r.lastTick.confidenceSum[b] as number);
        correctSum[b] = (correctSum[b] as number) + (r.lastTick.correctSum[b] as number);
      }
    }
    const reliability: ReliabilityBin[] = Array.from(count, (m, b) => ({
      low: b / bins,
      high: (b + 1) / bins,
      confidence: m > 0 ? (confidenceSum[b] as number) / m : null,
      accuracy: m > 0 ? (correctSum[b] as number) / m : null,
      count: m,
    }));
    curves.push({ config, bins, seeds: runs.length, ece, reliability });
  }
  return curves;
}
