/**
 * Nothing passes silently (issue 14): a reading option that names a column or metric that exists
 * nowhere stops with exit 2 and a "did you mean"; a report with no comparison, or with more than
 * half of its files unreadable, never passes a --fail-on gate (exit 3); and `-` is standard
 * output for every output option, never a file named "-". Fixtures of our own, written here.
 */
import { existsSync, mkdirSync, mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { EXIT_DONE, EXIT_NO_EVIDENCE, EXIT_USAGE } from '../../src/cli/exitCodes.js';
import { run } from '../../src/cli/program.js';
import { memoryIo } from './memoryIo.js';

vi.setConfig({ testTimeout: 120_000 });
const dir = mkdtempSync(join(tmpdir(), 'seedsift-silent-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const write = (file: string, text: string): void => {
  mkdirSync(join(file, '..'), { recursive: true });
  writeFileSync(file, text);
};
/** Two configs x two seeds; the candidate is 0.1 higher, spread 0.01. */
const runs = join(dir, 'runs');
for (const ticks of ['8', '16'])
  for (const seed of ['1', '2'])
    write(
      join(runs, `ticks=${ticks}`, `seed=${seed}`, 'log.csv'),
      `step,val_acc\n1,0.5\n2,0.${ticks === '8' ? 6 : 7}${seed}\n`,
    );
/** One config only: nothing to compare. */
const single = join(dir, 'single');
for (const seed of ['1', '2'])
  write(join(single, 'ticks=8', `seed=${seed}`, 'log.csv'), `step,val_acc\n1,0.5\n2,0.6${seed}\n`);
/** The same four readable logs, plus five files that are not gzip although named .gz: 5 of 9 unreadable. */
const broken = join(dir, 'broken');
for (const ticks of ['8', '16'])
  for (const seed of ['1', '2'])
    write(
      join(broken, `ticks=${ticks}`, `seed=${seed}`, 'log.csv'),
      `step,val_acc\n1,0.5\n2,0.${ticks === '8' ? 6 : 7}${seed}\n`,
    );
for (const seed of ['3', '4', '5', '6', '7'])
  write(join(broken, 'ticks=8', `seed=${seed}`, 'log.csv.gz'), 'not gzip at all\n');

/**
 * A wide file with one column per seed, the columns carrying a prefix `acc:` (issue 14, DESIGN "Inputs" 4). The
 * expected lines below follow from first principles: the pattern matches whole column names, `*` any text.
 */
const wide = join(dir, 'wide');
write(join(wide, 'ticks=8', 'wide.csv'), 'step,acc:seed_0_x,acc:seed_1_x\n1,0.5,0.6\n2,0.55,0.65\n');
/** The same, plus a file whose columns the unprefixed pattern does match: no stop, a per-file matter. */
const mixed = join(dir, 'mixed');
write(join(mixed, 'ticks=8', 'wide.csv'), 'step,acc:seed_0_x,acc:seed_1_x\n1,0.5,0.6\n2,0.55,0.65\n');
write(join(mixed, 'ticks=16', 'wide.csv'), 'step,seed_0_x,seed_1_x\n1,0.5,0.6\n2,0.55,0.65\n');

async function firstLine(args: string[]): Promise<[number, string]> {
  const io = memoryIo();
  const code = await run(args, io);
  return [code, io.err().split('\n')[0] ?? ''];
}

describe('reading options that name nothing stop: exit 2, first line of stderr', () => {
  const json = join(dir, 'never.json');
  const cases: [string, string[], string][] = [
    [
      '--step',
      ['report', runs, '--step', 'stpe', '--json', json],
      "seedsift: --step: no column 'stpe' (columns: step, val_acc); did you mean step?",
    ],
    [
      '--step (scan)',
      ['scan', runs, '--step', 'iteration'],
      "seedsift: --step: no column 'iteration' (columns: step, val_acc); did you mean one of step, val_acc?",
    ],
    [
      '--seed-column',
      ['scan', runs, '--seed-column', 'sed'],
      "seedsift: --seed-column: no column 'sed' (columns: step, val_acc); did you mean one of step, val_acc?",
    ],
    [
      '--metric',
      ['report', runs, '--metric', 'val_ac:max', '--json', json],
      "seedsift: --metric: no metric 'val_ac' (metrics: val_acc); did you mean val_acc?",
    ],
    [
      '--metric (scan)',
      ['scan', runs, '--metric', 'loss:min'],
      "seedsift: --metric: no metric 'loss' (metrics: val_acc); did you mean one of val_acc?",
    ],
    [
      '--seed-columns, columns with a prefix',
      ['scan', wide, '--seed-columns', 'acc:seed_{seed}_*'],
      "seedsift: --seed-columns: 'acc:seed_{seed}_*' matches no column (columns: step, acc:seed_0_x, acc:seed_1_x); " +
        "did you mean 'acc:acc:seed_{seed}_*' (it matches 2 columns)?",
    ],
    [
      '--seed-columns, columns with a suffix',
      ['scan', wide, '--seed-columns', 'acc:acc:seed_{seed}_'],
      "seedsift: --seed-columns: 'acc:acc:seed_{seed}_' matches no column " +
        "(columns: step, acc:seed_0_x, acc:seed_1_x); did you mean 'acc:acc:seed_{seed}_*' (it matches 2 columns)?",
    ],
    [
      '--seed-columns, nothing near',
      ['scan', wide, '--seed-columns', 'loss:run{seed}'],
      "seedsift: --seed-columns: 'loss:run{seed}' matches no column (columns: step, acc:seed_0_x, acc:seed_1_x); " +
        'did you mean one of step, acc:seed_0_x, acc:seed_1_x?',
    ],
  ];
  for (const [name, args, first] of cases)
    it(name, async () => {
      expect(await firstLine(args)).toEqual([EXIT_USAGE, first]);
    });
});

it(
  'a --seed-columns pattern that one file matches does not stop the command ' + '(the other is a per-file problem)',
  async () => {
    const io = memoryIo();
    expect(await run(['scan', mixed, '--seed-columns', 'acc:seed_{seed}_*'], io)).toBe(EXIT_DONE);
    expect(io.out() + io.err()).toContain('column-unused');
  },
);

describe('a gate never passes on nothing: exit 3', () => {
  it(
    'no comparison (one config): exit 3 with the reason; ' + 'without --fail-on the report is written (exit 0)',
    async () => {
      const json = join(dir, 'single.json');
      expect(await firstLine(['report', single, '--fail-on', 'worse', '--json', json, '--quiet'])).toEqual([
        EXIT_NO_EVIDENCE,
        'seedsift: --fail-on worse: no comparison was made (2 runs, 1 configs); ' +
          'a gate does not pass on nothing (exit 3)',
      ]);
      expect(existsSync(json)).toBe(true);
      expect(await firstLine(['report', single, '--json', json, '--quiet'])).toEqual([EXIT_DONE, '']);
    },
  );

  it('more than half of the files unreadable: exit 3 even though the comparison is better', async () => {
    const json = join(dir, 'broken.json');
    expect(await firstLine(['report', broken, '--fail-on', 'not-better', '--json', json, '--quiet'])).toEqual([
      EXIT_NO_EVIDENCE,
      'seedsift: --fail-on not-better: 5 of 9 files could not be read; a gate does not pass on what is left (exit 3)',
    ]);
    // The readable half alone passes the same gate (ticks=16 is 0.1 higher at spread 0.01: better).
    expect(await firstLine(['report', runs, '--fail-on', 'not-better', '--json', json, '--quiet'])).toEqual([
      EXIT_DONE,
      '',
    ]);
  });
});

describe('- is standard output for every output option', () => {
  for (const [option, starts] of [
    ['--json', '{\n  "format": "seedsift-results"'],
    ['--markdown', '## seedsift verdicts'],
    ['-o', '<!doctype html>'],
  ] as const)
    it(option, async () => {
      const io = memoryIo();
      // A report.html already in the current folder (left by `npm start`) must stay untouched.
      const page = join(process.cwd(), 'report.html');
      const before = existsSync(page) ? statSync(page).mtimeMs : null;
      expect(await run(['report', runs, option, '-'], io)).toBe(EXIT_DONE);
      expect(io.out().toLowerCase().startsWith(starts.toLowerCase())).toBe(true);
      expect(io.err()).toMatch(/wrote standard output\n$/);
      expect(existsSync('-')).toBe(false);
      expect(existsSync(page) ? statSync(page).mtimeMs : null).toBe(before);
    });
});
