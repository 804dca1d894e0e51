/**
 * Learning curves for `results.json` on a coarser grid, so the file stays a size a user can move
 * around: every k-th bin of the analysis grid is kept (k the smallest stride that leaves at most
 * `maxPoints` bins, the last bin always kept), with its mean, band, run count and every run's
 * value at that bin exactly as analysed; nothing is averaged or interpolated. The report's charts
 * use the full grid; `--full-curves` writes it to results.json too.
 */
import type { Curve } from '../analysis/results.js';

/** Bins per curve in results.json unless --full-curves. */
export const JSON_CURVE_POINTS = 100;

/**
 * The bins kept for a curve of `bins` bins: indices 0, k, 2k, ... and the last one.
 * Cost O(bins). Never throws. Example: `keptBins(10, 4)` → `[0, 3, 6, 9]`.
 */
export function keptBins(bins: number, maxPoints: number): number[] {
  if (bins <= maxPoints) return Array.from({ length: bins }, (_, i) => i);
  const stride = Math.ceil((bins - 1) / Math.max(1, maxPoints - 1));
  const out: number[] = [];
  for (let i = 0; i < bins; i += stride) out.push(i);
  if (out[out.length - 1] !== bins - 1) out.push(bins - 1);
  return out;
}

/**
 * `curves` with at most `maxPoints` bins each (see the module comment).
 * Cost O(curves x bins x runs). Never throws.
 */
export function coarseCurves(curves: readonly Curve[], maxPoints: number): Curve[] {
  return curves.map((c) => {
    if (c.steps.length <= maxPoints) return c;
    const keep = keptBins(c.steps.length, maxPoints);
    const pick = <T>(xs: readonly T[]): T[] => keep.map((i) => xs[i] as T);
    return {
      ...c,
      steps: pick(c.steps),
      mean: pick(c.mean),
      low: pick(c.low),
      high: pick(c.high),
      n: pick(c.n),
      ...(c.bandByBin === undefined ? {} : { bandByBin: pick(c.bandByBin) }),
      runs: c.runs.map((r) => ({ ...r, values: pick(r.values) })),
    };
  });
}
