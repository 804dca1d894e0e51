/**
 * `reach:VALUE` as a time-to-event comparison (METHODS.md, "`reach:VALUE`"): each run gives the
 * steps until it first reaches VALUE, or is right-censored at the comparison's step when it has not
 * (kept, never dropped). The arms are compared with the log-rank test (Mantel 1966; Peto & Peto
 * 1972), its p from the exact permutation distribution of the statistic when every relabeling can
 * be enumerated (else random relabelings), beside the Kaplan-Meier (1958) median steps-to-reach
 * and the fraction that reached by the comparison's step in each arm. An arm that often never
 * reaches contributes fewer events than its share of the runs at risk, so it can never be called
 * better for reaching sooner when it does. Nothing here throws on data.
 */
import { kaplanMeier } from '../stats/kaplanMeier.js';
import { logRank, logRankPermutation } from '../stats/logRank.js';
import { createRandom, deriveSeed } from '../stats/random.js';
import type { TimeToEvent } from '../stats/timeToEvent.js';
import type { Arm } from './arms.js';
import type { Difference, TimeToEventArm, TimeToEventResult } from './comparisonTypes.js';
import { attempt, finiteOrNull } from './attempt.js';

export interface TimeToEventDraft {
  readonly result: TimeToEventResult;
  readonly p: number | null;
  /** Sign of the candidate's steps-to-reach against the baseline's: negative when it reaches sooner. */
  readonly direction: number;
  readonly difference: Difference;
  readonly reasons: readonly string[];
}

/** The time-to-event comparison of two arms (values are steps; `events[i]` false when censored). */
export function timeToEventDraft(base: Arm, cand: Arm, label: string, seed: number, level: number): TimeToEventDraft {
  const reasons: string[] = [];
  const b: TimeToEvent = { times: [...base.values], events: [...base.events] };
  const c: TimeToEvent = { times: [...cand.values], events: [...cand.events] };
  const kmB = armSummary(b);
  const kmC = armSummary(c);
  const anyEvent = base.events.some((e) => e) || cand.events.some((e) => e);
  if (!anyEvent)
    reasons.push("no run of either arm reached the value by the comparison's step: there is nothing to compare");
  const test = anyEvent ? attempt(() => logRank(c, b), 'the log-rank test', reasons) : null;
  const perm = anyEvent
    ? attempt(
        () => logRankPermutation(c, b, createRandom(deriveSeed(seed, `logrank|${label}`))),
        'the log-rank permutation test',
        reasons,
      )
    : null;
  const observed = test?.observed[0] ?? null;
  const expected = test?.expected[0] ?? null;
  const p = finiteOrNull(perm?.p ?? test?.p);
  const method: TimeToEventResult['logRank']['method'] =
    perm === null ? 'chi-square' : perm.exact ? 'exact-permutation' : 'random-permutation';
  const estimate = kmB.medianSteps === null || kmC.medianSteps === null ? null : kmC.medianSteps - kmB.medianSteps;
  return {
    result: {
      baseline: kmB,
      candidate: kmC,
      logRank: { statistic: finiteOrNull(test?.statistic), p, observed, expected, method },
    },
    p,
    direction: observed === null || expected === null ? 0 : Math.sign(expected - observed),
    difference: { estimate, low: null, high: null, level, method: 'none', simultaneous: null, bca: null },
    reasons,
  };
}

function armSummary(t: TimeToEvent): TimeToEventArm {
  const reached = t.events.filter((e) => e).length;
  if (t.times.length === 0) return { runs: 0, reached, fraction: null, medianSteps: null };
  const km = kaplanMeier(t);
  const last = km.survival.length === 0 ? 1 : (km.survival[km.survival.length - 1] as number);
  return { runs: t.times.length, reached, fraction: 1 - last, medianSteps: km.median };
}
