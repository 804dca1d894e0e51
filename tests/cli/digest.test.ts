/**
 * `seedsift digest`, and reports from digests (the acceptance test of "Scaling out" in the
 * README). The reference is `seedsift report sample-runs --task-key task` on the raw logs: the
 * demo study split into two shards (tasks count and count-dense in one digest, count-sparse in the
 * other, named in the order the raw folder lists them), digested, and reported from the digests
 * must give the same results.
 *
 * What may differ, and only that, is what comes from which inputs were named:
 * - `inputs.paths` (the PATHs typed) and the file counts `inputs.files`/`inputs.filesRead`: the
 *   digest files are inputs read, and `sample-runs/generate.ts`, which only the raw call walks
 *   past, is a skipped file;
 * - the problems about files outside the shards (that one `file-skipped` note), and so the count
 *   of notes in the Markdown's "Input problems" line;
 * - in `scan --json`, the file list: the digests' own records, and the files outside the shards.
 * Everything else (settings, configs, metrics, runs with their files and problems, values,
 * config values, comparisons, curves, ticks, halting, calibration, the Markdown) is identical.
 */
import { mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Results } from '../../src/analysis/results.js';
import { run } from '../../src/cli/program.js';
import { DIGEST_KEY } from '../../src/ingest/digest/digestFormat.js';
import { closeEngine, openEngine } from '../../src/ingest/load/duckdb.js';
import type { Problem } from '../../src/problems.js';
import { memoryIo } from './memoryIo.js';

const dir = mkdtempSync(join(tmpdir(), 'seedsift-digest-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const at = (name: string): string => join(dir, name);

const shards = [['sample-runs/task=count', 'sample-runs/task=count-dense'], ['sample-runs/task=count-sparse']];
const digests = [at('a.parquet'), at('b.parquet')];

async function cli(...argv: string[]): Promise<{ code: number; out: string; err: string }> {
  const io = memoryIo();
  const code = await run(argv, io);
  return { code, out: io.out(), err: io.err() };
}

interface ScanJson {
  readonly files: readonly { readonly file: string }[];
  readonly problems: readonly Problem[];
  readonly [key: string]: unknown;
}

const json = <T>(name: string): T => JSON.parse(readFileSync(at(name), 'utf8')) as T;
const inShards = (file: string): boolean => shards.flat().some((s) => file.startsWith(`${s}/`));
/** Problems about files that only the raw call saw (outside the shards). */
const outside = (p: Problem): boolean => p.file !== undefined && !inShards(p.file) && !digests.includes(p.file);

const digestOut: string[] = [];
beforeAll(async () => {
  for (const [k, paths] of shards.entries()) {
    const r = await cli('digest', ...paths, '--out', digests[k] as string);
    expect(r.err, 'stderr').toBe('');
    expect(r.code).toBe(0);
    digestOut.push(r.out);
  }
  const baseline = ['--baseline', 'ticks=8,memory=4', '--task-key', 'task'];
  for (const [tag, inputs] of [
    ['1', digests],
    ['2', ['sample-runs']],
  ] as const) {
    const r = await cli(
      'report',
      ...inputs,
      ...baseline,
      '--json',
      at(`r${tag}.json`),
      '--markdown',
      at(`m${tag}.md`),
      '--quiet',
    );
    expect(r.err, 'stderr').toBe('');
    expect(r.code).toBe(0);
    const s = await cli('scan', ...inputs, '--json', at(`s${tag}.json`));
    expect(s.code).toBe(0);
  }
}, 120_000);

describe('seedsift digest', () => {
  it('writes one Parquet file per shard with the marker, and says what it wrote', async () => {
    expect(digestOut[0]).toMatch(
      new RegExp(`^60 runs from \\d+ files read, \\d+ problems\\nwrote ${digests[0]} \\(\\d+\\.\\d (KiB|MiB)\\)\\n$`),
    );
    expect(digestOut[1]).toMatch(/^30 runs from /);
    const engine = await openEngine();
    try {
      for (const file of digests) {
        const rows = (
          await engine.connection.runAndReadAll(
            `SELECT decode(value) FROM parquet_kv_metadata('${file}') WHERE decode(key) = '${DIGEST_KEY}'`,
          )
        ).getRows();
        expect(rows).toEqual([['1']]);
        expect(statSync(file).size).toBeGreaterThan(0);
      }
    } finally {
      closeEngine(engine);
    }
  });

  it('a report from the digests equals the report from the raw logs, but for what naming other inputs changes', () => {
    const r1 = json<Results>('r1.json');
    const r2 = json<Results>('r2.json');
    // problemCodes is the problems grouped by code: it differs as the problems do (checked below).
    const { inputs: i1, problems: p1, problemCodes: _c1, ...rest1 } = r1;
    const { inputs: i2, problems: p2, problemCodes: _c2, ...rest2 } = r2;
    expect(rest1).toEqual(rest2);
    // Not vacuous: the study has comparisons, curves, tick analyses, halting, calibration and task aggregates.
    const keys = [
      'comparisons',
      'curves',
      'ticks',
      'halting',
      'calibration',
      'values',
      'configValues',
      'tasks',
    ] as const;
    for (const key of keys) expect(r1[key].length, key).toBeGreaterThan(0);
    expect(i1.paths).toEqual(digests);
    expect(i2.paths).toEqual(['sample-runs']);
    expect(i1.mode).toBe(i2.mode);
    const s1 = json<ScanJson>('s1.json');
    const s2 = json<ScanJson>('s2.json');
    expect(i1.files).toBe(s1.files.length);
    expect(i2.files).toBe(s2.files.length);
    expect(i1.filesRead - digests.length).toBe(i2.filesRead);
    // Problems: the same, in the same order, once the raw call's problems about files outside the shards are set aside.
    expect(p2.filter(outside).map((p) => [p.code, p.file])).toEqual([['file-skipped', 'sample-runs/generate.ts']]);
    expect(p1).toEqual(p2.filter((p) => !outside(p)));
  });

  it('the Markdown summaries are identical but for the count of notes about files outside the shards', () => {
    const m1 = readFileSync(at('m1.md'), 'utf8').split('\n');
    const m2 = readFileSync(at('m2.md'), 'utf8').split('\n');
    const notes = json<Results>('r2.json').problems.filter((p) => outside(p) && p.severity === 'note').length;
    const line = m2.findIndex((l) => l.startsWith('Input problems:'));
    expect(line).toBeGreaterThan(0);
    const expected = [...m2];
    expected[line] = (m2[line] as string).replace(/(\d+) notes/, (_, n: string) => `${Number(n) - notes} notes`);
    expect(m1).toEqual(expected);
    expect(m1[line]).not.toBe(m2[line]);
  });

  it(
    'scan sees the same runs, metrics and dumps; its file list differs only by the digests and the files outside the ' +
      'shards',
    () => {
      const s1 = json<ScanJson>('s1.json');
      const s2 = json<ScanJson>('s2.json');
      const { files: f1, problems: p1, ...rest1 } = s1;
      const { files: f2, problems: p2, ...rest2 } = s2;
      expect(rest1).toEqual(rest2);
      expect(f1.filter((f) => !digests.includes(f.file))).toEqual(f2.filter((f) => inShards(f.file)));
      expect(f1.filter((f) => digests.includes(f.file)).map((f) => f.file)).toEqual(digests);
      expect(p1).toEqual(p2.filter((p) => !outside(p)));
    },
  );
});

describe('seedsift digest: errors', () => {
  it('--out must end in .parquet (so that report finds it); a digest never overwrites one of its inputs', async () => {
    const bad = await cli('digest', 'sample-runs/task=count-sparse', '--out', at('x.csv'));
    expect(bad.code).toBe(2);
    expect(bad.err).toBe(
      'seedsift: --out: expected a file name ending in .parquet (so that report and scan find it), ' +
        `got '${at('x.csv')}'\n`,
    );
    const over = await cli('digest', digests[1] as string, '--out', digests[1] as string);
    expect(over.code).toBe(2);
    expect(over.err).toBe(`seedsift: refusing to write over an input file: ${digests[1]}\n`);
  });

  it('no PATH and no --scores: a usage error; a score table can be digested without PATH', async () => {
    const none = await cli('digest', '--out', at('none.parquet'));
    expect(none.code).toBe(2);
    expect(none.err).toBe('seedsift: digest: expected PATH... (folders or files of run logs) or --scores FILE\n');
    writeFileSync(at('scores.csv'), 'method,seed,acc\nours,1,0.9\nbase,1,0.8\n');
    const scores = await cli('digest', '--scores', at('scores.csv'), '--out', at('scores.parquet'), '--quiet');
    expect([scores.code, scores.out, scores.err]).toEqual([0, '', '']);
  });

  it('report on a digest of another format version: exit 2, one line naming the file', async () => {
    const v9 = at('v9.parquet');
    const engine = await openEngine();
    try {
      await engine.connection.run(
        `COPY (SELECT * FROM read_parquet('${digests[1]}')) TO '${v9}' ` +
          `(FORMAT parquet, KV_METADATA {'${DIGEST_KEY}': '9'})`,
      );
    } finally {
      closeEngine(engine);
    }
    const r = await cli('report', v9, '--json', at('never.json'));
    expect(r.code).toBe(2);
    expect(r.err).toBe(
      `seedsift: ${v9}: not a usable seedsift digest: expected format version 1, got "9" ` +
        `(make the digest again with this seedsift) (${v9})\n`,
    );
  });
});
