/**
 * Errors in what the user typed (README "Outputs": exit codes; DESIGN "Command line"): exit 2 with
 * one line on stderr that names the option, no stack trace unless --debug; and the --fail-on gate,
 * exit 1, checked on a score table with a planted difference far beyond its noise (the planted
 * direction is the outside truth: the candidate was written 0.1 below the baseline, with a spread
 * of 0.01, for a metric whose goal is max).
 */
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { Results } from '../../src/analysis/results.js';
import { run } from '../../src/cli/program.js';
import { EXIT_GATE, EXIT_USAGE } from '../../src/cli/exitCodes.js';
import { memoryIo } from './memoryIo.js';

const dir = mkdtempSync(join(tmpdir(), 'seedsift-errors-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const json = join(dir, 'results.json');
/** A tiny study (ticks 8 and 16, two seeds each), so that each error costs little. */
const runs = join(dir, 'runs');
for (const ticks of ['8', '16']) {
  for (const seed of ['1', '2']) {
    mkdirSync(join(runs, `ticks=${ticks}`, `seed=${seed}`), { recursive: true });
    writeFileSync(
      join(runs, `ticks=${ticks}`, `seed=${seed}`, 'log.csv'),
      `step,val_acc\n1,0.5\n2,0.${ticks === '8' ? 6 : 7}${seed}\n`,
    );
  }
}

/** A stack frame as V8 prints it: "    at fn (file:line:col)". */
const FRAME = /^\s+at .+:\d+(:\d+)?\)?$/m;

const USAGE: readonly [string, string[], RegExp][] = [
  ['an unknown option', ['report', runs, '--bogus', '--json', json], /unknown option '--bogus'/],
  [
    'a misspelt option (commander suggests on a second line; seedsift keeps one)',
    ['report', runs, '--alph', '0.1', '--json', json],
    /unknown option '--alph'.*--alpha/,
  ],
  ['an unknown option before the command', ['--bogus'], /unknown option '--bogus'/],
  ['an unknown command', ['frobnicate'], /unknown command 'frobnicate'/],
  [
    '--alpha out of range',
    ['report', runs, '--alpha', '2', '--json', json],
    /--alpha: expected a number in \(0, 1\), got 2/,
  ],
  ['--alpha not a number', ['report', runs, '--alpha', 'abc', '--json', json], /--alpha: .*abc/],
  ['--alpha without its value', ['report', runs, '--alpha'], /option '--alpha <a>' argument missing/],
  [
    '--summary unknown',
    ['report', runs, '--summary', 'median', '--json', json],
    /--summary: expected final, .*got 'median'/,
  ],
  [
    '--summary last:P% out of range',
    ['report', runs, '--summary', 'last:200%', '--json', json],
    /--summary: .*'last:200%'/,
  ],
  [
    '--baseline not key=value',
    ['report', runs, '--baseline', 'ticks', '--json', json],
    /--baseline: expected key=value.*'ticks'/,
  ],
  [
    '--baseline naming no config',
    ['report', runs, '--baseline', 'ticks=99', '--json', json],
    /--baseline: ticks=99 matches no config/,
  ],
  [
    '--baseline with an unknown key',
    ['report', runs, '--baseline', 'depth=3', '--json', json],
    /--baseline: no config key 'depth'/,
  ],
  ['a missing PATH', ['report', 'no-such-folder', '--json', json], /PATH: .*no such file or folder \(no-such-folder\)/],
  ['scan without a PATH', ['scan'], /scan: expected PATH\.\.\. \(folders or files of run logs\) or --scores FILE/],
  [
    '--fail-on with a bad value',
    ['report', runs, '--fail-on', 'maybe', '--json', json],
    /--fail-on: expected worse, not-better, got 'maybe'/,
  ],
  [
    '--correction unknown',
    ['report', runs, '--correction', 'bonferroni', '--json', json],
    /--correction: .*'bonferroni'/,
  ],
  [
    '--metric without a goal',
    ['report', runs, '--metric', 'val_acc', '--json', json],
    /--metric: expected NAME:max or NAME:min, got 'val_acc'/,
  ],
  ['--seed not an integer', ['report', runs, '--seed', '1.5', '--json', json], /--seed: expected an integer/],
  [
    '--notebook that does not exist',
    ['report', runs, '--notebook', join(dir, 'nope.md'), '--json', json],
    /--notebook: cannot read .*nope\.md/,
  ],
  ['notebook new without a file (a nested command)', ['notebook', 'new'], /missing required argument 'file'/],
  [
    'an output folder that does not exist',
    ['report', runs, '--json', join(dir, 'no', 'such', 'r.json')],
    /cannot write .*r\.json: no folder/,
  ],
];

describe('usage errors: exit 2, one line on stderr naming the option, no stack trace', () => {
  it.each(USAGE)('%s', async (_name, argv, says) => {
    const io = memoryIo();
    const code = await run(argv, io);
    expect(code).toBe(EXIT_USAGE);
    expect(io.err()).toMatch(/^seedsift: [^\n]+\n$/);
    expect(io.err()).toMatch(says);
    expect(io.err()).not.toMatch(FRAME);
    expect(io.out()).toBe('');
  });

  it('--debug adds the stack trace after the same line', async () => {
    const io = memoryIo();
    expect(await run(['report', runs, '--alpha', '2', '--json', json, '--debug'], io)).toBe(EXIT_USAGE);
    const [first, ...rest] = io.err().split('\n');
    expect(first).toBe('seedsift: --alpha: expected a number in (0, 1), got 2');
    expect(rest.join('\n')).toMatch(FRAME);
  });
});

/** A score table: `base` around 0.80, `cand` around 0.70 (or `better` around 0.90), 5 seeds each, spread 0.01. */
function scores(): string {
  const spread = [-0.01, -0.005, 0, 0.005, 0.01];
  let text = 'method,seed,acc\n';
  for (const [method, centre] of [
    ['base', 0.8],
    ['cand', 0.7],
    ['better', 0.9],
  ] as const)
    for (const [k, d] of spread.entries()) text += `${method},${k + 1},${(centre + d).toFixed(3)}\n`;
  return text;
}

describe('--fail-on: exit 1 when the gate fails, with the reason on stderr', () => {
  const file = join(dir, 'scores.csv');
  writeFileSync(file, scores());
  const gate = async (failOn: string, ...more: string[]): Promise<{ code: number; err: string; results: Results }> => {
    const io = memoryIo();
    const code = await run(
      [
        'report',
        '--scores',
        file,
        '--baseline',
        'method=base',
        '--metric',
        'acc:max',
        '--fail-on',
        failOn,
        '--json',
        json,
        ...more,
      ],
      io,
    );
    return { code, err: io.err(), results: JSON.parse(readFileSync(json, 'utf8')) as Results };
  };

  it('--fail-on worse: a planted drop of 0.1 (spread 0.01, goal max) is worse, exit 1', async () => {
    const { code, err, results } = await gate('worse');
    const verdicts = Object.fromEntries(results.comparisons.map((c) => [c.candidate, c.verdict]));
    expect(verdicts).toEqual({ 'method=cand': 'worse', 'method=better': 'better' });
    expect(code).toBe(EXIT_GATE);
    expect(err).toMatch(
      /^seedsift: --fail-on worse: 1 of 2 comparisons are worse \(first: acc, method=cand vs method=base: worse\)\n$/,
    );
  });

  it(
    'the same table with the goal turned round (--metric ' + 'acc:min): the drop is better, the rise is worse',
    async () => {
      const { code, err, results } = await gate('worse', '--metric', 'acc:min');
      expect(Object.fromEntries(results.comparisons.map((c) => [c.candidate, c.verdict]))).toEqual({
        'method=cand': 'better',
        'method=better': 'worse',
      });
      expect(code).toBe(EXIT_GATE);
      expect(err).toMatch(/method=better vs method=base: worse/);
    },
  );

  it('--fail-on worse passes (exit 0, nothing on stderr) when no candidate is worse', async () => {
    writeFileSync(
      file,
      scores()
        .split('\n')
        .filter((l) => !l.startsWith('cand,'))
        .join('\n'),
    );
    const { code, err } = await gate('worse');
    writeFileSync(file, scores());
    expect([code, err]).toEqual([0, '']);
  });

  it('--fail-on not-better fails on the worse candidate, and passes when every candidate is better', async () => {
    expect((await gate('not-better')).code).toBe(EXIT_GATE);
    writeFileSync(
      file,
      scores()
        .split('\n')
        .filter((l) => !l.startsWith('cand,'))
        .join('\n'),
    );
    const { code, err } = await gate('not-better');
    expect([code, err]).toEqual([0, '']);
    writeFileSync(file, scores());
  });
});
