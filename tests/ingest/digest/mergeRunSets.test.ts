/**
 * Merging RunSet parts (src/ingest/digest/mergeRunSets.ts). The reference is raw ingest of the same logs
 * in one call (runs.ts: rows of one config and seed stacked in file order, the later row winning
 * on a repeated step; a divergence is a metric that went non-finite and stayed so): parts read
 * separately and merged must give the same series, statuses and counts.
 */
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { ingest } from '../../../src/ingest/ingest.js';
import { mergeRunSets, type RunSetPart } from '../../../src/ingest/digest/mergeRunSets.js';
import type { RunSet } from '../../../src/ingest/types.js';
import { makeTree, none, removeTree, runById, withCode } from '../../fixtures/ingest/tree.js';

const made: string[] = [];
afterAll(async () => {
  await Promise.all(made.splice(0).map(removeTree));
});

/** Write the folders, ingest each alone and all together. */
async function parts(folders: Record<string, Record<string, string>>): Promise<{ parts: RunSetPart[]; raw: RunSet }> {
  const tree: Record<string, string> = {};
  for (const [folder, files] of Object.entries(folders))
    for (const [rel, text] of Object.entries(files)) tree[`${folder}/${rel}`] = text;
  const root = await makeTree(tree);
  made.push(root);
  const paths = Object.keys(folders).map((f) => join(root, f));
  const each: RunSetPart[] = [];
  for (const p of paths) each.push({ digest: `${p}.parquet`, runSet: await ingest([p], none) });
  return { parts: each, raw: await ingest(paths, none) };
}

const series = (set: RunSet, id: string, metric: string): unknown => {
  const s = runById(set, id).metrics[metric];
  return s === undefined
    ? null
    : { steps: Array.from(s.steps), values: Array.from(s.values), divergedAt: s.divergedAt, missing: s.missing };
};

describe('one run in several parts', () => {
  it('the later part diverges after the earlier one ends: diverged, as raw', async () => {
    const { parts: p, raw } = await parts({
      A: { 'seed=1/log.csv': 'step,loss\n1,0.9\n2,0.8\n3,0.7\n4,0.6\n' },
      B: { 'seed=1/log.csv': 'step,loss\n3,0.5\n4,0.4\n5,nan\n6,nan\n' },
    });
    const merged = await mergeRunSets(p, none);
    expect(series(merged, 'seed=1', 'loss')).toEqual({
      steps: [1, 2, 3, 4],
      values: [0.9, 0.8, 0.5, 0.4],
      divergedAt: 5,
      missing: 2,
    });
    expect(series(merged, 'seed=1', 'loss')).toEqual(series(raw, 'seed=1', 'loss'));
    const [m, r] = [runById(merged, 'seed=1'), runById(raw, 'seed=1')];
    expect([m.status, m.divergedAt, m.lastStep]).toEqual([r.status, r.divergedAt, r.lastStep]);
    expect(m.status).toBe('diverged');
  });

  it('the earlier part diverges but the later one goes on with finite values: not diverged, as raw', async () => {
    const { parts: p, raw } = await parts({
      A: { 'seed=1/log.csv': 'step,loss\n1,0.9\n2,0.8\n3,nan\n4,nan\n' },
      B: { 'seed=1/log.csv': 'step,loss\n5,0.5\n6,0.4\n' },
    });
    const merged = await mergeRunSets(p, none);
    expect(series(merged, 'seed=1', 'loss')).toEqual(series(raw, 'seed=1', 'loss'));
    expect(runById(merged, 'seed=1')).toMatchObject({ status: 'ok', divergedAt: null, lastStep: 6 });
    expect(runById(raw, 'seed=1')).toMatchObject({ status: 'ok', divergedAt: null, lastStep: 6 });
  });

  it(
    'tick metrics with different tick counts: the union ' + 'of steps, missing ticks NaN, the later part winning',
    async () => {
      const { parts: p, raw } = await parts({
        A: { 'seed=1/log.csv': 'step,acc@0,acc@1\n1,0.1,0.2\n2,0.3,0.4\n' },
        B: { 'seed=1/log.csv': 'step,acc@0,acc@1,acc@2\n2,0.5,0.6,0.7\n3,0.8,0.9,1\n' },
      });
      const merged = await mergeRunSets(p, none);
      const ticks = (set: RunSet): unknown => {
        const t = runById(set, 'seed=1').tickMetrics.acc;
        return { steps: Array.from(t?.steps ?? []), values: (t?.values ?? []).map((v) => Array.from(v)) };
      };
      expect(ticks(merged)).toEqual({
        steps: [1, 2, 3],
        values: [
          [0.1, 0.5, 0.8],
          [0.2, 0.6, 0.9],
          [NaN, 0.7, 1],
        ],
      });
      expect(ticks(merged)).toEqual(ticks(raw));
      expect(merged.metrics).toEqual(raw.metrics);
    },
  );

  it('three parts: one run-duplicate naming all three in order', async () => {
    const log = 'step,loss\n1,0.5\n';
    const { parts: p } = await parts({
      A: { 'seed=1/log.csv': log },
      B: { 'seed=1/log.csv': log },
      C: { 'seed=1/log.csv': log },
    });
    const merged = await mergeRunSets(p, none);
    const dup = withCode(merged, 'run-duplicate');
    expect(dup).toHaveLength(1);
    expect(dup[0]).toMatchObject({ run: 'seed=1', file: p[1]?.digest });
    expect(dup[0]?.message).toMatch(
      new RegExp(`^3 sources claim this config and seed: ${p.map((x) => x.digest).join(', ')};`),
    );
  });
});

describe('renaming and metric infos', () => {
  it('a dump with no run of its own follows the merged key order; tick counts take the largest', async () => {
    const dump = 'sample,tick,correct,certainty\n0,0,1,0.5\n0,1,1,0.75\n';
    const { parts: p, raw } = await parts({
      A: { 'x=1/y=2/seed=1/log.csv': 'step,acc@0\n1,0.5\n' },
      B: { 'y=3/x=4/seed=1/dump.csv': dump, 'y=3/x=4/seed=2/log.csv': 'step,acc@0,acc@1\n1,0.5,0.6\n' },
    });
    expect(p[1]?.runSet.tickDumps[0]).toMatchObject({ run: 'y=3,x=4,seed=1', config: 'y=3,x=4' });
    const merged = await mergeRunSets(p, none);
    expect(merged.tickDumps.map((d) => [d.run, d.config])).toEqual(raw.tickDumps.map((d) => [d.run, d.config]));
    expect(merged.tickDumps[0]).toMatchObject({ run: 'x=4,y=3,seed=1', config: 'x=4,y=3' });
    expect(merged.files.map((f) => f.runs)).toEqual(raw.files.map((f) => f.runs));
    expect(merged.metrics).toEqual([
      { name: 'acc', goal: 'max', goalSource: 'inferred', bookkeeping: false, kind: 'tick', ticks: 2 },
    ]);
    expect(merged.metrics).toEqual(raw.metrics);
  });
});
