/** The outside world of one command-line invocation, passed in so tests can drive the CLI in-process. */
export interface Io {
  readonly cwd: string;
  readonly env: Readonly<Record<string, string | undefined>>;
  /** Whether stderr is a terminal (progress is shown only then). */
  readonly stderrIsTTY: boolean;
  stdout(text: string): void;
  stderr(text: string): void;
}

/** The real process's Io. */
export function processIo(): Io {
  return {
    cwd: process.cwd(),
    env: process.env,
    stderrIsTTY: process.stderr.isTTY === true,
    stdout: (text) => void process.stdout.write(text),
    stderr: (text) => void process.stderr.write(text),
  };
}
