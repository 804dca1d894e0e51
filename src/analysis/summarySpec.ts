/**
 * The `--summary` grammar: how one run's curve becomes one number (DESIGN.md, `--summary`).
 *
 * ```
 * final          value at the common horizon
 * last:P%        mean of the values in the last P% of [first step, horizon]   (0 < P <= 100)
 * best           best value up to the horizon, in the goal's direction (optimistic)
 * auc            area under the curve up to the horizon / the span it covers
 * reach:VALUE    first step at which the metric reaches VALUE (fewer steps is better)
 * step:N         value at the last logged step <= N
 * ```
 */
import type { Goal } from '../ingest/types.js';
import { SeedsiftError } from '../problems.js';
import type { SummarySpec } from './results.js';

const GRAMMAR = 'final, last:P%, best, auc, reach:VALUE or step:N';

/**
 * Parse a summary as typed on the command line or in notebook front matter.
 * Throws SeedsiftError('usage') naming the option on anything else.
 * Example: `parseSummary('last:10%')` is `{ kind: 'last', percent: 10 }`.
 */
export function parseSummary(text: string, option = '--summary'): SummarySpec {
  const t = text.trim();
  const bad = (why = ''): SeedsiftError =>
    new SeedsiftError('usage', `${option}: expected ${GRAMMAR}${why}, got '${text}'`);
  if (t === 'final' || t === 'best' || t === 'auc') return { kind: t };
  const colon = t.indexOf(':');
  if (colon < 0) throw bad();
  const kind = t.slice(0, colon);
  const arg = t.slice(colon + 1).trim();
  if (kind === 'last') {
    const percent = toNumber(arg.endsWith('%') ? arg.slice(0, -1) : arg);
    if (percent === null || percent <= 0 || percent > 100) throw bad(' (P in (0, 100])');
    return { kind: 'last', percent };
  }
  if (kind === 'reach') {
    const value = toNumber(arg);
    if (value === null) throw bad(' (VALUE a finite number)');
    return { kind: 'reach', value };
  }
  if (kind === 'step') {
    const step = toNumber(arg);
    if (step === null || step < 0) throw bad(' (N a step >= 0)');
    return { kind: 'step', step };
  }
  throw bad();
}

/** The canonical text of a summary. `formatSummary({ kind: 'last', percent: 10 })` is `last:10%`. */
export function formatSummary(spec: SummarySpec): string {
  switch (spec.kind) {
    case 'final':
    case 'best':
    case 'auc':
      return spec.kind;
    case 'last':
      return `last:${spec.percent}%`;
    case 'reach':
      return `reach:${spec.value}`;
    case 'step':
      return `step:${spec.step}`;
  }
}

/**
 * The direction in which a summary value is better: the metric's goal, except for `reach:VALUE`,
 * whose value is a number of steps (fewer is better whatever the metric's goal).
 * Example: `summaryGoal({ kind: 'reach', value: 0.9 }, 'max')` is `'min'`.
 */
export function summaryGoal(spec: SummarySpec, goal: Goal): Goal {
  return spec.kind === 'reach' ? 'min' : goal;
}

function toNumber(s: string): number | null {
  if (s.trim() === '') return null;
  const v = Number(s);
  return Number.isFinite(v) ? v : null;
}
