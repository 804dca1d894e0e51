import { describe, expect, it } from 'vitest';
import { ALTERNATIVES, checkAlternative, studentTPValue } from '../../src/stats/alternative.js';

describe('checkAlternative', () => {
  it('accepts the three alternatives and rejects anything else with the caller named', () => {
    for (const a of ALTERNATIVES) expect(checkAlternative(a, 'welch')).toBe(a);
    expect(ALTERNATIVES).toEqual(['two-sided', 'greater', 'less']);
    expect(() => checkAlternative('two.sided', 'welch')).toThrow(
      /welch: alternative must be one of two-sided, greater, less/,
    );
    expect(() => checkAlternative(undefined, 'pairedT')).toThrow(RangeError);
  });
});

describe('studentTPValue', () => {
  it('gives 0.05 / 0.025 / 0.975 at the exact 0.975 quantile of t with 10 df', () => {
    const q = 2.2281388519862747; // mpmath at 40 digits (rounded: 2.228139, tests/stats/tTable.ts)
    expect(studentTPValue(q, 10, 'two-sided')).toBeCloseTo(0.05, 14);
    expect(studentTPValue(q, 10, 'greater')).toBeCloseTo(0.025, 14);
    expect(studentTPValue(q, 10, 'less')).toBeCloseTo(0.975, 14);
  });

  it('reproduces the METHODS.md Welch p-values from t and df (scipy 1.10.1)', () => {
    const p = studentTPValue(2.4022431408862186, 7.701328923514923, 'two-sided');
    expect(Math.abs(p - 0.04418107272139468) / 0.04418107272139468).toBeLessThan(1e-10);
    const g = studentTPValue(2.4022431408862186, 7.701328923514923, 'greater');
    expect(Math.abs(g - 0.02209053636069734) / 0.02209053636069734).toBeLessThan(1e-10);
  });

  it(
    'is exact for the Cauchy case (df 1): P(T >= t) = 1/2 - atan(t)/pi ' +
      '(first principles: the df-1 density 1/(pi(1+t^2)) integrated)',
    () => {
      for (const t of [-3, -0.5, 0, 1, 40]) {
        expect(studentTPValue(t, 1, 'greater')).toBeCloseTo(0.5 - Math.atan(t) / Math.PI, 14);
        expect(studentTPValue(t, 1, 'less')).toBeCloseTo(0.5 + Math.atan(t) / Math.PI, 14);
      }
    },
  );

  it('keeps small upper-tail p-values (no 1 - cdf cancellation)', () => {
    // Cauchy upper tail at t = 1e8: 1/2 - atan(1e8)/pi = atan(1e-8)/pi = 3.1830988618379067e-9.
    const p = studentTPValue(1e8, 1, 'greater');
    expect(Math.abs(p - Math.atan(1e-8) / Math.PI) / p).toBeLessThan(1e-12);
  });

  it('caps the two-sided p at 1 and throws on bad input', () => {
    expect(studentTPValue(0, 5, 'two-sided')).toBe(1);
    expect(() => studentTPValue(1, 0, 'two-sided')).toThrow(/degrees of freedom/);
    expect(() => studentTPValue(Number.NaN, 3, 'less')).toThrow(/NaN/);
  });
});
