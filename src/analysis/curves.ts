/**
 * Learning curves across seeds on a shared step grid, without extrapolation.
 *
 * Grid: equal-width bins from the smallest first step to the largest last step of the metric over
 * all runs; as many bins as the longest run has logged points, and at most `bins` (400). Per run,
 * the mean of its logged values in each bin; a bin where the run logged nothing (before its first
 * step, past its last step, or between sparse logs) is null: nothing is carried forward.
 *
 * Per config and bin, across the runs that logged there: the mean, and a band by METHODS.md's rule
 * (the t-interval of the mean at every n; under `--interval bca` the BCa bootstrap of the mean with
 * `bandResamples` (2,000) resamples from 4 runs, falling back to the t interval if BCa fails,
 * e.g. on identical values), n per bin, and the method per bin. Bands are
 * for looking; tests decide. The bootstrap resamples the seeds as whole curves: one table of
 * resample counts per curve (per number of runs present in a bin) serves every bin, so a bin
 * costs one dot product per resample rather than random draws and look-ups (one 40-run x 400-bin
 * curve: about 4x faster), and neighbouring bins move together, as the runs behind them do.
 *
 * Diverged runs are kept as thin per-seed lines; under `--failed exclude` they do not enter the
 * mean, band or n, under `worst` their logged (finite) values do, up to where they stop.
 *
 * Cost O(points + runs x bins) per config, plus bootstrap work in bins with 20+ runs; work buffers
 * (Float64Array) are allocated once per curve.
 */
import type { Run, Series } from '../ingest/types.js';
import { bootstrapMeanFromCounts, resampleCounts } from '../stats/bootstrapMeanFromCounts.js';
import { createRandom, deriveSeed, type Random } from '../stats/random.js';
import { createTQuantileCache, type TQuantile } from '../stats/studentTQuantile.js';
import { tInterval } from '../stats/tInterval.js';
import { isDiverged } from './comparisonStep.js';
import type { Curve, FailedPolicy, IntervalChoice, IntervalMethod } from './results.js';

export interface CurveSettings {
  readonly bins: number;
  readonly level: number;
  readonly interval: IntervalChoice;
  readonly bandResamples: number;
  readonly seed: number;
  readonly failed: FailedPolicy;
}

export interface StepGrid {
  readonly first: number;
  readonly width: number;
  readonly bins: number;
  /** Bin centres (steps). */
  readonly centres: readonly number[];
}

/**
 * The shared grid of a metric over some series (null when none has a point).
 * Example: two series over steps 0..100 with 11 points each and maxBins 400 give 11 bins of width 100/11.
 */
export function stepGrid(series: readonly Series[], maxBins: number): StepGrid | null {
  let first = Infinity;
  let last = -Infinity;
  let longest = 0;
  for (const s of series) {
    const n = s.steps.length;
    if (n === 0) continue;
    first = Math.min(first, s.steps[0] as number);
    last = Math.max(last, s.steps[n - 1] as number);
    longest = Math.max(longest, n);
  }
  if (longest === 0) return null;
  const bins = last > first ? Math.max(1, Math.min(maxBins, longest)) : 1;
  const width = (last - first) / bins;
  const centres: number[] = [];
  for (let b = 0; b < bins; b++) centres.push(bins === 1 && width === 0 ? first : first + (b + 0.5) * width);
  return { first, width, bins, centres };
}

/** The bin of a step on a grid (the last bin includes the grid's end). */
export function binOf(grid: StepGrid, step: number): number {
  if (grid.width === 0) return 0;
  return Math.min(grid.bins - 1, Math.max(0, Math.floor((step - grid.first) / grid.width)));
}

/**
 * One curve per config (in the order the runs come, which should be `orderRuns` order) for a
 * scalar metric. Runs without the metric are left out of its curves; a config with none has no curve.
 * Throws only if the stats functions do on a programming error; data never makes it throw.
 * Example: `learningCurves(runs, 'val_acc', settings)[0].n` counts the runs per bin of the first config.
 */
export function learningCurves(runs: readonly Run[], metric: string, settings: CurveSettings): Curve[] {
  const withMetric: Run[] = [];
  const seriesOf: Series[] = [];
  for (const run of runs) {
    const s = run.metrics[metric];
    if (s === undefined || s.steps.length === 0) continue;
    withMetric.push(run);
    seriesOf.push(s);
  }
  const grid = stepGrid(seriesOf, settings.bins);
  if (grid === null) return [];
  const byConfig = new Map<string, { runs: Run[]; series: Series[] }>();
  for (let j = 0; j < withMetric.length; j++) {
    const run = withMetric[j] as Run;
    let group = byConfig.get(run.config);
    if (group === undefined) {
      group = { runs: [], series: [] };
      byConfig.set(run.config, group);
    }
    group.runs.push(run);
    group.series.push(seriesOf[j] as Series);
  }
  const curves: Curve[] = [];
  for (const [config, group] of byConfig)
    curves.push(configCurve(group.runs, group.series, metric, config, grid, settings));
  return curves;
}

/*
 * The work of one curve is split into small functions on purpose: V8 optimizes a hot loop in a
 * small function once, where a long function that holds the loop is re-optimized each time it
 * reaches code it has not run yet, and runs several times slower in between on a first report.
 */

function configCurve(
  runs: readonly Run[],
  series: readonly Series[],
  metric: string,
  config: string,
  grid: StepGrid,
  settings: CurveSettings,
): Curve {
  const k = grid.bins;
  const r = runs.length;
  // Work buffers, allocated once per curve: runs x bins matrix (NaN = no value), per-bin sums, a column.
  const matrix = new Float64Array(r * k).fill(NaN);
  const sums = new Float64Array(k);
  const counts = new Float64Array(k);
  const perRun: Curve['runs'][number][] = [];
  for (let j = 0; j < r; j++) {
    const run = runs[j] as Run;
    const s = series[j] as Series;
    sums.fill(0);
    counts.fill(0);
    accumulate(s.steps, s.values, grid.first, grid.width, k, sums, counts);
    perRun.push({ run: run.id, seed: run.seed, values: binMeans(sums, counts, matrix, j * k) });
  }
  const counted = runs.map((run) => settings.failed === 'worst' || !isDiverged(run, metric));
  const random = createRandom(deriveSeed(settings.seed, `curve|${metric}|${config}`));
  const { mean, low, high, n, bandByBin } = binBands(
    matrix,
    r,
    k,
    counted,
    settings,
    sharedDraws(random, settings.bandResamples),
  );
  return {
    metric,
    config,
    steps: grid.centres,
    mean,
    low,
    high,
    n,
    band: mainMethod(bandByBin),
    bandByBin,
    level: settings.level,
    runs: perRun,
  };
}

/** Add each point's value to its bin's sum and count, in point order (the bin is `binOf`'s, inlined). */
function accumulate(
  steps: Float64Array,
  values: Float64Array,
  first: number,
  width: number,
  bins: number,
  sums: Float64Array,
  counts: Float64Array,
): void {
  const n = steps.length;
  for (let i = 0; i < n; i++) {
    const b = width === 0 ? 0 : Math.min(bins - 1, Math.max(0, Math.floor(((steps[i] as number) - first) / width)));
    sums[b] = (sums[b] as number) + (values[i] as number);
    counts[b] = (counts[b] as number) + 1;
  }
}

/**
 * Per bin the mean of the run's values (null where it logged
 * nothing), also written to matrix[offset + bin] (NaN there).
 */
function binMeans(sums: Float64Array, counts: Float64Array, matrix: Float64Array, offset: number): (number | null)[] {
  const k = sums.length;
  const values: (number | null)[] = new Array<number | null>(k);
  for (let b = 0; b < k; b++) {
    const c = counts[b] as number;
    const v = c > 0 ? (sums[b] as number) / c : NaN;
    matrix[offset + b] = v;
    values[b] = c > 0 ? v : null;
  }
  return values;
}

/** Mean, band, n and method per bin over the counted runs of a runs x bins matrix. */
function binBands(
  matrix: Float64Array,
  r: number,
  k: number,
  counted: readonly boolean[],
  settings: CurveSettings,
  draws: Draws,
): Pick<Curve, 'mean' | 'low' | 'high' | 'n'> & { bandByBin: IntervalMethod[] } {
  const column = new Float64Array(r);
  const mean: (number | null)[] = [];
  const low: (number | null)[] = [];
  const high: (number | null)[] = [];
  const n: number[] = [];
  const bandByBin: IntervalMethod[] = [];
  const quantile = createTQuantileCache().quantile; // bins of a curve share a few (level, df) pairs
  for (let b = 0; b < k; b++) {
    let m = 0;
    for (let j = 0; j < r; j++) {
      const v = matrix[j * k + b] as number;
      if (counted[j] === true && !Number.isNaN(v)) column[m++] = v;
    }
    const band = binBand(column.subarray(0, m), settings, draws, quantile);
    mean.push(band.mean);
    low.push(band.low);
    high.push(band.high);
    n.push(m);
    bandByBin.push(band.method);
  }
  return { mean, low, high, n, bandByBin };
}

interface Band {
  readonly mean: number | null;
  readonly low: number | null;
  readonly high: number | null;
  readonly method: IntervalMethod;
}

/** Bootstrap resamples of m values as counts (`resampleCounts` layout), B resamples. */
export type Draws = (m: number) => Float64Array;

/**
 * Draws that every bin of a curve shares: one table per number of values m, drawn from `random`
 * the first time a bin with m values asks. Example: `sharedDraws(createRandom(1), 2000)(25).length` is 50,000.
 */
export function sharedDraws(random: Random, resamples: number): Draws {
  const tables = new Map<number, Float64Array>();
  return (m) => {
    let table = tables.get(m);
    if (table === undefined) {
      table = resampleCounts(random, m, resamples);
      tables.set(m, table);
    }
    return table;
  };
}

/**
 * Fresh draws on every call (one interval per generator): the resamples `bootstrapMean` would
 * draw with that generator. Example: `freshDraws(createRandom(1), 2000)(25).length` is 50,000.
 */
export function freshDraws(random: Random, resamples: number): Draws {
  return (m) => resampleCounts(random, m, resamples);
}

/** Runs from which `--interval bca` gives a BCa band (a bootstrap of 3 values covers at most 75%: METHODS.md). */
export const BCA_BAND_FROM = 4;

/**
 * The band of one bin: the t-interval; under `--interval bca`,
 * BCa bootstrap (resample counts from `draws`) from 4 runs.
 */
export function binBand(
  x: Float64Array,
  settings: Pick<CurveSettings, 'level' | 'interval'>,
  draws: Draws,
  quantile?: TQuantile,
): Band {
  const m = x.length;
  if (m === 0) return { mean: null, low: null, high: null, method: 'none' };
  if (m === 1) return { mean: x[0] as number, low: null, high: null, method: 'none' };
  const t = tInterval(x, settings.level, quantile);
  if (settings.interval === 'bca' && m >= BCA_BAND_FROM) {
    try {
      const boot = bootstrapMeanFromCounts(x, draws(m), { method: 'bca', level: settings.level });
      if (Number.isFinite(boot.low) && Number.isFinite(boot.high))
        return { mean: t.estimate, low: boot.low, high: boot.high, method: 'bca' };
    } catch (error) {
      if (!(error instanceof RangeError)) throw error;
    }
  }
  return { mean: t.estimate, low: t.low, high: t.high, method: 't' };
}

/** The method used in most bins that have a band (ties go to the t-interval). */
function mainMethod(methods: readonly IntervalMethod[]): IntervalMethod {
  let t = 0;
  let bca = 0;
  for (const m of methods) {
    if (m === 't') t++;
    else if (m === 'bca') bca++;
  }
  if (t === 0 && bca === 0) return 'none';
  return bca > t ? 'bca' : 't';
}
