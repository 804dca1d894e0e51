/**
 * Fisher's exact test on a 2x2 table [[a, b], [c, d]] (Fisher 1922): conditional on the margins, a
 * has the hypergeometric distribution. Two-sided p: the sum of the probabilities of every table at
 * most as probable as the observed one (with a relative tolerance of 1e-7, as scipy.stats.fisher_exact);
 * 'greater' / 'less': the upper / lower tail of a. The odds ratio is the sample one, ad / (bc).
 * Cost O(min(row, column) margins). Throws a RangeError for negative or non-integer counts.
 * Example: `fisherExact([8, 2, 1, 5]).p` is 0.03496503496503495 (scipy 1.10.1).
 */
import gammaln from '@stdlib/math-base-special-gammaln';

export type FisherAlternative = 'two-sided' | 'greater' | 'less';

export function fisherExact(
  table: readonly [number, number, number, number],
  alternative: FisherAlternative = 'two-sided',
): { p: number; oddsRatio: number } {
  for (const v of table)
    if (!Number.isInteger(v) || v < 0) throw new RangeError(`fisherExact: counts must be integers >= 0, got ${v}`);
  const [a, b, c, d] = table;
  const row = a + b;
  const col = a + c;
  const n = a + b + c + d;
  const lo = Math.max(0, col - (n - row));
  const hi = Math.min(row, col);
  const lnC = (m: number, k: number): number => gammaln(m + 1) - gammaln(k + 1) - gammaln(m - k + 1);
  const denom = lnC(n, col);
  const prob = (x: number): number => Math.exp(lnC(row, x) + lnC(n - row, col - x) - denom);
  const oddsRatio = b * c === 0 ? (a * d === 0 ? Number.NaN : Infinity) : (a * d) / (b * c);
  let p = 0;
  if (alternative === 'greater') for (let x = a; x <= hi; x++) p += prob(x);
  else if (alternative === 'less') for (let x = lo; x <= a; x++) p += prob(x);
  else {
    const observed = prob(a);
    for (let x = lo; x <= hi; x++) {
      const q = prob(x);
      if (q <= observed * (1 + 1e-7)) p += q;
    }
  }
  return { p: Math.min(1, p), oddsRatio };
}
