/**
 * Sanity checks on fixtures of our own (tests/fixtures/select/build.ts, `writeSanity`): which
 * runs are copies, which failed, follows from how the files were written.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { sanityChecks } from '../../src/analysis/sanityChecks.js';
import { resolveIngestOptions } from '../../src/cli/ingestOptions.js';
import { ingest } from '../../src/ingest/ingest.js';
import { writeSanity } from '../fixtures/select/build.js';

vi.setConfig({ testTimeout: 120_000 });
const dir = mkdtempSync(join(tmpdir(), 'seedsift-sanity-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
writeSanity(dir);

describe('sanityChecks', () => {
  it('finds copied runs within and across configs, single-step runs and a config whose every run failed', async () => {
    const runSet = await ingest([join(dir, 'runs')], resolveIngestOptions({}));
    const problems = sanityChecks(runSet);
    const by = (code: string): string[] => problems.filter((p) => p.code === code).map((p) => p.run ?? p.message);
    // algo=a seed 2 and algo=b seed 0 were written with algo=a seed 0's numbers.
    expect(by('series-identical')).toEqual(['algo=a,seed=2', 'algo=b,seed=0']);
    expect(problems.find((p) => p.run === 'algo=a,seed=2')?.message).toContain('within config algo=a');
    expect(problems.find((p) => p.run === 'algo=b,seed=0')?.message).toContain('across configs');
    // algo=c's three runs logged one row each; single-step runs are not called copies (too short to tell).
    expect(by('run-single-step')).toEqual(['algo=c,seed=0', 'algo=c,seed=1', 'algo=c,seed=2']);
    expect(by('config-all-failed')).toHaveLength(1);
    expect(by('config-all-failed')[0]).toMatch(/^every run of algo=c failed/);
  });

  it('a seed that appears twice in one config from different files is reported, not merged silently', async () => {
    const runSet = await ingest([join(dir, 'twice')], resolveIngestOptions({ seedColumn: 'seed' }));
    expect(runSet.problems.filter((p) => p.code === 'run-duplicate').map((p) => p.run)).toEqual(['algo=a,seed=0']);
  });

  it('two method folders given as two PATHs stay two configs (path key), with a note', async () => {
    const ours = join(dir, 'methods', 'ours');
    const base = join(dir, 'methods', 'base');
    const runSet = await ingest([ours, base], resolveIngestOptions({}));
    expect(runSet.keys).toEqual(['path']);
    expect([...new Set(runSet.runs.map((r) => r.config))]).toEqual([`path=${ours}`, `path=${base}`]);
    expect(runSet.runs).toHaveLength(4);
    expect(runSet.problems.filter((p) => p.code === 'run-duplicate')).toEqual([]);
    expect(runSet.problems.filter((p) => p.code === 'path-key')).toHaveLength(1);
  });
});
