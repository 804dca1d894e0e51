/**
 * Expected calibration error (ECE) with equal-width confidence bins, and the reliability-diagram
 * data behind it (Naeini, Cooper & Hauskrecht 2015, "Obtaining well calibrated probabilities using
 * Bayesian binning", AAAI; Guo, Pleiss, Sun & Weinberger 2017, "On calibration of modern neural
 * networks", ICML, section 2):
 *
 *   ECE = sum_b (|B_b| / n) * |acc(B_b) - conf(B_b)|
 *
 * where B_b is the set of predictions whose confidence (top-class probability) falls in bin b,
 * acc(B_b) the fraction of them that are correct and conf(B_b) their mean confidence. Empty bins
 * contribute nothing. Since (|B_b|/n) * |acc - conf| = |sum correct - sum confidence| / n over the
 * bin, that is how it is computed.
 *
 * Bin convention: M bins of width 1/M with edges e_b = b/M (computed as b / M in floating point).
 * Bin b (0-based) is the half-open interval (e_b, e_{b+1}], as Guo et al. define
 * I_m = ((m-1)/M, m/M]; the first bin also includes 0, so it is [0, e_1]. A confidence exactly on an
 * edge therefore belongs to the bin below it (0.5 with 2 bins is in bin 0).
 *
 * Default 15 bins (Guo et al. 2017 use M = 15). Cost O(n + M). Nothing here mutates its input.
 */
import type { Numbers } from './moments.js';

/** One bin of a reliability diagram. `confidence` and `accuracy` are null for an empty bin. */
export interface ReliabilityBin {
  readonly low: number;
  readonly high: number;
  readonly count: number;
  /** Mean confidence of the predictions in the bin. */
  readonly confidence: number | null;
  /** Fraction of the predictions in the bin that are correct. */
  readonly accuracy: number | null;
}

export interface CalibrationError {
  readonly ece: number;
  /** Number of predictions. */
  readonly n: number;
  readonly bins: readonly ReliabilityBin[];
}

function checkBins(bins: number): void {
  if (!Number.isInteger(bins) || bins < 1)
    throw new RangeError(`calibration bins must be a positive integer, got ${bins}`);
}

/**
 * Index (0-based) of the bin holding a confidence in [0, 1] under the (e_b, e_{b+1}] convention
 * above, with e_b = b / bins. Throws a RangeError for a confidence outside [0, 1] or NaN, or a
 * non-positive or fractional number of bins. Cost O(1).
 * Example: `calibrationBin(0.5, 2)` is 0; `calibrationBin(0.51, 2)` is 1; `calibrationBin(0, 15)` is 0.
 */
export function calibrationBin(confidence: number, bins: number): number {
  checkBins(bins);
  if (!(confidence >= 0 && confidence <= 1)) throw new RangeError(`confidence must lie in [0, 1], got ${confidence}`);
  return binOf(confidence, bins);
}

/** `calibrationBin` without the argument checks (hot loop; callers have checked). */
function binOf(confidence: number, bins: number): number {
  let b = Math.ceil(confidence * bins) - 1;
  if (b < 0) b = 0;
  if (b > bins - 1) b = bins - 1;
  // confidence * bins may round across an edge; settle membership against the edges b / bins.
  if (b > 0 && confidence <= b / bins) b -= 1;
  else if (b < bins - 1 && confidence > (b + 1) / bins) b += 1;
  return b;
}

/** Per-bin sums from which ECE and the reliability bins follow (one entry per bin). */
export interface CalibrationBinSums {
  /** Predictions in the bin. */
  readonly count: Numbers;
  /** Sum of their confidences. */
  readonly confidenceSum: Numbers;
  /** Number of them that are correct. */
  readonly correctSum: Numbers;
}

/**
 * ECE and reliability bins from per-bin sums: ECE = sum_b |correctSum_b - confidenceSum_b| / n with
 * n = sum_b count_b, which equals sum_b (|B_b|/n) |acc(B_b) - conf(B_b)|. Lets a caller accumulate
 * the sums of many groups (ticks) in one pass over its data and share the formula.
 * Cost O(bins). Throws a RangeError when the three arrays differ in length, are empty, or hold no
 * prediction in total.
 * Example: `calibrationFromBinSums({ count: [1, 1], confidenceSum: [0.3, 0.9], correctSum: [0, 1] }).ece` is 0.2.
 */
export function calibrationFromBinSums(sums: CalibrationBinSums): CalibrationError {
  const { count, confidenceSum, correctSum } = sums;
  const bins = count.length;
  if (bins === 0 || confidenceSum.length !== bins || correctSum.length !== bins) {
    throw new RangeError(
      `calibrationFromBinSums: expected three non-empty arrays of one length, got ${bins}, ${confidenceSum.length}, ` +
        `${correctSum.length}`,
    );
  }
  let n = 0;
  let gapSum = 0;
  const out: ReliabilityBin[] = [];
  for (let b = 0; b < bins; b++) {
    const m = count[b] as number;
    const cs = confidenceSum[b] as number;
    const ks = correctSum[b] as number;
    n += m;
    gapSum += Math.abs(ks - cs);
    out.push({
      low: b / bins,
      high: (b + 1) / bins,
      count: m,
      confidence: m > 0 ? cs / m : null,
      accuracy: m > 0 ? ks / m : null,
    });
  }
  if (!(n > 0)) throw new RangeError('expected calibration error requires at least 1 prediction');
  return { ece: gapSum / n, n, bins: out };
}

/**
 * Expected calibration error over equal-width confidence bins, with the reliability bins.
 * `correct[i]` is 1 when prediction i is correct and 0 when it is wrong.
 * Cost O(n + bins). Throws a RangeError when the inputs are empty or of different lengths, when a
 * confidence is outside [0, 1] or NaN, when a correctness value is not 0 or 1, or when `bins` is not
 * a positive integer.
 * Example: `expectedCalibrationError([0.9, 0.3], [1, 0], 2).ece` is |1 - 0.9|/2 + |0 - 0.3|/2 = 0.2.
 */
export function expectedCalibrationError(confidence: Numbers, correct: Numbers, bins = 15): CalibrationError {
  checkBins(bins);
  const n = confidence.length;
  if (n === 0) throw new RangeError('expectedCalibrationError requires at least 1 prediction');
  if (correct.length !== n) {
    throw new RangeError(
      `expectedCalibrationError: confidence and correct differ in length (${n} vs ${correct.length})`,
    );
  }
  const count = new Float64Array(bins);
  const confidenceSum = new Float64Array(bins);
  const correctSum = new Float64Array(bins);
  for (let i = 0; i < n; i++) {
    const c = confidence[i] as number;
    const k = correct[i] as number;
    if (k !== 0 && k !== 1) throw new RangeError(`correct must be 0 or 1, got ${k} at index ${i}`);
    if (!(c >= 0 && c <= 1)) throw new RangeError(`confidence must lie in [0, 1], got ${c} at index ${i}`);
    const b = binOf(c, bins);
    count[b] = (count[b] as number) + 1;
    confidenceSum[b] = (confidenceSum[b] as number) + c;
    correctSum[b] = (correctSum[b] as number) + k;
  }
  return calibrationFromBinSums({ count, confidenceSum, correctSum });
}
