/**
 * configValues: mean across seeds per config with METHODS.md's interval rule.
 * External reference: scipy 1.10.1 (Debian python3-scipy),
 *   stats.t.interval(0.95, 4, loc=np.mean(A), scale=stats.sem(A)) = (69.68106821529129, 72.9189317847087)
 * for METHODS.md's A = [71.2, 69.8, 73.1, 70.4, 72.0].
 */
import { describe, expect, it } from 'vitest';
import { configValues } from '../../src/analysis/configValues.js';
import type { RunValue } from '../../src/analysis/results.js';

const A = [71.2, 69.8, 73.1, 70.4, 72.0];
const settings = { level: 0.95, interval: 'bca' as const, bandResamples: 500, seed: 1 };

function runValues(config: string, values: readonly (number | null)[]): RunValue[] {
  return values.map((value, i) => ({
    metric: 'val_acc',
    summary: 'final',
    run: `${config},seed=${i}`,
    config,
    seed: String(i),
    value,
    note: value === null ? 'diverged: excluded' : null,
    step: 100,
    loggedAt: 100,
    usedInTests: value !== null,
  }));
}

describe('configValues', () => {
  it('gives the t-interval of the mean by default (scipy 1.10.1 t.interval)', () => {
    const [a] = configValues(runValues('a', [...A, null]), { ...settings, interval: 'welch' });
    expect(a?.n).toBe(5);
    expect(a?.missing).toBe(1);
    expect(a?.method).toBe('t');
    expect(a?.mean).toBeCloseTo(71.3, 12);
    expect(a?.low).toBeCloseTo(69.68106821529129, 10);
    expect(a?.high).toBeCloseTo(72.9189317847087, 10);
  });

  it('gives a BCa bootstrap under --interval bca, and no interval for one run', () => {
    const twenty = Array.from({ length: 20 }, (_, i) => 0.8 + 0.001 * ((i * 7) % 20));
    const out = configValues([...runValues('many', twenty), ...runValues('one', [0.5])], settings);
    expect(out.map((c) => [c.config, c.method])).toEqual([
      ['many', 'bca'],
      ['one', 'none'],
    ]);
    expect(out[1]).toMatchObject({ n: 1, mean: 0.5, low: null, high: null });
    const many = out[0];
    expect(many?.low).toBeLessThan(many?.mean as number);
    expect(many?.high).toBeGreaterThan(many?.mean as number);
  });
});
