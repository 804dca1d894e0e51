/**
 * Per-sample tick dumps (DESIGN "Inputs"): files with columns `sample, tick, correct, certainty`,
 * optionally `confidence` and `step`, one row per sample and tick. Alternatively, per-class
 * probability columns `p0, p1, ..., p{C-1}` (C >= 2, numbered from 0 without gaps) give
 *
 * - certainty = 1 - H(p)/ln(C), with H(p) = -sum p_c ln p_c (0 ln 0 = 0), the normalised entropy
 *   of METHODS.md "Tick-level analyses" (p is divided by its sum first, so rounding in the file
 *   does not matter; a negative or non-finite p, or a zero sum, makes the row invalid),
 * - confidence = max_c p_c (the top-class probability),
 * - correct = 1 when the class with the largest p (the first, on ties, as numpy's argmax) equals
 *   the `label` column (or `target`), a whole number in 0..C-1.
 * A column given explicitly (`correct`, `certainty`, `confidence`) is used as is; probabilities
 * fill only what is missing.
 *
 * Checks (a dump that fails one is skipped whole, `tick-dump-invalid`, naming the first bad row):
 * sample ids are numbers (samples are ordered by id); ticks are whole numbers >= 0; `correct` is 0
 * or 1 (`true`/`false` accepted); certainty and confidence lie in [0, 1]; every sample has every
 * tick 0..T-1 exactly once, T = largest tick + 1. A file with a `step` column holds one dump per
 * step value. Cells are encoded as in load/query.ts.
 */

/** Where the dump's columns are (indices into the file's names), or why it cannot be read. */
export interface DumpColumns {
  readonly sample: number;
  readonly tick: number;
  readonly step: number | null;
  readonly correct: number | null;
  readonly certainty: number | null;
  readonly confidence: number | null;
  readonly label: number | null;
  /** Probability columns p0..p{C-1}, in class order (empty when absent). */
  readonly probabilities: readonly number[];
}

/** One dump grid: samples x ticks, sample-major. */
export interface DumpGrid {
  readonly step: number | null;
  readonly samples: number;
  readonly ticks: number;
  readonly correct: Uint8Array;
  readonly certainty: Float64Array;
  readonly confidence: Float64Array | null;
}

/**
 * Find the dump columns among a file's names (see the module comment). `stepName` is the step
 * column's name (`--step`, else `step`). Pure. Returns `{ missing }` naming what is lacking.
 * Example: `planDump(['sample', 'tick', 'correct', 'certainty'], 'step')` finds no step and no probabilities.
 */
export function planDump(names: readonly string[], stepName: string): DumpColumns | { readonly missing: string } {
  const at = (name: string): number | null => {
    const k = names.indexOf(name);
    return k < 0 ? null : k;
  };
  const probs: number[] = [];
  for (let c = 0; at(`p${c}`) !== null; c++) probs.push(at(`p${c}`) as number);
  const probabilities = probs.length >= 2 ? probs : [];
  const label = at('label') ?? at('target');
  const sample = at('sample');
  const tick = at('tick');
  const correct = at('correct');
  const certainty = at('certainty');
  const lacking: string[] = [];
  if (sample === null) lacking.push('sample');
  if (tick === null) lacking.push('tick');
  if (correct === null && (probabilities.length === 0 || label === null))
    lacking.push('correct (or p0..pK with label)');
  if (certainty === null && probabilities.length === 0) lacking.push('certainty (or p0..pK)');
  if (lacking.length > 0 || sample === null || tick === null) return { missing: lacking.join(', ') };
  return { sample, tick, step: at(stepName), correct, certainty, confidence: at('confidence'), label, probabilities };
}

/**
 * Certainty, confidence and predicted class from one row of class probabilities (see the module
 * comment: 1 - H/ln C, METHODS.md). Pure, O(C). Returns null when a probability is negative or not
 * finite, the sum is not positive, or C < 2.
 * Example: `fromProbabilities([0.5, 0.5])` is `{ certainty: 0, confidence: 0.5, predicted: 0 }`.
 */
export function fromProbabilities(
  p: ArrayLike<number>,
): { certainty: number; confidence: number; predicted: number } | null {
  const c = p.length;
  if (c < 2) return null;
  let sum = 0;
  let predicted = 0;
  for (let k = 0; k < c; k++) {
    const v = p[k] as number;
    if (!Number.isFinite(v) || v < 0) return null;
    sum += v;
    if (v > (p[predicted] as number)) predicted = k;
  }
  if (!(sum > 0)) return null;
  let entropy = 0;
  for (let k = 0; k < c; k++) {
    const q = (p[k] as number) / sum;
    if (q > 0) entropy -= q * Math.log(q);
  }
  const certainty = Math.min(1, Math.max(0, 1 - entropy / Math.log(c)));
  return { certainty, confidence: (p[predicted] as number) / sum, predicted };
}

type Cells = (column: number) => Float64Array;

/** Per-row values of a dump, in typed arrays (one entry per row). */
interface RowValues {
  readonly correct: Float64Array;
  readonly certainty: Float64Array;
  readonly confidence: Float64Array;
}

/** Check every row and compute its values; the first invalid row stops with its reason. */
function readRows(cells: Cells, rows: number, cols: DumpColumns): RowValues | { row: number; reason: string } {
  const out: RowValues = {
    correct: new Float64Array(rows),
    certainty: new Float64Array(rows),
    confidence: new Float64Array(rows).fill(NaN),
  };
  const sample = cells(cols.sample);
  const tick = cells(cols.tick);
  const probs = cols.probabilities.map((k) => cells(k));
  const p = new Float64Array(probs.length);
  for (let i = 0; i < rows; i++) {
    if (!Number.isFinite(sample[i] as number)) return { row: i, reason: 'sample is not a number' };
    const t = tick[i] as number;
    if (!Number.isInteger(t) || t < 0) return { row: i, reason: 'tick is not a whole number >= 0' };
    for (let c = 0; c < probs.length; c++) p[c] = (probs[c] as Float64Array)[i] as number;
    const derived = probs.length === 0 ? null : fromProbabilities(p);
    if (probs.length > 0 && derived === null && (cols.certainty === null || cols.correct === null))
      return { row: i, reason: 'class probabilities are not non-negative numbers with a positive sum' };
    let correct: number;
    if (cols.correct !== null) correct = cells(cols.correct)[i] as number;
    else {
      const label = cells(cols.label as number)[i] as number;
      if (!Number.isInteger(label) || label < 0 || label >= probs.length)
        return { row: i, reason: `label is not a class number 0..${probs.length - 1}` };
      correct = (derived as { predicted: number }).predicted === label ? 1 : 0;
    }
    if (correct !== 0 && correct !== 1) return { row: i, reason: 'correct is not 0 or 1' };
    const certainty =
      cols.certainty !== null ? (cells(cols.certainty)[i] as number) : (derived as { certainty: number }).certainty;
    if (!(certainty >= 0 && certainty <= 1)) return { row: i, reason: 'certainty is not a number in [0, 1]' };
    const confidence =
      cols.confidence !== null ? (cells(cols.confidence)[i] as number) : derived === null ? NaN : derived.confidence;
    if (cols.confidence !== null && !(confidence >= 0 && confidence <= 1))
      return { row: i, reason: 'confidence is not a number in [0, 1]' };
    out.correct[i] = correct;
    out.certainty[i] = certainty;
    out.confidence[i] = confidence;
  }
  return out;
}

/**
 * Build the dumps of one file (or of one seed's rows of it): `cells(k)` gives column k's encoded
 * cells, one per row. Pure, O(rows log rows), typed arrays only (no object per row). On the first
 * invalid row or an incomplete grid, returns `{ invalid: { row, reason } }` (row -1 when no single
 * row is to blame) and no dumps.
 * Example: rows (sample 0, tick 0, correct 1, certainty 0.4), (0, 1, 1, 0.9) give one dump, 1 sample x 2 ticks.
 */
export function buildDumps(
  cells: Cells,
  rows: number,
  cols: DumpColumns,
): { dumps: DumpGrid[] } | { invalid: { row: number; reason: string } } {
  const stepCells = cols.step === null ? null : cells(cols.step);
  if (stepCells !== null)
    for (let i = 0; i < rows; i++)
      if (!Number.isFinite(stepCells[i] as number)) return { invalid: { row: i, reason: 'step is not a number' } };
  const values = readRows(cells, rows, cols);
  if ('reason' in values) return { invalid: values };
  const sample = cells(cols.sample);
  const tick = cells(cols.tick);
  const order = Int32Array.from({ length: rows }, (_, i) => i);
  if (stepCells !== null) order.sort((a, b) => (stepCells[a] as number) - (stepCells[b] as number) || a - b);
  const dumps: DumpGrid[] = [];
  for (let from = 0; from < rows; ) {
    let to = from + 1;
    if (stepCells !== null)
      while (to < rows && stepCells[order[to] as number] === stepCells[order[from] as number]) to++;
    else to = rows;
    const group = order.subarray(from, to);
    const ids = Float64Array.from(group, (i) => sample[i] as number).sort();
    const index = new Map<number, number>();
    for (const id of ids) if (!index.has(id)) index.set(id, index.size);
    let ticks = 0;
    for (const i of group) ticks = Math.max(ticks, (tick[i] as number) + 1);
    const size = index.size * ticks;
    const correct = new Uint8Array(size);
    const certainty = new Float64Array(size);
    const confidence = cols.confidence === null && cols.probabilities.length === 0 ? null : new Float64Array(size);
    const seen = new Uint8Array(size);
    for (const i of group) {
      const at = (index.get(sample[i] as number) as number) * ticks + (tick[i] as number);
      if (seen[at] === 1)
        return { invalid: { row: i, reason: `sample ${sample[i] as number} has tick ${tick[i] as number} twice` } };
      seen[at] = 1;
      correct[at] = values.correct[i] as number;
      certainty[at] = values.certainty[i] as number;
      if (confidence !== null) confidence[at] = values.confidence[i] as number;
    }
    const hole = seen.indexOf(0);
    if (hole >= 0)
      return {
        invalid: {
          row: -1,
          reason:
            `sample ${[...index.keys()][Math.floor(hole / ticks)] as number} lacks tick ${hole % ticks} ` +
            `(every sample needs ticks 0..${ticks - 1})`,
        },
      };
    dumps.push({
      step: stepCells === null ? null : (stepCells[group[0] as number] as number),
      samples: index.size,
      ticks,
      correct,
      certainty,
      confidence,
    });
    from = to;
  }
  return { dumps };
}
