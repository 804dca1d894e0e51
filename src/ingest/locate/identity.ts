/**
 * The identity of a located file: its config parameters, information fields, seed, and where they
 * came from (`IdentitySource`), decided here for every reading mode (readingMode.ts) from what the
 * file's location says. In DESIGN's order of preference:
 *
 * 1. `key=value` segments of the path as given, the PATH's own included (hive.ts), file name
 *    included (`seed=3.csv`).
 * 2. `--layout TEMPLATE` fields (layout.ts), matched against the path relative to the PATH. Where
 *    a key comes both from a `key=value` segment and from a layout field, the segment's value is
 *    kept.
 * 3./4. `--seed-column` / `--seed-columns`: the seed is inside the file (`seed: null`, identity
 *    `seed-column(s)`); config from 1 and 2. A seed the path names anyway goes to `info.seed`
 *    (assemble/parts.ts uses it when the file has no seed column after all).
 * 5. `--manifest FILE` (manifest.ts): its row gives the file's seed and params.
 *
 * A `params.json` in the same folder (sidecar.ts) adds parameters and is checked against the path
 * or manifest; when nothing else names the seed, its `seed` does (not in modes 3/4, where it is
 * information). The identity names where the seed came from; when the seed came from params.json
 * or nowhere, it names where the config came from (`layout`, else `hive` when the path has
 * `key=value` segments, else `none`). A file with no seed at all is given one by `locate`
 * (`auto-N`, `seed-missing`), and a seed inside a file is read by assemble/parts.ts.
 */
import type { Problem } from '../../problems.js';
import type { ReadingMode } from '../readingMode.js';
import type { IdentitySource } from '../types.js';
import { hivePairs } from './hive.js';
import type { Layout } from './layout.js';
import type { ManifestRow } from './manifest.js';
import { mergeSidecar, type Identity, type Sidecar } from './sidecar.js';

/** A decided identity, with the problems params.json raised. */
export interface Decided {
  readonly identity: Identity & { readonly identity: IdentitySource };
  readonly problems: Problem[];
}

type SeedOrigin = 'hive' | 'layout' | 'params' | null;

/** Where the seed comes from inside files in this mode, or null when it comes from locations. */
export function seedInFile(mode: ReadingMode): 'seed-column' | 'seed-columns' | null {
  return mode.kind === 'seed-column' || mode.kind === 'seed-columns' ? mode.kind : null;
}

/** The `--layout` of a mode that reads paths, else null. */
export function modeLayout(mode: ReadingMode): Layout | null {
  return mode.kind === 'paths' || mode.kind === 'seed-column' || mode.kind === 'seed-columns' ? mode.layout : null;
}

/**
 * Identity of a file found under a PATH: hive segments of `file`, then the layout's `fields`
 * (already matched), then params.json (see the module comment). Pure, O(path length + keys).
 * Example: `pathIdentity('runs/ticks=8/seed=1/log.csv', {}, { kind: 'paths', layout: null }, null)`
 * gives `{ params: { ticks: '8' }, info: {}, seed: '1', identity: 'hive' }` and no problems.
 */
export function pathIdentity(
  file: string,
  fields: Readonly<Record<string, string>>,
  mode: ReadingMode,
  sidecar: Sidecar | null,
): Decided {
  const layout = modeLayout(mode);
  const inFile = seedInFile(mode);
  const params: Record<string, string> = {};
  const info: Record<string, string> = {};
  let seed: string | null = null;
  let seedFrom: SeedOrigin = null;
  const pairs = hivePairs(file);
  for (const [key, value] of pairs) {
    if (key === 'seed') [seed, seedFrom] = [value, 'hive'];
    else if (key.startsWith('_')) info[key] = value;
    else params[key] = value;
  }
  for (const name of layout?.fields ?? []) {
    const value = fields[name] as string;
    if (name === 'seed') {
      if (seed === null) [seed, seedFrom] = [value, 'layout'];
    } else if (name.startsWith('_')) info[name] ??= value;
    else params[name] ??= value;
  }
  let identity: Identity = { params, info, seed };
  if (inFile !== null && seed !== null) identity = { params, info: { seed, ...info }, seed: null };
  const merged =
    sidecar === null ? { identity, problems: [] } : mergeSidecar(identity, sidecar, 'path', inFile === null);
  seedFrom ??= merged.identity.seed !== null ? 'params' : null;
  const configFrom: IdentitySource = layout !== null ? 'layout' : pairs.length > 0 ? 'hive' : 'none';
  const source: IdentitySource = inFile ?? (seedFrom === 'hive' || seedFrom === 'layout' ? seedFrom : configFrom);
  return { identity: { ...merged.identity, identity: source }, problems: merged.problems };
}

/**
 * Identity of a manifest row: its params, information fields and seed, then params.json (see the
 * module comment). Pure. Example: a row `x/log.csv,1,8` under `file,seed,ticks` with no
 * params.json gives `{ params: { ticks: '8' }, info: {}, seed: '1', identity: 'manifest' }`.
 */
export function manifestIdentity(row: ManifestRow, sidecar: Sidecar | null): Decided {
  const identity: Identity = { params: row.params, info: row.info, seed: row.seed };
  const merged = sidecar === null ? { identity, problems: [] } : mergeSidecar(identity, sidecar, 'manifest', true);
  return { identity: { ...merged.identity, identity: 'manifest' }, problems: merged.problems };
}
