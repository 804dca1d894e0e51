/**
 * The two-sample log-rank test (Mantel 1966, "Evaluation of survival data and two new rank order
 * statistics arising in its consideration", Cancer Chemotherapy Reports 50:163-170; Peto & Peto
 * 1972), for right-censored times, and its exact permutation version.
 *
 * At each distinct time t_k at which d_k >= 1 events happen in the pooled sample, with r_k units at
 * risk of which r1_k are in the first group, the first group's expected events under H0 (equal
 * survival functions) are d_k r1_k / r_k, with the hypergeometric variance (exact with ties)
 *
 *   v_k = d_k (r1_k / r_k) (1 - r1_k / r_k) (r_k - d_k) / (r_k - 1)    (0 when r_k = 1).
 *
 * With O1 the first group's events, E1 = sum d_k r1_k / r_k and V = sum v_k, the statistic is
 * (O1 - E1)^2 / V, referred to chi-square with 1 df. It is the same for either group (O2 - E2 =
 * -(O1 - E1)), so it is two-sided. When V = 0 every term has r1_k = 0, r1_k = r_k or d_k = r_k,
 * each of which gives O1 = E1: there is no evidence either way, and the statistic is 0 (p = 1).
 */
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import type { Random } from './random.js';
import { checkTimeToEvent, type TimeToEvent } from './timeToEvent.js';

export interface LogRankResult {
  /** (O1 - E1)^2 / V. */
  readonly statistic: number;
  readonly df: 1;
  /** P(chi-square with 1 df >= statistic). */
  readonly p: number;
  /** Events observed in a and in b. */
  readonly observed: [number, number];
  /** Events expected in a and in b under H0 (they sum to the observed total). */
  readonly expected: [number, number];
}

export interface LogRankPermutationOptions {
  /** Enumerate every relabeling when C(N, n1) is at most this (default 200,000). */
  readonly exactLimit?: number;
  /** Random relabelings when there are more (default 100,000). */
  readonly resamples?: number;
}

export interface LogRankPermutationResult {
  readonly p: number;
  /** True when every relabeling was enumerated. */
  readonly exact: boolean;
  /** Relabelings evaluated: C(N, n1) when exact, else the number of random relabelings M. */
  readonly splits: number;
}

/**
 * Log-rank (Mantel-Cox) test of H0: a and b have the same distribution of time to event (see the
 * file comment). Check value: METHODS.md's 6-MP data (Gehan 1965) give chi-square 16.7929,
 * p 4.17e-5 (statsmodels 0.13.5 `survdiff` agrees). The chi-square approximation needs a fair
 * number of events; at small n use `logRankPermutation`.
 * Cost O(N log N). Throws a RangeError on bad input (see `checkTimeToEvent`).
 * Example: `logRank({ times: [1, 2], events: [true, true] }, { times: [3, 4], events: [true, true] })`
 * has observed [2, 2], expected [1.0833..., 2.9166...].
 */
export function logRank(a: TimeToEvent, b: TimeToEvent): LogRankResult {
  checkTimeToEvent(a, 'logRank');
  checkTimeToEvent(b, 'logRank');
  const layout = poolLayout(a, b);
  const inFirst = new Uint8Array(layout.levels.length);
  inFirst.fill(1, 0, a.times.length);
  const { o1, e1, variance } = score(layout, inFirst);
  const statistic = variance > 0 ? ((o1 - e1) * (o1 - e1)) / variance : 0;
  const total = layout.totalEvents;
  return {
    statistic,
    df: 1,
    p: chiSquare1Sf(statistic),
    observed: [o1, total - o1],
    expected: [e1, total - e1],
  };
}

/**
 * Permutation p-value of the log-rank statistic: under H0 the group labels are exchangeable, so
 * every relabeling of the N pooled units into groups of n1 and n2 is equally likely. Exact when
 * C(N, n1) <= exactLimit: p = #(relabelings with statistic >= observed) / C(N, n1), the observed
 * labeling included. Otherwise M random relabelings and p = (1 + b) / (1 + M) (Phipson & Smyth
 * 2010, "Permutation p-values should never be zero", SAGMB 9(1):39). Two-sided, on the chi-square
 * statistic; "at least as large" allows 1e-9 relative (plus 1e-12) for rounding, so that
 * relabelings equal in exact arithmetic count.
 * Cost O(C(N, n1) (N + K)) exact (K distinct event times), O(M (N + K)) Monte Carlo. Randomness only
 * from `random` (not used when exact). Throws a RangeError on bad input or options.
 * Example: `logRankPermutation({ times: [1, 2], events: [true, true] }, { times: [3, 4], events: [false, false] },
 * random)` is { p: 1/3, exact: true, splits: 6 }: the observed labeling and its mirror image are the two most
 * extreme of the C(4, 2) = 6.
 */
export function logRankPermutation(
  a: TimeToEvent,
  b: TimeToEvent,
  random: Random,
  options: LogRankPermutationOptions = {},
): LogRankPermutationResult {
  const exactLimit = options.exactLimit ?? 200_000;
  const resamples = options.resamples ?? 100_000;
  if (!(exactLimit >= 0)) throw new RangeError(`logRankPermutation: exactLimit must be >= 0, got ${exactLimit}`);
  if (!Number.isInteger(resamples) || resamples < 1)
    throw new RangeError(`logRankPermutation: resamples must be a positive integer, got ${resamples}`);
  const observed = logRank(a, b).statistic;
  const layout = poolLayout(a, b);
  const n = layout.levels.length;
  const size = Math.min(a.times.length, b.times.length);
  const threshold = observed * (1 - 1e-9) - 1e-12;
  const inFirst = new Uint8Array(n);
  const extreme = (): boolean => {
    const { o1, e1, variance } = score(layout, inFirst);
    const s = variance > 0 ? ((o1 - e1) * (o1 - e1)) / variance : 0;
    return s >= threshold;
  };
  const count = countSplits(n, size, exactLimit);
  if (count <= exactLimit) {
    let atLeast = 0;
    const walk = (start: number, left: number): void => {
      if (left === 0) {
        if (extreme()) atLeast++;
        return;
      }
      for (let i = start; i <= n - left; i++) {
        inFirst[i] = 1;
        walk(i + 1, left - 1);
        inFirst[i] = 0;
      }
    };
    walk(0, size);
    return { p: atLeast / count, exact: true, splits: count };
  }
  const order = new Int32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  let atLeast = 0;
  for (let m = 0; m < resamples; m++) {
    inFirst.fill(0);
    for (let i = 0; i < size; i++) {
      const j = i + random.int(n - i);
      const pick = order[j] as number;
      order[j] = order[i] as number;
      order[i] = pick;
      inFirst[pick] = 1;
    }
    if (extreme()) atLeast++;
  }
  return { p: (1 + atLeast) / (1 + resamples), exact: false, splits: resamples };
}

/**
 * The pooled sample reduced to what the statistic needs: the distinct event times t_0 < ... <
 * t_{K-1}; per unit its level (the number of event times <= its time: it is at risk at t_k for
 * k < level) and whether its event happened (then at t_{level - 1}); per event time the events
 * d_k and the units at risk r_k.
 */
interface Layout {
  readonly levels: Int32Array;
  readonly events: Uint8Array;
  readonly deaths: Float64Array;
  readonly atRisk: Float64Array;
  readonly totalEvents: number;
}

function poolLayout(a: TimeToEvent, b: TimeToEvent): Layout {
  const times = [...a.times, ...b.times];
  const flags = [...a.events, ...b.events];
  const n = times.length;
  const eventTimes = [...new Set(times.filter((_, i) => flags[i]))].sort((x, y) => x - y);
  const k = eventTimes.length;
  const levels = new Int32Array(n);
  const events = new Uint8Array(n);
  const deaths = new Float64Array(k);
  const atRisk = new Float64Array(k);
  let totalEvents = 0;
  for (let i = 0; i < n; i++) {
    const t = times[i] as number;
    // Number of event times <= t (binary search).
    let lo = 0;
    let hi = k;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if ((eventTimes[mid] as number) <= t) lo = mid + 1;
      else hi = mid;
    }
    levels[i] = lo;
    for (let j = 0; j < lo; j++) atRisk[j] = (atRisk[j] as number) + 1;
    if (flags[i]) {
      events[i] = 1;
      deaths[lo - 1] = (deaths[lo - 1] as number) + 1;
      totalEvents++;
    }
  }
  return { levels, events, deaths, atRisk, totalEvents };
}

/** O1, E1 and V for the units marked in `inFirst` (see the file comment). */
function score(layout: Layout, inFirst: Uint8Array): { o1: number; e1: number; variance: number } {
  const { levels, events, deaths, atRisk } = layout;
  const k = deaths.length;
  const byLevel = new Float64Array(k + 1);
  let o1 = 0;
  for (let i = 0; i < levels.length; i++) {
    if (inFirst[i] !== 1) continue;
    byLevel[levels[i] as number] = (byLevel[levels[i] as number] as number) + 1;
    o1 += events[i] as number;
  }
  let r1 = 0;
  let e1 = 0;
  let variance = 0;
  for (let j = k - 1; j >= 0; j--) {
    r1 += byLevel[j + 1] as number; // units of the first group at risk at t_j: level > j
    const r = atRisk[j] as number;
    const d = deaths[j] as number;
    const share = r1 / r;
    e1 += d * share;
    if (r > 1) variance += (d * share * (1 - share) * (r - d)) / (r - 1);
  }
  return { o1, e1, variance };
}

/** P(chi-square_1 >= x) = 2 Phi(-sqrt(x)). */
function chiSquare1Sf(x: number): number {
  return Math.min(1, 2 * normalCdf(-Math.sqrt(x), 0, 1));
}

/** C(n, k), or limit + 1 as soon as it is known to exceed limit (no overflow). */
function countSplits(n: number, k: number, limit: number): number {
  let c = 1;
  for (let i = 1; i <= k; i++) {
    c = (c * (n - k + i)) / i; // exact: C(n - k + i, i) is an integer at every step
    if (c > limit) return Math.floor(limit) + 1;
  }
  return c;
}
