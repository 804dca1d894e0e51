/**
 * The --fail-on gate for CI jobs: `worse` fails when any comparison's verdict is worse;
 * `not-better` fails when any comparison's verdict is not better (worse or inconclusive).
 * Returns a one-line reason, or null when the gate passes (or no gate was set).
 */
import type { Results } from '../analysis/results.js';

export function failedGate(results: Results): string | null {
  const gate = results.settings.failOn;
  if (gate === null) return null;
  const failing = results.comparisons.filter((c) =>
    gate === 'worse' ? c.verdict === 'worse' : c.verdict !== 'better',
  );
  if (failing.length === 0) return null;
  const first = failing[0];
  const which =
    first === undefined
      ? ''
      : ` (first: ${first.metric}, ${first.candidate} vs ${first.baseline}${first.task === null ? '' : `, task ${first.task}`}: ${first.verdict})`;
  return `${failing.length} of ${results.comparisons.length} comparisons are ${gate === 'worse' ? 'worse' : 'not better'}${which}`;
}
