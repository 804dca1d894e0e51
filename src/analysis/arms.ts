/**
 * The two arms of one comparison, from the runs' outcomes at its step (`runValues.ts`), under the
 * failure policy (METHODS.md, "Failures as an outcome"): a failed run (diverged, short, or
 * `step:N` beyond its end) is counted in its arm's failures and either left out (`--failed
 * exclude`, the default) or scored as the worst value observed among the non-failed runs of this
 * comparison (`--failed worst`: the smallest for a goal of max, the largest for min; for
 * `reach:VALUE`, never reaching, censored at the comparison's step). Runs with no value
 * (missing) are left out and counted. When any run failed, the failure counts of the two arms are
 * compared with Fisher's exact test (two-sided). Pure; cost O(runs).
 */
import type { Goal } from '../ingest/types.js';
import { fisherExact } from '../stats/fisherExact.js';
import type { FailureCounts, RunUse } from './comparisonTypes.js';
import type { FailedPolicy } from './results.js';
import type { RunOutcome } from './runValues.js';

/** One arm's values as the tests see them. */
export interface Arm {
  readonly values: Float64Array;
  /** For time-to-event summaries: whether each value is an event (reached), else censored. */
  readonly events: readonly boolean[];
  readonly seeds: readonly string[];
  readonly diverged: number;
  readonly short: number;
  /** Non-failed runs without a value. */
  readonly noValue: number;
  /** Failed runs scored worst (counted in `values`). */
  readonly scoredWorst: number;
}

export interface Arms {
  readonly base: Arm;
  readonly cand: Arm;
  readonly uses: readonly RunUse[];
  readonly failures: FailureCounts;
}

/**
 * Build both arms. `goal` is the direction of the summary value; `timeToEvent` marks `reach:VALUE`
 * (values are times; a censored run is kept with `events[i] = false`); `step` is the comparison's step.
 * Example: under `worst`, a diverged run of a max-goal metric takes the smallest value of the comparison.
 */
export function buildArms(
  baseline: readonly RunOutcome[],
  candidate: readonly RunOutcome[],
  goal: Goal,
  policy: FailedPolicy,
  timeToEvent: boolean,
  step: number | null,
): Arms {
  const worst = policy === 'worst' ? worstValue([...baseline, ...candidate], goal, timeToEvent, step) : null;
  const uses: RunUse[] = [];
  const base = armOf(baseline, 'baseline', worst, uses);
  const cand = armOf(candidate, 'candidate', worst, uses);
  const failedB = base.diverged + base.short;
  const failedC = cand.diverged + cand.short;
  const fisherP =
    failedB + failedC === 0
      ? null
      : fisherExact([failedB, baseline.length - failedB, failedC, candidate.length - failedC]).p;
  return {
    base,
    cand,
    uses,
    failures: {
      baseline: { runs: baseline.length, diverged: base.diverged, short: base.short },
      candidate: { runs: candidate.length, diverged: cand.diverged, short: cand.short },
      fisherP,
    },
  };
}

function worstValue(
  runs: readonly RunOutcome[],
  goal: Goal,
  timeToEvent: boolean,
  step: number | null,
): { value: number; event: boolean } | null {
  if (timeToEvent) {
    let latest = step ?? -Infinity;
    for (const r of runs) if (r.failed === null && r.value !== null) latest = Math.max(latest, r.value);
    return Number.isFinite(latest) ? { value: latest, event: false } : null;
  }
  let worst: number | null = null;
  for (const r of runs) {
    if (r.failed !== null || r.value === null) continue;
    if (worst === null || (goal === 'max' ? r.value < worst : r.value > worst)) worst = r.value;
  }
  return worst === null ? null : { value: worst, event: false };
}

function armOf(
  runs: readonly RunOutcome[],
  arm: RunUse['arm'],
  worst: { value: number; event: boolean } | null,
  uses: RunUse[],
): Arm {
  const values: number[] = [];
  const events: boolean[] = [];
  const seeds: string[] = [];
  let diverged = 0;
  let short = 0;
  let noValue = 0;
  let scoredWorst = 0;
  for (const r of runs) {
    let used: number | null = null;
    if (r.failed !== null) {
      if (r.failed === 'diverged') diverged++;
      else short++;
      if (worst !== null) {
        used = worst.value;
        events.push(worst.event);
        scoredWorst++;
      }
    } else if (r.value === null) noValue++;
    else {
      used = r.value;
      events.push(!r.censored);
    }
    if (used !== null) {
      values.push(used);
      seeds.push(r.seed);
    }
    uses.push({
      run: r.run,
      arm,
      value: used,
      loggedAt: r.failed === null ? r.loggedAt : null,
      failed: r.failed,
      censored: r.failed === null ? r.censored : used !== null,
      stale: r.stale,
    });
  }
  return { values: Float64Array.from(values), events, seeds, diverged, short, noValue, scoredWorst };
}
