/**
 * Safe output writing: each file is written to a temporary file beside it and renamed into place,
 * so a crash or kill mid-write leaves any earlier file intact; seedsift refuses to write over one
 * of its own input files. A target that exists and is not a file or a folder (`/dev/null`, a
 * named pipe, a terminal) is written to directly: renaming over it would replace the device.
 */
import { existsSync, realpathSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { SeedsiftError } from '../problems.js';

/**
 * The name that means standard output for every output option
 * (`-o -`, `--json -`, `--markdown -`), never a file named "-".
 */
export const STDOUT = '-';

/** Real path when the file exists, else the resolved path (for comparing outputs with inputs). */
function identity(path: string): string {
  return existsSync(path) ? realpathSync(path) : resolve(path);
}

/**
 * Write `text` to `path` atomically. `inputs` are the files the run read; writing over one of them
 * throws SeedsiftError('output').
 */
export function writeOutput(path: string, text: string, inputs: readonly string[]): void {
  const target = identity(path);
  if (inputs.some((input) => identity(input) === target)) {
    throw new SeedsiftError('output', `refusing to write over an input file: ${path}`);
  }
  if (existsSync(target)) {
    const kind = statSync(target);
    if (!kind.isFile() && !kind.isDirectory()) {
      writeFileSync(target, text);
      return;
    }
  }
  const temp = join(dirname(target), `.${basename(target)}.${process.pid}.tmp`);
  try {
    writeFileSync(temp, text);
    renameSync(temp, target);
  } catch (error) {
    rmSync(temp, { force: true });
    const e = error as NodeJS.ErrnoException;
    const why =
      e.code === 'ENOENT'
        ? `no folder ${dirname(path)}`
        : e.code === 'EACCES' || e.code === 'EPERM'
          ? 'permission denied'
          : e.code === 'EISDIR'
            ? 'it is a folder'
            : (e.code ?? e.message);
    throw new SeedsiftError('output', `cannot write ${path}: ${why}`);
  }
}
