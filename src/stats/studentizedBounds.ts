/**
 * Bounds of the bootstrap-t (studentized) interval (Efron & Tibshirani 1993, ch. 12.5): each
 * resample's t* = (theta* - theta)/se*, and the interval (theta - t*_{1-alpha/2} se, theta - t*_{alpha/2} se).
 */
import type { Ordered } from './orderStatistics.js';
import { quantileOf } from './percentileInterval.js';

/** (theta* - theta)/se* on centred data (theta = 0): +-Infinity when se* = 0, 0 when also theta* = 0. */
export function studentized(deviation: number, seStar: number): number {
  if (seStar > 0) return deviation / seStar;
  return deviation === 0 ? 0 : deviation > 0 ? Infinity : -Infinity;
}

/** Bootstrap-t bounds on the centred scale: (-q_{1-alpha/2} se, -q_{alpha/2} se), q the sorted t*. */
export function studentizedBounds(t: Ordered, se: number, level: number): { low: number; high: number } {
  const tail = (1 - level) / 2;
  const qLow = quantileWithInfinities(t, tail);
  const qHigh = quantileWithInfinities(t, 1 - tail);
  return { low: scaleBound(-qHigh, se), high: scaleBound(-qLow, se) };
}

function scaleBound(q: number, se: number): number {
  return q === 0 || se === 0 ? 0 : q * se;
}

/**
 * Type-7 quantile that also accepts +-Infinity among the sorted values: interpolating towards an
 * infinite neighbour gives that infinity (the limit), where plain arithmetic would give NaN.
 */
function quantileWithInfinities(t: Ordered, p: number): number {
  const n = t.values.length;
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const a = t.at(lo);
  const b = t.at(Math.min(lo + 1, n - 1));
  if (h === lo || a === b) return a;
  if (a === -Infinity) return -Infinity;
  if (b === Infinity) return Infinity;
  return quantileOf(t, p);
}
