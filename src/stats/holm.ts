/**
 * Holm's step-down adjustment of p-values for multiple comparisons (Holm 1979, "A simple
 * sequentially rejective multiple test procedure", Scand. J. Statist. 6:65-70). It controls the
 * family-wise error rate under any dependence and is uniformly more powerful than Bonferroni.
 */

/**
 * Holm-adjusted p-values, in the input order. With p sorted increasingly as p_(1) <= ... <= p_(m),
 * adjusted p_(i) = max over j <= i of min(1, (m - j + 1) p_(j)) (R's p.adjust(method = "holm")).
 * Rejecting where the adjusted p < alpha is Holm's procedure at level alpha.
 *
 * Cost O(m log m). An empty list gives an empty list. Throws a RangeError when a value is not a
 * probability (NaN, below 0 or above 1).
 * Example: `holm([0.01, 0.04, 0.03, 0.005, 0.2, 0.03])` is [0.05, 0.12, 0.12, 0.03, 0.2, 0.12].
 */
export function holm(p: readonly number[]): number[] {
  const m = p.length;
  const order = sortedOrder(p, 'holm');
  const adjusted = new Array<number>(m).fill(0);
  let running = 0;
  for (let rank = 0; rank < m; rank++) {
    const i = order[rank] as number;
    running = Math.max(running, Math.min(1, (m - rank) * (p[i] as number)));
    adjusted[i] = running;
  }
  return adjusted;
}

/**
 * Indices of p in increasing order of p (ties keep input order), after checking that every value
 * is a probability; shared by the step-down and step-up adjustments. Cost O(m log m).
 * Throws a RangeError naming `who` on NaN or a value outside [0, 1].
 * Example: `sortedOrder([0.3, 0.1, 0.2], 'holm')` is [1, 2, 0].
 */
export function sortedOrder(p: readonly number[], who: string): number[] {
  for (let i = 0; i < p.length; i++) {
    const v = p[i] as number;
    if (!(v >= 0 && v <= 1)) throw new RangeError(`${who}: p-value ${i} must be in [0, 1], got ${v}`);
  }
  return p.map((_, i) => i).sort((a, b) => (p[a] as number) - (p[b] as number) || a - b);
}
