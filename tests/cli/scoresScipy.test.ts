/**
 * results.json against scipy, end to end: fixture cases (tests/reference/scipy-cases.json, made by
 * scipy 1.10.1 through Debian's python3-scipy; see tests/reference/README.md) go through a score
 * table and the command line, and the comparison numbers in results.json must equal scipy's.
 * Each case is one metric: candidate rows carry x, baseline rows carry y (scipy's first and second
 * sample), so candidate - baseline is scipy's x - y.
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { Comparison, Results } from '../../src/analysis/results.js';
import { run } from '../../src/cli/program.js';
import { memoryIo } from './memoryIo.js';

interface Pair {
  readonly x: readonly number[];
  readonly y: readonly number[];
}
interface WelchCase extends Pair {
  statistic: number;
  df: number;
  p: Record<string, number>;
  interval95: { low: number; high: number };
}
interface PermutationCase extends Pair {
  splits: number;
  exactCounts: { absAtLeast: number };
}
interface MannWhitneyCase extends Pair {
  ties: boolean;
  u: number;
  exact?: Record<string, number>;
}
const fixture = JSON.parse(readFileSync(new URL('../reference/scipy-cases.json', import.meta.url), 'utf8')) as {
  scipyVersion: string;
  welch: WelchCase[];
  permutation: PermutationCase[];
  mannWhitney: MannWhitneyCase[];
};

const welch = fixture.welch.slice(0, 20);
const permutation = fixture.permutation.filter((c) => c.splits <= 200_000).slice(0, 15);
const mannWhitney = fixture.mannWhitney
  .filter((c) => !c.ties && c.exact !== undefined && c.x.length >= 3 && c.y.length >= 3)
  .slice(0, 15);
const metrics: [string, Pair][] = [
  ...welch.map((c, i): [string, Pair] => [`w${i}`, c]),
  ...permutation.map((c, i): [string, Pair] => [`p${i}`, c]),
  ...mannWhitney.map((c, i): [string, Pair] => [`u${i}`, c]),
];

/** A score table: columns arm, seed, one column per case; an arm shorter than the longest leaves cells empty. */
function scoreTable(): string {
  const rows = Math.max(...metrics.flatMap(([, c]) => [c.x.length, c.y.length]));
  const lines = [['arm', 'seed', ...metrics.map(([m]) => m)].join(',')];
  for (const [arm, side] of [
    ['base', 'y'],
    ['cand', 'x'],
  ] as const) {
    for (let r = 0; r < rows; r++)
      lines.push(
        [arm, String(r), ...metrics.map(([, c]) => (c[side][r] === undefined ? '' : String(c[side][r])))].join(','),
      );
  }
  return `${lines.join('\n')}\n`;
}

const dir = mkdtempSync(join(tmpdir(), 'seedsift-scores-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function results(): Promise<Results> {
  writeFileSync(join(dir, 'scores.csv'), scoreTable());
  const io = memoryIo();
  const code = await run(
    [
      'report',
      '--scores',
      join(dir, 'scores.csv'),
      '--baseline',
      'arm=base',
      '--correction',
      'none',
      '--json',
      join(dir, 'r.json'),
    ],
    io,
  );
  expect(io.err()).toBe('');
  expect(code).toBe(0);
  return JSON.parse(readFileSync(join(dir, 'r.json'), 'utf8')) as Results;
}

const rel = (a: number | null, b: number): number => Math.abs((a as number) - b) / Math.max(Math.abs(b), 1e-300);

const SCIPY = `scipy ${fixture.scipyVersion} (Debian python3-scipy)`;
describe(`results.json equals ${SCIPY} through a score table and the CLI`, async () => {
  const r = await results();
  const byMetric = new Map<string, Comparison>(r.comparisons.map((c) => [c.metric, c]));

  it.each(welch.map((c, i) => ({ i, c })))(
    'Welch case $i: statistic, df, p, difference and its interval',
    ({ i, c }) => {
      const cmp = byMetric.get(`w${i}`) as Comparison;
      expect(cmp.candidate).toBe('arm=cand');
      expect(rel(cmp.tests.welch.statistic, c.statistic)).toBeLessThan(1e-10);
      expect(rel(cmp.tests.welch.df, c.df)).toBeLessThan(1e-10);
      expect(rel(cmp.tests.welch.p, c.p['two-sided'] as number)).toBeLessThan(1e-9);
      expect(cmp.p).toBe(cmp.tests.welch.p);
      // METHODS.md: the Welch t-interval at every n (BCa only beside it, from 10 runs per arm).
      if (Math.min(c.x.length, c.y.length) >= 10) expect(cmp.difference.bca).not.toBeNull();
      // scipy's interval uses its t.ppf, accurate to a few 1e-9 (tests/reference/README.md): 1e-8 of the half-width.
      const half = (c.interval95.high - c.interval95.low) / 2;
      expect(Math.abs((cmp.difference.low as number) - c.interval95.low)).toBeLessThan(1e-8 * half);
      expect(Math.abs((cmp.difference.high as number) - c.interval95.high)).toBeLessThan(1e-8 * half);
      expect(cmp.difference.method).toBe('welch-t');
    },
  );

  it.each(permutation.map((c, i) => ({ i, c })))(
    'permutation case $i: exact p = #(|T*| >= |T|) / splits',
    ({ i, c }) => {
      const cmp = byMetric.get(`p${i}`) as Comparison;
      expect(cmp.tests.permutation.exact).toBe(true);
      expect(cmp.tests.permutation.p).toBeCloseTo(c.exactCounts.absAtLeast / c.splits, 14);
    },
  );

  it.each(mannWhitney.map((c, i) => ({ i, c })))('Mann-Whitney case $i: U and exact p', ({ i, c }) => {
    const cmp = byMetric.get(`u${i}`) as Comparison;
    expect(cmp.tests.mannWhitney.exact).toBe(true);
    expect(cmp.tests.mannWhitney.u).toBe(c.u);
    expect(rel(cmp.tests.mannWhitney.p, c.exact?.['two-sided'] as number)).toBeLessThan(1e-12);
  });
});
