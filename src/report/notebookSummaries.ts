/**
 * The summaries a notebook's cells name (`{{compare "val_acc" summary="last:10%"}}`), so the report
 * can compute each of them (`withNotebookSummaries`) instead of failing on a cell whose summary the
 * command line did not ask for. Read from the Handlebars source of the body: every `summary=`
 * option given as a quoted string, in order of first appearance, without repeats.
 */
import type { Results } from '../analysis/results.js';

/**
 * Summaries named by `summary="..."` (or single quotes) in a notebook body.
 * Cost O(length). Never throws.
 * Example: `notebookSummaries('{{compare "a" summary="last:10%"}} {{values "a" summary=\'best\'}}')`
 * → `['last:10%', 'best']`.
 */
export function notebookSummaries(body: string): string[] {
  const out: string[] = [];
  for (const m of body.matchAll(/\bsummary\s*=\s*(?:"([^"]*)"|'([^']*)')/g)) {
    const s = (m[1] ?? m[2] ?? '').trim();
    if (s !== '' && !out.includes(s)) out.push(s);
  }
  return out;
}

/**
 * `results` with the values, config values and comparisons of `more` (the same runs analysed under
 * another summary) added after its own, and `more`'s problems that `results` lacks. Settings stay
 * those of `results` (its summary is the report's). Each summary keeps its own family for the
 * adjustment (METHODS.md: one metric and one summary).
 * Cost O(size). Never throws.
 */
export function mergeSummary(results: Results, more: Results): Results {
  const seen = new Set(results.problems.map((p) => JSON.stringify([p.code, p.message, p.file ?? null, p.run ?? null])));
  return {
    ...results,
    values: [...results.values, ...more.values],
    configValues: [...results.configValues, ...more.configValues],
    comparisons: [...results.comparisons, ...more.comparisons],
    problems: [
      ...results.problems,
      ...more.problems.filter((p) => !seen.has(JSON.stringify([p.code, p.message, p.file ?? null, p.run ?? null]))),
    ],
  };
}
