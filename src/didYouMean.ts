/**
 * "Did you mean": the closest of the names that exist to a name that does not, for the error an
 * option that names nothing stops with (a column, metric, key or value that exists nowhere).
 * Closeness is an edit distance (insertions, deletions, substitutions and swaps of neighbouring
 * characters: the optimal string alignment variant of Damerau 1964 and Levenshtein 1966) on
 * lower-cased names, a name that contains or is contained by the given one counting as
 * distance 1; a name is offered when its distance is at most a third of the longer name's length
 * (at least 1). Shared by every stage, like problems.ts. Pure; cost O(names x length^2).
 */
import { SeedsiftError } from './problems.js';

/**
 * Edit distance between two strings counting insertions, deletions, substitutions and swaps of two
 * neighbouring characters as one edit each (the optimal string alignment distance, Damerau's
 * variant of Levenshtein's). O(|a| x |b|).
 * Example: `editDistance('stpe', 'step')` is 1; `editDistance('kitten', 'sitting')` is 3.
 */
export function editDistance(a: string, b: string): number {
  const rows = Array.from({ length: a.length + 1 }, (_, i) =>
    Array.from({ length: b.length + 1 }, (_, j) => (i === 0 ? j : j === 0 ? i : 0)),
  );
  const at = (i: number, j: number): number => (rows[i] as number[])[j] as number;
  for (let i = 1; i <= a.length; i++)
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let d = Math.min(at(i - 1, j) + 1, at(i, j - 1) + 1, at(i - 1, j - 1) + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) d = Math.min(d, at(i - 2, j - 2) + 1);
      (rows[i] as number[])[j] = d;
    }
  return at(a.length, b.length);
}

/**
 * The names close to `given`, closest first (ties in the order given).
 * Example: `closestNames('val_ac', ['train_loss', 'val_acc'])` is `['val_acc']`.
 */
export function closestNames(given: string, names: readonly string[]): string[] {
  const g = given.toLowerCase();
  const scored = names.map((name, index) => {
    const n = name.toLowerCase();
    const distance = n === g ? 0 : n.includes(g) || g.includes(n) ? 1 : editDistance(g, n);
    return { name, index, distance, limit: Math.max(1, Math.floor(Math.max(g.length, n.length) / 3)) };
  });
  return scored
    .filter((s) => s.distance <= s.limit)
    .sort((a, b) => a.distance - b.distance || a.index - b.index)
    .map((s) => s.name);
}

/**
 * The "did you mean" clause for a name among `names` (each shown with `prefix`): the closest ones,
 * else all of them. Example: `didYouMean('val_ac', ['val_acc'])` is "did you mean val_acc?".
 */
export function didYouMean(given: string, names: readonly string[], prefix = ''): string {
  const close = closestNames(given, names);
  const show = (list: readonly string[]): string => list.map((n) => prefix + n).join(', ');
  if (close.length > 0)
    return `did you mean ${close
      .slice(0, 3)
      .map((n) => prefix + n)
      .join(' or ')}?`;
  if (names.length === 0) return 'did you mean to name something else? (there is nothing of that kind)';
  return `did you mean one of ${names.length > 12 ? `${show(names.slice(0, 12))}, ...` : show(names)}?`;
}

/**
 * The usage error of an option that names something that exists nowhere: one line saying what is
 * missing, what exists, and "did you mean".
 * Example: `unknownName('--metrics', 'metric', 'val_ac', ['val_acc', 'loss']).message` is
 * "--metrics: no metric 'val_ac' (metrics: val_acc, loss); did you mean val_acc?".
 */
export function unknownName(option: string, kind: string, given: string, names: readonly string[]): SeedsiftError {
  const shown = names.length > 12 ? `${names.slice(0, 12).join(', ')}, ...` : names.join(', ');
  return new SeedsiftError(
    'usage',
    `${option}: no ${kind} '${given}' (${kind}s: ${shown || 'none'}); ${didYouMean(given, names)}`,
  );
}
