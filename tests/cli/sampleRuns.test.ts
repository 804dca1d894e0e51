/**
 * The demo study finds what its generator planted (sample-runs/generate.ts): more ticks raise
 * val_acc (+0.03 at 16 ticks, +0.05 at 32 ticks over 8), memory length has no effect. The planted
 * effects are the outside truth here: they are written into the generator, not read off seedsift.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { Results } from '../../src/analysis/results.js';
import { run } from '../../src/cli/program.js';
import { memoryIo } from './memoryIo.js';

const dir = mkdtempSync(join(tmpdir(), 'seedsift-sample-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function report(...args: string[]): Promise<Results> {
  const file = join(dir, 'results.json');
  const io = memoryIo();
  const code = await run(['report', 'sample-runs', '--json', file, ...args], io);
  expect(io.err(), 'stderr').toBe('');
  expect(code).toBe(0);
  return JSON.parse(readFileSync(file, 'utf8')) as Results;
}

const verdictsOf = (r: Results, metric: string): Record<string, string> =>
  Object.fromEntries(
    r.comparisons.filter((c) => c.metric === metric).map((c) => [`${c.candidate} v ${c.baseline}`, c.verdict]),
  );

describe('the demo study', () => {
  it('finds that more ticks help val_acc against the 8-tick baseline', async () => {
    const r = await report('--baseline', 'ticks=8,memory=4');
    expect(verdictsOf(r, 'val_acc')).toEqual({
      'ticks=8,memory=12 v ticks=8,memory=4': 'inconclusive',
      'ticks=16,memory=4 v ticks=8,memory=4': 'better',
      'ticks=16,memory=12 v ticks=8,memory=4': 'better',
      'ticks=32,memory=4 v ticks=8,memory=4': 'better',
      'ticks=32,memory=12 v ticks=8,memory=4': 'better',
    });
    const gain = r.comparisons.find((c) => c.metric === 'val_acc' && c.candidate === 'ticks=32,memory=4');
    // Planted: +0.05 at 32 ticks; the interval must cover it.
    expect(gain?.difference.low).toBeLessThan(0.05);
    expect(gain?.difference.high).toBeGreaterThan(0.05);
  });

  it('calls the memory-length comparisons (planted null) inconclusive, each against its counterpart', async () => {
    const r = await report('--baseline', 'memory=4');
    const v = verdictsOf(r, 'val_acc');
    expect(Object.keys(v)).toEqual([
      'ticks=8,memory=12 v ticks=8,memory=4',
      'ticks=16,memory=12 v ticks=16,memory=4',
      'ticks=32,memory=12 v ticks=32,memory=4',
    ]);
    expect(Object.values(v)).toEqual(['inconclusive', 'inconclusive', 'inconclusive']);
  });

  it('reports the planted messy cases: the diverged, short and resumed runs', async () => {
    const r = await report('--baseline', 'memory=4');
    const status = Object.fromEntries(r.runs.filter((x) => x.status !== 'ok').map((x) => [x.id, x.status]));
    expect(status).toEqual({ 'ticks=8,memory=12,seed=3': 'short', 'ticks=32,memory=12,seed=4': 'diverged' });
    expect(r.runs.find((x) => x.id === 'ticks=32,memory=12,seed=4')?.divergedAt).toBe(1400);
    const dup = r.problems.filter((p) => p.code === 'steps-duplicated');
    expect(dup).toHaveLength(1);
    expect(dup[0]?.file).toContain('ticks=16/memory=4/seed=2');
    // The short run (it stops at 1300) is a failure of its arm and moves no comparison: every
    // comparison is made at 2000, where all the other runs end; it is counted beside the verdict.
    expect(r.metrics.find((m) => m.name === 'val_acc' && m.kind === 'scalar')?.horizon).toBe(2000);
    const withShort = r.comparisons.find((c) => c.metric === 'val_acc' && c.candidate === 'ticks=8,memory=12');
    expect(withShort?.step).toBe(2000);
    expect(withShort?.failures.candidate).toEqual({ runs: 5, diverged: 0, short: 1 });
  });
});
