/**
 * `key=value` path segments (the Hive partitioning convention): `runs/ticks=32/memory=12/seed=3/log.csv`
 * says ticks 32, memory 12, seed 3.
 *
 * Rules (seedsift's own reading of the convention):
 * - A segment is a pair when it is exactly `KEY=VALUE` with KEY a name (a letter or `_`, then
 *   letters, digits, `_`, `-`, `.`) and VALUE not empty; everything after the first `=` is the
 *   value. Other segments (`runs`, `2026-03-01`, `a=`, `=3`) are plain folder names.
 * - The file name counts too, without its log extension: `seed=3.csv` and `seed=3.csv.gz` say
 *   seed 3. A file named like this is common when one folder holds every seed's log.
 * - Every segment of the path as the user gave it counts, the PATH's own segments included, so
 *   `seedsift scan runs/ticks=32 runs/ticks=64` keeps `ticks` apart, and a file given directly
 *   (`runs/ticks=8/seed=1/log.csv`) keeps its folders' values.
 * - A key that appears twice keeps the position of its first appearance and the value of its
 *   last (deepest, most specific) one.
 */
import { sep } from 'node:path';
import { logStem } from './fileFormat.js';

const PAIR = /^([A-Za-z_][A-Za-z0-9_.-]*)=(.+)$/;
/** Always `/`; a backslash too where it is the platform separator (on POSIX it is a legal name character). */
const SEPARATORS = sep === '\\' ? /[\\/]/ : /\//;

/**
 * The `key=value` pairs of a file's path, in order of appearance, as `[key, value]`.
 * `path` may use `/` or the platform separator. Cost O(length of the path); never throws.
 * Example: `hivePairs('runs/ticks=32/seed=3/log.csv')` is `[['ticks', '32'], ['seed', '3']]`.
 */
export function hivePairs(path: string): ReadonlyArray<readonly [string, string]> {
  const segments = path.split(SEPARATORS).filter((s) => s !== '' && s !== '.' && s !== '..');
  const values = new Map<string, string>();
  segments.forEach((segment, i) => {
    const m = PAIR.exec(i === segments.length - 1 ? logStem(segment) : segment);
    if (m !== null) values.set(m[1] as string, m[2] as string);
  });
  return [...values.entries()];
}
