/**
 * intervalLabel and chartFrame's wrapLines: the words charts use.
 * The method names are the published ones (Welch 1947; Efron 1987 BCa; bootstrap-t, percentile),
 * common practice.
 */
import { describe, expect, it } from 'vitest';
import { wrapLines } from '../../../src/report/charts/chartFrame.js';
import { formatLevel, intervalLabel, intervalLabels } from '../../../src/report/charts/intervalLabel.js';

describe('intervalLabel', () => {
  it('says level and method', () => {
    expect(formatLevel(0.95)).toBe('95%');
    expect(formatLevel(0.999)).toBe('99.9%');
    expect(formatLevel(0.9)).toBe('90%');
    expect(intervalLabel('t', 0.95)).toBe('95% t-interval');
    expect(intervalLabel('welch-t', 0.9)).toBe('90% Welch t-interval');
    expect(intervalLabel('bca', 0.95)).toBe('95% BCa bootstrap interval');
    expect(intervalLabel('none', 0.95)).toBe('no interval');
  });

  it('lists distinct labels in order of first appearance', () => {
    expect(
      intervalLabels([
        { method: 't', level: 0.95 },
        { method: 'bca', level: 0.95 },
        { method: 't', level: 0.95 },
      ]),
    ).toBe('95% t-interval or 95% BCa bootstrap interval');
    expect(intervalLabels([])).toBe('');
  });
});

describe('wrapLines', () => {
  it('wraps at word boundaries and keeps a long word whole', () => {
    expect(wrapLines(['a bb ccc'], 4)).toEqual(['a bb', 'ccc']);
    expect(wrapLines(['</script><img src=x onerror=alert(1)> ok'], 10)).toEqual([
      '</script><img',
      'src=x',
      'onerror=alert(1)>',
      'ok',
    ]);
    expect(wrapLines(['one', 'two three'], 80)).toEqual(['one', 'two three']);
  });
});
