/**
 * Fewer points for a line that only needs to be looked at: consecutive points taken `stride` at a
 * time, each group drawn as one point at the mean of its steps and the mean of its values (values
 * that are null, a break in the line, left out of the mean; a group with none stays null). Used for
 * the single-seed lines of a learning-curve chart when a study has hundreds of runs: the chart
 * then says at what resolution they are drawn. Pure, O(points).
 * Example: `coarsenLine([0, 1, 2, 3, 4], [1, 3, null, 5, 7], 2)` is `{ steps: [0.5, 2.5, 4], values: [2, 5, 7] }`.
 */
export function coarsenLine(
  steps: readonly number[],
  values: readonly (number | null)[],
  stride: number,
): { steps: number[]; values: (number | null)[] } {
  if (!Number.isInteger(stride) || stride < 1)
    throw new RangeError(`coarsenLine: stride must be a whole number >= 1, got ${stride}`);
  if (stride === 1) return { steps: [...steps], values: [...values] };
  const outSteps: number[] = [];
  const outValues: (number | null)[] = [];
  for (let from = 0; from < steps.length; from += stride) {
    const to = Math.min(steps.length, from + stride);
    let stepSum = 0;
    let valueSum = 0;
    let count = 0;
    for (let i = from; i < to; i++) {
      stepSum += steps[i] as number;
      const v = values[i] ?? null;
      if (v !== null) {
        valueSum += v;
        count++;
      }
    }
    outSteps.push(stepSum / (to - from));
    outValues.push(count === 0 ? null : valueSum / count);
  }
  return { steps: outSteps, values: outValues };
}

/**
 * The stride that keeps `lines` lines of `points` points each within `budget` points in all.
 * Example: `lineStride(400, 400, 24000)` is 7; `lineStride(30, 400, 24000)` is 1.
 */
export function lineStride(lines: number, points: number, budget: number): number {
  return Math.max(1, Math.ceil((lines * points) / budget));
}
