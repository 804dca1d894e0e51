/**
 * Paths as the reports show them: an absolute PATH inside the current folder becomes relative to
 * it (`/home/a/study/runs` from `/home/a/study` is `runs`), so reports do not carry the folders of
 * the machine they were made on; paths outside the current folder, and relative ones, stay as given.
 */
import { isAbsolute, relative, sep } from 'node:path';

/**
 * Cost O(paths). Never throws.
 * Example: `relativePaths(['/w/s/runs', '/tmp/x', 'a'], '/w/s')` → `['runs', '/tmp/x', 'a']`.
 */
export function relativePaths(paths: readonly string[], cwd: string): string[] {
  return paths.map((p) => {
    if (!isAbsolute(p)) return p;
    const r = relative(cwd, p);
    return r === '' ? '.' : r === '..' || r.startsWith(`..${sep}`) || isAbsolute(r) ? p : r;
  });
}
