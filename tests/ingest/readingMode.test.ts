import { describe, expect, it } from 'vitest';
import { modeFiles, NO_FLAGS, readingMode, seedPatterns } from '../../src/ingest/readingMode.js';
import { SeedsiftError } from '../../src/problems.js';

// Expected values: the identity sources of DESIGN.md "Inputs" (one way of naming runs at a time:
// path segments and --layout, a seed column, per-seed columns, a manifest, a score table) and the
// option table of README.md; each test states the rule it checks.
const flags = (o: Partial<typeof NO_FLAGS>) => ({ ...NO_FLAGS, ...o });

describe('readingMode', () => {
  it('chooses one mode from the flags', () => {
    expect(readingMode(NO_FLAGS)).toEqual({ kind: 'paths', layout: null });
    expect(readingMode(flags({ layout: '{model}_{seed}.csv' }))).toMatchObject({
      kind: 'paths',
      layout: { template: '{model}_{seed}.csv', fields: ['model', 'seed'] },
    });
    expect(readingMode(flags({ seedColumn: 'run' }))).toEqual({ kind: 'seed-column', layout: null, column: 'run' });
    const wide = readingMode(flags({ seedColumns: 'acc:s{seed}', layout: '{model}/*.csv' }));
    expect(wide.kind).toBe('seed-columns');
    expect(wide.kind === 'seed-columns' && wide.patterns.map((p) => p.metric)).toEqual(['acc']);
    expect(wide.kind === 'seed-columns' && wide.layout?.fields).toEqual(['model']);
    expect(readingMode(flags({ manifest: 'runs.csv' }))).toEqual({ kind: 'manifest', file: 'runs.csv' });
  });

  it('a score table: the seed column is `seed` unless --seed-column names another; --by kept', () => {
    expect(readingMode(flags({ scores: 's.csv' }))).toEqual({
      kind: 'scores',
      file: 's.csv',
      seedColumn: 'seed',
      by: null,
    });
    expect(readingMode(flags({ scores: 's.csv', seedColumn: 'run', by: ['ticks'] }))).toEqual({
      kind: 'scores',
      file: 's.csv',
      seedColumn: 'run',
      by: ['ticks'],
    });
  });

  it('rejects two seed sources, naming them', () => {
    for (const o of [
      { seedColumn: 'seed', seedColumns: 'a:{seed}' },
      { seedColumn: 'seed', manifest: 'runs.csv' },
      { seedColumns: 'a:{seed}', manifest: 'runs.csv' },
    ])
      expect(() => readingMode(flags(o))).toThrow(/--seed-column, --seed-columns and --manifest: expected at most one/);
  });

  it('rejects --manifest with --layout, --scores with an option that reads paths, --by without --scores', () => {
    expect(() => readingMode(flags({ manifest: 'm.csv', layout: '{seed}.csv' }))).toThrow(
      /--manifest .* cannot be combined with --layout/,
    );
    expect(() => readingMode(flags({ scores: 's.csv', layout: '{seed}.csv' }))).toThrow(
      /--scores: .* cannot be combined with --layout/,
    );
    expect(() => readingMode(flags({ scores: 's.csv', seedColumns: 'a:{seed}' }))).toThrow(/with --seed-columns/);
    expect(() => readingMode(flags({ scores: 's.csv', manifest: 'm.csv' }))).toThrow(/with --manifest/);
    expect(() => readingMode(flags({ by: ['ticks'] }))).toThrow(/--by: .* needs --scores/);
  });

  it('rejects a malformed --layout and a --seed-columns pattern without one {seed}, as usage errors', () => {
    for (const o of [{ layout: '{model/{seed}.csv' }, { seedColumns: 'acc' }, { seedColumns: 'a:{seed},b:x' }]) {
      expect(() => readingMode(flags(o))).toThrow(SeedsiftError);
      try {
        readingMode(flags(o));
      } catch (e) {
        expect(e).toMatchObject({ code: 'usage' });
      }
    }
  });
});

describe('modeFiles', () => {
  it('names the manifest or the score table, nothing for the other modes', () => {
    expect(modeFiles(readingMode(flags({ manifest: 'runs.csv' })))).toEqual(['runs.csv']);
    expect(modeFiles(readingMode(flags({ scores: 's.csv' })))).toEqual(['s.csv']);
    expect(modeFiles(readingMode(flags({ seedColumn: 'seed' })))).toEqual([]);
  });
});

describe('seedPatterns', () => {
  it('{seed} captures lazily; * matches any text', () => {
    const [p] = seedPatterns('acc:seed_{seed}_*');
    expect(p?.metric).toBe('acc');
    expect(p?.regex.exec('seed_12_run_a')?.[1]).toBe('12');
    expect(p?.regex.exec('xseed_1_a')).toBeNull(); // whole names only
  });
  it('several patterns, comma-separated; a pattern without NAME: is named from its text', () => {
    const ps = seedPatterns('acc:a{seed},val_loss_s{seed}');
    expect(ps.map((p) => p.metric)).toEqual(['acc', 'val_loss_s']);
  });
  it('regex characters in the pattern are literal', () => {
    expect(seedPatterns('m:acc.{seed}')[0]?.regex.test('accX3')).toBe(false);
  });
  it('throws a usage error without exactly one {seed}', () => {
    expect(() => seedPatterns('acc:seed_*')).toThrow(SeedsiftError);
    expect(() => seedPatterns('acc:{seed}_{seed}')).toThrow(/one \{seed\} capture/);
  });
});
