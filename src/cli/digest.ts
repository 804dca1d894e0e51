/**
 * `seedsift digest PATH... --out FILE.parquet`: read the runs under PATH... (every reading option
 * applies) and save them, exactly, as one digest file; `report`, `scan` and `seeds` read digests
 * beside or instead of raw logs (src/ingest/digest/writeDigest.ts, digest/readDigest.ts). The digest is written
 * to a temporary file beside FILE and renamed into place, and never over one of its inputs.
 */
import { existsSync, realpathSync, renameSync, rmSync, statSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { Command } from 'commander';
import { ingest } from '../ingest/ingest.js';
import { writeDigest } from '../ingest/digest/writeDigest.js';
import { SeedsiftError } from '../problems.js';
import { addIngestOptions, rawIngestOptions, resolveIngestOptions } from './ingestOptions.js';
import { modeFiles } from '../ingest/readingMode.js';
import { inputFiles } from './inputFiles.js';
import type { Io } from './io.js';
import { progressDisplay } from './progress.js';

/** Real path when the file exists, else the resolved path (for comparing the output with inputs). */
const identity = (path: string): string => (existsSync(path) ? realpathSync(path) : resolve(path));

function mebibytes(bytes: number): string {
  return bytes < 1024 * 1024 ? `${(bytes / 1024).toFixed(1)} KiB` : `${(bytes / 1024 / 1024).toFixed(1)} MiB`;
}

/** The `digest` command (see the module comment); `done` receives the exit code. */
export function digestCommand(io: Io, done: (code: number) => void): Command {
  const command = new Command('digest')
    .description(
      'read runs where they live and save them exactly as one Parquet digest, for report or scan to read later ' +
        '(e.g. one digest per shard of a cluster job array)',
    )
    .argument('[paths...]', 'folders or files of run logs (none with --scores)')
    .requiredOption('--out <file>', 'the digest to write (a name ending in .parquet)')
    .option('--quiet', 'print nothing but errors');
  addIngestOptions(command, 'digest');
  command.action(async (paths: string[], raw: Record<string, unknown> & { out: string; quiet?: boolean }) => {
    if (!/\.parquet$/i.test(raw.out))
      throw new SeedsiftError(
        'usage',
        `--out: expected a file name ending in .parquet (so that report and scan find it), got '${raw.out}'`,
      );
    const options = resolveIngestOptions(rawIngestOptions(raw));
    if (paths.length === 0 && options.mode.kind !== 'scores')
      throw new SeedsiftError('usage', 'digest: expected PATH... (folders or files of run logs) or --scores FILE');
    const progress = progressDisplay(io, raw.quiet === true);
    const runSet = await ingest(paths, options, progress.hooks).finally(() => progress.done());
    const target = identity(raw.out);
    if (inputFiles(runSet, modeFiles(options.mode)).some((f) => identity(f) === target))
      throw new SeedsiftError('output', `refusing to write over an input file: ${raw.out}`);
    const temp = join(dirname(target), `.${basename(target)}.${process.pid}.tmp.parquet`);
    try {
      await writeDigest(runSet, temp);
      renameSync(temp, target);
    } catch (error) {
      rmSync(temp, { force: true });
      throw new SeedsiftError('output', `cannot write ${raw.out}: ${(error as Error).message}`);
    }
    if (raw.quiet !== true) {
      const read = runSet.files.filter((f) => f.status === 'read').length;
      io.stdout(
        `${runSet.runs.length} runs from ${read} files read, ${runSet.problems.length} ` +
          `problems\nwrote ${raw.out} (${mebibytes(statSync(target).size)})\n`,
      );
    }
    done(0);
  });
  return command;
}
