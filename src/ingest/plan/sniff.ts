/**
 * Delimiter sniffing for `.txt` logs (DESIGN "Inputs": `.txt`, delimiter sniffed).
 *
 * Rule (ours, simple and predictable): on the first lines of the file (blank lines ignored), try
 * `,`, tab, `;` and `|` in that order; the first that splits the first line into more than one
 * field and more than half of the lines into that same number wins (fields inside double quotes are
 * not split; the other lines leave room for malformed rows, which are then reported). Failing that, if
 * splitting on runs of whitespace (spaces and tabs, leading and trailing ignored) passes the same
 * test, the file is whitespace-separated (aligned columns). Failing both, the delimiter is the one
 * giving the most fields on the first line (ties to the earlier candidate), or `,`.
 */

/** How a text file's fields are separated. */
export interface Delimiter {
  /** A one-character delimiter, or `null` for runs of whitespace. */
  readonly char: string | null;
}

const CANDIDATES = [',', '\t', ';', '|'] as const;

/**
 * Number of fields in one line split on `char`, with double-quoted fields kept whole (a doubled
 * quote inside quotes is a literal quote). Pure, O(length). Example: `countFields('a,"b,c"', ',')` is 2.
 */
export function countFields(line: string, char: string): number {
  let count = 1;
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const c = line[i];
    if (c === '"') quoted = !quoted;
    else if (c === char && !quoted) count++;
  }
  return count;
}

/**
 * Fields of a whitespace-separated line (runs of spaces and tabs; leading and trailing ignored).
 * Pure, O(length). Example: `whitespaceFields('  1  0.5\t2 ')` is `['1', '0.5', '2']`.
 */
export function whitespaceFields(line: string): string[] {
  return line.split(/[ \t\v\f]+/).filter((f) => f.length > 0);
}

/**
 * Choose the delimiter of a text log from its first lines (see the module comment for the rule).
 * Pure, O(total length x 5). Never throws; with no lines it returns `,`.
 * Example: `sniffDelimiter(['step;loss', '1;0.5'])` is `{ char: ';' }`;
 * `sniffDelimiter(['step   loss', '1      0.5'])` is `{ char: null }`.
 */
export function sniffDelimiter(lines: readonly string[]): Delimiter {
  const sample = lines.filter((l) => l.trim().length > 0);
  if (sample.length === 0) return { char: ',' };
  const agrees = (count: (line: string) => number): boolean => {
    const first = count(sample[0] as string);
    return first > 1 && sample.filter((l) => count(l) === first).length > 0.5 * sample.length;
  };
  for (const char of CANDIDATES) if (agrees((l) => countFields(l, char))) return { char };
  if (agrees((l) => whitespaceFields(l).length)) return { char: null };
  let best: string = ',';
  let bestCount = 1;
  for (const char of CANDIDATES) {
    const n = countFields(sample[0] as string, char);
    if (n > bestCount) [best, bestCount] = [char, n];
  }
  return { char: best };
}
