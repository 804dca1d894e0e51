/**
 * The Kaplan-Meier (product-limit) estimator of a survival function from right-censored times
 * (Kaplan & Meier 1958, "Nonparametric estimation from incomplete observations", JASA 53:457-481).
 *
 * At each distinct time t_j at which d_j >= 1 events happen, with r_j units still at risk (time
 * >= t_j; a unit censored at t_j counts as at risk there, the usual convention),
 *
 *   S(t) = prod_{t_j <= t} (1 - d_j / r_j).
 *
 * In seedsift S(t) is the estimated share of runs that have not yet reached a value by step t, so
 * 1 - S(t) is the share that reached it by then; the median is the median steps-to-reach.
 */
import { checkTimeToEvent, type TimeToEvent } from './timeToEvent.js';

export interface KaplanMeierResult {
  /** Units (runs). */
  readonly n: number;
  /** Units whose event was observed (runs that reached). */
  readonly events: number;
  /** events / n: the fraction that reached (not the Kaplan-Meier estimate; censored units count as not reached). */
  readonly fractionReached: number;
  /** The distinct times at which at least one event happened, ascending. */
  readonly times: number[];
  /** S just after each of `times`. */
  readonly survival: number[];
  /** The first time at which S <= 0.5, or null when S stays above 0.5 (too few events to estimate it). */
  readonly median: number | null;
}

/** S within this of 0.5 counts as 0.5 for the median (the product rounds: 3/4 x 2/3 is 0.5000000000000001). */
const MEDIAN_TOLERANCE = 1e-12;

/**
 * Kaplan-Meier estimate of the survival function of `data` (see the file comment), with its
 * median (first time with S(t) <= 0.5; statsmodels' `SurvfuncRight.quantile(0.5)` takes the first
 * time with S(t) < 0.5 instead, as SAS does, which differs only where S equals 0.5 exactly).
 * Cost O(n log n). Throws a RangeError on bad input (see `checkTimeToEvent`).
 * Example: `kaplanMeier({ times: [1, 2, 3, 4], events: [true, true, true, true] })` is
 * { n: 4, events: 4, fractionReached: 1, times: [1, 2, 3, 4], survival: [0.75, 0.5, 0.25, 0], median: 2 }
 * (to rounding).
 */
export function kaplanMeier(data: TimeToEvent): KaplanMeierResult {
  checkTimeToEvent(data, 'kaplanMeier');
  const n = data.times.length;
  const order = Array.from({ length: n }, (_, i) => i).sort(
    (i, j) => (data.times[i] as number) - (data.times[j] as number),
  );
  const times: number[] = [];
  const survival: number[] = [];
  let atRisk = n;
  let events = 0;
  let s = 1;
  let median: number | null = null;
  for (let k = 0; k < n; ) {
    const t = data.times[order[k] as number] as number;
    let d = 0;
    let leaving = 0;
    while (k < n && data.times[order[k] as number] === t) {
      if (data.events[order[k] as number]) d++;
      leaving++;
      k++;
    }
    if (d > 0) {
      s *= 1 - d / atRisk;
      times.push(t);
      survival.push(s);
      events += d;
      if (median === null && s <= 0.5 + MEDIAN_TOLERANCE) median = t;
    }
    atRisk -= leaving;
  }
  return { n, events, fractionReached: events / n, times, survival, median };
}
