/**
 * Comparisons of a metric whose goal is unknown (no --metric, no name rule: `goalSource`
 * `unknown`) are computed as if higher were better, then say only which way the difference goes.
 */
import type { Comparison } from './results.js';

/**
 * A comparison of a metric whose goal is unknown says which way the difference goes, never
 * better or worse: a better/worse verdict (computed as if higher were better) becomes
 * inconclusive, with a caution that says whether the candidate is higher or lower.
 */
export function directionOnly(c: Comparison): Comparison {
  if ((c.verdict !== 'better' && c.verdict !== 'worse') || c.difference.estimate === null) return c;
  const way = c.difference.estimate > 0 ? 'higher' : 'lower';
  return {
    ...c,
    verdict: 'inconclusive',
    cautions: [
      ...c.cautions,
      `no goal is known for ${c.metric}: the candidate is ${way} (adjusted p below alpha), but whether that is ` +
        `better is not known; say --metric ${c.metric}:max or ${c.metric}:min`,
    ],
  };
}
