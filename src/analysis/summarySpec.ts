/**
 * The `--summary` grammar, read through the one table of summary kinds (`summaryKinds.ts`):
 * `final`, `last:P%`, `best`, `auc`, `reach:VALUE`, `step:N`.
 */
import type { Goal } from '../ingest/types.js';
import { SeedsiftError } from '../problems.js';
import type { SummarySpec } from './results.js';
import { kindOf, SUMMARY_KINDS, type SummaryKind } from './summaryKinds.js';

const GRAMMAR = 'final, last:P%, best, auc, reach:VALUE or step:N';

/**
 * Parse a summary as typed on the command line or in notebook front matter.
 * Throws SeedsiftError('usage') naming the option on anything else.
 * Example: `parseSummary('last:10%')` is `{ kind: 'last', percent: 10 }`.
 */
export function parseSummary(text: string, option = '--summary'): SummarySpec {
  const t = text.trim();
  const colon = t.indexOf(':');
  const kind = colon < 0 ? t : t.slice(0, colon);
  const arg = colon < 0 ? null : t.slice(colon + 1).trim();
  const entry = Object.hasOwn(SUMMARY_KINDS, kind) ? SUMMARY_KINDS[kind as SummaryKind] : undefined;
  const parsed = entry === undefined ? '' : (entry.parse as (a: string | null) => SummarySpec | string)(arg);
  if (typeof parsed === 'string')
    throw new SeedsiftError('usage', `${option}: expected ${GRAMMAR}${parsed}, got '${text}'`);
  return parsed;
}

/** The canonical text of a summary. `formatSummary({ kind: 'last', percent: 10 })` is `last:10%`. */
export function formatSummary(spec: SummarySpec): string {
  return (kindOf(spec).format as (s: SummarySpec) => string)(spec);
}

/**
 * The direction in which a summary value is better: the metric's goal, except for `reach:VALUE`,
 * whose value is a number of steps (fewer is better whatever the metric's goal).
 * Example: `summaryGoal({ kind: 'reach', value: 0.9 }, 'max')` is `'min'`.
 */
export function summaryGoal(spec: SummarySpec, goal: Goal): Goal {
  return kindOf(spec).goal(goal);
}
