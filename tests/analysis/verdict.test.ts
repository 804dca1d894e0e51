import { describe, expect, it } from 'vitest';
import { adjustFamily, decideVerdict } from '../../src/analysis/verdict.js';

describe('adjustFamily', () => {
  it('Holm and Benjamini-Hochberg on the METHODS.md check values, nulls left out', () => {
    // METHODS.md: Holm on [.01, .04, .03, .005, .2, .03] is [.05,
    // .12, .12, .03, .2, .12]; BH [.03, .048, .045, .03, .2, .045]
    const p = [0.01, null, 0.04, 0.03, 0.005, 0.2, 0.03];
    const holm = adjustFamily(p, 'holm');
    const bh = adjustFamily(p, 'bh');
    [0.05, null, 0.12, 0.12, 0.03, 0.2, 0.12].forEach((v, i) => {
      if (v === null) expect(holm[i]).toBeNull();
      else expect(holm[i]).toBeCloseTo(v, 12);
    });
    [0.03, null, 0.048, 0.045, 0.03, 0.2, 0.045].forEach((v, i) => {
      if (v === null) expect(bh[i]).toBeNull();
      else expect(bh[i]).toBeCloseTo(v, 12);
    });
    expect(adjustFamily(p, 'none')).toEqual(p);
  });
});

describe('decideVerdict', () => {
  it('better/worse follow the goal direction; inconclusive without significance', () => {
    expect(decideVerdict(0.01, 0.3, 'max', 0.05)).toBe('better');
    expect(decideVerdict(0.01, -0.3, 'max', 0.05)).toBe('worse');
    expect(decideVerdict(0.01, -0.3, 'min', 0.05)).toBe('better');
    expect(decideVerdict(0.01, 0.3, 'min', 0.05)).toBe('worse');
    expect(decideVerdict(0.05, 0.3, 'max', 0.05)).toBe('inconclusive'); // p must be below alpha
    expect(decideVerdict(null, 0.3, 'max', 0.05)).toBe('inconclusive');
    expect(decideVerdict(0.001, 0, 'max', 0.05)).toBe('inconclusive');
  });
});
