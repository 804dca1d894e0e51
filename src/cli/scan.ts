/** `seedsift scan PATH...`: what was found, as text or JSON. */
import { Command } from 'commander';
import { problem, SeedsiftError } from '../problems.js';
import { addIngestOptions, rawIngestOptions, resolveIngestOptions } from './ingestOptions.js';
import { modeFiles } from '../ingest/readingMode.js';
import { inputFiles } from './inputFiles.js';
import { progressDisplay } from './progress.js';
import { relativePaths } from './relativePaths.js';
import type { Io } from './io.js';
import { STDOUT, writeOutput } from './writeOutput.js';

export function scanCommand(io: Io, done: (code: number) => void): Command {
  const command = new Command('scan')
    .description('list what was found: configs x seeds, metrics and goals, tick metrics, step ranges, problems')
    .argument('[paths...]', 'folders or files of run logs (none with --scores)')
    .option('--json <file>', "write the scan as JSON to FILE ('-' for standard output)")
    .option('--quiet', 'no progress display while reading');
  addIngestOptions(command, 'scan');
  command.action(async (paths: string[], raw: Record<string, unknown> & { json?: string; quiet?: boolean }) => {
    // Heavy modules (DuckDB) load only when the command runs, so --help and --version start fast.
    const [
      { ingest },
      { inventory },
      { setAsideColumns, withoutUncomparedGoals },
      { sanityChecks },
      { scanJson },
      { scanText },
    ] = await Promise.all([
      import('../ingest/ingest.js'),
      import('../analysis/inventory.js'),
      import('../analysis/setAside.js'),
      import('../analysis/sanityChecks.js'),
      import('../report/scanJson.js'),
      import('../report/scanText.js'),
    ]);
    const options = resolveIngestOptions(rawIngestOptions(raw));
    if (paths.length === 0 && options.mode.kind !== 'scores')
      throw new SeedsiftError('usage', 'scan: expected PATH... (folders or files of run logs) or --scores FILE');
    const progress = progressDisplay(io, raw.quiet === true);
    const read = await ingest(relativePaths(paths, io.cwd), options, progress.hooks).finally(() => progress.done());
    // Bookkeeping columns are listed as report would set them aside, each with how to include it.
    const setAside = setAsideColumns(read);
    const compared = read.metrics.map((m) => m.name).filter((name) => !setAside.some((s) => s.name === name));
    const runSet = {
      ...read,
      problems: [
        ...withoutUncomparedGoals(read.problems, compared),
        ...sanityChecks(read),
        ...setAside.map((s) => problem('column-set-aside', s.message)),
      ],
    };
    const inv = inventory(runSet);
    if (raw.json === STDOUT) io.stdout(scanJson(runSet, inv, setAside));
    else {
      io.stdout(scanText(runSet, inv));
      if (raw.json !== undefined)
        writeOutput(raw.json, scanJson(runSet, inv, setAside), inputFiles(runSet, modeFiles(options.mode)));
    }
    done(0);
  });
  return command;
}
