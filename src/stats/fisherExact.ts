/**
 * Fisher's exact test for a 2x2 table (Fisher 1935, "The logic of inductive inference", JRSS 98:39-82;
 * the test is in every statistics handbook): with the margins fixed, the top-left cell X of
 *
 *   [[a, b],
 *    [c, d]]
 *
 * follows the hypergeometric distribution P(X = x) = C(a + b, x) C(c + d, a + c - x) / C(N, a + c),
 * N = a + b + c + d. Semantics are those of scipy.stats.fisher_exact in scipy 1.10.1 (read from its
 * source, `scipy/stats/_stats_py.py`):
 * - 'less': P(X <= a); 'greater': P(X >= a);
 * - 'two-sided': the sum of P(X = x) over every x whose probability is at most the observed one,
 *   with scipy's relative tolerance: x counts when P(X = x) < P(X = a) (1 + 1e-14) on the far side
 *   of the mode, every x on the observed side of a counts, and p is 1 when P(X = a) is within
 *   1e-14 (relative) of the probability at the mode;
 * - a row or column that sums to 0: p = 1 and odds ratio NaN;
 * - sample odds ratio a d / (b c), Infinity when b or c is 0 (also 0/0 when a or d is 0 too).
 *
 * Ties decide two-sided p-values (a symmetric table has two x with equal probability). Floating
 * log-gamma values are off by up to about 1e-12 relative at large counts, more than scipy's 1e-14,
 * so when a probability ratio is within 1e-9 of the threshold it is decided exactly, with BigInt
 * binomial coefficients. The probabilities summed are exp of log-gamma differences (relative error
 * about 1e-12 at counts in the thousands).
 */
import gammaln from '@stdlib/math-base-special-gammaln';
import { type Alternative, checkAlternative } from './alternative.js';

export interface FisherExactResult {
  /** The p-value for the chosen alternative. */
  readonly p: number;
  /** Sample odds ratio a d / (b c) (scipy's "statistic"); Infinity when b c = 0, NaN for an empty margin. */
  readonly oddsRatio: number;
}

/** 1 / epsilon, where epsilon = 1e-14 is scipy 1.10.1's relative tolerance for "at most as probable as observed". */
const INVERSE_EPSILON = 10n ** 14n;

/**
 * Fisher's exact test of independence in the 2x2 table [[a, b], [c, d]] (see the file comment for
 * the exact rules, which follow scipy 1.10.1's `fisher_exact`).
 * Cost O(min(a + b, a + c)) log-gamma evaluations, plus BigInt binomials only near ties.
 * Throws a RangeError when a cell is not a non-negative integer (a safe integer) or the
 * alternative is unknown.
 * Example: `fisherExact([3, 1, 1, 3])` is { p: 0.48571428571428565 (= 34/70), oddsRatio: 9 }
 * (Fisher's tea-tasting table, Fisher 1935, The Design of Experiments, section 2).
 */
export function fisherExact(
  table: readonly [number, number, number, number],
  alternative: Alternative = 'two-sided',
): FisherExactResult {
  checkAlternative(alternative, 'fisherExact');
  for (let i = 0; i < 4; i++) {
    const v = table[i];
    if (!(Number.isSafeInteger(v) && (v as number) >= 0))
      throw new RangeError(`fisherExact: cell ${i} must be a non-negative integer, got ${String(v)}`);
  }
  const [a, b, c, d] = table;
  if (a + b === 0 || c + d === 0 || a + c === 0 || b + d === 0) return { p: 1, oddsRatio: Number.NaN };
  const oddsRatio = c > 0 && b > 0 ? (a * d) / (c * b) : Number.POSITIVE_INFINITY;

  const row1 = a + b;
  const row2 = c + d;
  const col1 = a + c;
  const total = row1 + row2;
  const low = Math.max(0, col1 - row2);
  const high = Math.min(col1, row1);
  const logDenominator = logChoose(total, col1);
  const logPmf = (x: number): number => logChoose(row1, x) + logChoose(row2, col1 - x) - logDenominator;
  const pmf = (x: number): number => Math.exp(logPmf(x));
  const sum = (from: number, to: number): number => {
    let s = 0;
    for (let x = from; x <= to; x++) s += pmf(x);
    return s;
  };

  if (alternative === 'less') return { p: Math.min(1, sum(low, a)), oddsRatio };
  if (alternative === 'greater') return { p: Math.min(1, sum(a, high)), oddsRatio };

  const mode = Math.floor(((col1 + 1) * (row1 + 1)) / (total + 2));
  const exact = new ExactWeights(row1, row2, col1);
  const logExact = logPmf(a);
  // P(mode) within epsilon of P(a), relative to the larger: p = 1 (scipy's first branch).
  if (withinRelative(logPmf(mode) - logExact, exact, mode, a)) return { p: 1, oddsRatio };
  // Far side: x counts when P(x) < P(a) (1 + epsilon).
  const counts = (x: number): boolean => {
    const diff = logPmf(x) - logExact;
    if (Math.abs(diff) > 1e-9) return diff < 0;
    return exact.lessThanScaled(x, a);
  };
  let p: number;
  if (a < mode) {
    p = sum(low, a);
    let first = high + 1;
    while (first - 1 >= mode && counts(first - 1)) first--;
    p += sum(first, high);
  } else {
    p = sum(a, high);
    let last = low - 1;
    while (last + 1 <= mode && counts(last + 1)) last++;
    p += sum(low, last);
  }
  return { p: Math.min(1, p), oddsRatio };
}

function logChoose(n: number, k: number): number {
  return gammaln(n + 1) - gammaln(k + 1) - gammaln(n - k + 1);
}

/**
 * |P(x) - P(a)| / max(P(x), P(a)) <= 1e-14, decided in floating point when the log ratio is far
 * from 0 and exactly otherwise.
 */
function withinRelative(logRatio: number, exact: ExactWeights, x: number, a: number): boolean {
  if (Math.abs(logRatio) > 1e-9) return false;
  return exact.withinRelative(x, a);
}

/**
 * Exact hypergeometric weights W(x) = C(row1, x) C(row2, col1 - x) (proportional to P(X = x)) as
 * BigInt, for deciding ties. Only built on demand (a few per test).
 */
class ExactWeights {
  constructor(
    private readonly row1: number,
    private readonly row2: number,
    private readonly col1: number,
  ) {}

  weight(x: number): bigint {
    return choose(this.row1, x) * choose(this.row2, this.col1 - x);
  }

  /** W(x) < W(a) (1 + epsilon), multiplied through by 1 / epsilon. */
  lessThanScaled(x: number, a: number): boolean {
    return this.weight(x) * INVERSE_EPSILON < this.weight(a) * (INVERSE_EPSILON + 1n);
  }

  /** |W(x) - W(a)| <= epsilon max(W(x), W(a)) (BigInt: Math.max does not apply). */
  withinRelative(x: number, a: number): boolean {
    const wx = this.weight(x);
    const wa = this.weight(a);
    const diff = wx > wa ? wx - wa : wa - wx;
    // biome-ignore lint/complexity/useMathMinMax: BigInt values, Math.max does not accept them
    const larger = wx > wa ? wx : wa;
    return diff * INVERSE_EPSILON <= larger;
  }
}

/** C(n, k) exactly (multiplicative formula; each partial product is an integer). */
function choose(n: number, k: number): bigint {
  if (k < 0 || k > n) return 0n;
  const m = Math.min(k, n - k);
  let c = 1n;
  for (let i = 1; i <= m; i++) c = (c * BigInt(n - m + i)) / BigInt(i);
  return c;
}
