/**
 * Walk the PATHs given on the command line and list every file under them, in a deterministic
 * order, following symbolic links safely.
 *
 * - Order: PATHs in the order given; within one, files sorted by their relative path, segment by
 *   segment, by UTF-16 code units (locale-independent, so the order is the same on every machine).
 * - Hidden entries (name starting with `.`, e.g. `.git`, `.ipynb_checkpoints`, macOS `._x.csv`)
 *   are not read: a hidden file is listed as skipped, a hidden folder is not searched. Each gets
 *   a `file-skipped` note. (A PATH given on the command line is walked even if hidden.)
 * - Symbolic links are followed in a second pass, after every real folder: each real folder is
 *   searched once. A link back to a folder that contains it (a loop) or to a folder already searched
 *   is not followed (`file-skipped` note: nothing is lost, its files are read once under their
 *   other path). A broken link is a `file-unreadable` problem when its name is a log file's.
 *   Walking ends because the set of real folders is finite.
 * - One real file reached by two paths (a link to a file, overlapping PATHs) is kept once: the path
 *   not through a link if there is one, else the first in order; the others are listed as
 *   skipped with a note naming the kept one.
 * - A PATH that does not exist or cannot be examined throws SeedsiftError('usage').
 */
import { lstat, readdir, realpath, stat } from 'node:fs/promises';
import type { Dirent, Stats } from 'node:fs';
import { basename, join, sep } from 'node:path';
import { problem, SeedsiftError, type Problem } from '../../problems.js';
import { fileFormat } from './fileFormat.js';
import type { FileRecord } from '../types.js';

/** One file found by `walk`. */
export interface WalkedFile {
  /** Path as seedsift opens it: the PATH as given joined with the relative path. */
  readonly file: string;
  /** `/`-separated path relative to the PATH (the base name when the PATH is the file itself). */
  readonly relPath: string;
  /** Index of the PATH in the list given. */
  readonly root: number;
  readonly realPath: string;
  /** Reached through a symbolic link (to the file or to a folder above it). */
  readonly viaLink: boolean;
}

/** What each PATH turned out to be: a file, a folder searched, or a folder already searched under an earlier PATH. */
export type RootKind = 'file' | 'folder' | 'repeated';

export interface WalkResult {
  readonly files: readonly WalkedFile[];
  /** One entry per PATH, in the order given. */
  readonly roots: readonly RootKind[];
  /** Files seen but not listed in `files` (hidden, special, broken links, duplicates). */
  readonly skipped: readonly FileRecord[];
  readonly problems: readonly Problem[];
}

/**
 * A FileRecord for a file that will not be read: no rows, no runs, kind `log` when its name is a
 * log file's, else `unknown`. Pure, O(1). Example: `skippedFile('a/model.pt', 'skipped').kind` is `'unknown'`.
 */
export function skippedFile(file: string, status: 'skipped' | 'unreadable'): FileRecord {
  return { file, status, rows: 0, rejectedRows: 0, runs: [], kind: fileFormat(file) === null ? 'unknown' : 'log' };
}

/**
 * Order two `/`-separated paths segment by segment, each segment by UTF-16 code units (so a
 * folder's files stay together and the order does not depend on the locale). Pure, O(length).
 * Example: `['a-c/x.csv', 'a/b.csv'].sort(comparePaths)` is `['a/b.csv', 'a-c/x.csv']`.
 */
export function comparePaths(a: string, b: string): number {
  const x = a.split('/');
  const y = b.split('/');
  for (let i = 0; i < Math.min(x.length, y.length); i++) {
    const p = x[i] as string;
    const q = y[i] as string;
    if (p !== q) return p < q ? -1 : 1;
  }
  return x.length - y.length;
}

function errnoCode(error: unknown): string {
  return (error as NodeJS.ErrnoException).code ?? String(error);
}

interface PendingLink {
  readonly file: string;
  readonly relPath: string;
  readonly root: number;
  /** Real path of the folder holding the link. */
  readonly holder: string;
}

/**
 * List the files under `roots` (files or folders). Cost: one `readdir` per real folder and one
 * `stat`/`realpath` per link; memory O(files). Throws SeedsiftError('usage') for a PATH that does
 * not exist or cannot be examined; every other difficulty is a problem.
 * Example: `walk(['runs'])` on runs/b.csv, runs/a/x.csv lists `a/x.csv` then `b.csv`.
 */
export async function walk(roots: readonly string[]): Promise<WalkResult> {
  const found: WalkedFile[] = [];
  const skipped: FileRecord[] = [];
  const problems: Problem[] = [];
  const searched = new Map<string, string>();
  const links: PendingLink[] = [];
  const kinds: RootKind[] = [];

  const skip = (file: string, status: 'skipped' | 'unreadable', p: Problem): void => {
    skipped.push(skippedFile(file, status));
    problems.push(p);
  };

  const searchFolder = async (
    dir: string,
    relPath: string,
    root: number,
    viaLink: boolean,
    real: string,
  ): Promise<boolean> => {
    const earlier = searched.get(real);
    if (earlier !== undefined) {
      problems.push(
        problem('file-skipped', `folder not searched again: it was already searched as ${earlier}`, { file: dir }),
      );
      return false;
    }
    searched.set(real, dir);
    let entries: Dirent[];
    try {
      entries = await readdir(dir, { withFileTypes: true });
    } catch (error) {
      problems.push(
        problem('file-unreadable', `folder could not be listed (${errnoCode(error)}); files in it were not read`, {
          file: dir,
        }),
      );
      return true;
    }
    entries.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
    for (const entry of entries) {
      const file = join(dir, entry.name);
      const rel = relPath === '' ? entry.name : `${relPath}/${entry.name}`;
      const childReal = join(real, entry.name);
      if (entry.name.startsWith('.')) {
        if (entry.isDirectory()) problems.push(problem('file-skipped', 'hidden folder not searched', { file }));
        else skip(file, 'skipped', problem('file-skipped', 'hidden file not read', { file }));
      } else if (entry.isSymbolicLink()) {
        let target: Stats;
        try {
          target = await stat(file);
        } catch (error) {
          const status = fileFormat(entry.name) === null ? 'skipped' : 'unreadable';
          const code = status === 'skipped' ? 'file-skipped' : 'file-unreadable';
          skip(file, status, problem(code, `broken symbolic link (${errnoCode(error)}); not read`, { file }));
          continue;
        }
        if (target.isDirectory()) links.push({ file, relPath: rel, root, holder: real });
        else if (target.isFile())
          found.push({ file, relPath: rel, root, realPath: await realpath(file), viaLink: true });
        else
          skip(
            file,
            'skipped',
            problem('file-skipped', 'not a regular file or folder (a device, socket or pipe); not read', { file }),
          );
      } else if (entry.isDirectory()) {
        await searchFolder(file, rel, root, viaLink, childReal);
      } else if (entry.isFile()) {
        found.push({ file, relPath: rel, root, realPath: childReal, viaLink });
      } else {
        skip(
          file,
          'skipped',
          problem('file-skipped', 'not a regular file or folder (a device, socket or pipe); not read', { file }),
        );
      }
    }
    return true;
  };

  // Pass 1: each PATH, without following links to folders.
  for (const [index, root] of roots.entries()) {
    let info: Stats;
    let link: Stats;
    let real: string;
    try {
      link = await lstat(root);
      info = await stat(root);
      real = await realpath(root);
    } catch (error) {
      const code = errnoCode(error);
      const what = code === 'ENOENT' ? 'no such file or folder' : `cannot be examined (${code})`;
      throw new SeedsiftError('usage', `PATH: expected a log file or a folder of logs, got ${what}`, { file: root });
    }
    if (info.isDirectory()) {
      kinds.push((await searchFolder(root, '', index, link.isSymbolicLink(), real)) ? 'folder' : 'repeated');
    } else if (info.isFile()) {
      kinds.push('file');
      found.push({ file: root, relPath: basename(root), root: index, realPath: real, viaLink: link.isSymbolicLink() });
    } else
      throw new SeedsiftError('usage', 'PATH: expected a log file or a folder of logs, got a device, socket or pipe', {
        file: root,
      });
  }

  // Pass 2: links to folders, each real folder searched once.
  for (let k = 0; k < links.length; k++) {
    const link = links[k] as PendingLink;
    let real: string;
    try {
      real = await realpath(link.file);
    } catch (error) {
      problems.push(
        problem('file-unreadable', `symbolic link could not be resolved (${errnoCode(error)}); not followed`, {
          file: link.file,
        }),
      );
      continue;
    }
    if (link.holder === real || link.holder.startsWith(real + sep)) {
      problems.push(
        problem(
          'file-skipped',
          'symbolic link loop: it points back to a folder that contains it ' +
            `(${searched.get(real) ?? real}); not followed`,
          { file: link.file },
        ),
      );
      continue;
    }
    await searchFolder(link.file, link.relPath, link.root, true, real);
  }

  // One path per real file: prefer a path not through a link, then the first in order.
  found.sort((a, b) => a.root - b.root || comparePaths(a.relPath, b.relPath));
  const kept = new Map<string, WalkedFile>();
  for (const f of found) {
    const other = kept.get(f.realPath);
    if (other === undefined || (other.viaLink && !f.viaLink)) kept.set(f.realPath, f);
  }
  const files: WalkedFile[] = [];
  for (const f of found) {
    const keep = kept.get(f.realPath) as WalkedFile;
    if (keep === f) files.push(f);
    else
      skip(
        f.file,
        'skipped',
        problem('file-skipped', `same file as ${keep.file} (reached by a second path); taken once, under that path`, {
          file: f.file,
        }),
      );
  }
  return { files, roots: kinds, skipped, problems };
}
