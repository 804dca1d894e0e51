/**
 * The Kaplan-Meier (1958) product-limit estimate of the survival function S(t) = P(T > t) from
 * right-censored data: at each distinct event time t_j with d_j events among n_j at risk,
 * S(t_j) = prod (1 - d_i / n_i) over i <= j. A subject censored at t_j is at risk at t_j (events
 * before censorings at tied times, the usual convention). The median is the smallest event time
 * with S(t) <= 0.5, null when S never falls to 0.5. Cost O(n log n).
 * Throws a RangeError when times and events differ in length or a time is not finite.
 * Example: times [1, 2, 3, 4], events all true: survival [0.75, 0.5, 0.25, 0], median 2.
 */
import type { TimeToEvent } from './timeToEvent.js';

export function kaplanMeier(t: TimeToEvent): {
  n: number;
  events: number;
  times: number[];
  survival: number[];
  median: number | null;
} {
  const n = t.times.length;
  if (t.events.length !== n) throw new RangeError('kaplanMeier: times and events differ in length');
  for (const x of t.times) if (!Number.isFinite(x)) throw new RangeError(`kaplanMeier: times must be finite, got ${x}`);
  const order = [...t.times.keys()].sort((i, j) => (t.times[i] as number) - (t.times[j] as number));
  const times: number[] = [];
  const survival: number[] = [];
  let atRisk = n;
  let s = 1;
  let events = 0;
  let median: number | null = null;
  for (let k = 0; k < n; ) {
    const time = t.times[order[k] as number] as number;
    let d = 0;
    let leaving = 0;
    while (k < n && t.times[order[k] as number] === time) {
      if (t.events[order[k] as number]) d++;
      leaving++;
      k++;
    }
    if (d > 0) {
      s *= 1 - d / atRisk;
      times.push(time);
      survival.push(s);
      events += d;
      if (median === null && s <= 0.5) median = time;
    }
    atRisk -= leaving;
  }
  return { n, events, times, survival, median };
}
