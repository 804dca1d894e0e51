/**
 * The log-rank test of equal hazards between two groups of right-censored times (Mantel 1966;
 * Peto & Peto 1972): at each distinct event time, with d events among n at risk (n_a in group a),
 * group a's expected events are d n_a / n with hypergeometric variance
 * d (n_a/n)(1 - n_a/n)(n - d)/(n - 1); the statistic (O_a - E_a)^2 / V is chi-square with 1 df.
 * `logRankPermutation` gives the exact permutation p of the same statistic (every relabeling of
 * the pooled subjects when there are at most `maxSplits`, else `resamples` random relabelings with
 * p = (1 + b)/(1 + M), Phipson & Smyth 2010) for small groups, where the chi-square is rough.
 * Cost O(n log n) per statistic. Throws a RangeError when a group is empty or no event occurs.
 * Example (Freireich 6-MP v placebo, Gehan 1965): statistic 16.7929, p 4.17e-5.
 */
import erfc from '@stdlib/math-base-special-erfc';
import type { Random } from './random.js';
import type { TimeToEvent } from './timeToEvent.js';

export interface LogRankResult {
  readonly statistic: number;
  readonly df: 1;
  readonly p: number;
  readonly observed: [number, number];
  readonly expected: [number, number];
}

interface Pooled {
  readonly times: Float64Array;
  readonly events: Uint8Array;
  /** Indices sorted by time. */
  readonly order: Int32Array;
}

function pool(a: TimeToEvent, b: TimeToEvent): Pooled {
  const n = a.times.length + b.times.length;
  if (a.times.length === 0 || b.times.length === 0)
    throw new RangeError('logRank requires at least 1 subject per group');
  if (a.events.length !== a.times.length || b.events.length !== b.times.length)
    throw new RangeError('logRank: times and events differ in length');
  const times = new Float64Array(n);
  const events = new Uint8Array(n);
  [a, b].forEach((g, gi) =>
    g.times.forEach((t, i) => {
      const k = gi === 0 ? i : a.times.length + i;
      times[k] = t;
      events[k] = g.events[i] ? 1 : 0;
    }),
  );
  const order = Int32Array.from([...times.keys()].sort((i, j) => (times[i] as number) - (times[j] as number)));
  return { times, events, order };
}

/** O_a, E_a, V for the membership `inA` (1 for group a). */
function parts(p: Pooled, inA: Uint8Array): { o: number; e: number; v: number; d: number } {
  const n = p.times.length;
  let nA = 0;
  for (let i = 0; i < n; i++) nA += inA[i] as number;
  let atRisk = n;
  let o = 0;
  let e = 0;
  let v = 0;
  let total = 0;
  for (let k = 0; k < n; ) {
    const time = p.times[p.order[k] as number] as number;
    let d = 0;
    let dA = 0;
    let leave = 0;
    let leaveA = 0;
    while (k < n && p.times[p.order[k] as number] === time) {
      const i = p.order[k] as number;
      if (p.events[i]) {
        d++;
        dA += inA[i] as number;
      }
      leave++;
      leaveA += inA[i] as number;
      k++;
    }
    if (d > 0) {
      const share = nA / atRisk;
      o += dA;
      e += d * share;
      if (atRisk > 1) v += (d * share * (1 - share) * (atRisk - d)) / (atRisk - 1);
      total += d;
    }
    atRisk -= leave;
    nA -= leaveA;
  }
  return { o, e, v, d: total };
}

/** The log-rank test of a against b. */
export function logRank(a: TimeToEvent, b: TimeToEvent): LogRankResult {
  const p = pool(a, b);
  const inA = new Uint8Array(p.times.length);
  inA.fill(1, 0, a.times.length);
  const { o, e, v, d } = parts(p, inA);
  if (d === 0) throw new RangeError('logRank: no event in either group');
  const statistic = v > 0 ? ((o - e) * (o - e)) / v : o === e ? 0 : Infinity;
  return {
    statistic,
    df: 1,
    p: erfc(Math.sqrt(statistic / 2)),
    observed: [o, d - o],
    expected: [e, d - e],
  };
}

/** Options of `logRankPermutation`. */
export interface LogRankPermutationOptions {
  readonly maxSplits?: number;
  readonly resamples?: number;
}

/** Permutation p of the log-rank statistic (exact when every split can be enumerated). */
export function logRankPermutation(
  a: TimeToEvent,
  b: TimeToEvent,
  random: Random,
  options: LogRankPermutationOptions = {},
): { p: number; exact: boolean; splits: number } {
  const p = pool(a, b);
  const n = p.times.length;
  const na = a.times.length;
  const inA = new Uint8Array(n);
  inA.fill(1, 0, na);
  const stat = (m: Uint8Array): number => {
    const r = parts(p, m);
    return r.v > 0 ? ((r.o - r.e) * (r.o - r.e)) / r.v : 0;
  };
  const observed = stat(inA) * (1 - 1e-12);
  let splits = 1;
  for (let i = 1; i <= na; i++) splits = (splits * (n - na + i)) / i;
  splits = Math.round(splits);
  const maxSplits = options.maxSplits ?? 200_000;
  if (splits <= maxSplits) {
    const idx = Array.from({ length: na }, (_, i) => i);
    const m = new Uint8Array(n);
    let count = 0;
    for (;;) {
      m.fill(0);
      for (const i of idx) m[i] = 1;
      if (stat(m) >= observed) count++;
      let k = na - 1;
      while (k >= 0 && idx[k] === n - na + k) k--;
      if (k < 0) break;
      idx[k] = (idx[k] as number) + 1;
      for (let j = k + 1; j < na; j++) idx[j] = (idx[j - 1] as number) + 1;
    }
    return { p: count / splits, exact: true, splits };
  }
  const resamples = options.resamples ?? 100_000;
  const perm = Int32Array.from({ length: n }, (_, i) => i);
  const m = new Uint8Array(n);
  let count = 0;
  for (let r = 0; r < resamples; r++) {
    for (let i = 0; i < na; i++) {
      const j = i + Math.floor(random.next() * (n - i));
      const t = perm[i] as number;
      perm[i] = perm[j] as number;
      perm[j] = t;
    }
    m.fill(0);
    for (let i = 0; i < na; i++) m[perm[i] as number] = 1;
    if (stat(m) >= observed) count++;
  }
  return { p: (1 + count) / (1 + resamples), exact: false, splits: resamples };
}
