/**
 * The locate stage of ingest: from the PATHs given on the command line to the list of files to
 * read, each with what its location says about it (config parameters, seed, information fields).
 * Nothing is read from the log files themselves here; the load stage does that.
 *
 * Identity, in DESIGN's order of preference:
 * 1. `key=value` segments of the path as given, the PATH's own included (hive.ts), file name
 *    included (`seed=3.csv`).
 * 2. `--layout TEMPLATE` fields (layout.ts), matched against the path relative to the PATH. With a
 *    layout, a file that does not match is skipped (`layout-unmatched`). Where a key comes both
 *    from a `key=value` segment and from a layout field, the segment's value is kept.
 * 3./4. `--seed-column` / `--seed-columns`: the seed is inside the file (`seed: null`, identity
 *    `seed-column(s)`); config from 1 and 2. A seed the path names anyway goes to `info.seed`.
 * 5. `--manifest FILE` (manifest.ts): rows give file, seed and params; the PATHs, if any, are
 *    searched only to list (as skipped) the log files the manifest leaves out.
 * A `params.json` in the same folder as a file adds parameters and is checked against the path or
 * manifest (sidecar.ts); when nothing else names the seed, its `seed` does.
 * Identity names where the seed came from; when the seed came from params.json or nowhere, it
 * names where the config came from (`layout`, else `hive` when the path has `key=value`
 * segments, else `none`).
 *
 * A file with no seed from any source gets `seed-missing` and the seed `auto-N`, N = 1, 2, ... in
 * source order (the prefix cannot collide with a real seed written as a number), so every such
 * file stays a run of its own.
 *
 * Order: sources in PATH order, sorted by relative path within one PATH (walk.ts); with a
 * manifest, in manifest row order. Files named `params.json` and the manifest itself are
 * consumed, not listed. Every other file found that does not become a source is in `files`
 * (status `skipped` or `unreadable`) with a problem. `options.scores` is not used: score tables
 * do not go through locate.
 */
import { realpath } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { problem, SeedsiftError, type Problem } from '../problems.js';
import { fileFormat } from './fileFormat.js';
import { hivePairs } from './hive.js';
import { compileLayout, type Layout } from './layout.js';
import { readManifest } from './manifest.js';
import { separatePaths } from './pathKey.js';
import { mergeSidecar, readSidecar, SIDECAR_NAME, type Identity, type Sidecar } from './sidecar.js';
import type { FileRecord, IdentitySource, IngestOptions, RunSource } from './types.js';
import { skippedFile, walk, type WalkedFile } from './walk.js';

/** What `locate` hands to the load stage. */
export interface Located {
  readonly sources: RunSource[];
  readonly files: FileRecord[];
  readonly problems: Problem[];
}

type SeedOrigin = 'hive' | 'layout' | 'params' | null;

function checkOptions(options: IngestOptions): void {
  const given = (['layout', 'seedColumn', 'seedColumns', 'manifest'] as const).filter((k) => options[k] !== null);
  const flag = {
    layout: '--layout',
    seedColumn: '--seed-column',
    seedColumns: '--seed-columns',
    manifest: '--manifest',
  } as const;
  if (options.seedColumn !== null && options.seedColumns !== null) {
    throw new SeedsiftError('usage', 'options: expected at most one of --seed-column and --seed-columns, got both');
  }
  if (options.manifest !== null && given.length > 1) {
    throw new SeedsiftError(
      'usage',
      `options: --manifest names every file's seed and params, so it cannot be combined with ${given
        .filter((k) => k !== 'manifest')
        .map((k) => flag[k])
        .join(', ')}`,
    );
  }
}

/** Identity of a walked file from its path (hive segments, then layout fields). */
function pathIdentity(
  f: WalkedFile,
  layoutFields: Readonly<Record<string, string>>,
  layout: Layout | null,
): { identity: Identity; seedFrom: SeedOrigin } {
  const params: Record<string, string> = {};
  const info: Record<string, string> = {};
  let seed: string | null = null;
  let seedFrom: SeedOrigin = null;
  for (const [key, value] of hivePairs(f.file)) {
    if (key === 'seed') [seed, seedFrom] = [value, 'hive'];
    else if (key.startsWith('_')) info[key] = value;
    else params[key] = value;
  }
  for (const name of layout?.fields ?? []) {
    const value = layoutFields[name] as string;
    if (name === 'seed') {
      if (seed === null) [seed, seedFrom] = [value, 'layout'];
    } else if (name.startsWith('_')) info[name] ??= value;
    else params[name] ??= value;
  }
  return { identity: { params, info, seed }, seedFrom };
}

/**
 * Find the run files under `paths` and what their locations say (see the module comment).
 * Cost: one directory listing per folder, one read per params.json folder; O(files) memory.
 * Throws SeedsiftError('usage') for a PATH or manifest that does not exist, a malformed --layout,
 * or contradictory options; SeedsiftError('input') for a manifest that cannot be parsed or has
 * no `file` column. Every other difficulty is a problem; a folder with no log files is `no-logs`.
 * Example: `locate(['runs'], opts)` with runs/ticks=8/seed=1/log.csv gives one source
 * `{ relPath: 'ticks=8/seed=1/log.csv', params: { ticks: '8' }, seed: '1', identity: 'hive' }`.
 */
export async function locate(paths: readonly string[], options: IngestOptions): Promise<Located> {
  checkOptions(options);
  const layout = options.layout === null ? null : compileLayout(options.layout);
  const seedInFile: IdentitySource | null =
    options.seedColumn !== null ? 'seed-column' : options.seedColumns !== null ? 'seed-columns' : null;
  const manifest = options.manifest === null ? null : await readManifest(options.manifest);
  const walked = await walk(paths);

  const files: FileRecord[] = [...(manifest?.skipped ?? []), ...walked.skipped];
  const problems: Problem[] = [...(manifest?.problems ?? []), ...walked.problems];
  const pending: { source: Omit<RunSource, 'seed'> & { seed: string | null }; line?: number; root?: number }[] = [];
  const sidecars = new Map<string, Sidecar | null>();
  const sidecarFor = async (file: string): Promise<Sidecar | null> => {
    const path = join(dirname(file), SIDECAR_NAME);
    if (!sidecars.has(path)) {
      const read = await readSidecar(path);
      problems.push(...read.problems);
      sidecars.set(path, read.sidecar);
    }
    return sidecars.get(path) ?? null;
  };
  const withSidecar = async (file: string, identity: Identity, origin: string): Promise<Identity> => {
    const sidecar = await sidecarFor(file);
    if (sidecar === null) return identity;
    const merged = mergeSidecar(identity, sidecar, origin, seedInFile === null);
    problems.push(...merged.problems);
    return merged.identity;
  };

  // Manifest rows are the sources; the walk only lists what the manifest leaves out.
  for (const row of manifest?.rows ?? []) {
    const kind = fileFormat(row.file);
    if (kind === null) continue;
    const identity = await withSidecar(row.file, { params: row.params, info: row.info, seed: row.seed }, 'manifest');
    pending.push({
      source: { file: row.file, relPath: row.relPath, ...kind, ...identity, identity: 'manifest' },
      line: row.line,
    });
  }
  const listed = new Set((manifest?.rows ?? []).map((r) => r.realPath));
  const manifestReal = options.manifest === null ? null : await realpath(options.manifest);

  const logsPerRoot = paths.map(() => 0);
  for (const f of walked.files) {
    const baseName = f.relPath.slice(f.relPath.lastIndexOf('/') + 1);
    if (baseName === SIDECAR_NAME || f.realPath === manifestReal) continue;
    const kind = fileFormat(baseName);
    if (kind === null) {
      files.push(skippedFile(f.file, 'skipped'));
      if (f.file !== paths[f.root])
        problems.push(
          problem('file-skipped', 'not a log file (expected .csv, .tsv, .txt or .parquet, optionally .gz); not read', {
            file: f.file,
          }),
        );
      continue;
    }
    logsPerRoot[f.root] = (logsPerRoot[f.root] ?? 0) + 1;
    if (manifest !== null) {
      if (!listed.has(f.realPath)) {
        files.push(skippedFile(f.file, 'skipped'));
        problems.push(
          problem('file-skipped', `log file not listed in the manifest ${options.manifest as string}; not read`, {
            file: f.file,
          }),
        );
      }
      continue;
    }
    const fields = layout === null ? {} : layout.match(f.relPath);
    if (layout !== null && fields === null) {
      files.push(skippedFile(f.file, 'skipped'));
      problems.push(
        problem(
          'layout-unmatched',
          `${f.relPath} does not match --layout '${layout.template}' (matched against the whole path below ${paths[f.root] as string}, file name included; end the template with /* or /** to accept any file name)`,
          { file: f.file },
        ),
      );
      continue;
    }
    const fromPath = pathIdentity(f, fields ?? {}, layout);
    let identity = fromPath.identity;
    if (seedInFile !== null && identity.seed !== null)
      identity = { ...identity, info: { seed: identity.seed, ...identity.info }, seed: null };
    const merged = await withSidecar(f.file, identity, 'path');
    const seedFrom: SeedOrigin = fromPath.seedFrom ?? (merged.seed !== null ? 'params' : null);
    const configFrom: IdentitySource = layout !== null ? 'layout' : hivePairs(f.file).length > 0 ? 'hive' : 'none';
    const source: IdentitySource = seedInFile ?? (seedFrom === 'hive' || seedFrom === 'layout' ? seedFrom : configFrom);
    pending.push({ source: { file: f.file, relPath: f.relPath, ...kind, ...merged, identity: source }, root: f.root });
  }
  walked.roots.forEach((kind, k) => {
    if (kind !== 'repeated' && logsPerRoot[k] === 0) {
      const what = kind === 'file' ? 'is not a log file' : 'holds no log files';
      problems.push(
        problem('no-logs', `${paths[k] as string} ${what} (expected .csv, .tsv, .txt or .parquet, optionally .gz)`, {
          file: paths[k] as string,
        }),
      );
    }
  });

  let auto = 0;
  const found: RunSource[] = pending.map(({ source, line }) => {
    if (source.seed !== null || seedInFile !== null) return source;
    const seed = `auto-${++auto}`;
    const where = line === undefined ? { file: source.file } : { file: options.manifest as string, line };
    problems.push(
      problem(
        'seed-missing',
        `no seed found for ${source.file} (no seed= segment, layout field, seed column, manifest seed or params.json seed); given the seed ${seed}`,
        where,
      ),
    );
    return { ...source, seed };
  });
  // Runs of two PATHs never merge silently (pathKey.ts).
  const separated = separatePaths(
    found,
    pending.map((p) => p.root ?? null),
    paths,
  );
  const sources = separated.sources;
  problems.push(...separated.problems);
  const seen = new Set<string>();
  const unique = problems.filter((p) => {
    const key = JSON.stringify([p.code, p.file, p.line, p.message]);
    return seen.has(key) ? false : (seen.add(key), true);
  });
  return { sources, files, problems: unique };
}
