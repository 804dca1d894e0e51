/**
 * Chart data at the precision a chart can show: every non-integer number in a spec's inline data
 * rounded to 6 significant digits (never below the units digit), so the page does not carry
 * 17-digit floats that no axis, tooltip (4 digits) or pixel can show. A 520-pixel axis resolves
 * about 1 part in 10^3; 6 digits keep a thousand times more. Only the charts are rounded:
 * results.json and the tables keep full precision.
 */
import type { TopLevelSpec } from 'vega-lite';

/** Significant digits kept in chart data. */
export const CHART_DIGITS = 6;

/**
 * One number to `digits` significant digits, keeping every digit of its integer part; integers,
 * non-finite numbers and zero are returned as they are.
 * Cost O(1). Never throws. Example: `roundNumber(0.45113333333333333)`
 * → `0.451133`; `roundNumber(1234567.89)` → `1234568`.
 */
export function roundNumber(x: number, digits = CHART_DIGITS): number {
  if (!Number.isFinite(x) || Number.isInteger(x)) return x;
  const integerDigits = Math.abs(x) >= 1 ? Math.floor(Math.log10(Math.abs(x))) + 1 : 0;
  return Number(x.toPrecision(Math.min(100, Math.max(digits, integerDigits))));
}

function roundValue(value: unknown, digits: number): unknown {
  if (typeof value === 'number') return roundNumber(value, digits);
  if (Array.isArray(value)) return value.map((v) => roundValue(v, digits));
  if (value !== null && typeof value === 'object') {
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, roundValue(v, digits)]));
  }
  return value;
}

function walk(node: unknown, digits: number): unknown {
  if (Array.isArray(node)) return node.map((n) => walk(n, digits));
  if (node === null || typeof node !== 'object') return node;
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(node)) {
    // Inline rows (`data.values`) and named data sets (`datasets`) are data; the rest is spec.
    out[key] = key === 'values' || key === 'datasets' ? roundValue(value, digits) : walk(value, digits);
  }
  return out;
}

/**
 * A copy of `spec` whose inline data (`data: { values }` at any depth, and `datasets`) has every
 * number rounded by `roundNumber`; everything else (encodings, scale domains, titles) is copied
 * as it is. The input is not changed.
 * Cost O(size of the spec). Never throws.
 * Example: `roundChartData({ data: { values: [{ a: 1 / 3 }] }, mark: 'point' })`
 * → `{ data: { values: [{ a: 0.333333 }] }, mark: 'point' }`.
 */
export function roundChartData(spec: TopLevelSpec, digits = CHART_DIGITS): TopLevelSpec {
  return walk(spec, digits) as TopLevelSpec;
}
