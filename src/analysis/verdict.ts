/**
 * The decision of a family of comparisons (METHODS.md, "Multiple comparisons" and "Verdict"):
 * p-values adjusted across the family (Holm 1979 by default, Benjamini-Hochberg 1995 by option, or
 * none), then `better` when the adjusted p < alpha and the difference points in the goal's
 * direction, `worse` when the adjusted p < alpha and it points the other way, else `inconclusive`.
 * A family is the comparisons of one metric, one summary and one task.
 */
import type { Goal } from '../ingest/types.js';
import { benjaminiHochberg } from '../stats/benjaminiHochberg.js';
import { holm } from '../stats/holm.js';
import type { Correction, Verdict } from './results.js';

/**
 * Adjust the p-values of a family; nulls (tests that could not run) are left out of the family
 * and stay null. Cost O(m log m).
 * Example: `adjustFamily([0.01, null, 0.04], 'holm')` is `[0.02, null, 0.04]`.
 */
export function adjustFamily(p: readonly (number | null)[], correction: Correction): (number | null)[] {
  const present: number[] = [];
  for (const v of p) if (v !== null) present.push(v);
  const adjusted = correction === 'holm' ? holm(present) : correction === 'bh' ? benjaminiHochberg(present) : present;
  let k = 0;
  return p.map((v) => (v === null ? null : (adjusted[k++] as number)));
}

/**
 * The verdict of one comparison from its adjusted p, the estimated difference (candidate minus
 * baseline) and the goal of the compared values.
 * Example: `decideVerdict(0.01, -0.3, 'min', 0.05)` is `'better'` (lower is better and it went down).
 */
export function decideVerdict(pAdjusted: number | null, difference: number, goal: Goal, alpha: number): Verdict {
  if (pAdjusted === null || !(pAdjusted < alpha) || difference === 0 || !Number.isFinite(difference))
    return 'inconclusive';
  const up = difference > 0;
  return up === (goal === 'max') ? 'better' : 'worse';
}
