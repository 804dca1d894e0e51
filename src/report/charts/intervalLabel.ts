/**
 * Words for an interval: its level and method, as chart titles and subtitles say them.
 */
import type { IntervalMethod } from '../../analysis/results.js';

const METHOD_WORDS: Readonly<Record<IntervalMethod, string>> = {
  'welch-t': 'Welch t-interval',
  t: 't-interval',
  bca: 'BCa bootstrap interval',
  percentile: 'percentile bootstrap interval',
  'expanded-percentile': 'expanded-percentile bootstrap interval',
  'bootstrap-t': 'bootstrap-t interval',
  none: 'no interval',
};

/**
 * A confidence level as a percentage without trailing zeros.
 * Cost O(1). Never throws. Example: `formatLevel(0.95)` → `'95%'`; `formatLevel(0.999)` → `'99.9%'`.
 */
export function formatLevel(level: number): string {
  return `${Number((level * 100).toFixed(2))}%`;
}

/**
 * An interval's level and method in words (`none` has no level).
 * Cost O(1). Never throws. Example: `intervalLabel('t', 0.95)` → `'95% t-interval'`.
 */
export function intervalLabel(method: IntervalMethod, level: number): string {
  return method === 'none' ? METHOD_WORDS.none : `${formatLevel(level)} ${METHOD_WORDS[method]}`;
}

/**
 * The distinct interval labels of several records, in order of first appearance, joined for a
 * subtitle ("95% t-interval" or "95% t-interval or 95% BCa bootstrap interval").
 * Cost O(records). Never throws. Example: `intervalLabels([{ method: 't', level: 0.95 }])` → `'95% t-interval'`.
 */
export function intervalLabels(
  records: readonly { readonly method: IntervalMethod; readonly level: number }[],
): string {
  const labels: string[] = [];
  for (const r of records) {
    const label = intervalLabel(r.method, r.level);
    if (!labels.includes(label)) labels.push(label);
  }
  return labels.join(' or ');
}
