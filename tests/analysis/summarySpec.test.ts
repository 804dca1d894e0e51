import { describe, expect, it } from 'vitest';
import { formatSummary, parseSummary, summaryGoal } from '../../src/analysis/summarySpec.js';

describe('parseSummary', () => {
  it('parses every form of DESIGN.md and formats it back', () => {
    const cases = [
      ['final', { kind: 'final' }],
      ['last:10%', { kind: 'last', percent: 10 }],
      ['best', { kind: 'best' }],
      ['auc', { kind: 'auc' }],
      ['reach:0.9', { kind: 'reach', value: 0.9 }],
      ['step:5000', { kind: 'step', step: 5000 }],
    ] as const;
    for (const [text, spec] of cases) {
      expect(parseSummary(text)).toEqual(spec);
      expect(formatSummary(spec)).toBe(text);
    }
    expect(parseSummary('last:25')).toEqual({ kind: 'last', percent: 25 });
  });

  it('rejects what it does not know, naming the option', () => {
    for (const bad of ['', 'mean', 'last:0%', 'last:150%', 'reach:', 'reach:abc', 'step:-1', 'final:3']) {
      expect(() => parseSummary(bad)).toThrow('--summary: expected final, last:P%, best, auc, reach:VALUE or step:N');
    }
  });

  it('counts steps to reach a value as lower-is-better', () => {
    expect(summaryGoal({ kind: 'reach', value: 0.9 }, 'max')).toBe('min');
    expect(summaryGoal({ kind: 'final' }, 'max')).toBe('max');
    expect(summaryGoal({ kind: 'best' }, 'min')).toBe('min');
  });
});
