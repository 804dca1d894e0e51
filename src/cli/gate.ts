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
      : ` (first: ${first.metric}, ${first.candidate} ` +
        `vs ${first.baseline}${first.task === null ? '' : `, task ${first.task}`}: ${first.verdict})`;
  return (
    `${failing.length} of ${results.comparisons.length} comparisons ` +
    `are ${gate === 'worse' ? 'worse' : 'not better'}${which}`
  );
}

/**
 * Why a gate cannot pass whatever it asks: no comparison was made, or more than half of the log
 * files could not be read (`file-unreadable`). Returns the reason, or null when there is
 * something to judge. A report of nothing must never pass a CI gate.
 */
export function ungated(results: Results): string | null {
  const unreadable = new Set(results.problems.filter((p) => p.code === 'file-unreadable').map((p) => p.file)).size;
  const tried = results.inputs.filesRead + unreadable;
  if (tried > 0 && unreadable * 2 > tried)
    return `${unreadable} of ${tried} files could not be read; a gate does not pass on what is left (exit 3)`;
  if (results.comparisons.length === 0)
    return (
      `no comparison was made (${results.runs.length} runs, ${results.configs.length} configs); a gate ` +
      `does not pass on nothing (exit 3)`
    );
  return null;
}
