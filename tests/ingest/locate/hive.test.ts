import { describe, expect, it } from 'vitest';
import { hivePairs } from '../../../src/ingest/locate/hive.js';

// Expected values: DESIGN.md "Inputs" example (runs/ticks=32/memory=12/seed=3/log.csv) and the
// Hive partitioning convention of one key=value per path segment (common practice).
describe('hivePairs', () => {
  it('reads the DESIGN example in order of appearance', () => {
    expect(hivePairs('runs/ticks=32/memory=12/seed=3/log.csv')).toEqual([
      ['ticks', '32'],
      ['memory', '12'],
      ['seed', '3'],
    ]);
  });

  it('reads nested keys at any depth and keeps their order', () => {
    expect(hivePairs('study/model=ctm/2026-03-01/task=parity/ticks=8/seed=1/train/log.csv.gz')).toEqual([
      ['model', 'ctm'],
      ['task', 'parity'],
      ['ticks', '8'],
      ['seed', '1'],
    ]);
  });

  it('reads a pair from the file name without its log extension', () => {
    expect(hivePairs('runs/ticks=8/seed=3.csv')).toEqual([
      ['ticks', '8'],
      ['seed', '3'],
    ]);
    expect(hivePairs('runs/ticks=8/seed=3.csv.gz')).toEqual([
      ['ticks', '8'],
      ['seed', '3'],
    ]);
  });

  it('keeps everything after the first = as the value', () => {
    expect(hivePairs('opt=a=b/log.csv')).toEqual([['opt', 'a=b']]);
    expect(hivePairs('lr=1e-4/log.csv')).toEqual([['lr', '1e-4']]);
  });

  it('ignores segments that are not KEY=VALUE', () => {
    expect(hivePairs('runs/=3/a=/2026-03-01/x y=2/./../log.csv')).toEqual([]);
  });

  it('keeps the first position and the deepest value of a repeated key', () => {
    expect(hivePairs('ticks=8/memory=4/ticks=16/log.csv')).toEqual([
      ['ticks', '16'],
      ['memory', '4'],
    ]);
  });

  it('reads absolute paths and ./ prefixes alike', () => {
    expect(hivePairs('/data/ticks=8/seed=2/log.csv')).toEqual([
      ['ticks', '8'],
      ['seed', '2'],
    ]);
    expect(hivePairs('./ticks=8/log.csv')).toEqual([['ticks', '8']]);
  });
});
