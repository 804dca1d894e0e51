import { describe, expect, it } from 'vitest';
import { groupId, pairConfigs } from '../../src/analysis/pairing.js';
import { parseSelector } from '../../src/analysis/selectors.js';

const keys = ['ticks', 'memory'];
const config = (ticks: string, memory: string): { id: string; params: Record<string, string> } => ({
  id: `ticks=${ticks},memory=${memory}`,
  params: { ticks, memory },
});
const configs = [
  config('8', '4'),
  config('8', '8'),
  config('8', '12'),
  config('16', '4'),
  config('16', '8'),
  config('32', '8'),
];
const short = (p: { baseline: string; candidate: string }): string => `${p.candidate} v ${p.baseline}`;

describe('pairConfigs (DESIGN.md selector semantics)', () => {
  it('a selector naming every key: that config is the baseline of all others', () => {
    const r = pairConfigs(configs, keys, parseSelector('ticks=8,memory=4'), null);
    expect(r.pairs.map(short)).toEqual([
      'ticks=8,memory=8 v ticks=8,memory=4',
      'ticks=8,memory=12 v ticks=8,memory=4',
      'ticks=16,memory=4 v ticks=8,memory=4',
      'ticks=16,memory=8 v ticks=8,memory=4',
      'ticks=32,memory=8 v ticks=8,memory=4',
    ]);
    expect(r.missing).toEqual([]);
  });

  it(
    'a partial selector: each config against its counterpart with the same other values; missing counterparts ' +
      'listed',
    () => {
      const r = pairConfigs(configs, keys, parseSelector('memory=4'), null);
      expect(r.pairs.map(short)).toEqual([
        'ticks=8,memory=8 v ticks=8,memory=4',
        'ticks=8,memory=12 v ticks=8,memory=4',
        'ticks=16,memory=8 v ticks=16,memory=4',
      ]);
      expect(r.missing).toEqual([{ task: null, config: 'ticks=32,memory=8', counterpart: 'ticks=32,memory=4' }]);
    },
  );

  it('no selector: every pair, earlier config as baseline', () => {
    const r = pairConfigs(configs.slice(0, 3), keys, null, null);
    expect(r.pairs.map(short)).toEqual([
      'ticks=8,memory=8 v ticks=8,memory=4',
      'ticks=8,memory=12 v ticks=8,memory=4',
      'ticks=8,memory=12 v ticks=8,memory=8',
    ]);
  });

  it('a task key is left out of the grouping; pairs are formed per task value', () => {
    const withTask = [
      { id: 'method=base,task=b', params: { method: 'base', task: 'b' } },
      { id: 'method=ours,task=b', params: { method: 'ours', task: 'b' } },
      { id: 'method=base,task=a', params: { method: 'base', task: 'a' } },
      { id: 'method=ours,task=a', params: { method: 'ours', task: 'a' } },
      { id: 'method=ours,task=c', params: { method: 'ours', task: 'c' } },
    ];
    const r = pairConfigs(withTask, ['method', 'task'], parseSelector('method=base'), 'task');
    expect(r.tasks).toEqual(['a', 'b', 'c']);
    expect(r.pairs).toEqual([
      {
        task: 'a',
        baseline: 'method=base',
        candidate: 'method=ours',
        baselineConfig: 'method=base,task=a',
        candidateConfig: 'method=ours,task=a',
      },
      {
        task: 'b',
        baseline: 'method=base',
        candidate: 'method=ours',
        baselineConfig: 'method=base,task=b',
        candidateConfig: 'method=ours,task=b',
      },
    ]);
    expect(r.missing).toEqual([{ task: 'c', config: 'method=ours', counterpart: 'method=base' }]);
    expect(groupId({ method: 'ours', task: 'a' }, ['method', 'task'], 'task')).toBe('method=ours');
  });
});
