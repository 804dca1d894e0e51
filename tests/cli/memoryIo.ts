/** An in-memory Io for driving the command line in tests. */
import type { Io } from '../../src/cli/io.js';

export interface MemoryIo extends Io {
  out(): string;
  err(): string;
}

export function memoryIo(env: Record<string, string | undefined> = {}): MemoryIo {
  let out = '';
  let err = '';
  return {
    cwd: process.cwd(),
    env: { SOURCE_DATE_EPOCH: '1764547200', ...env },
    stderrIsTTY: false,
    stdout: (text) => {
      out += text;
    },
    stderr: (text) => {
      err += text;
    },
    out: () => out,
    err: () => err,
  };
}
