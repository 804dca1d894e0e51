/**
 * The command line: the only module that reads argv, prints and decides exit codes.
 * `run(argv, io)` drives it in-process (tests use it); `main.ts` connects it to the real process.
 *
 * Exit codes: 0 done; 1 a gate failed (--fail-on); 2 a usage or input error (one line on stderr,
 * no stack trace unless --debug); 3 a --fail-on gate had nothing to judge (exitCodes.ts); 70 an
 * internal error (a bug in seedsift: please report it).
 */
import { Command, CommanderError } from 'commander';
import { digestCommand } from './digest.js';
import { SeedsiftError } from '../problems.js';
import type { Io } from './io.js';
import { notebookCommand } from './notebook.js';
import { reportCommand } from './report.js';
import { scanCommand } from './scan.js';
import { seedsCommand } from './seeds.js';
import { version } from './version.js';
import { EXIT_DONE, EXIT_INTERNAL, EXIT_USAGE } from './exitCodes.js';

/**
 * Commander's usage errors as one line like seedsift's own (`seedsift: unknown option '--x' (Did
 * you mean --y?) (see seedsift report --help)`): commander puts its suggestion on a second line.
 */
function oneLine(command: string): (text: string, write: (text: string) => void) => void {
  return (text, write) =>
    write(
      `seedsift: ${text
        .trim()
        .replace(/^error: /, '')
        .replace(/\s*\n\s*/g, ' ')} (see seedsift ${command}--help)\n`,
    );
}

export function buildProgram(io: Io, done: (code: number) => void): Command {
  const program = new Command('seedsift')
    .description(
      "Does a change beat seed noise? Reads many runs' per-step logs, tests configurations against each other, " +
        'and writes a self-contained report.',
    )
    .version(version(), '-V, --version')
    .option('--debug', 'show the stack trace of an error')
    .configureOutput({ writeOut: io.stdout, writeErr: io.stderr, outputError: oneLine('') })
    .exitOverride();
  for (const command of [
    scanCommand(io, done),
    reportCommand(io, done),
    digestCommand(io, done),
    notebookCommand(io, done),
    seedsCommand(io, done),
  ]) {
    // Nested commands too (notebook new): without exitOverride commander would call process.exit(1).
    const configure = (c: Command, path: string): void => {
      c.configureOutput({ writeOut: io.stdout, writeErr: io.stderr, outputError: oneLine(path) }).exitOverride();
      for (const sub of c.commands) configure(sub, `${path}${sub.name()} `);
    };
    configure(command, `${command.name()} `);
    program.addCommand(command);
  }
  program.addHelpText(
    'after',
    `
Examples:
  seedsift scan sample-runs
  seedsift report sample-runs --baseline ticks=8,memory=4 -o report.html --json results.json --markdown summary.md
  seedsift report runs/ --baseline memory=4 --summary last:10% --fail-on worse
  seedsift digest runs/shard-3 --out digests/3.parquet && seedsift report digests/*.parquet
  seedsift notebook new study.md
  seedsift seeds --sd 0.01 --effect 0.005`,
  );
  return program;
}

/** Run the command line with `argv` (without the node and script names); resolves to the exit code. */
export async function run(argv: readonly string[], io: Io): Promise<number> {
  let code: number = EXIT_DONE;
  const program = buildProgram(io, (c) => (code = c));
  const debug = argv.includes('--debug');
  try {
    await program.parseAsync([...argv], { from: 'user' });
    return code;
  } catch (error) {
    if (error instanceof CommanderError) {
      // Help and version exit 0; every other commander error is a usage error it already printed.
      return error.exitCode === 0 ? EXIT_DONE : EXIT_USAGE;
    }
    if (error instanceof SeedsiftError) {
      io.stderr(`seedsift: ${error.message}\n`);
      if (debug && error.stack !== undefined) io.stderr(`${error.stack}\n`);
      return EXIT_USAGE;
    }
    const message = error instanceof Error ? error.message : String(error);
    io.stderr(`seedsift: internal error: ${message} (this is a bug in seedsift; --debug shows the stack)\n`);
    if (debug && error instanceof Error && error.stack !== undefined) io.stderr(`${error.stack}\n`);
    return EXIT_INTERNAL;
  }
}
