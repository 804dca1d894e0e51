/**
 * `seedsift seeds` on pilot runs (the demo study): the between-seed sd is pooled within configs,
 * never across them (METHODS.md "How many seeds"), it plans only for a named difference, and at
 * alpha / M with --comparisons M.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Results } from '../../src/analysis/results.js';
import type { SeedsAnswer } from '../../src/analysis/seedsNeeded.js';
import { run } from '../../src/cli/program.js';
import { memoryIo } from './memoryIo.js';

async function seeds(...args: string[]): Promise<{ code: number; answer: SeedsAnswer | null; err: string }> {
  const io = memoryIo();
  const code = await run(['seeds', ...args], io);
  return { code, answer: code === 0 ? (JSON.parse(io.out()) as SeedsAnswer) : null, err: io.err() };
}

describe('seedsift seeds on pilot runs', () => {
  it('--baseline memory=4 matches nine configs (3 tasks x 3 ticks): pooled within them (36 df)', async () => {
    const r = await seeds('sample-runs', '--for', 'val_acc', '--baseline', 'memory=4', '--effect', '0.01', '--json');
    expect(r.code).toBe(0);
    // 9 configs x 5 runs: (5 - 1) x 9 = 36 degrees of freedom within configs (first principles)
    expect(r.answer?.sdFrom).toContain('(45 pilot runs, 36 df)');
    // The same values from `report --json`: pooled within configs sqrt(sum (n_i - 1) s_i^2 / sum (n_i - 1)),
    // and the sd of all 45 taken as one group (what pooling across configs gave), first principles.
    const dir = mkdtempSync(join(tmpdir(), 'seedsift-seeds-'));
    const file = join(dir, 'r.json');
    expect(await run(['report', 'sample-runs', '--json', file], memoryIo())).toBe(0);
    const results = JSON.parse(readFileSync(file, 'utf8')) as Results;
    rmSync(dir, { recursive: true, force: true });
    const byConfig = new Map<string, number[]>();
    for (const v of results.values)
      if (v.metric === 'val_acc' && v.value !== null && v.config.endsWith('memory=4'))
        byConfig.set(v.config, [...(byConfig.get(v.config) ?? []), v.value]);
    const ss = (x: number[]): number => {
      const m = x.reduce((a, b) => a + b, 0) / x.length;
      return x.reduce((a, b) => a + (b - m) ** 2, 0);
    };
    const groups = [...byConfig.values()];
    const within = Math.sqrt(groups.reduce((a, g) => a + ss(g), 0) / groups.reduce((a, g) => a + g.length - 1, 0));
    const all = groups.flat();
    const across = Math.sqrt(ss(all) / (all.length - 1));
    expect(r.answer?.sd).toBeCloseTo(within, 12);
    expect(across).toBeGreaterThan(2 * within); // the configs' means differ (more ticks help): not seed noise
    expect(r.answer?.effectFrom).toBe('given');
  });

  it('never plans for the observed difference, and plans at alpha / M for M comparisons', async () => {
    const r = await seeds(
      'sample-runs',
      '--for',
      'val_acc',
      '--baseline',
      'ticks=8,memory=4',
      '--candidate',
      'ticks=16,memory=4',
    );
    expect(r.code).toBe(2);
    expect(r.err).toContain('post-hoc');
    const m = await seeds('--sd', '1', '--effect', '0.5', '--comparisons', '5', '--json');
    expect(m.answer?.testAlpha).toBeCloseTo(0.01, 15);
    // statsmodels 0.13.5 TTestIndPower().solve_power(0.5, alpha=0.01, power=0.8) = 95.10
    expect(m.answer?.seedsPerArm).toBe(96);
  });
});
