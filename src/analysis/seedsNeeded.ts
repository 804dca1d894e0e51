/**
 * How many seeds a decision needs (`seedsift seeds`): the runs per arm with which a two-sided
 * two-sample t-test at level alpha detects a given difference with the given power, by the
 * noncentral t (Cohen 1988, ch. 2; for training runs, Colas, Sigaud & Oudeyer 2018, "How many
 * random seeds? Statistical power analysis in deep reinforcement learning experiments").
 *
 * Two ways to ask, always for a difference the user names (never "seeds to detect the observed
 * difference", which is post-hoc power: Hoenig & Heisey 2001):
 * - `pilot`: pilot runs grouped by config; the between-seed sd is pooled within configs, never
 *   across them (the spread between configs is not seed noise);
 * - `figures`: a standard deviation and a difference given directly (metric units).
 * With several comparisons planned (`comparisons` m > 1), the test is planned at the family's
 * corrected alpha, alpha / m (Bonferroni: the first step of Holm).
 * The answer is a plain record the command line prints. A pilot's sd is itself uncertain (with 5
 * runs its relative standard error is about 35%), so the figure is a planning guide, not a promise.
 */
import { SeedsiftError } from '../problems.js';
import { variance, type Numbers } from '../stats/moments.js';
import { seedsPerArm, welchPower } from '../stats/power.js';

export type SeedsQuestion =
  | {
      readonly kind: 'pilot';
      /** Pilot values per config (each at least 1 run; configs with 2 or more give the sd). */
      readonly groups: readonly Numbers[];
      readonly effect: number;
      readonly alpha: number;
      readonly power: number;
      readonly comparisons?: number;
    }
  | {
      readonly kind: 'figures';
      readonly sd: number;
      readonly effect: number;
      readonly alpha: number;
      readonly power: number;
      readonly comparisons?: number;
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
  readonly effectFrom: 'given';
  /** Comparisons in the family the plan is for, and the per-test alpha used (alpha / m). */
  readonly comparisons: number;
  readonly testAlpha: number;
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
  const m = q.comparisons ?? 1;
  if (!(Number.isInteger(m) && m >= 1))
    throw new SeedsiftError('usage', `--comparisons: expected an integer >= 1, got ${m}`);
  let sd: number;
  let sdFrom: string;
  const effect = checkEffect(q.effect);
  const effectFrom = 'given' as const;
  if (q.kind === 'pilot') {
    let ss = 0;
    let df = 0;
    let runs = 0;
    let used = 0;
    for (const g of q.groups) {
      runs += g.length;
      if (g.length < 2) continue;
      ss += (g.length - 1) * variance(g);
      df += g.length - 1;
      used++;
    }
    if (df < 1)
      throw new SeedsiftError(
        'input',
        `pilot: expected a config with at least 2 pilot runs with a value, got ${runs} runs`,
      );
    sd = Math.sqrt(ss / df);
    sdFrom = `sd pooled within ${used} config${used === 1 ? '' : 's'} (${runs} pilot runs, ${df} df)`;
  } else {
    if (!(Number.isFinite(q.sd) && q.sd > 0))
      throw new SeedsiftError('usage', `--sd: expected a positive number, got ${q.sd}`);
    sd = q.sd;
    sdFrom = 'given';
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
  const testAlpha = q.alpha / m;
  if (m > 1)
    notes.push(
      `planned at alpha ${q.alpha} / ${m} comparisons = ${Number(testAlpha.toPrecision(4))} per test ` +
        `(Bonferroni, Holm's first step)`,
    );
  let seeds: number | null = null;
  if (d === 0) notes.push('a difference of 0 cannot be detected with any number of seeds');
  else {
    try {
      seeds = seedsPerArm(d, testAlpha, q.power);
    } catch (error) {
      if (!(error instanceof RangeError)) throw error;
      notes.push(`the difference is so small against the sd that more than 2^40 seeds per arm would be needed`);
    }
  }
  const powerAt = POWER_TABLE_SEEDS.map((n) => ({ seeds: n, power: welchPower(d, n, n, testAlpha) }));
  return {
    method: 'noncentral-t',
    kind: q.kind,
    sd,
    sdFrom,
    effect,
    effectFrom,
    comparisons: m,
    testAlpha,
    standardized: d,
    alpha: q.alpha,
    power: q.power,
    seedsPerArm: seeds,
    powerAt,
    notes,
  };
}

function checkEffect(effect: number): number {
  if (!Number.isFinite(effect))
    throw new SeedsiftError('usage', `--effect: expected a number (a difference in metric units), got ${effect}`);
  return effect;
}
