/**
 * Line length: no line of the repository's TypeScript is longer than 120 characters (issue 17,
 * "long lines folded"). biome's formatter folds code at 120 columns (biome.json `lineWidth`) but
 * leaves comments and string literals alone, and biome has no lint rule for line length, so this
 * test is the check. Length counts Unicode code points, so `×` or `—` count as one character.
 *
 * The check walks `src`, `tests`, `bench` and `sample-runs` as a whole; `PENDING` can exempt a file
 * while another branch is folding it, and is empty when every branch has landed.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = join(import.meta.dirname, '..', '..');
const LIMIT = 120;

/** Folders (searched recursively) and files whose TypeScript must keep within `LIMIT`. */
const ENFORCED = ['src', 'tests', 'bench', 'sample-runs'];

/**
 * Files inside an enforced folder that another branch is folding now; the check skips them until that
 * branch lands, and the lead then empties this list.
 */
const PENDING: string[] = [];

/** The 1-based numbers and lengths of the lines of `text` longer than `limit` code points. */
function longLines(text: string, limit: number): { line: number; length: number }[] {
  const out: { line: number; length: number }[] = [];
  text.split(/\r\n|\r|\n/).forEach((line, k) => {
    const length = [...line].length;
    if (length > limit) out.push({ line: k + 1, length });
  });
  return out;
}

/** Every `.ts` file at or under `path` (relative to the repository), in name order. */
function typeScriptFiles(path: string): string[] {
  const full = join(ROOT, path);
  if (statSync(full).isFile()) return path.endsWith('.ts') ? [path] : [];
  return readdirSync(full, { withFileTypes: true })
    .filter((entry) => entry.name !== 'node_modules' && !entry.name.startsWith('.'))
    .sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0))
    .flatMap((entry) => typeScriptFiles(join(path, entry.name)));
}

describe('longLines', () => {
  it('finds exactly the lines over the limit, counting code points and every line ending', () => {
    const text = `${'a'.repeat(5)}\r\n${'b'.repeat(6)}\n${'×'.repeat(5)}\r${'—'.repeat(7)}`;
    expect(longLines(text, 5)).toEqual([
      { line: 2, length: 6 },
      { line: 4, length: 7 },
    ]);
    expect(longLines('', 5)).toEqual([]);
  });
});

describe(`TypeScript lines are at most ${LIMIT} characters`, () => {
  it('in every enforced folder', () => {
    const files = ENFORCED.flatMap(typeScriptFiles).filter((file) => !PENDING.includes(file));
    expect(files.length).toBeGreaterThan(100);
    const over = files.flatMap((file) =>
      longLines(readFileSync(join(ROOT, file), 'utf8'), LIMIT).map(
        ({ line, length }) => `${relative(ROOT, join(ROOT, file))}:${line} (${length} characters)`,
      ),
    );
    expect(over).toEqual([]);
  });
});
