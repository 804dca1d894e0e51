/**
 * The locate stage of ingest: from the PATHs given on the command line to the list of files to
 * read, each with what its location says about it (config parameters, seed, information fields).
 * Nothing is read from the log files themselves here; the load stage does that.
 *
 * What a file's location says about its run (config, seed, where each came from) is decided by
 * identity.ts, in the reading mode chosen at the edge (readingMode.ts). A `params.json` in the same
 * folder as a file is read once per folder (sidecar.ts) and handed to identity.ts.
 *
 * A file with no seed from any source gets `seed-missing` and the seed `auto-N`, N = 1, 2, ... in
 * source order (the prefix cannot collide with a real seed written as a number), so every such
 * file stays a run of its own.
 *
 * Order: sources in PATH order, sorted by relative path within one PATH (walk.ts); with a
 * manifest, in manifest row order. Files named `params.json` and the manifest itself are
 * consumed, not listed. Every other file found that does not become a source is in `files`
 * (status `skipped` or `unreadable`) with a problem. The reading mode (readingMode.ts) was checked
 * at the edge; a score table does not go through locate.
 */
import { realpath } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { problem, type Problem } from '../../problems.js';
import { fileFormat } from './fileFormat.js';
import { manifestIdentity, modeLayout, pathIdentity, seedInFile } from './identity.js';
import { readManifest } from './manifest.js';
import { separatePaths } from './pathKey.js';
import { readSidecar, SIDECAR_NAME, type Sidecar } from './sidecar.js';
import type { FileRecord, IngestOptions, RunSource } from '../types.js';
import { skippedFile, walk } from './walk.js';

/** What `locate` hands to the load stage. */
export interface Located {
  readonly sources: RunSource[];
  readonly files: FileRecord[];
  readonly problems: Problem[];
}

/**
 * Find the run files under `paths` and what their locations say (see the module comment).
 * Cost: one directory listing per folder, one read per params.json folder; O(files) memory.
 * Throws SeedsiftError('usage') for a PATH or manifest that does not exist; SeedsiftError('input') for a manifest that
 * cannot be parsed or has no `file` column. Every other difficulty is a problem; a folder with no log files is
 * `no-logs`.
 * Example: `locate(['runs'], opts)` with runs/ticks=8/seed=1/log.csv gives one source
 * `{ relPath: 'ticks=8/seed=1/log.csv', params: { ticks: '8' }, seed: '1', identity: 'hive' }`.
 */
export async function locate(paths: readonly string[], options: IngestOptions): Promise<Located> {
  const mode = options.mode;
  const layout = modeLayout(mode);
  const inFile = seedInFile(mode);
  const manifestFile = mode.kind === 'manifest' ? mode.file : null;
  const manifest = manifestFile === null ? null : await readManifest(manifestFile);
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

  // Manifest rows are the sources; the walk only lists what the manifest leaves out.
  for (const row of manifest?.rows ?? []) {
    const kind = fileFormat(row.file);
    if (kind === null) continue;
    const decided = manifestIdentity(row, await sidecarFor(row.file));
    problems.push(...decided.problems);
    pending.push({ source: { file: row.file, relPath: row.relPath, ...kind, ...decided.identity }, line: row.line });
  }
  const listed = new Set((manifest?.rows ?? []).map((r) => r.realPath));
  const manifestReal = manifestFile === null ? null : await realpath(manifestFile);

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
          problem('file-skipped', `log file not listed in the manifest ${manifestFile as string}; not read`, {
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
          `${f.relPath} does not match --layout '${layout.template}' (matched against the whole path below ` +
            `${paths[f.root] as string}, file name included; end the template with /* or /** to accept any file name)`,
          { file: f.file },
        ),
      );
      continue;
    }
    const decided = pathIdentity(f.file, fields ?? {}, mode, await sidecarFor(f.file));
    problems.push(...decided.problems);
    pending.push({ source: { file: f.file, relPath: f.relPath, ...kind, ...decided.identity }, root: f.root });
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
    if (source.seed !== null || inFile !== null) return source;
    const seed = `auto-${++auto}`;
    const where = line === undefined ? { file: source.file } : { file: manifestFile as string, line };
    problems.push(
      problem(
        'seed-missing',
        `no seed found for ${source.file} (no seed= segment, layout field, seed column, manifest seed or ` +
          `params.json seed); given the seed ${seed}`,
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
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
  return { sources, files, problems: unique };
}
