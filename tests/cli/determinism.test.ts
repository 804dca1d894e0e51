/**
 * Determinism (README "Outputs", DESIGN "Outputs"): the same inputs and --seed give byte-identical
 * report.html, results.json and summary.md, and the date shown comes from SOURCE_DATE_EPOCH
 * (the reproducible-builds convention: seconds since 1970-01-01 UTC; common practice).
 *
 * The demo study (sample-runs/, 5 seeds per arm, three tasks) is reported as `npm start` does,
 * with --task-key: its comparisons use no resampling that the seed changes (only the across-task
 * stratified bootstrap does), so a second check uses a score table with 25 seeds per arm, where the
 * difference interval is a BCa bootstrap and the permutation test is Monte Carlo: there the seed
 * must matter, and the same seed must still give the same bytes.
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { Results } from '../../src/analysis/results.js';
import { run } from '../../src/cli/program.js';
import { createRandom } from '../../src/stats/random.js';
import { memoryIo } from './memoryIo.js';

const dir = mkdtempSync(join(tmpdir(), 'seedsift-determinism-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** 2025-12-01T00:00:00Z as SOURCE_DATE_EPOCH (1764547200 s = 20423 days x 86400 s). */
const EPOCH = '1764547200';

async function report(tag: string, argv: readonly string[]): Promise<{ html: Buffer; json: Buffer; markdown: Buffer }> {
  const files = { html: join(dir, `${tag}.html`), json: join(dir, `${tag}.json`), markdown: join(dir, `${tag}.md`) };
  const io = memoryIo({ SOURCE_DATE_EPOCH: EPOCH });
  const code = await run([...argv, '-o', files.html, '--json', files.json, '--markdown', files.markdown], io);
  expect(io.err()).toBe('');
  expect(code).toBe(0);
  return { html: readFileSync(files.html), json: readFileSync(files.json), markdown: readFileSync(files.markdown) };
}

describe('two runs with the same inputs and seed give byte-identical files', () => {
  it('the demo study (sample-runs) with SOURCE_DATE_EPOCH set', async () => {
    const argv = ['report', 'sample-runs', '--baseline', 'ticks=8,memory=4', '--task-key', 'task', '--seed', '7'];
    const a = await report('demo-a', argv);
    const b = await report('demo-b', argv);
    expect(a.html.equals(b.html), 'report.html').toBe(true);
    expect(a.json.equals(b.json), 'results.json').toBe(true);
    expect(a.markdown.equals(b.markdown), 'summary.md').toBe(true);
    const results = JSON.parse(a.json.toString('utf8')) as Results;
    expect(results.generated).toBe('2025-12-01T00:00:00.000Z');
    expect(a.html.toString('utf8')).toContain('2025-12-01');
    expect(results.comparisons.length).toBeGreaterThan(0);
    expect(results.tasks.length).toBeGreaterThan(0);
  }, 120_000);

  it('a study that resamples: the seed changes the intervals, the same seed gives the same bytes', async () => {
    // Invented scores, 25 seeds per arm, drawn once from a seeded generator (the values do not matter).
    const random = createRandom(42);
    let table = 'method,seed,acc\n';
    for (const [method, centre] of [
      ['base', 0.8],
      ['cand', 0.805],
    ] as const) {
      for (let seed = 1; seed <= 25; seed++)
        table += `${method},${seed},${(centre + (random.next() - 0.5) * 0.04).toFixed(5)}\n`;
    }
    const scores = join(dir, 'scores.csv');
    writeFileSync(scores, table);
    const argv = (seed: string): string[] => [
      'report',
      '--scores',
      scores,
      '--baseline',
      'method=base',
      '--metric',
      'acc:max',
      '--seed',
      seed,
    ];
    const a = await report('boot-a', argv('3'));
    const b = await report('boot-b', argv('3'));
    const c = await report('boot-c', argv('4'));
    expect(a.html.equals(b.html), 'report.html').toBe(true);
    expect(a.json.equals(b.json), 'results.json').toBe(true);
    expect(a.markdown.equals(b.markdown), 'summary.md').toBe(true);
    const ra = JSON.parse(a.json.toString('utf8')) as Results;
    const rc = JSON.parse(c.json.toString('utf8')) as Results;
    // The headline is Welch's t (no resampling); the BCa interval beside it (25 runs per arm) resamples.
    const interval = (r: Results): [string, number, number] => {
      const d = r.comparisons[0]?.difference;
      return [d?.method ?? '', d?.bca?.low ?? NaN, d?.bca?.high ?? NaN];
    };
    expect(interval(ra)[0]).toBe('welch-t');
    expect(Number.isFinite(interval(ra)[1])).toBe(true);
    expect(interval(ra)).not.toEqual(interval(rc)); // the seed reached the bootstrap
  }, 120_000);
});
