/**
 * One run's rows as one table: the parts of the run (one per file, or per seed of a file) stacked
 * in source order, each metric a column of encoded cells (load/query.ts; NaN where a part has no
 * such column), and the rows whose step is not a finite number taken out and reported
 * (`step-invalid`, per file, with the lines of the first few). With a single part and every step
 * usable, the columns are the file's own arrays (no copy).
 *
 * Metric names: a scalar column is named as in the file; a wide per-tick column `name@k` is tick k
 * of `name`; a `--seed-columns` column is the pattern's metric; in a long per-tick file every
 * column other than the step, `tick` and seed columns is a per-tick metric. Only names that hold
 * a number somewhere in the study (`numeric`) become metrics.
 */
import type { FileData } from '../load/loadFiles.js';
import type { Part } from './parts.js';
import { LISTED_ROWS } from './parts.js';
import { draft, type Draft, type RowRef } from '../lines/drafts.js';

/** A run's rows (usable steps only, file order). */
export interface RunRows {
  readonly steps: Float64Array;
  /** Scalar metrics (long files: per-tick metrics) by name. */
  readonly metrics: ReadonlyMap<string, Float64Array>;
  /** Wide per-tick metrics by base name: tick k's column, undefined where no file has tick k. */
  readonly wide: ReadonlyMap<string, readonly (Float64Array | undefined)[]>;
  /** Long files: the tick column. */
  readonly ticks: Float64Array | null;
  readonly parts: readonly Part[];
  /** Row of the stacked table where each part starts (length parts + 1). */
  readonly offsets: Int32Array;
  /** Stacked-table row of each usable row; null when every row was usable. */
  readonly kept: Int32Array | null;
}

/**
 * The file row behind row i of a run table. Pure, O(log parts).
 * Example: with two parts of 3 rows each and every row kept, row 4 is row 1 of the second part's file.
 */
export function refOf(rows: RunRows, i: number): RowRef {
  const at = rows.kept === null ? i : (rows.kept[i] as number);
  let lo = 0;
  let hi = rows.parts.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if ((rows.offsets[mid] as number) <= at) lo = mid;
    else hi = mid - 1;
  }
  const part = rows.parts[lo] as Part;
  const local = at - (rows.offsets[lo] as number);
  return { data: part.data, kind: 'row', n: part.rows === null ? local : (part.rows[local] as number) };
}

/** The columns of one part by metric name. */
function partColumns(
  part: Part,
  numeric: ReadonlySet<string>,
): { metrics: Map<string, number>; wide: Map<string, Map<number, number>> } {
  const plan = part.data.plan;
  const metrics = new Map<string, number>();
  const wide = new Map<string, Map<number, number>>();
  if (part.perSeed.length > 0) {
    for (const c of part.perSeed) if (numeric.has(c.metric) && !metrics.has(c.metric)) metrics.set(c.metric, c.index);
    return { metrics, wide };
  }
  for (const k of plan.scalars) {
    const name = plan.names[k] as string;
    if (numeric.has(name)) metrics.set(name, k);
  }
  for (const t of plan.wideTicks) {
    if (!numeric.has(`${t.base}@`)) continue;
    const m = wide.get(t.base) ?? new Map<number, number>();
    m.set(t.tick, t.index);
    wide.set(t.base, m);
  }
  return { metrics, wide };
}

function gather(
  parts: readonly Part[],
  offsets: Int32Array,
  column: (part: Part, p: number) => number | null,
): Float64Array {
  const out = new Float64Array(offsets[parts.length] as number).fill(NaN);
  parts.forEach((part, p) => {
    const k = column(part, p);
    if (k === null) return;
    const src = part.data.cells.get(k) as Float64Array;
    const base = offsets[p] as number;
    if (part.rows === null) out.set(src, base);
    else for (let i = 0; i < part.rows.length; i++) out[base + i] = src[part.rows[i] as number] as number;
  });
  return out;
}

function compact(column: Float64Array, kept: Int32Array): Float64Array {
  const out = new Float64Array(kept.length);
  for (let i = 0; i < kept.length; i++) out[i] = column[kept[i] as number] as number;
  return out;
}

/**
 * Stack the parts of one run (see the module comment). `numeric` holds the metric names with a
 * number somewhere (`name@` for a wide per-tick base). Pure, O(rows x metrics).
 * Example: one part of a file with columns step, loss gives `metrics: { loss }` sharing the file's arrays.
 */
export function runRows(parts: readonly Part[], numeric: ReadonlySet<string>): { rows: RunRows; drafts: Draft[] } {
  const offsets = new Int32Array(parts.length + 1);
  parts.forEach((p, k) => {
    offsets[k + 1] = (offsets[k] as number) + (p.rows === null ? p.data.rows : p.rows.length);
  });
  const columns = parts.map((p) => partColumns(p, numeric));
  const single = parts.length === 1 && (parts[0] as Part).rows === null;
  const column = (pick: (part: Part, p: number) => number | null): Float64Array => {
    if (single) {
      const k = pick(parts[0] as Part, 0);
      if (k !== null) return (parts[0] as Part).data.cells.get(k) as Float64Array;
    }
    return gather(parts, offsets, pick);
  };
  let steps = column((part) => part.data.plan.step);
  const metricNames = [...new Set(columns.flatMap((c) => [...c.metrics.keys()]))];
  const metrics = new Map(
    metricNames.map(
      (name) => [name, column((_, p) => (columns[p] as (typeof columns)[number]).metrics.get(name) ?? null)] as const,
    ),
  );
  const wideNames = [...new Set(columns.flatMap((c) => [...c.wide.keys()]))];
  const wide = new Map(
    wideNames.map((base) => {
      const count = Math.max(...columns.map((c) => Math.max(-1, ...(c.wide.get(base)?.keys() ?? [])))) + 1;
      const list = Array.from({ length: count }, (_, t) => {
        const present = columns.some((c) => c.wide.get(base)?.has(t) === true);
        return present
          ? column((_, p) => (columns[p] as (typeof columns)[number]).wide.get(base)?.get(t) ?? null)
          : undefined;
      });
      return [base, list] as const;
    }),
  );
  let ticks = parts.some((p) => p.data.plan.tick !== null) ? column((part) => part.data.plan.tick) : null;

  const drafts: Draft[] = [];
  const bad: number[] = [];
  for (let i = 0; i < steps.length; i++) if (!Number.isFinite(steps[i] as number)) bad.push(i);
  let kept: Int32Array | null = null;
  if (bad.length > 0) {
    const isBad = new Uint8Array(steps.length);
    for (const i of bad) isBad[i] = 1;
    const keep: number[] = [];
    for (let i = 0; i < steps.length; i++) if (isBad[i] === 0) keep.push(i);
    kept = Int32Array.from(keep);
    const k = kept;
    const table: RunRows = { steps, metrics, wide, ticks, parts, offsets, kept: null };
    const byFile = new Map<FileData, RowRef[]>();
    for (const i of bad) {
      const ref = refOf(table, i);
      const list = byFile.get(ref.data) ?? [];
      list.push(ref);
      byFile.set(ref.data, list);
    }
    for (const [data, refs] of byFile) {
      const stepName = data.plan.names[data.plan.step as number] as string;
      drafts.push(
        draft(
          'step-invalid',
          `${refs.length} row(s) have a ${stepName} cell that is empty, not a number or not finite; those rows were ` +
            `dropped${refs.length > LISTED_ROWS ? `; the first ${LISTED_ROWS}` : ''}`,
          { file: data.header.source.file, rows: refs.slice(0, LISTED_ROWS) },
        ),
      );
    }
    steps = compact(steps, k);
    for (const [name, col] of metrics) metrics.set(name, compact(col, k));
    for (const [base, list] of wide)
      wide.set(
        base,
        list.map((c) => (c === undefined ? undefined : compact(c, k))),
      );
    if (ticks !== null) ticks = compact(ticks, k);
  }
  return { rows: { steps, metrics, wide, ticks, parts, offsets, kept }, drafts };
}

/** Is any cell a number (finite, or `nan`/`inf`)? Stops at the first. */
function holdsNumber(cells: Float64Array | undefined): boolean {
  if (cells === undefined) return false;
  for (let i = 0; i < cells.length; i++) {
    const c = cells[i] as number;
    if (!Number.isNaN(c) && c !== -Infinity) return true;
  }
  return false;
}

/**
 * The metric names (as `runRows` names them; `base@` for a wide per-tick metric) that hold a number
 * in at least one log file, and the column names that hold none anywhere, with the files that have
 * them (`column-not-numeric`). Pure, O(cells) at worst, usually O(columns).
 * Example: a column `phase` holding only `train`/`eval` is not numeric.
 */
export function numericNames(data: readonly FileData[]): { numeric: Set<string>; notNumeric: Map<string, string[]> } {
  const numeric = new Set<string>();
  const filesOf = new Map<string, string[]>();
  const columns = data
    .filter((d) => d.plan.kind === 'log')
    .map((d) => {
      const plan = d.plan;
      const keyed: { name: string; key: string; index: number }[] = [
        ...plan.scalars.map((k) => ({ name: plan.names[k] as string, key: plan.names[k] as string, index: k })),
        ...plan.wideTicks.map((t) => ({ name: plan.names[t.index] as string, key: `${t.base}@`, index: t.index })),
        ...plan.perSeed.map((c) => ({ name: plan.names[c.index] as string, key: c.metric, index: c.index })),
      ];
      const file = d.header.source.file;
      for (const c of keyed) {
        if (!numeric.has(c.key) && holdsNumber(d.cells.get(c.index))) numeric.add(c.key);
        const files = filesOf.get(c.name) ?? [];
        if (files[files.length - 1] !== file) files.push(file);
        filesOf.set(c.name, files);
      }
      return keyed;
    });
  const notNumeric = new Map<string, string[]>();
  for (const keyed of columns)
    for (const c of keyed)
      if (!numeric.has(c.key) && !notNumeric.has(c.name)) notNumeric.set(c.name, filesOf.get(c.name) ?? []);
  return { numeric, notNumeric };
}
