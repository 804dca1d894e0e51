import { describe, expect, it } from 'vitest';
import { planColumns } from '../../../src/ingest/plan/columns.js';
import type { FileData } from '../../../src/ingest/load/loadFiles.js';
import { splitParts } from '../../../src/ingest/assemble/parts.js';
import { none, opts, source } from '../../fixtures/ingest/tree.js';

// DESIGN.md "Inputs", identity 3 and 4: a seed column (one file, many seeds) and one column per seed.
function fileData(names: string[], seed: string | null, extra: Partial<FileData> = {}, options = none): FileData {
  const plan = planColumns(names, options);
  return {
    header: {
      source: source('/r', 'm=a/log.csv', { m: 'a' }, seed),
      names,
      parquetTypes: null,
      text: { delimiter: ',', header: true, skip: 0 },
      bytes: 0,
      textLike: [],
    },
    plan,
    rows: 0,
    cells: new Map(),
    seedCodes: null,
    seedValues: [],
    rowIds: null,
    rejects: [],
    malformed: [],
    ...extra,
  };
}

describe('splitParts', () => {
  it('one part with the seed of the location', () => {
    const { parts, drafts } = splitParts(fileData(['step', 'acc'], '3', { rows: 2 }));
    expect(parts.map((p) => [p.seed, p.rows])).toEqual([['3', null]]);
    expect(drafts).toEqual([]);
  });
  it('--seed-column: one part per seed in order of first row; empty seed cells reported', () => {
    const data = fileData(
      ['step', 'seed', 'acc'],
      null,
      { rows: 5, seedCodes: Float64Array.of(2, 1, 2, 0, 1), seedValues: ['0', '1'] },
      opts({ seedColumn: 'seed' }),
    );
    const { parts, drafts } = splitParts(data);
    expect(parts.map((p) => [p.seed, Array.from(p.rows ?? [])])).toEqual([
      ['1', [0, 2]],
      ['0', [1, 4]],
    ]);
    expect(drafts.map((d) => [d.code, d.rows?.map((r) => r.n)])).toEqual([['seed-missing', [3]]]);
  });
  it("--seed-columns: one part per seed, all rows, that seed's columns", () => {
    const data = fileData(['step', 's1', 's2'], null, { rows: 1 }, opts({ seedColumns: 'acc:s{seed}' }));
    expect(splitParts(data).parts.map((p) => [p.seed, p.rows, p.perSeed.map((c) => c.index)])).toEqual([
      ['1', null, [1]],
      ['2', null, [2]],
    ]);
  });
  it('a seed expected inside the file but absent: the path seed if any, else one of its own', () => {
    const data = fileData(['step', 'acc'], null, { rows: 1 }, opts({ seedColumn: 'seed' }));
    const { parts, drafts } = splitParts(data);
    expect(parts.map((p) => p.seed)).toEqual(['auto:m=a/log.csv']);
    expect(drafts.map((d) => d.code)).toEqual(['seed-missing']);
  });
});
