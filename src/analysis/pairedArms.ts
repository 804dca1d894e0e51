/**
 * The runs of two arms matched by seed, for `--paired`: the values of the seeds present in both
 * arms, in the candidate's order (x candidate, y baseline). A seed in one arm only is left out.
 * Pure; cost O(runs).
 */
import type { Arm } from './arms.js';

export function pairedArms(base: Arm, cand: Arm): { x: Float64Array; y: Float64Array } {
  const bySeed = new Map<string, number>();
  base.seeds.forEach((seed, i) => {
    bySeed.set(seed, base.values[i] as number);
  });
  const x: number[] = [];
  const y: number[] = [];
  cand.seeds.forEach((seed, i) => {
    const b = bySeed.get(seed);
    if (b !== undefined) {
      x.push(cand.values[i] as number);
      y.push(b);
    }
  });
  return { x: Float64Array.from(x), y: Float64Array.from(y) };
}
