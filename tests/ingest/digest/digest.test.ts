/**
 * Digests: src/ingest/digest/writeDigest.ts, digest/readDigest.ts, and reading them in ingest (merging in
 * mergeRunSets.ts). The reference is ingest reading the raw logs itself (checked against
 * csv-parse and hand-made fixtures in ingest.test.ts and loadFiles.test.ts): a digest must give
 * back exactly the RunSet raw ingest gave, and digests read together must give what one raw ingest
 * of all their logs gives. The Parquet layout is checked with plain DuckDB SQL, outside the
 * digest reader.
 */
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readDigest } from '../../../src/ingest/digest/readDigest.js';
import { DIGEST_KEY } from '../../../src/ingest/digest/digestFormat.js';
import { writeDigest } from '../../../src/ingest/digest/writeDigest.js';
import { closeEngine, openEngine, type Engine } from '../../../src/ingest/load/duckdb.js';
import { ingest } from '../../../src/ingest/ingest.js';
import type { RunSet } from '../../../src/ingest/types.js';
import { problem, SeedsiftError } from '../../../src/problems.js';
import { makeTree, none, opts, removeTree, runById, withCode } from '../../fixtures/ingest/tree.js';

const made: string[] = [];
afterAll(async () => {
  await Promise.all(made.splice(0).map(removeTree));
});
async function tree(files: Record<string, string>): Promise<string> {
  const root = await makeTree(files);
  made.push(root);
  return root;
}

async function withEngine<T>(f: (engine: Engine) => Promise<T>): Promise<T> {
  const engine = await openEngine();
  try {
    return await f(engine);
  } finally {
    closeEngine(engine);
  }
}

async function sql(text: string): Promise<unknown[][]> {
  return withEngine(async (e) => (await e.connection.runAndReadAll(text)).getRows());
}

/**
 * Every difference between two values, as paths: typed arrays element by element with
 * `Object.is` (so NaN equals NaN and -0 differs from 0), object keys in order, arrays by length.
 */
function differences(a: unknown, b: unknown, path = '$'): string[] {
  if (ArrayBuffer.isView(a) || ArrayBuffer.isView(b)) {
    const x = a as Float64Array;
    const y = b as Float64Array;
    if (x?.constructor !== y?.constructor || x.length !== y.length)
      return [`${path}: ${x?.constructor?.name}[${x?.length}] v ${y?.constructor?.name}[${y?.length}]`];
    for (let i = 0; i < x.length; i++) if (!Object.is(x[i], y[i])) return [`${path}[${i}]: ${x[i]} v ${y[i]}`];
    return [];
  }
  if (Array.isArray(a) && Array.isArray(b)) {
    if (a.length !== b.length) return [`${path}: length ${a.length} v ${b.length}`];
    return a.flatMap((v, i) => differences(v, b[i], `${path}[${i}]`));
  }
  if (a !== null && b !== null && typeof a === 'object' && typeof b === 'object') {
    const ka = Object.keys(a);
    const kb = Object.keys(b);
    if (ka.join('\u0000') !== kb.join('\u0000')) return [`${path}: keys ${ka.join(',')} v ${kb.join(',')}`];
    return ka.flatMap((k) =>
      differences((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], `${path}.${k}`),
    );
  }
  return Object.is(a, b) ? [] : [`${path}: ${String(a)} v ${String(b)}`];
}

/** Write a RunSet as a digest under a fresh folder and read it back. */
async function roundTrip(set: RunSet, name = 'd.parquet'): Promise<{ file: string; back: RunSet }> {
  const file = join(await tree({}), name);
  await writeDigest(set, file);
  return { file, back: await withEngine((e) => readDigest(e, file)) };
}

/** Digests of each folder, written beside the folders (in a folder of their own). */
async function digestsOf(folders: readonly string[], options = none): Promise<string[]> {
  const out = await tree({});
  const files: string[] = [];
  for (const [k, folder] of folders.entries()) {
    const file = join(out, `${k}.parquet`);
    await writeDigest(await ingest([folder], options), file);
    files.push(file);
  }
  return files;
}

/** A RunSet without the digests' own file records. */
const withoutDigests = (set: RunSet, digests: readonly string[]): RunSet => ({
  ...set,
  files: set.files.filter((f) => !digests.includes(f.file)),
});

describe('a digest keeps a RunSet exactly', () => {
  it('sample-runs: every run, series, tick series, dump, info, file record and problem comes back equal', async () => {
    const set = await ingest(['sample-runs'], none);
    // The demo has what a digest must carry: tick metrics, dumps with confidence, every status but rejected.
    expect(set.tickDumps.filter((d) => d.confidence !== null).length).toBeGreaterThan(0);
    expect(set.runs.every((r) => Object.keys(r.tickMetrics).length === 2)).toBe(true);
    expect(new Set(set.runs.map((r) => r.status))).toEqual(new Set(['ok', 'short', 'diverged']));
    const { file, back } = await roundTrip(set);
    expect(back.files[0]).toEqual({
      file,
      status: 'read',
      rows: expect.any(Number),
      rejectedRows: 0,
      runs: set.runs.map((r) => r.id),
      kind: 'log',
    });
    expect(differences({ ...back, files: back.files.slice(1) }, set)).toEqual([]);
  });

  it(
    'is one ZSTD Parquet file with the marker, one number per row in the documented layout (read with plain ' +
      'DuckDB)',
    async () => {
      const set = await ingest(['sample-runs/task=count/ticks=8'], none);
      const { file, back } = await roundTrip(set);
      const f = `'${file}'`;
      expect(
        await sql(`SELECT decode(value) FROM parquet_kv_metadata(${f}) WHERE decode(key) = '${DIGEST_KEY}'`),
      ).toEqual([['1']]);
      expect(await sql(`SELECT DISTINCT compression FROM parquet_metadata(${f})`)).toEqual([['ZSTD']]);
      expect(await sql(`SELECT count(*)::INTEGER FROM read_parquet(${f}) WHERE kind > 0`)).toEqual([
        [back.files[0]?.rows],
      ]);
      // kind 1: one row per metric point; run = index in runs, item = index in the run's metrics.
      const rows = await sql(
        `SELECT run, item, count(*)::INTEGER, min(step), max(step), sum(value) FROM read_parquet(${f}) ` +
          'WHERE kind = 1 GROUP BY run, item ORDER BY run, item',
      );
      const expected = set.runs.flatMap((r, i) =>
        Object.values(r.metrics)
          .map((s, j) => ({ s, j }))
          .filter(({ s }) => s.steps.length > 0)
          .map(({ s, j }) => [
            i,
            j,
            s.steps.length,
            s.steps[0],
            s.steps[s.steps.length - 1],
            s.values.reduce((a, b) => a + b, 0),
          ]),
      );
      expect(rows.map((r) => r.slice(0, 5))).toEqual(expected.map((r) => r.slice(0, 5)));
      rows.forEach((r, k) => {
        expect(r[5] as number).toBeCloseTo(expected[k]?.[5] as number, 9);
      });
      // kind 2: tick k of a tick metric; kinds 3-5: dump correct/certainty/confidence.
      const ticks = set.runs.reduce(
        (n, r) => n + Object.values(r.tickMetrics).reduce((m, t) => m + t.steps.length * t.values.length, 0),
        0,
      );
      const cells = set.tickDumps.reduce((n, d) => n + d.samples * d.ticks, 0);
      expect(
        await sql(`SELECT kind, count(*)::INTEGER FROM read_parquet(${f}) WHERE kind > 1 GROUP BY kind ORDER BY kind`),
      ).toEqual([
        [2, ticks],
        [3, cells],
        [4, cells],
        [5, set.tickDumps.reduce((n, d) => n + (d.confidence === null ? 0 : d.samples * d.ticks), 0)],
      ]);
    },
  );

  it(
    'odd cases: names that need quoting, empty series, a tick metric without ticks, NaN, -0 and infinities, dumps ' +
      'without confidence or run',
    async () => {
      const f = (...v: number[]): Float64Array => Float64Array.from(v);
      const set: RunSet = {
        mode: 'logs',
        keys: ['a"b', 'ünï'],
        runs: [
          {
            id: `a"b=x'y,ünï=1,2,seed=7`,
            config: `a"b=x'y,ünï=1,2`,
            params: { 'a"b': "x'y", ünï: '1,2' },
            seed: '7',
            info: { _stamp: '2026' },
            files: ['r/1.csv', 'r/2.csv'],
            identity: 'layout',
            metrics: {
              '1': { steps: f(-5, -0, 3), values: f(0.1, -0, 5e-324), divergedAt: null, missing: 0 },
              "lo'ss": { steps: f(), values: f(), divergedAt: 4, missing: 3 },
            },
            tickMetrics: {
              acc: { steps: f(1, 2), values: [f(NaN, Infinity), f(-Infinity, 0.25)] },
              none: { steps: f(1, 2, 3), values: [] },
            },
            status: 'diverged',
            lastStep: 3,
            divergedAt: 4,
          },
        ],
        metrics: [
          { name: '1', goal: 'max', goalSource: 'inferred', bookkeeping: false, kind: 'scalar', ticks: 0 },
          { name: "lo'ss", goal: 'max', goalSource: 'option', bookkeeping: false, kind: 'scalar', ticks: 0 },
          { name: 'acc', goal: 'max', goalSource: 'inferred', bookkeeping: false, kind: 'tick', ticks: 2 },
        ],
        tickDumps: [
          {
            run: 'gone,seed=1',
            config: 'gone',
            seed: '1',
            file: 'd.csv',
            step: null,
            samples: 2,
            ticks: 3,
            correct: Uint8Array.of(1, 0, 1, 0, 0, 1),
            certainty: f(0, 0.5, 1, 0.25, 0.75, 1),
            confidence: null,
          },
          {
            run: `a"b=x'y,ünï=1,2,seed=7`,
            config: `a"b=x'y,ünï=1,2`,
            seed: '7',
            file: 'e.csv',
            step: 100,
            samples: 1,
            ticks: 2,
            correct: Uint8Array.of(1, 1),
            certainty: f(0.5, 0.75),
            confidence: f(0.6, 0.9),
          },
          {
            run: 'empty,seed=1',
            config: 'empty',
            seed: '1',
            file: 'f.csv',
            step: 0,
            samples: 0,
            ticks: 4,
            correct: new Uint8Array(0),
            certainty: f(),
            confidence: f(),
          },
        ],
        files: [
          {
            file: 'r/1.csv',
            status: 'read',
            rows: 3,
            rejectedRows: 1,
            runs: [`a"b=x'y,ünï=1,2,seed=7`],
            kind: 'log',
          },
        ],
        problems: [
          problem('step-invalid', 'row 2: step is "x"', { file: 'r/1.csv', line: 3, run: `a"b=x'y,ünï=1,2,seed=7` }),
          problem('goal-inferred', '1: higher is taken to be better'),
        ],
      };
      const { back } = await roundTrip(set, "o'dd name.parquet");
      expect(differences({ ...back, files: back.files.slice(1) }, set)).toEqual([]);
    },
  );

  it(
    'series that end on, just before and just after a 2,048-row chunk boundary come back equal, rows in the ' +
      'documented order',
    async () => {
      // The writer hands rows to DuckDB 2,048 at a time (DuckDB's vector size, common practice for its
      // C API); pieces of these lengths start and end at every position relative to a chunk.
      const lengths = [2047, 1, 2048, 0, 2049, 5000, 3];
      const series = (
        n: number,
        k: number,
      ): { steps: Float64Array; values: Float64Array; divergedAt: null; missing: number } => ({
        steps: Float64Array.from({ length: n }, (_, i) => i * 10 + k),
        values: Float64Array.from({ length: n }, (_, i) => Math.sin(i + k) * 1e3 + k),
        divergedAt: null,
        missing: 0,
      });
      const metrics = Object.fromEntries(lengths.map((n, k) => [`m${k}`, series(n, k)]));
      const ticks = series(3000, 9);
      const set: RunSet = {
        mode: 'logs',
        keys: ['c'],
        runs: [
          {
            id: 'c=1,seed=1',
            config: 'c=1',
            params: { c: '1' },
            seed: '1',
            info: {},
            files: ['a.csv'],
            identity: 'hive',
            metrics,
            tickMetrics: { acc: { steps: ticks.steps, values: [ticks.values, ticks.values.map((v) => -v)] } },
            status: 'ok',
            lastStep: 49990,
            divergedAt: null,
          },
        ],
        metrics: [
          ...lengths.map((_, k) => ({
            name: `m${k}`,
            goal: 'max' as const,
            goalSource: 'option' as const,
            bookkeeping: false,
            kind: 'scalar' as const,
            ticks: 0,
          })),
          { name: 'acc', goal: 'max', goalSource: 'option', bookkeeping: false, kind: 'tick', ticks: 2 },
        ],
        tickDumps: [],
        files: [],
        problems: [],
      };
      const { file, back } = await roundTrip(set);
      expect(differences({ ...back, files: [] }, set)).toEqual([]);
      // Plain DuckDB, in file order: the header first, then each piece's rows consecutively.
      const rows = await sql(
        `SELECT kind, item, tick, step FROM read_parquet('${file}', file_row_number = true) ORDER BY file_row_number`,
      );
      const expected: unknown[][] = [[0, -1, 0, NaN]];
      lengths.forEach((n, k) => {
        for (let i = 0; i < n; i++) expected.push([1, k, 0, i * 10 + k]);
      });
      for (const t of [0, 1]) for (let i = 0; i < 3000; i++) expected.push([2, 0, t, i * 10 + 9]);
      expect(rows.length).toBe(expected.length);
      expect(differences(rows, expected)).toEqual([]);
    },
  );

  it('a digest of several Parquet row groups (read a row group at a time) comes back equal', async () => {
    // 2.5 million numbers: three row groups of the writer's 1 Mi rows, read in three slices.
    const n = 625_000;
    const run = (seed: string, k: number): RunSet['runs'][number] => ({
      id: `c=1,seed=${seed}`,
      config: 'c=1',
      params: { c: '1' },
      seed,
      info: {},
      files: [`${seed}.csv`],
      identity: 'hive',
      metrics: Object.fromEntries(
        ['a', 'b'].map((m, j) => [
          m,
          {
            steps: Float64Array.from({ length: n }, (_, i) => i + k),
            values: Float64Array.from({ length: n }, (_, i) => Math.cos(i * (j + 1) + k)),
            divergedAt: null,
            missing: 0,
          },
        ]),
      ),
      tickMetrics: {},
      status: 'ok',
      lastStep: n - 1 + k,
      divergedAt: null,
    });
    const set: RunSet = {
      mode: 'logs',
      keys: ['c'],
      runs: [run('1', 0), run('2', 7)],
      metrics: ['a', 'b'].map((name) => ({
        name,
        goal: 'max' as const,
        goalSource: 'option' as const,
        bookkeeping: false,
        kind: 'scalar' as const,
        ticks: 0,
      })),
      tickDumps: [],
      files: [],
      problems: [],
    };
    const { file, back } = await roundTrip(set);
    expect(Number((await sql(`SELECT count(*) FROM parquet_metadata('${file}') WHERE column_id = 0`))[0]?.[0])).toBe(3);
    expect(differences({ ...back, files: [] }, set)).toEqual([]);
    // A run's series with the same steps share one array, as from a raw log.
    const one = back.runs[0] as RunSet['runs'][number];
    expect(one.metrics.a?.steps).toBe(one.metrics.b?.steps);
  });

  it('a score-table RunSet comes back equal too', async () => {
    const root = await tree({ 'scores.csv': 'method,seed,acc\nours,1,0.9\nours,2,\nbase,1,0.8\n' });
    const set = await ingest([], opts({ scores: join(root, 'scores.csv') }));
    const { back } = await roundTrip(set);
    expect(back.mode).toBe('scores');
    expect(differences({ ...back, files: back.files.slice(1) }, set)).toEqual([]);
  });
});

describe('ingest reads digests beside raw logs', () => {
  const log = (rows: [number, number][]): string =>
    `step,loss,acc\n${rows.map(([s, v]) => `${s},${v},${1 - v}`).join('\n')}\n`;
  const steps = (n: number, v0: number): [number, number][] =>
    Array.from({ length: n }, (_, i) => [10 * (i + 1), v0 / (i + 1)]);

  it(
    'digests of two shards read together equal one raw ingest of both (ids, status short across shards, problems ' +
      'in order)',
    async () => {
      const root = await tree({
        'A/cfg=x/seed=1/log.csv': log(steps(10, 0.9)),
        'A/cfg=y/seed=1/log.csv': log([...steps(10, 0.8), [110, NaN]]),
        'B/cfg=x/seed=2/log.csv': log(steps(5, 0.7)), // short only next to A's seed 1 (50 < 0.9 x 100)
        'B/cfg=y/seed=2/log.csv': log(steps(10, 0.6)).replace('\n20,', '\n20,,\n20,'),
      });
      const shards = [join(root, 'A'), join(root, 'B')];
      const raw = await ingest(shards, none);
      const digests = await digestsOf(shards);
      const merged = await ingest(digests, none);
      expect(runById(raw, 'cfg=x,seed=2').status).toBe('short');
      expect(runById(await ingest([shards[1] as string], none), 'cfg=x,seed=2').status).toBe('ok');
      expect(withCode(raw, 'run-short')).toHaveLength(1);
      expect(differences(withoutDigests(merged, digests), raw)).toEqual([]);
      expect(merged.files.filter((f) => digests.includes(f.file)).map((f) => f.file)).toEqual(digests);
    },
  );

  it('a digest and raw logs in one call: the same as all raw; parts in the order their files were found', async () => {
    const root = await tree({
      'A/cfg=x/seed=1/log.csv': log(steps(4, 0.9)),
      'B/cfg=y/seed=1/log.csv': log(steps(4, 0.8)),
      'C/cfg=z/seed=1/log.csv': log(steps(4, 0.7)),
    });
    const [a, b, c] = ['A', 'B', 'C'].map((s) => join(root, s)) as [string, string, string];
    const [db] = await digestsOf([b]);
    const merged = await ingest([a, db as string, c], none);
    const raw = await ingest([a, b, c], none);
    // The raw logs (A and C) form one part, placed where its first file was found: before the digest.
    expect(merged.runs.map((r) => r.id)).toEqual(['cfg=x,seed=1', 'cfg=z,seed=1', 'cfg=y,seed=1']);
    expect(
      differences({ ...merged, files: [] }, { ...raw, runs: [raw.runs[0], raw.runs[2], raw.runs[1]], files: [] }),
    ).toEqual([]);
    const order = (set: RunSet): string[] => set.files.map((f) => f.file);
    expect(order(merged)).toEqual([
      ...order(raw).filter((f) => !f.startsWith(b)),
      db,
      ...order(raw).filter((f) => f.startsWith(b)),
    ]);
  });

  it(
    'a digest found inside a folder is read as a digest (no seed-missing for it); an ordinary Parquet log beside ' +
      'it is a log',
    async () => {
      const root = await tree({ 'A/cfg=x/seed=1/log.csv': log(steps(3, 0.9)) });
      const [d] = await digestsOf([join(root, 'A')]);
      const mixed = await tree({});
      await withEngine(async (e) => {
        await e.connection.run(
          `COPY (SELECT * FROM read_parquet('${d}')) TO '${join(mixed, 'digest.parquet')}' (FORMAT parquet, ` +
            `KV_METADATA {'${DIGEST_KEY}': '1'})`,
        );
        await e.connection.run(
          `COPY (SELECT * FROM (VALUES (1, 0.5), (2, 0.25)) t(step, loss)) TO '${join(mixed, 'seed=9.parquet')}' ` +
            `(FORMAT parquet)`,
        );
      });
      const set = await ingest([mixed], none);
      expect(set.runs.map((r) => r.id)).toEqual(['cfg=x,seed=1', 'seed=9']);
      expect(Array.from(runById(set, 'seed=9').metrics.loss?.values ?? [])).toEqual([0.5, 0.25]);
      expect(withCode(set, 'seed-missing')).toEqual([]);
    },
  );

  it(
    'keys met in another order in another shard: ids ' + 'rebuilt with the merged keys, as raw ingest builds them',
    async () => {
      const root = await tree({
        'A/x=1/y=2/seed=1/log.csv': log(steps(3, 0.9)),
        'B/y=3/x=4/seed=1/log.csv': log(steps(3, 0.8)),
      });
      const shards = [join(root, 'A'), join(root, 'B')];
      const digests = await digestsOf(shards);
      const alone = await ingest([shards[1] as string], none);
      expect(alone.runs[0]?.id).toBe('y=3,x=4,seed=1');
      const raw = await ingest(shards, none);
      const merged = await ingest(digests, none);
      expect(merged.runs.map((r) => r.id)).toEqual(['x=1,y=2,seed=1', 'x=4,y=3,seed=1']);
      expect(differences(withoutDigests(merged, digests), raw)).toEqual([]);
    },
  );

  it(
    'one run in two digests: run-duplicate, series merged with the later value winning, as raw logs stacked in ' +
      'file order',
    async () => {
      const root = await tree({
        'A/c=1/seed=1/log.csv': log([
          [1, 0.9],
          [2, 0.8],
          [3, 0.7],
          [4, 0.6],
        ]),
        'B/c=1/seed=1/log.csv': log([
          [3, 0.5],
          [4, 0.4],
          [5, 0.3],
          [6, 0.2],
        ]),
      });
      const shards = [join(root, 'A'), join(root, 'B')];
      const raw = await ingest(shards, none);
      const digests = await digestsOf(shards);
      const merged = await ingest(digests, none);
      const m = runById(merged, 'c=1,seed=1');
      const r = runById(raw, 'c=1,seed=1');
      expect(Array.from(m.metrics.loss?.steps ?? [])).toEqual([1, 2, 3, 4, 5, 6]);
      expect(Array.from(m.metrics.loss?.values ?? [])).toEqual([0.9, 0.8, 0.5, 0.4, 0.3, 0.2]);
      expect(differences(m.metrics, r.metrics)).toEqual([]);
      expect([m.status, m.lastStep, m.files]).toEqual([r.status, r.lastStep, r.files]);
      expect(withCode(merged, 'run-duplicate')).toEqual([
        expect.objectContaining({ run: 'c=1,seed=1', file: digests[1] }),
      ]);
      expect(withCode(merged, 'run-duplicate')[0]?.message).toContain(`${digests[0]}, ${digests[1]}`);
      expect(withCode(raw, 'run-duplicate')).toHaveLength(1);
    },
  );

  it(
    "goals: the first digest's goal is kept and a disagreement " + 'is a goal-conflict; --metric when reading decides',
    async () => {
      const root = await tree({
        'A/c=1/seed=1/log.csv': log(steps(3, 0.9)),
        'B/c=2/seed=1/log.csv': log(steps(3, 0.9)),
      });
      const [da] = await digestsOf([join(root, 'A')], opts({ metricGoals: { loss: 'max' } }));
      const [db] = await digestsOf([join(root, 'B')]);
      const merged = await ingest([da as string, db as string], none);
      expect(merged.metrics.find((m) => m.name === 'loss')).toEqual({
        name: 'loss',
        goal: 'max',
        goalSource: 'option',
        bookkeeping: false,
        kind: 'scalar',
        ticks: 0,
      });
      expect(withCode(merged, 'goal-conflict')).toEqual([
        expect.objectContaining({
          file: db,
          message: expect.stringMatching(
            /^loss: .* says higher is better, .* says lower is better; the first was kept/,
          ),
        }),
      ]);
      expect(withCode(merged, 'goal-inferred').map((p) => p.message.split(':')[0])).toEqual(['acc']);
      const decided = await ingest([da as string, db as string], opts({ metricGoals: { loss: 'min' } }));
      expect(decided.metrics.find((m) => m.name === 'loss')).toMatchObject({ goal: 'min', goalSource: 'option' });
      expect(withCode(decided, 'goal-conflict')).toEqual([]);
    },
  );

  it('a score-table digest with per-step logs is an input error naming both', async () => {
    const root = await tree({
      'scores.csv': 'method,seed,acc\nours,1,0.9\n',
      'A/c=1/seed=1/log.csv': log(steps(3, 0.9)),
    });
    const out = await tree({});
    await writeDigest(await ingest([], opts({ scores: join(root, 'scores.csv') })), join(out, 's.parquet'));
    await expect(ingest([join(root, 'A'), join(out, 's.parquet')], none)).rejects.toThrow(
      /s\.parquet: holds a score table, the logs read directly holds per-step logs/,
    );
  });
});

describe('a file that carries the marker but is not a usable digest', () => {
  it('another format version, a broken header: SeedsiftError naming the file', async () => {
    const root = await tree({ 'A/c=1/seed=1/log.csv': 'step,loss\n1,0.5\n' });
    const [d] = await digestsOf([join(root, 'A')]);
    const out = await tree({});
    const v2 = join(out, 'v2.parquet');
    const broken = join(out, 'broken.parquet');
    await withEngine(async (e) => {
      await e.connection.run(
        `COPY (SELECT * FROM read_parquet('${d}')) TO '${v2}' (FORMAT parquet, KV_METADATA {'${DIGEST_KEY}': '2'})`,
      );
      await e.connection.run(
        `COPY (SELECT 0::UTINYINT AS kind, 'not json' AS text) TO '${broken}' (FORMAT parquet, KV_METADATA ` +
          `{'${DIGEST_KEY}': '1'})`,
      );
    });
    const error = await ingest([v2], none).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(SeedsiftError);
    expect((error as SeedsiftError).code).toBe('input');
    expect((error as SeedsiftError).message).toBe(
      `${v2}: not a usable seedsift digest: expected format version 1, got "2" ` +
        `(make the digest again with this seedsift) (${v2})`,
    );
    await expect(ingest([broken], none)).rejects.toThrow(
      new RegExp(`^${broken}: not a usable seedsift digest: its header cannot be read`),
    );
  });

  it('readDigest on an ordinary Parquet file says it has no marker', async () => {
    const out = await tree({});
    const plain = join(out, 'plain.parquet');
    await withEngine((e) => e.connection.run(`COPY (SELECT 1 AS step, 0.5 AS loss) TO '${plain}' (FORMAT parquet)`));
    await expect(withEngine((e) => readDigest(e, plain))).rejects.toThrow(
      `expected the key ${DIGEST_KEY} in its Parquet metadata, got none`,
    );
  });
});
