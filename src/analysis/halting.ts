/**
 * Certainty-threshold halting (METHODS.md, tick-level analyses): for a threshold tau, each sample
 * exits at the first tick whose certainty is >= tau, or at the last tick when none is. Per run, the
 * accuracy at exit (fraction of samples correct at their exit tick) and the mean exit tick; per
 * config, the mean across seeds of both with a t-interval, over a grid of thresholds (the
 * accuracy-compute trade-off curve), and the histogram of exit ticks at a reference threshold.
 *
 * Conventions:
 * - Ticks are 0-based indices (0 .. ticks-1), as in ingest; a mean exit tick of 3.5 means on
 *   average 4.5 ticks were run.
 * - A NaN certainty never triggers an exit.
 * - One dump per run: when a run has dumps at several checkpoints, the one with the largest step is
 *   used (a dump without a step counts as older than any dump with one; among equals, the later in
 *   input order). See `latestDumpPerRun`.
 * - `samples` of a curve is the samples per run (the smallest, should runs differ); `ticks` the
 *   largest tick count; the histogram counts are summed over the config's runs.
 *
 * Algorithm: thresholds are sorted once; for each sample the running maximum of certainty over
 * ticks is compared with the sorted thresholds, so one pass over the sample's ticks finds the first
 * crossing of every threshold (the first tick with certainty >= tau is the first tick at which the
 * running maximum reaches tau). The pass stops once every threshold is crossed. Cost
 * O(samples x (ticks + thresholds)) per dump, typed arrays only, memory O(thresholds + ticks).
 */
import type { TickDump } from '../ingest/types.js';
import type { HaltingCurve } from './results.js';
import { seedMeanInterval } from './seedMeanInterval.js';

/** Per-run result of halting at each (sorted, unique) threshold. */
interface RunHalting {
  readonly accuracy: Float64Array;
  readonly meanExit: Float64Array;
  readonly histogram: Float64Array;
}

/**
 * Keep one dump per run: the one at the largest step (null steps count as oldest; ties go to the
 * later dump in input order). Runs keep the order in which they first appear.
 * Cost O(dumps). Example: dumps of run r at steps 100 and 200 give the one at 200.
 */
export function latestDumpPerRun(dumps: readonly TickDump[]): TickDump[] {
  const chosen = new Map<string, TickDump>();
  for (const d of dumps) {
    const prev = chosen.get(d.run);
    if (prev === undefined || (d.step ?? -Infinity) >= (prev.step ?? -Infinity)) chosen.set(d.run, d);
  }
  return [...chosen.values()];
}

function checkDump(d: TickDump): void {
  const cells = d.samples * d.ticks;
  if (
    d.correct.length !== cells ||
    d.certainty.length !== cells ||
    (d.confidence !== null && d.confidence.length !== cells)
  ) {
    throw new RangeError(`tick dump of run ${d.run}: arrays must hold samples x ticks = ${cells} cells`);
  }
  for (let i = 0; i < cells; i++) {
    if ((d.correct[i] as number) > 1)
      throw new RangeError(`tick dump of run ${d.run}: correct must be 0 or 1, got ${d.correct[i]}`);
  }
}

/** One pass over a dump: exit tick of every sample at every sorted threshold. */
function haltRun(d: TickDump, sorted: Float64Array, reference: number): RunHalting {
  const J = sorted.length;
  const K = d.ticks;
  const correctAtExit = new Float64Array(J);
  const exitSum = new Float64Array(J);
  const histogram = new Float64Array(K);
  const { certainty, correct } = d;
  for (let s = 0; s < d.samples; s++) {
    const row = s * K;
    let runningMax = -Infinity;
    let j = 0;
    for (let t = 0; t < K && j < J; t++) {
      const c = certainty[row + t] as number;
      if (!(c > runningMax)) continue;
      runningMax = c;
      while (j < J && runningMax >= (sorted[j] as number)) {
        correctAtExit[j] = (correctAtExit[j] as number) + (correct[row + t] as number);
        exitSum[j] = (exitSum[j] as number) + t;
        if (j === reference) histogram[t] = (histogram[t] as number) + 1;
        j++;
      }
    }
    // Thresholds never reached: exit at the last tick.
    if (j < J) {
      const last = K - 1;
      const k = correct[row + last] as number;
      for (; j < J; j++) {
        correctAtExit[j] = (correctAtExit[j] as number) + k;
        exitSum[j] = (exitSum[j] as number) + last;
        if (j === reference) histogram[last] = (histogram[last] as number) + 1;
      }
    }
  }
  const accuracy = new Float64Array(J);
  const meanExit = new Float64Array(J);
  for (let j = 0; j < J; j++) {
    accuracy[j] = (correctAtExit[j] as number) / d.samples;
    meanExit[j] = (exitSum[j] as number) / d.samples;
  }
  return { accuracy, meanExit, histogram };
}

/**
 * Halting curves per config (configs in order of first appearance) from per-sample tick dumps.
 * Dumps with no samples or no ticks are skipped. Intervals are Student t-intervals across runs at
 * `level`; with one run they are null.
 * Cost O(total cells); see the file comment. Throws a RangeError when `thresholds` is empty or holds
 * a non-finite value, when `referenceThreshold` is not finite, or when a dump's arrays do not hold
 * samples x ticks cells or a correctness value is not 0 or 1.
 * Example: `haltingCurves(dumps, { thresholds: [0.5, 0.8], level: 0.95, referenceThreshold: 0.8 })`.
 */
export function haltingCurves(
  dumps: readonly TickDump[],
  opts: { thresholds: readonly number[]; level: number; referenceThreshold: number },
): HaltingCurve[] {
  if (opts.thresholds.length === 0) throw new RangeError('haltingCurves requires at least one threshold');
  for (const tau of [...opts.thresholds, opts.referenceThreshold]) {
    if (!Number.isFinite(tau)) throw new RangeError(`halting thresholds must be finite, got ${tau}`);
  }
  const sorted = Float64Array.from(new Set([...opts.thresholds, opts.referenceThreshold])).sort();
  const position = (tau: number): number => sorted.indexOf(tau);
  const reference = position(opts.referenceThreshold);

  const byConfig = new Map<string, TickDump[]>();
  for (const d of latestDumpPerRun(dumps)) {
    checkDump(d);
    if (d.samples === 0 || d.ticks === 0) continue;
    const list = byConfig.get(d.config);
    if (list === undefined) byConfig.set(d.config, [d]);
    else list.push(d);
  }

  const curves: HaltingCurve[] = [];
  for (const [config, runs] of byConfig) {
    const results = runs.map((d) => haltRun(d, sorted, reference));
    const ticks = Math.max(...runs.map((d) => d.ticks));
    const counts = new Array<number>(ticks).fill(0);
    for (const r of results) {
      r.histogram.forEach((c, t) => {
        counts[t] = (counts[t] as number) + c;
      });
    }
    const perThreshold = opts.thresholds.map((tau) => {
      const j = position(tau);
      return {
        accuracy: seedMeanInterval(
          results.map((r) => r.accuracy[j] as number),
          opts.level,
        ),
        exitTick: seedMeanInterval(
          results.map((r) => r.meanExit[j] as number),
          opts.level,
        ),
      };
    });
    curves.push({
      config,
      thresholds: [...opts.thresholds],
      accuracy: perThreshold.map((x) => x.accuracy),
      exitTick: perThreshold.map((x) => x.exitTick),
      seeds: runs.length,
      samples: Math.min(...runs.map((d) => d.samples)),
      ticks,
      exitHistogram: { threshold: opts.referenceThreshold, counts },
    });
  }
  return curves;
}
