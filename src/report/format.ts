/**
 * How numbers read in the report and the Markdown summary: one rule for digits, one for p-values,
 * one for intervals, so the HTML page and summary.md say the same thing. Missing numbers (null,
 * NaN) read as an em dash. Formatting computes nothing statistical.
 */
import type { Comparison, Difference, FailedPolicy } from '../analysis/results.js';
import { intervalLabel } from './charts/intervalLabel.js';

export { formatLevel } from './charts/intervalLabel.js';

/** What a missing number reads as. */
export const MISSING = '—';

/**
 * Decimals that show about three significant digits of `scale` (an interval half-width, a standard
 * deviation): 2 - floor(log10 |scale|), clamped to [0, 6]; 2 when the scale is 0 or unknown.
 * Cost O(1). Never throws.
 * Example: `decimalsFor(1.66)` → 2; `decimalsFor(0.004)` → 5.
 */
export function decimalsFor(scale: number | null): number {
  if (scale === null || !Number.isFinite(scale) || scale === 0) return 2;
  return Math.max(0, Math.min(6, 2 - Math.floor(Math.log10(Math.abs(scale)))));
}

/**
 * A number with fixed decimals; null or NaN as an em dash; infinities as ∞ / −∞; minus as ASCII `-`.
 * Cost O(1). Never throws.
 * Example: `formatNumber(71.3, 2)` → `'71.30'`; `formatNumber(null)` → `'—'`.
 */
export function formatNumber(x: number | null, decimals = 2): string {
  if (x === null || Number.isNaN(x)) return MISSING;
  if (!Number.isFinite(x)) return x > 0 ? '∞' : '-∞';
  const text = x.toFixed(decimals);
  return /^-0\.?0*$/.test(text) ? text.slice(1) : text;
}

/**
 * A signed number (`+1.71`, `-0.32`, `0.00`).
 * Cost O(1). Never throws. Example: `formatSigned(1.714, 2)` → `'+1.71'`.
 */
export function formatSigned(x: number | null, decimals = 2): string {
  const text = formatNumber(x, decimals);
  return x !== null && x > 0 && text !== formatNumber(0, decimals) ? `+${text}` : text;
}

/**
 * A p-value: `< 0.001` below 0.001, four decimals below 0.01, else three.
 * Cost O(1). Never throws. Example: `formatP(0.04418)` → `'0.044'`; `formatP(0.0079)` → `'0.0079'`.
 */
export function formatP(p: number | null): string {
  if (p === null || Number.isNaN(p)) return MISSING;
  if (p < 0.001) return '< 0.001';
  return p < 0.01 ? p.toFixed(4) : p.toFixed(3);
}

/**
 * Decimals for one comparison's row: from the difference interval's half-width, else the pooled
 * standard deviation, else the size of the difference.
 * Cost O(1). Never throws.
 */
export function comparisonDecimals(c: Comparison): number {
  const d = c.difference;
  if (d.low !== null && d.high !== null && Number.isFinite(d.high - d.low) && d.high > d.low)
    return decimalsFor((d.high - d.low) / 2);
  if (c.detectable.sd !== null && c.detectable.sd > 0) return decimalsFor(c.detectable.sd);
  return decimalsFor(Math.abs(d.estimate ?? 0));
}

/**
 * A difference with its interval, `+1.71 [0.06, 3.37]`, or the estimate alone when the interval
 * is missing.
 * Cost O(1). Never throws. Example:
 * `formatDifference({ estimate: 1.714, low: 0.0575, high: 3.371, level: 0.95, method: 'welch-t' }, 2)`
 * → `'+1.71 [0.06, 3.37]'`.
 */
export function formatDifference(d: Difference, decimals: number): string {
  const estimate = formatSigned(d.estimate, decimals);
  if (d.low === null || d.high === null) return estimate;
  return `${estimate} [${formatNumber(d.low, decimals)}, ${formatNumber(d.high, decimals)}]`;
}

/**
 * Seeds behind a comparison, baseline first: `5 v 7`, and the failed runs with what happened to
 * them: `5 v 4 (1 diverged in the candidate, excluded)`.
 * Cost O(1). Never throws.
 */
export function formatSeeds(c: Comparison, policy: FailedPolicy): string {
  const base = `${c.n.baseline} v ${c.n.candidate}`;
  const parts: string[] = [];
  const f = c.failures;
  for (const arm of ['baseline', 'candidate'] as const) {
    if (f[arm].diverged > 0) parts.push(`${f[arm].diverged} diverged in the ${arm}`);
    if (f[arm].short > 0) parts.push(`${f[arm].short} short in the ${arm}`);
  }
  if (parts.length === 0) return base;
  return `${base} (${parts.join(', ')}, ${policy === 'worst' ? 'counted as worst' : 'excluded'})`;
}

/**
 * The failure counts beside a verdict, with Fisher's exact test: `failed 0/5 v 2/5, Fisher p 0.44`;
 * null when no run of either arm failed.
 * Cost O(1). Never throws.
 */
export function formatFailures(c: Comparison): string | null {
  const f = c.failures;
  if (f.fisherP === null) return null;
  const count = (a: typeof f.baseline): string => `${a.diverged + a.short}/${a.runs}`;
  return `failed ${count(f.baseline)} v ${count(f.candidate)}, Fisher p ${formatP(f.fisherP)}`;
}

/**
 * The comparison's step: `step 12000`, or an empty string for score tables.
 * Cost O(1). Never throws.
 */
export function formatStep(c: Comparison): string {
  return c.step === null ? '' : `step ${formatNumber(c.step, 0)}`;
}

/**
 * An interval's level and method in words: `95% Welch t-interval`; `no interval` for `none` (the
 * same words as the chart subtitles, from `charts/intervalLabel.ts`).
 * Cost O(1). Never throws.
 */
export function formatIntervalKind(d: { readonly level: number; readonly method: Difference['method'] }): string {
  return intervalLabel(d.method, d.level);
}
