/**
 * How many seeds a decision needs (`seedsift seeds`): the runs per arm with which a two-sided
 * two-sample t-test at level alpha detects a given difference with the given power, by the
 * noncentral t (Cohen 1988, ch. 2; for training runs, Colas, Sigaud & Oudeyer 2018, "How many
 * random seeds? Statistical power analysis in deep reinforcement learning experiments").
 *
 * Three ways to ask:
 * - `pilot`: values of two pilot arms (baseline, candidate): the pooled sd and the observed
 *   difference (candidate - baseline) are the inputs;
 * - `pilot-one`: values of one config's pilot runs for the sd, and a target difference;
 * - `figures`: a standard deviation and a difference given directly (metric units).
 * The answer is a plain record the command line prints. A pilot's sd is itself uncertain (with 5
 * runs its relative standard error is about 35%), so the figure is a planning guide, not a promise.
 */
import { SeedsiftError } from '../problems.js';
import { mean, variance, type Numbers } from '../stats/moments.js';
import { seedsPerArm, welchPower } from '../stats/power.js';

export type SeedsQuestion =
  | {
      readonly kind: 'pilot';
      readonly baseline: Numbers;
      readonly candidate: Numbers;
      readonly alpha: number;
      readonly power: number;
    }
  | {
      readonly kind: 'pilot-one';
      readonly values: Numbers;
      readonly effect: number;
      readonly alpha: number;
      readonly power: number;
    }
  | {
      readonly kind: 'figures';
      readonly sd: number;
      readonly effect: number;
      readonly alpha: number;
      readonly power: number;
    };

export interface SeedsAnswer {
  readonly method: 'noncentral-t';
  readonly kind: SeedsQuestion['kind'];
  /** Standard deviation between seeds used (metric units). */
  readonly sd: number;
  /** Where it came from, in words. */
  readonly sdFrom: string;
  /** Difference to detect (metric units, sign kept). */
  readonly effect: number;
  readonly effectFrom: 'observed' | 'given';
  /** |effect| / sd (Cohen's d). */
  readonly standardized: number;
  readonly alpha: number;
  readonly power: number;
  /** Runs per arm, or null when no finite number suffices (a difference of 0). */
  readonly seedsPerArm: number | null;
  /** Power of the test at a few seed counts per arm, for the same difference. */
  readonly powerAt: readonly { readonly seeds: number; readonly power: number }[];
  readonly notes: readonly string[];
}

/** Seed counts at which `powerAt` is given. */
export const POWER_TABLE_SEEDS = [3, 5, 10, 20, 50] as const;

/**
 * Answer a seeds question. Throws SeedsiftError('usage') for alpha outside (0, 1), power outside
 * (alpha, 1), a non-positive or non-finite sd, or a non-finite effect; SeedsiftError('input') when
 * a pilot arm has fewer than 2 values or the pilot's sd is 0. Cost: O(log n) power evaluations.
 * Example: `seedsNeeded({ kind: 'figures', sd: 1, effect: 0.5, alpha: 0.05, power: 0.8 }).seedsPerArm` is 64.
 */
export function seedsNeeded(q: SeedsQuestion): SeedsAnswer {
  if (!(q.alpha > 0 && q.alpha < 1))
    throw new SeedsiftError('usage', `--alpha: expected a number in (0, 1), got ${q.alpha}`);
  if (!(q.power > q.alpha && q.power < 1))
    throw new SeedsiftError('usage', `--power: expected a number in (alpha, 1), got ${q.power}`);
  const notes: string[] = [];
  let sd: number;
  let sdFrom: string;
  let effect: number;
  let effectFrom: 'observed' | 'given';
  if (q.kind === 'pilot') {
    pilotArm(q.baseline, 'baseline');
    pilotArm(q.candidate, 'candidate');
    const df = q.baseline.length + q.candidate.length - 2;
    sd = Math.sqrt(
      ((q.baseline.length - 1) * variance(q.baseline) + (q.candidate.length - 1) * variance(q.candidate)) / df,
    );
    sdFrom = `pooled sd of ${q.baseline.length} + ${q.candidate.length} pilot runs`;
    effect = mean(q.candidate) - mean(q.baseline);
    effectFrom = 'observed';
    notes.push(
      'the observed pilot difference is itself noisy: a larger pilot difference than the true one makes this count too small',
    );
  } else if (q.kind === 'pilot-one') {
    pilotArm(q.values, 'pilot');
    sd = Math.sqrt(variance(q.values));
    sdFrom = `sd of ${q.values.length} pilot runs`;
    effect = checkEffect(q.effect);
    effectFrom = 'given';
  } else {
    if (!(Number.isFinite(q.sd) && q.sd > 0))
      throw new SeedsiftError('usage', `--sd: expected a positive number, got ${q.sd}`);
    sd = q.sd;
    sdFrom = 'given';
    effect = checkEffect(q.effect);
    effectFrom = 'given';
  }
  if (!(sd > 0))
    throw new SeedsiftError(
      'input',
      'pilot: every pilot run gave the same value (sd 0); seeds cannot be planned from it',
    );
  if (q.kind !== 'figures')
    notes.push(
      `the sd comes from a pilot; with few pilot runs it is uncertain (relative standard error about 1/sqrt(2(n-1)))`,
    );
  const d = Math.abs(effect) / sd;
  let seeds: number | null = null;
  if (d === 0) notes.push('a difference of 0 cannot be detected with any number of seeds');
  else {
    try {
      seeds = seedsPerArm(d, q.alpha, q.power);
    } catch (error) {
      if (!(error instanceof RangeError)) throw error;
      notes.push(`the difference is so small against the sd that more than 2^40 seeds per arm would be needed`);
    }
  }
  const powerAt = POWER_TABLE_SEEDS.map((n) => ({ seeds: n, power: welchPower(d, n, n, q.alpha) }));
  return {
    method: 'noncentral-t',
    kind: q.kind,
    sd,
    sdFrom,
    effect,
    effectFrom,
    standardized: d,
    alpha: q.alpha,
    power: q.power,
    seedsPerArm: seeds,
    powerAt,
    notes,
  };
}

function pilotArm(x: Numbers, name: string): void {
  if (x.length < 2)
    throw new SeedsiftError('input', `${name}: expected at least 2 pilot runs with a value, got ${x.length}`);
}

function checkEffect(effect: number): number {
  if (!Number.isFinite(effect))
    throw new SeedsiftError('usage', `--effect: expected a number (a difference in metric units), got ${effect}`);
  return effect;
}
