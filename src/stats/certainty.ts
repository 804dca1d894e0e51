/**
 * Normalised certainty and confidence of a classifier's output distribution.
 *
 * - Certainty: 1 - H(p) / ln(C), where H(p) = -sum_i p_i ln p_i is the Shannon entropy in nats of
 *   the output distribution over C classes (0 ln 0 = 0). It is 0 for the uniform distribution and
 *   1 for a one-hot distribution, and lies in [0, 1] (ln C is the largest entropy over C classes;
 *   Cover & Thomas, "Elements of Information Theory", thm 2.6.4). This is the certainty read by
 *   continuous-thought-style models to decide when to stop ticking (METHODS.md, tick-level analyses).
 * - Confidence: the top-class probability max_i p_i (Guo et al. 2017, "On calibration of modern
 *   neural networks", section 2), the quantity that calibration error bins.
 *
 * Inputs are a flat, row-major array of `positions x classes` values: one distribution per
 * position (a token of a sequence output, a cell of a grid). With several positions the result is
 * the mean over positions, as METHODS.md prescribes. From logits the distribution is the softmax
 * p_i = exp(z_i) / sum_j exp(z_j), computed in log space (log-sum-exp with the maximum subtracted),
 * so large logits do not overflow.
 *
 * Cost O(length), no allocation. Nothing here mutates its input.
 */
import type { Numbers } from './moments.js';

/** How far a row of probabilities may sum from 1 (float32 softmax outputs are off by ~1e-7 per class). */
const SUM_TOLERANCE = 1e-4;

/** Check the shape and return the number of positions. */
function positionsOf(name: string, x: Numbers, classes: number): number {
  if (!Number.isInteger(classes) || classes < 2) {
    throw new RangeError(`${name} requires at least 2 classes, got ${classes}`);
  }
  if (x.length === 0 || x.length % classes !== 0) {
    throw new RangeError(
      `${name}: expected a non-empty multiple of ${classes} values (positions x classes), got ${x.length}`,
    );
  }
  return x.length / classes;
}

/**
 * Entropy (nats) and top probability of one row of probabilities, renormalised by its sum so that
 * rounding in the producer cannot push certainty outside [0, 1]. Throws on invalid probabilities.
 */
function probabilityRow(x: Numbers, start: number, classes: number): { entropy: number; top: number } {
  let total = 0;
  for (let i = 0; i < classes; i++) {
    const v = x[start + i] as number;
    if (!(v >= 0) || v === Infinity) {
      throw new RangeError(`probabilities must be finite and non-negative, got ${v} at index ${start + i}`);
    }
    total += v;
  }
  if (Math.abs(total - 1) > SUM_TOLERANCE) {
    throw new RangeError(`probabilities of one position must sum to 1, got ${total} at index ${start}`);
  }
  let entropy = 0;
  let top = 0;
  for (let i = 0; i < classes; i++) {
    const p = (x[start + i] as number) / total;
    if (p > 0) entropy -= p * Math.log(p);
    if (p > top) top = p;
  }
  return { entropy, top };
}

/** Entropy (nats) and top probability of one row of logits, through a stable log-softmax. */
function logitRow(z: Numbers, start: number, classes: number): { entropy: number; top: number } {
  let max = -Infinity;
  for (let i = 0; i < classes; i++) {
    const v = z[start + i] as number;
    // -Infinity is allowed (a masked class, probability 0); NaN and +Infinity are not.
    if (Number.isNaN(v) || v === Infinity)
      throw new RangeError(`logits must be finite or -Infinity, got ${v} at index ${start + i}`);
    if (v > max) max = v;
  }
  if (max === -Infinity) throw new RangeError(`logits of one position are all -Infinity at index ${start}`);
  let s = 0;
  for (let i = 0; i < classes; i++) s += Math.exp((z[start + i] as number) - max);
  const logSum = max + Math.log(s);
  let entropy = 0;
  for (let i = 0; i < classes; i++) {
    const v = z[start + i] as number;
    if (v === -Infinity) continue;
    const logP = v - logSum;
    entropy -= Math.exp(logP) * logP;
  }
  // The top class has logit `max`, so its probability is exp(max - logSum) = 1 / s.
  return { entropy, top: 1 / s };
}

function clampUnit(v: number): number {
  return Math.min(Math.max(v, 0), 1);
}

/**
 * Normalised certainty 1 - H(p)/ln(C) of probabilities laid out as positions x classes (row-major),
 * averaged over positions. `classes` defaults to the whole array (one position).
 * Cost O(length). Throws a RangeError for fewer than 2 classes, a length that is not a multiple of
 * `classes`, negative or non-finite probabilities, or a row that does not sum to 1 (within 1e-4).
 * Example: `certainty([0.5, 0.5])` is 0; `certainty([1, 0, 0])` is 1.
 */
export function certainty(probabilities: Numbers, classes: number = probabilities.length): number {
  const positions = positionsOf('certainty', probabilities, classes);
  const logC = Math.log(classes);
  let acc = 0;
  for (let r = 0; r < positions; r++) acc += 1 - probabilityRow(probabilities, r * classes, classes).entropy / logC;
  return clampUnit(acc / positions);
}

/**
 * Normalised certainty 1 - H(softmax(z))/ln(C) from logits laid out as positions x classes,
 * averaged over positions. Throws as `certainty` does, and for NaN or +Infinity logits.
 * Example: `certaintyFromLogits([2, 1, 0])` is 0.24232088933841778 (worked by hand in the tests).
 */
export function certaintyFromLogits(logits: Numbers, classes: number = logits.length): number {
  const positions = positionsOf('certaintyFromLogits', logits, classes);
  const logC = Math.log(classes);
  let acc = 0;
  for (let r = 0; r < positions; r++) acc += 1 - logitRow(logits, r * classes, classes).entropy / logC;
  return clampUnit(acc / positions);
}

/**
 * Confidence: the top-class probability max_i p_i, averaged over positions.
 * Throws as `certainty` does. Example: `confidence([0.2, 0.7, 0.1])` is 0.7.
 */
export function confidence(probabilities: Numbers, classes: number = probabilities.length): number {
  const positions = positionsOf('confidence', probabilities, classes);
  let acc = 0;
  for (let r = 0; r < positions; r++) acc += probabilityRow(probabilities, r * classes, classes).top;
  return clampUnit(acc / positions);
}

/**
 * Confidence max_i softmax(z)_i from logits, averaged over positions. Throws as `certaintyFromLogits`.
 * Example: `confidenceFromLogits([2, 1, 0])` is e^2 / (e^2 + e + 1) = 0.6652409557748219.
 */
export function confidenceFromLogits(logits: Numbers, classes: number = logits.length): number {
  const positions = positionsOf('confidenceFromLogits', logits, classes);
  let acc = 0;
  for (let r = 0; r < positions; r++) acc += logitRow(logits, r * classes, classes).top;
  return clampUnit(acc / positions);
}
