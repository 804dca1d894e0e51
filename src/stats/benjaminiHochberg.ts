/**
 * The Benjamini-Hochberg step-up adjustment of p-values (Benjamini & Hochberg 1995, "Controlling
 * the false discovery rate", JRSS B 57:289-300). It controls the false discovery rate for
 * independent or positively dependent tests; it rejects at least as much as Holm.
 */
import { sortedOrder } from './holm.js';

/**
 * BH-adjusted p-values ("q-values" in R's p.adjust(method = "BH") sense), in the input order.
 * With p sorted increasingly, adjusted p_(i) = min over j >= i of min(1, m p_(j) / j), so the
 * adjusted values are monotone in p. Rejecting where the adjusted p <= alpha is the BH step-up
 * procedure at false discovery rate alpha.
 *
 * Cost O(m log m). An empty list gives an empty list. Throws a RangeError when a value is not a
 * probability (NaN, below 0 or above 1).
 * Example: `benjaminiHochberg([0.01, 0.04, 0.03, 0.005, 0.2, 0.03])` is [0.03, 0.048, 0.045, 0.03, 0.2, 0.045].
 */
export function benjaminiHochberg(p: readonly number[]): number[] {
  const m = p.length;
  const order = sortedOrder(p, 'benjaminiHochberg');
  const adjusted = new Array<number>(m).fill(0);
  let running = 1;
  for (let rank = m - 1; rank >= 0; rank--) {
    const i = order[rank] as number;
    running = Math.min(running, (p[i] as number) * (m / (rank + 1))); // m / k >= 1 rounds to >= 1, so q >= p
    adjusted[i] = running;
  }
  return adjusted;
}
