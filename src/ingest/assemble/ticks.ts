/**
 * Per-tick metrics (DESIGN "Inputs"): wide columns `name@k` (k = 0, 1, ...), or long files with a
 * `tick` column and one row per step and tick. Both become a `TickSeries`: the steps at which any
 * tick of the metric was logged, sorted, and for each tick k a value per step (NaN where tick k
 * was not logged, or logged as `nan`/`inf`, at that step).
 *
 * The policies are those of messy.ts, applied per cell: of the rows logging tick k at one step, the
 * last in file order wins; a step is duplicated when two rows log the same tick there; missing
 * cells are counted. Divergence is judged on scalar metrics only. Cells are encoded as in
 * load/query.ts. Row numbers index the run's rows (file order, usable steps only).
 */
import { firstBackwardRow } from './messy.js';
import type { TickSeries } from '../types.js';

/** A per-tick metric of one run after the policies, with what they found. */
export interface CleanedTicks {
  readonly series: TickSeries;
  readonly empty: number;
  readonly nonFinite: number;
  readonly text: number;
  readonly duplicateSteps: readonly number[];
  readonly firstDuplicateRow: number;
  readonly firstUnsortedRow: number;
  /** Long files: rows whose tick is not a whole number >= 0 (not used). */
  readonly invalidTickRows: readonly number[];
}

/** Where the cells of a per-tick metric are: one column per tick (wide), or a tick column and a cell column (long). */
type TickCells =
  | { readonly wide: readonly (Float64Array | undefined)[] }
  | { readonly ticks: Float64Array; readonly cells: Float64Array };

/**
 * Build a TickSeries: rows are visited in step order (`visit`); per step and tick the last
 * logged cell in file order wins. Shared by the wide and long forms; plain indexed loops (this
 * runs over rows x ticks cells).
 */
function build(
  steps: Float64Array,
  visit: Int32Array,
  ticks: number,
  source: TickCells,
): Omit<CleanedTicks, 'invalidTickRows'> {
  const n = visit.length;
  const lastRow = new Int32Array(ticks);
  const lastCell = new Float64Array(ticks);
  const logged = new Int32Array(ticks);
  const outSteps = new Float64Array(n);
  const outValues = Array.from({ length: ticks }, () => new Float64Array(n));
  const kept = new Uint8Array(steps.length);
  const duplicateSteps: number[] = [];
  let firstDuplicateRow = -1;
  let empty = 0;
  let nonFinite = 0;
  let text = 0;
  let out = 0;
  const wide = 'wide' in source ? source.wide : null;
  const tickOf = 'wide' in source ? null : source.ticks;
  const longCells = 'wide' in source ? null : source.cells;
  let k = 0;
  while (k < n) {
    const step = steps[visit[k] as number] as number;
    lastRow.fill(-1);
    logged.fill(0);
    for (; k < n && steps[visit[k] as number] === step; k++) {
      const row = visit[k] as number;
      // Each row gives (tick, cell) pairs: every tick column (wide), or its tick (long).
      const first = wide === null ? ((tickOf as Float64Array)[row] as number) : 0;
      const last = wide === null ? first : ticks - 1;
      if (wide === null && !(Number.isInteger(first) && first >= 0)) continue;
      for (let t = first; t <= last; t++) {
        let c: number;
        if (wide === null) c = (longCells as Float64Array)[row] as number;
        else {
          const col = wide[t];
          if (col === undefined) continue;
          c = col[row] as number;
        }
        if (Number.isNaN(c)) {
          empty++;
          continue;
        }
        if (c === -Infinity) {
          text++;
          continue;
        }
        if (c === Infinity) nonFinite++;
        lastRow[t] = row;
        lastCell[t] = c;
        logged[t] = (logged[t] as number) + 1;
      }
    }
    let any = false;
    let duplicated = false;
    for (let t = 0; t < ticks; t++) {
      const r = lastRow[t] as number;
      if (r < 0) continue;
      any = true;
      kept[r] = 1;
      if ((logged[t] as number) > 1) {
        duplicated = true;
        if (firstDuplicateRow < 0 || r < firstDuplicateRow) firstDuplicateRow = r;
      }
    }
    if (!any) continue;
    if (duplicated) duplicateSteps.push(step);
    outSteps[out] = step;
    for (let t = 0; t < ticks; t++) {
      const c = lastCell[t] as number;
      (outValues[t] as Float64Array)[out] = (lastRow[t] as number) >= 0 && Number.isFinite(c) ? c : NaN;
    }
    out++;
  }
  const series: TickSeries = { steps: outSteps.slice(0, out), values: outValues.map((v) => v.slice(0, out)) };
  return {
    series,
    empty,
    nonFinite,
    text,
    duplicateSteps,
    firstDuplicateRow,
    firstUnsortedRow: firstBackwardRow(steps, kept),
  };
}

function identity(n: number): Int32Array {
  return Int32Array.from({ length: n }, (_, i) => i);
}

/**
 * The wide form when steps strictly increase (the common case): one row per step, so no
 * duplicates and nothing to sort; column by column, which is several times faster than row by row.
 * The loops are small functions of their own so that V8 optimizes each once.
 */
function increasingWide(steps: Float64Array, columns: readonly (Float64Array | undefined)[]): CleanedTicks {
  const n = steps.length;
  const logged = new Uint8Array(n);
  // Cells found empty, not a number (text) and +-inf, over all columns.
  const tally: Tally = { empty: 0, text: 0, nonFinite: 0 };
  const complete = columns.map((col) => col !== undefined && scanColumn(col, n, logged, tally));
  let count = 0;
  for (let i = 0; i < n; i++) count += logged[i] as number;
  const outSteps = count === n ? steps : compactSteps(steps, logged, count);
  const values = columns.map((col, t) => {
    if (col === undefined) return new Float64Array(count).fill(NaN);
    // Every row logged and every cell of this column finite: the column as it is.
    if (count === n && complete[t] === true) return col;
    return compactColumn(col, logged, count);
  });
  const { empty, nonFinite, text } = tally;
  return {
    series: { steps: outSteps, values },
    empty,
    nonFinite,
    text,
    duplicateSteps: [],
    firstDuplicateRow: -1,
    firstUnsortedRow: -1,
    invalidTickRows: [],
  };
}

interface Tally {
  empty: number;
  text: number;
  nonFinite: number;
}

/**
 * Count one column's missing cells into `tally` and mark the rows where it has a cell (finite or
 * +-inf) in `logged`. True when the column has a finite cell in each of the n rows.
 */
function scanColumn(col: Float64Array, n: number, logged: Uint8Array, tally: Tally): boolean {
  let empty = 0;
  let text = 0;
  let nonFinite = 0;
  for (let i = 0; i < n; i++) {
    const c = col[i] as number;
    if (Number.isNaN(c)) empty++;
    else if (c === -Infinity) text++;
    else {
      logged[i] = 1;
      if (c === Infinity) nonFinite++;
    }
  }
  tally.empty += empty;
  tally.text += text;
  tally.nonFinite += nonFinite;
  return col.length === n && empty === 0 && text === 0 && nonFinite === 0;
}

/** The steps of the logged rows. */
function compactSteps(steps: Float64Array, logged: Uint8Array, count: number): Float64Array {
  const out = new Float64Array(count);
  for (let i = 0, j = 0; i < steps.length; i++) if (logged[i] === 1) out[j++] = steps[i] as number;
  return out;
}

/** A column's values at the logged rows, NaN where its cell there is not finite. */
function compactColumn(col: Float64Array, logged: Uint8Array, count: number): Float64Array {
  const out = new Float64Array(count).fill(NaN);
  for (let i = 0, j = 0; i < logged.length; i++) {
    if (logged[i] !== 1) continue;
    const c = col[i] as number;
    if (Number.isFinite(c)) out[j] = c;
    j++;
  }
  return out;
}

/**
 * A per-tick metric from wide columns: `columns[k]` holds tick k's cells (undefined when the file
 * has no column for tick k). `order` is `stepOrder(steps)`. Pure, O(rows x ticks). When steps
 * strictly increase and every row has a cell, the series shares `steps` and every column whose
 * cells are all finite (no copy, as `cleanSeries` does); otherwise it owns new arrays.
 * Example: steps [1, 2], columns [[0.1, 0.2], [0.3, 0.4]] give steps [1, 2], values [[0.1, 0.2], [0.3, 0.4]].
 */
export function wideTickSeries(
  steps: Float64Array,
  order: Int32Array | null,
  columns: readonly (Float64Array | undefined)[],
): CleanedTicks {
  if (order === null) return increasingWide(steps, columns);
  const visit = order;
  const built = build(steps, visit, columns.length, { wide: columns });
  return { ...built, invalidTickRows: [] };
}

/**
 * A per-tick metric from a long file: row i logs `cells[i]` at tick `ticks[i]` (encoded cells; a
 * tick that is not a whole number >= 0 makes the row unusable, listed in `invalidTickRows`).
 * `order` is `stepOrder(steps)`. Pure, O(rows log rows). The number of ticks is the largest tick + 1.
 * Example: steps [5, 5], ticks [0, 1], cells [0.2, 0.4] give steps [5], values [[0.2], [0.4]].
 */
export function longTickSeries(
  steps: Float64Array,
  ticks: Float64Array,
  order: Int32Array | null,
  cells: Float64Array,
): CleanedTicks {
  const invalidTickRows: number[] = [];
  let count = 0;
  for (let i = 0; i < ticks.length; i++) {
    const t = ticks[i] as number;
    if (Number.isInteger(t) && t >= 0) count = Math.max(count, t + 1);
    else invalidTickRows.push(i);
  }
  const visit = order ?? identity(steps.length);
  const built = build(steps, visit, count, { ticks, cells });
  return { ...built, invalidTickRows };
}
