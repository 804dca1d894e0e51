/**
 * Choosing what is compared (issue 14), end to end through the command line on fixtures of our own
 * (tests/fixtures/select/build.ts; every expectation below follows from how those numbers are
 * built) and on sample-runs: bookkeeping columns set aside, goals unknown, --metrics, candidates,
 * config filters, dropped keys, keys of the arm; and each typo stops with exit 2 and a first line
 * of stderr that says what exists and "did you mean".
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it, vi } from 'vitest';
import type { Results } from '../../src/analysis/results.js';
import { EXIT_USAGE } from '../../src/cli/exitCodes.js';
import { run } from '../../src/cli/program.js';
import { writeBookkeeping, writeParams } from '../fixtures/select/build.js';
import { memoryIo } from './memoryIo.js';

vi.setConfig({ testTimeout: 120_000 });
const dir = mkdtempSync(join(tmpdir(), 'seedsift-select-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const bookkeeping = join(dir, 'bookkeeping');
const params = join(dir, 'params');
const repeated = join(dir, 'repeated');
writeBookkeeping(bookkeeping);
writeParams(params);
writeParams(repeated, true);

async function report(args: string[]): Promise<Results> {
  const file = join(dir, `r${Math.random().toString(36).slice(2)}.json`);
  const io = memoryIo();
  const code = await run(['report', ...args, '--json', file, '--quiet'], io);
  expect(io.err()).toBe('');
  expect(code).toBe(0);
  return JSON.parse(readFileSync(file, 'utf8')) as Results;
}

const codes = (r: Results, code: string): string[] => r.problems.filter((p) => p.code === code).map((p) => p.message);

describe('which columns are metrics', () => {
  it(
    'sets aside bookkeeping names and counters, lists ' + 'them with how to include them, and compares the rest',
    async () => {
      const r = await report([bookkeeping]);
      // val_acc (name rule) and bits (no rule, goes up and down) are metrics; the rest are bookkeeping.
      expect(r.metrics.map((m) => m.name)).toEqual(['val_acc', 'bits']);
      expect(r.setAside).toEqual([
        { name: 'wall_time', reason: 'name' },
        { name: 'epoch', reason: 'name' },
        { name: 'preemptions', reason: 'name' },
        { name: 'score', reason: 'counter' },
        { name: 'total_samples', reason: 'counter' },
      ]);
      const notes = codes(r, 'column-set-aside');
      expect(notes).toHaveLength(5);
      expect(notes.every((n) => n.includes('--as-metric'))).toBe(true);
      expect(new Set(r.comparisons.map((c) => c.metric))).toEqual(new Set(['val_acc', 'bits']));
      // Goal notes of columns that are not compared are not repeated.
      expect(codes(r, 'goal-unknown').map((m) => m.split(':')[0])).toEqual(['bits']);
    },
  );

  it('a metric no rule knows gets no better or worse, only the direction; --metric gives it a goal', async () => {
    const r = await report([bookkeeping, '--baseline', 'algo=a']);
    const bits = r.metrics.find((m) => m.name === 'bits');
    expect(bits).toMatchObject({ goal: null, goalSource: 'unknown' });
    const c = r.comparisons.find((x) => x.metric === 'bits');
    // algo=b logs bits exactly 1 higher at the last step, spread 0.01: far beyond noise.
    expect(c?.difference.estimate).toBeCloseTo(1, 9);
    expect(c?.verdict).toBe('inconclusive');
    expect(c?.cautions.some((t) => t.includes('the candidate is higher'))).toBe(true);
    const told = await report([bookkeeping, '--baseline', 'algo=a', '--metric', 'bits:min']);
    expect(told.comparisons.find((x) => x.metric === 'bits')?.verdict).toBe('worse');
  });

  it('--as-metric and --metrics bring a set-aside column back; scan lists the set-aside columns too', async () => {
    const r = await report([bookkeeping, '--as-metric', 'score']);
    expect(r.metrics.map((m) => m.name)).toEqual(['val_acc', 'score', 'bits']);
    expect(r.setAside.map((s) => s.name)).not.toContain('score');
    const only = await report([bookkeeping, '--metrics', 'epoch']);
    expect(only.metrics.map((m) => m.name)).toEqual(['epoch']);
    const io = memoryIo();
    expect(await run(['scan', bookkeeping, '--json', '-'], io)).toBe(0);
    const scan = JSON.parse(io.out()) as { setAside: { name: string }[] };
    expect(scan.setAside.map((s) => s.name)).toEqual(['wall_time', 'epoch', 'preemptions', 'score', 'total_samples']);
  });
});

describe('selection options', () => {
  it('keys that change only with the baseline key are attributes of the arm, and the report says so', async () => {
    // cuda splits each algorithm into two configs; lr, buffer and clip change only with algo.
    const r = await report([params, '--baseline', 'algo=dqn']);
    expect(r.comparisons.map((c) => [c.baseline, c.candidate])).toEqual([
      ['algo=dqn,lr=0.001,buffer=10000,cuda=false', 'algo=ppo,lr=0.0003,cuda=false,clip=0.2'],
      ['algo=dqn,lr=0.001,buffer=10000,cuda=true', 'algo=ppo,lr=0.0003,cuda=true,clip=0.2'],
    ]);
    expect(codes(r, 'arm-keys')).toEqual([
      'counterparts for --baseline algo=dqn were matched ignoring lr, buffer, clip: their values change ' +
        'only with algo (attributes of the arm)',
    ]);
  });

  it('--drop-keys joins runs that differ only in a machine flag; --keep-keys keeps named keys only', async () => {
    const r = await report([params, '--baseline', 'algo=dqn', '--drop-keys', 'cuda']);
    expect(r.configs.map((c) => c.id)).toEqual(['algo=dqn,lr=0.001,buffer=10000', 'algo=ppo,lr=0.0003,clip=0.2']);
    expect(r.comparisons).toHaveLength(1);
    // Last step 3000: dqn 100 + 1.5 + 0.1 x seed, ppo 110 + 1.5 + 0.1 x seed: difference 10.
    expect(r.comparisons[0]?.difference.estimate).toBeCloseTo(10, 9);
    const kept = await report([params, '--baseline', 'algo=dqn', '--keep-keys', 'algo']);
    expect(kept.configs.map((c) => c.id)).toEqual(['algo=dqn', 'algo=ppo']);
    expect(kept.settings.keepKeys).toEqual(['algo']);
  });

  it('a seed that appears twice in a config once a key is dropped is kept twice and reported', async () => {
    const r = await report([repeated, '--drop-keys', 'cuda']);
    const dqn = r.runs.filter((x) => x.config === 'algo=dqn,lr=0.001,buffer=10000');
    expect(dqn.map((x) => x.id)).toContain('algo=dqn,lr=0.001,buffer=10000,seed=1#2');
    expect(codes(r, 'seed-repeated')).toHaveLength(1);
  });

  it('--candidate, --include-configs and --exclude-configs choose the configs compared', async () => {
    // The demo's first task alone (the other two repeat the same configs).
    const base = ['sample-runs', '--baseline', 'ticks=8,memory=4', '--metrics', 'val_acc', '--task-key', 'task'];
    base.push('--include-configs', 'task=count');
    const one = await report([...base, '--candidate', 'ticks=16,memory=4']);
    expect(one.comparisons.map((c) => c.candidate)).toEqual(['ticks=16,memory=4']);
    const two = await report([...base, '--candidate', 'ticks=16,memory=4', '--candidate', 'ticks=32,memory=12']);
    expect(two.comparisons.map((c) => c.candidate)).toEqual(['ticks=16,memory=4', 'ticks=32,memory=12']);
    const without = await report([...base, '--exclude-configs', 'ticks=32']);
    expect(without.configs.map((c) => c.id)).toEqual([
      'task=count,ticks=8,memory=4',
      'task=count,ticks=8,memory=12',
      'task=count,ticks=16,memory=4',
      'task=count,ticks=16,memory=12',
    ]);
    // --include-configs takes any of its selectors: one selector naming both keys keeps the first task's memory=4.
    const only = await report([...base.slice(0, -2), '--include-configs', 'task=count,memory=4']);
    expect(only.configs.map((c) => c.id)).toEqual([
      'task=count,ticks=8,memory=4',
      'task=count,ticks=16,memory=4',
      'task=count,ticks=32,memory=4',
    ]);
  });

  it('on sample-runs, --metrics val_acc gives only val_acc in JSON, Markdown and HTML', async () => {
    const html = join(dir, 'v.html');
    const md = join(dir, 'v.md');
    const json = join(dir, 'v.json');
    const io = memoryIo();
    const args = ['report', 'sample-runs', '--metrics', 'val_acc', '--baseline', 'ticks=8,memory=4'];
    expect(await run([...args, '-o', html, '--markdown', md, '--json', json, '--quiet'], io)).toBe(0);
    const r = JSON.parse(readFileSync(json, 'utf8')) as Results;
    const lists: readonly (readonly { readonly metric?: string; readonly name?: string }[])[] = [
      r.metrics,
      r.ticks,
      r.curves,
      r.values,
      r.configValues,
      r.comparisons,
    ];
    for (const list of lists) expect(new Set(list.map((x) => x.metric ?? x.name))).toEqual(new Set(['val_acc']));
    expect(r.settings.metrics).toEqual(['val_acc']);
    const markdown = readFileSync(md, 'utf8');
    // Headings: the overview, the sweeps and the one metric section, each of val_acc only.
    const headings = [...markdown.matchAll(/^### (.+)$/gm)].map((m) => m[1] as string);
    expect(headings.filter((h) => /^val\\_acc \(/.test(h))).toHaveLength(1);
    for (const h of headings) expect(h).toMatch(/(^|: )val\\_acc( |$)/);
    expect(markdown).not.toMatch(/train\\?_loss|val\\?_loss|certainty/);
    const page = readFileSync(html, 'utf8');
    expect([...page.matchAll(/class="metric-heading"><bdi class="name">([^<]+)</g)].map((m) => m[1])).toEqual([
      'val_acc',
    ]);
  });

  it('--primary leads every output', async () => {
    const r = await report(['sample-runs', '--baseline', 'ticks=8,memory=4', '--primary', 'val_loss']);
    expect(r.metrics[0]?.name).toBe('val_loss');
    expect(r.comparisons[0]?.metric).toBe('val_loss');
  });
});

describe('a name that exists nowhere stops: exit 2, first line of stderr says what exists and did you mean', () => {
  const cases: [string, string[], string][] = [
    [
      '--metrics',
      ['sample-runs', '--metrics', 'val_ac'],
      "seedsift: --metrics: no metric 'val_ac' (metrics: train_loss, val_loss, val_acc, certainty); did you " +
        'mean val_acc?',
    ],
    [
      '--primary',
      ['sample-runs', '--primary', 'val_los'],
      "seedsift: --primary: no metric 'val_los' (metrics: train_loss, val_loss, val_acc, certainty); did " +
        'you mean val_loss?',
    ],
    [
      '--as-metric',
      ['sample-runs', '--as-metric', 'epoc'],
      "seedsift: --as-metric: no metric 'epoc' (metrics: train_loss, val_loss, val_acc, certainty); did you " +
        'mean one of train_loss, val_loss, val_acc, certainty?',
    ],
    [
      '--drop-keys',
      ['sample-runs', '--drop-keys', 'memroy'],
      "seedsift: --drop-keys: no config key 'memroy' (config keys: task, ticks, memory); did you mean memory?",
    ],
    [
      '--keep-keys',
      ['sample-runs', '--keep-keys', 'tick'],
      "seedsift: --keep-keys: no config key 'tick' (config keys: task, ticks, memory); did you mean ticks?",
    ],
    [
      '--include-configs',
      ['sample-runs', '--include-configs', 'memory=5'],
      'seedsift: --include-configs: memory=5 matches no config; memory takes 4, 12; did you mean memory=4?',
    ],
    [
      '--exclude-configs',
      ['sample-runs', '--exclude-configs', 'tiks=8'],
      "seedsift: --exclude-configs: no config key 'tiks'; keys are task, ticks, memory; did you mean ticks?",
    ],
    [
      '--candidate',
      ['sample-runs', '--baseline', 'memory=4', '--candidate', 'memory=13'],
      'seedsift: --candidate: memory=13 matches no config; memory takes 4, 12; did you mean memory=12?',
    ],
    [
      '--baseline value',
      ['sample-runs', '--baseline', 'ticks=9'],
      'seedsift: --baseline: ticks=9 matches no config; ticks takes 8, 16, 32; did you mean ticks=8?',
    ],
    [
      '--task-key',
      ['sample-runs', '--task-key', 'tick'],
      "seedsift: --task-key: expected one of the config keys (task, ticks, memory), got 'tick'; did you mean ticks?",
    ],
  ];
  for (const [name, args, first] of cases)
    it(name, async () => {
      const io = memoryIo();
      expect(await run(['report', ...args, '--json', join(dir, 'never.json')], io)).toBe(EXIT_USAGE);
      expect(io.err().split('\n')[0]).toBe(first);
    });

  it('--candidate without --baseline', async () => {
    const io = memoryIo();
    expect(await run(['report', 'sample-runs', '--candidate', 'ticks=8', '--json', join(dir, 'n.json')], io)).toBe(
      EXIT_USAGE,
    );
    expect(io.err().split('\n')[0]).toBe(
      'seedsift: --candidate: expected --baseline too (candidates are compared with the baseline)',
    );
  });
});
