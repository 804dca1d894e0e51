/**
 * One timed run of a command under GNU time (`/usr/bin/time -v`, Debian package `time`): wall-clock
 * seconds measured around the child, CPU seconds (user + system) and peak resident memory as
 * GNU time reports them for the child and the children it waited for.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export const GNU_TIME = '/usr/bin/time';

/** What one run cost. */
export interface Measurement {
  /** Wall-clock seconds (performance.now() around the child; includes process start-up). */
  readonly wallSeconds: number;
  /** User + system CPU seconds. */
  readonly cpuSeconds: number;
  /** Peak resident set size in MiB ("Maximum resident set size (kbytes)" / 1024). */
  readonly peakMiB: number;
  readonly stdout: string;
}

/**
 * Run `command args` in `cwd` under `/usr/bin/time -v -o FILE` and read FILE.
 * Throws Error when the command exits non-zero (with its stderr) or GNU time's report lacks a field.
 * Cost: the command's own. Example: timedRun('/usr/bin/true', [], '.') → { wallSeconds: 0.002, ... }.
 */
export function timedRun(command: string, args: readonly string[], cwd: string): Measurement {
  const scratch = mkdtempSync(join(tmpdir(), 'seedsift-bench-'));
  const report = join(scratch, 'time.txt');
  try {
    const start = performance.now();
    const result = spawnSync(GNU_TIME, ['-v', '-o', report, command, ...args], {
      cwd,
      encoding: 'utf8',
      stdio: ['ignore', 'pipe', 'pipe'],
      maxBuffer: 64 * 1024 * 1024,
    });
    const wallSeconds = (performance.now() - start) / 1000;
    if (result.status !== 0) {
      const what = [command, ...args].join(' ');
      throw new Error(`${what}: exit ${result.status ?? result.signal ?? result.error?.message}\n${result.stderr}`);
    }
    const text = readFileSync(report, 'utf8');
    const user = field(text, 'User time (seconds)');
    const system = field(text, 'System time (seconds)');
    const peakKiB = field(text, 'Maximum resident set size (kbytes)');
    return { wallSeconds, cpuSeconds: user + system, peakMiB: peakKiB / 1024, stdout: result.stdout };
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
}

/** The number after "\tName: " in GNU time's verbose report. */
function field(text: string, name: string): number {
  const line = text.split('\n').find((l) => l.trim().startsWith(`${name}:`));
  const value = line === undefined ? NaN : Number(line.slice(line.indexOf(':') + 1).trim());
  if (!Number.isFinite(value)) throw new Error(`${GNU_TIME} -v: no '${name}' in its report:\n${text}`);
  return value;
}
