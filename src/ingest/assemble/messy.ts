/**
 * The messy-log policies of DESIGN "Messy logs", as pure functions over one run's rows (file order,
 * rows with an unusable step already removed and reported as `step-invalid`). Cells are encoded as
 * in load/query.ts: a finite number; NaN for an empty cell; +Infinity for `nan`/`inf`; -Infinity
 * for text.
 *
 * Per metric (`cleanSeries`):
 * - A row *logs* a metric when its cell holds a number, finite or not (`nan` and `inf` included).
 *   Empty and text cells do not log it, so train and eval rows mixed in one file each keep their
 *   own metrics ("each metric keeps its own non-missing rows").
 * - Duplicated steps: of the rows that log the metric at one step, the last in file order wins.
 *   A step counts as duplicated when two or more rows log the same metric there (train and eval
 *   rows that log different metrics at one step are not duplicates).
 * - Unsorted steps: values are returned sorted by step; the run is reported when a winning row
 *   comes after a winning row with a larger step (a resumed run that repeats steps is not
 *   unsorted once its earlier rows have lost).
 * - Missing cells (empty, `nan`/`inf`, text) are counted (`Series.missing`) and left out.
 * - Divergence: when the last winning values of a metric are non-finite (one or more, up to the
 *   end of the run), the metric diverged at the first step of that final stretch.
 */
import type { Series } from '../types.js';

/**
 * Row order by step (stable: equal steps keep file order), or null when steps strictly increase
 * (the common case, which then costs no sort and no copy). Pure, O(n) when sorted, else
 * O(n log n). Example: `stepOrder(Float64Array.of(1, 3, 2))` is `Int32Array [0, 2, 1]`.
 */
export function stepOrder(steps: Float64Array): Int32Array | null {
  let increasing = true;
  for (let i = 1; i < steps.length; i++) {
    if (!((steps[i] as number) > (steps[i - 1] as number))) {
      increasing = false;
      break;
    }
  }
  if (increasing) return null;
  const order = Int32Array.from({ length: steps.length }, (_, i) => i);
  return order.sort((a, b) => (steps[a] as number) - (steps[b] as number) || a - b);
}

/**
 * The first row, in file order among the rows marked kept, whose step is smaller than a step of an
 * earlier kept row; -1 when the kept rows are in step order. Pure, O(n).
 * Example: steps [10, 30, 20], all kept, gives 2.
 */
export function firstBackwardRow(steps: Float64Array, kept: Uint8Array): number {
  let max = -Infinity;
  for (let i = 0; i < steps.length; i++) {
    if (kept[i] !== 1) continue;
    const s = steps[i] as number;
    if (s < max) return i;
    if (s > max) max = s;
  }
  return -1;
}

/** One metric of one run after the policies, with what they found. Row numbers index the run's rows. */
export interface CleanedSeries {
  readonly series: Series;
  readonly empty: number;
  readonly nonFinite: number;
  readonly text: number;
  /** Steps at which two or more rows logged the metric (sorted). */
  readonly duplicateSteps: readonly number[];
  /** The first winning row that repeats an earlier row's step, else -1. */
  readonly firstDuplicateRow: number;
  /** See `firstBackwardRow`, over the winning rows; -1 when in order. */
  readonly firstUnsortedRow: number;
  /** The row at which the metric went non-finite for good, else -1. */
  readonly divergedRow: number;
}

function countCells(cells: Float64Array): { empty: number; nonFinite: number; text: number } {
  let empty = 0;
  let nonFinite = 0;
  let text = 0;
  for (let i = 0; i < cells.length; i++) {
    const c = cells[i] as number;
    if (Number.isNaN(c)) empty++;
    else if (c === Infinity) nonFinite++;
    else if (c === -Infinity) text++;
  }
  return { empty, nonFinite, text };
}

/**
 * Apply the policies of the module comment to one metric of one run. `steps` are finite, one per
 * row in file order; `order` is `stepOrder(steps)`. When steps strictly increase and every cell
 * is a finite number, the returned series shares `steps` and `cells` (no copy); otherwise it owns
 * new arrays. Pure, O(n). Never throws.
 * Example: steps [1, 2, 2], cells [0.5, 0.6, 0.7] give steps [1, 2], values [0.5, 0.7], one duplicated step.
 */
export function cleanSeries(steps: Float64Array, cells: Float64Array, order: Int32Array | null): CleanedSeries {
  const n = steps.length;
  const counts = countCells(cells);
  const missing = counts.empty + counts.nonFinite + counts.text;
  if (order === null && missing === 0) {
    const series: Series = { steps, values: cells, divergedAt: null, missing: 0 };
    return { series, ...counts, duplicateSteps: [], firstDuplicateRow: -1, firstUnsortedRow: -1, divergedRow: -1 };
  }
  // Winning rows in step order: one per step that some row logs.
  const winners: number[] = [];
  const duplicateSteps: number[] = [];
  let firstDuplicateRow = -1;
  if (order === null) {
    for (let i = 0; i < n; i++) if (!Number.isNaN(cells[i] as number) && cells[i] !== -Infinity) winners.push(i);
  } else {
    let k = 0;
    while (k < n) {
      const step = steps[order[k] as number] as number;
      let last = -1;
      let logged = 0;
      for (; k < n && steps[order[k] as number] === step; k++) {
        const row = order[k] as number;
        const c = cells[row] as number;
        if (!Number.isNaN(c) && c !== -Infinity) {
          last = row;
          logged++;
        }
      }
      if (last < 0) continue;
      winners.push(last);
      if (logged > 1) {
        duplicateSteps.push(step);
        if (firstDuplicateRow < 0 || last < firstDuplicateRow) firstDuplicateRow = last;
      }
    }
  }
  let firstUnsortedRow = -1;
  if (order !== null) {
    const kept = new Uint8Array(n);
    for (const w of winners) kept[w] = 1;
    firstUnsortedRow = firstBackwardRow(steps, kept);
  }
  let divergedRow = -1;
  let end = winners.length;
  while (end > 0 && cells[winners[end - 1] as number] === Infinity) {
    end--;
    divergedRow = winners[end] as number;
  }
  // "Goes non-finite and stays so" needs a finite stretch before: a metric that is never finite
  // did not diverge, it was never logged (the loader reports it as metric-empty).
  if (end === 0 || !winners.slice(0, end).some((w) => Number.isFinite(cells[w] as number))) divergedRow = -1;
  let finite = 0;
  for (const w of winners) if (Number.isFinite(cells[w] as number)) finite++;
  const outSteps = new Float64Array(finite);
  const outValues = new Float64Array(finite);
  let j = 0;
  for (const w of winners) {
    const c = cells[w] as number;
    if (!Number.isFinite(c)) continue;
    outSteps[j] = steps[w] as number;
    outValues[j] = c;
    j++;
  }
  const series: Series = {
    steps: outSteps,
    values: outValues,
    divergedAt: divergedRow < 0 ? null : (steps[divergedRow] as number),
    missing,
  };
  return { series, ...counts, duplicateSteps, firstDuplicateRow, firstUnsortedRow, divergedRow };
}
