/**
 * Output safety (README "Outputs", DESIGN "Outputs"; src/cli/writeOutput.ts): every file is
 * written to a temporary file beside it and renamed into place, so a crash or a kill mid-write
 * leaves any earlier file whole; seedsift refuses to write over one of its inputs; a normal run
 * leaves no temporary file behind.
 *
 * The kill test runs the real command (`node --import tsx src/cli/main.ts`) as a child process and
 * sends SIGKILL, which cannot be caught: at moments drawn from a seeded generator across the run's
 * length, and as soon as a temporary file appears (the write itself). After every kill the earlier
 * report.html must be either its old bytes or the complete new file (the bytes an uninterrupted
 * run writes), never a mix or a part. That rename(2) replaces a file atomically is POSIX
 * (common practice, the reason for the temporary file).
 */
import { execFileSync, spawn } from 'node:child_process';
import {
  existsSync,
  lstatSync,
  mkdirSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  rmSync,
  symlinkSync,
  writeFileSync,
} from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { run } from '../../src/cli/program.js';
import { createRandom } from '../../src/stats/random.js';
import { memoryIo } from './memoryIo.js';

const REPO = fileURLToPath(new URL('../../', import.meta.url));
const dir = mkdtempSync(join(tmpdir(), 'seedsift-safety-'));
const EPOCH = '1764547200';
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** A small study: two configs, three seeds, in `root/runs`. */
function study(root: string): string {
  const runs = join(root, 'runs');
  for (const lr of ['0.1', '0.2']) {
    for (const seed of [1, 2, 3]) {
      const folder = join(runs, `lr=${lr}`, `seed=${seed}`);
      mkdirSync(folder, { recursive: true });
      let text = 'step,loss,acc\n';
      for (let step = 1; step <= 40; step++)
        text +=
          `${step},${(1 / step + seed * 0.001).toFixed(5)},` +
          `${(0.5 + step / 100 + (lr === '0.2' ? 0.01 : 0) + seed * 0.002).toFixed(5)}\n`;
      writeFileSync(join(folder, 'log.csv'), text);
    }
  }
  return runs;
}

const temps = (folder: string): string[] => readdirSync(folder).filter((f) => f.endsWith('.tmp'));

describe('seedsift refuses to write over its inputs (exit 2, the input unchanged)', () => {
  const root = join(dir, 'refuse');
  const runs = study(root);
  const log = join(runs, 'lr=0.1/seed=1/log.csv');
  const before = readFileSync(log);
  writeFileSync(join(runs, 'lr=0.1/seed=1/params.json'), '{ "lr": 0.1 }\n');
  writeFileSync(
    join(root, 'manifest.csv'),
    'file,seed,lr\nruns/lr=0.1/seed=1/log.csv,1,0.1\nruns/lr=0.2/seed=1/log.csv,1,0.2\n',
  );
  writeFileSync(join(root, 'notebook.md'), readFileSync(join(REPO, 'templates/notebook.md')));
  writeFileSync(join(root, 'scores.csv'), 'method,seed,acc\na,1,0.5\na,2,0.6\nb,1,0.7\nb,2,0.8\n');
  symlinkSync(log, join(root, 'alias.json'));

  const cases: [string, string[], string][] = [
    ["a log read (the issue's example: report runs --json runs/x/log.csv)", ['report', runs, '--json', log], log],
    [
      'a log, spelled another way',
      ['report', runs, '--markdown', join(runs, 'lr=0.1/./seed=1/../seed=1/log.csv')],
      log,
    ],
    ['a log, through a symbolic link', ['report', runs, '--json', join(root, 'alias.json')], log],
    [
      'a params.json beside a log',
      ['report', runs, '--json', join(runs, 'lr=0.1/seed=1/params.json')],
      join(runs, 'lr=0.1/seed=1/params.json'),
    ],
    [
      'the --manifest',
      ['report', runs, '--manifest', join(root, 'manifest.csv'), '--json', join(root, 'manifest.csv')],
      join(root, 'manifest.csv'),
    ],
    [
      'the --notebook',
      ['report', runs, '--notebook', join(root, 'notebook.md'), '-o', join(root, 'notebook.md')],
      join(root, 'notebook.md'),
    ],
    [
      'the --scores table',
      ['report', '--scores', join(root, 'scores.csv'), '--json', join(root, 'scores.csv')],
      join(root, 'scores.csv'),
    ],
    ['scan --json over a log', ['scan', runs, '--json', log], log],
  ];
  it.each(cases)('%s', async (_name, argv, input) => {
    const bytes = readFileSync(input);
    const io = memoryIo();
    expect(await run(argv, io)).toBe(2);
    expect(io.err()).toMatch(/^seedsift: refusing to write over an input file: [^\n]+\n$/);
    expect(readFileSync(input).equals(bytes)).toBe(true);
    expect(readFileSync(log).equals(before)).toBe(true);
    expect(temps(root)).toEqual([]);
  });

  it('two outputs on one file is a usage error, before anything is written', async () => {
    const io = memoryIo();
    const out = join(root, 'twice.html');
    expect(await run(['report', runs, '-o', out, '--json', out], io)).toBe(2);
    expect(io.err()).toMatch(/^seedsift: -o, --json, --markdown: expected a different file for each[^\n]*\n$/);
    expect(existsSync(out)).toBe(false);
  });

  it('a write that fails (a folder where the file should go) keeps nothing half-written', async () => {
    const target = join(root, 'is-a-folder');
    mkdirSync(target);
    const io = memoryIo();
    expect(await run(['report', runs, '--json', target], io)).toBe(2);
    expect(io.err()).toBe(`seedsift: cannot write ${target}: it is a folder\n`);
    expect(temps(root)).toEqual([]);
  });
});

describe('a normal run leaves no temporary file behind', () => {
  it('report writing html, json and markdown', async () => {
    const root = join(dir, 'normal');
    const runs = study(root);
    const out = join(root, 'out');
    mkdirSync(out);
    const io = memoryIo();
    expect(
      await run(
        [
          'report',
          runs,
          '-o',
          join(out, 'report.html'),
          '--json',
          join(out, 'results.json'),
          '--markdown',
          join(out, 'summary.md'),
        ],
        io,
      ),
    ).toBe(0);
    expect(readdirSync(out).sort()).toEqual(['report.html', 'results.json', 'summary.md']);
  });

  it('an output that is a named pipe is written into, not replaced (as /dev/null must be)', async () => {
    const root = join(dir, 'pipe');
    const runs = study(root);
    const fifo = join(root, 'json.fifo');
    execFileSync('mkfifo', [fifo]);
    // A reader on the pipe (opening a pipe for writing waits for one), collecting what comes through.
    const reader = spawn('cat', [fifo], { stdio: ['ignore', 'pipe', 'ignore'] });
    let received = '';
    reader.stdout.on('data', (d: Buffer) => (received += d.toString()));
    const closed = new Promise((resolve) => reader.on('close', resolve));
    try {
      expect(await run(['report', runs, '--json', fifo], memoryIo())).toBe(0);
      expect(lstatSync(fifo).isFIFO()).toBe(true);
      await closed;
    } finally {
      reader.kill();
    }
    expect((JSON.parse(received) as { runs: unknown[] }).runs).toHaveLength(6);
    expect(readdirSync(root).filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });
});

/** Run the real command in a child process; resolves when it exits. */
function child(
  argv: readonly string[],
  onStart: (kill: () => void) => void = () => undefined,
): Promise<{ code: number | null; signal: NodeJS.Signals | null; stderr: string }> {
  return new Promise((resolve, reject) => {
    const p = spawn(process.execPath, ['--import', 'tsx', join(REPO, 'src/cli/main.ts'), ...argv], {
      cwd: REPO,
      env: { ...process.env, SOURCE_DATE_EPOCH: EPOCH },
      stdio: ['ignore', 'ignore', 'pipe'],
    });
    let stderr = '';
    p.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
    p.on('error', reject);
    p.on('exit', (code, signal) => resolve({ code, signal, stderr }));
    onStart(() => p.kill('SIGKILL'));
  });
}

describe('a kill mid-run leaves the earlier report whole', () => {
  it('SIGKILL at seeded random moments and as soon as the temporary file appears', async () => {
    const root = join(dir, 'kill');
    const runs = study(root);
    const out = join(root, 'out');
    mkdirSync(out);
    const html = join(out, 'report.html');
    // The earlier report (alpha 0.05) and the complete new one (alpha 0.01), written in-process.
    const fresh = join(root, 'fresh.html');
    expect(await run(['report', runs, '-o', html], memoryIo({ SOURCE_DATE_EPOCH: EPOCH }))).toBe(0);
    expect(await run(['report', runs, '-o', fresh, '--alpha', '0.01'], memoryIo({ SOURCE_DATE_EPOCH: EPOCH }))).toBe(0);
    const old = readFileSync(html);
    const complete = readFileSync(fresh);
    expect(complete.equals(old)).toBe(false); // else the test could not tell them apart
    const random = createRandom(20260301);
    const outcomes: string[] = [];
    // How long a run takes here, from the first kill (which waits for the write): the range of the random moments.
    let length = 0;
    for (const onTemp of [true, false, false]) {
      writeFileSync(html, old); // each kill starts from the earlier report
      let watch: NodeJS.Timeout | undefined;
      let timer: NodeJS.Timeout | undefined;
      const t0 = Date.now();
      const result = await child(['report', runs, '-o', html, '--alpha', '0.01'], (kill) => {
        if (onTemp) {
          watch = setInterval(() => {
            if (temps(out).length > 0) kill();
          }, 1);
        } else timer = setTimeout(kill, Math.floor(random.next() * length));
      });
      clearInterval(watch);
      clearTimeout(timer);
      if (onTemp) length = Date.now() - t0;
      const now = readFileSync(html);
      const state = now.equals(old) ? 'old' : now.equals(complete) ? 'new' : 'PARTIAL';
      outcomes.push(
        `${result.signal ?? `exit ${result.code}`} after ${Date.now() - t0} ` +
          `ms${onTemp ? ' (on the temporary file)' : ''}: ${state}`,
      );
      expect(state, outcomes.join('; ')).not.toBe('PARTIAL');
      // A killed run may leave its temporary file; the report is what counts.
      for (const t of temps(out)) rmSync(join(out, t));
    }
    console.log(`kill test (a run takes about ${length} ms here, up to its write): ${outcomes.join('; ')}`);
  }, 180_000);
});
