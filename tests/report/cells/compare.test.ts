/**
 * The compare cell: every statistic of a comparison, read from Results. The memory=8 v memory=4
 * column of val_acc carries METHODS.md's check values for A v B (scipy 1.10.1): Welch t 2.4022,
 * df 7.7013, p 0.0442; permutation p 27/792 = 0.0341; Mann-Whitney U 30, p 0.0480; Hedges' g 1.341
 * with interval J x (0.1176, 2.7346) = (0.109, 2.523); Cliff's delta 0.714 (0.0006, 0.9459).
 */
import { describe, expect, it } from 'vitest';
import type { Comparison } from '../../../src/analysis/results.js';
import { sampleResults } from '../sampleResults.js';
import { renderCells, textOf } from './renderCells.js';

function column(html: string, label: string): string[] {
  const row = [...html.matchAll(/<tr>([\s\S]*?)<\/tr>/g)].map((m) =>
    [...(m[1] ?? '').matchAll(/<td[^>]*>([\s\S]*?)<\/td>/g)].map((c) => textOf(c[1] ?? '')),
  );
  return row.find((cells) => cells[0] === label)?.slice(1) ?? [];
}

describe('{{compare}}', () => {
  it('shows the primary test, the checks beside it, effect sizes and seeds', async () => {
    const html = await renderCells('{{compare "val_acc"}}', sampleResults());
    expect(column(html, 'Mean (baseline v candidate)')[0]).toBe('69.59 v 71.30');
    expect(column(html, 'Seeds (baseline v candidate)')).toEqual([
      '7 v 5',
      '7 v 4 (1 diverged in the candidate, excluded)',
    ]);
    expect(column(html, 'Welch t-test (decides)')[0]).toBe('t = 2.40, df = 7.7, p = 0.044');
    expect(column(html, 'Step compared at')).toEqual(['1000', '1000']);
    expect(column(html, 'Failed runs (Fisher exact test)')[1]).toBe('failed 0/7 v 1/5, Fisher p 0.462');
    expect(column(html, 'Permutation test')[0]).toBe('p = 0.034 (exact, every split)');
    expect(column(html, 'Mann-Whitney U')[0]).toBe('U = 30.0, p = 0.048 (exact)');
    expect(column(html, "Hedges' g, candidate minus baseline [interval]")[0]).toBe('+1.34 [0.11, 2.52]');
    expect(column(html, "Cliff's delta, candidate minus baseline [interval]")[0]).toBe('+0.71 [0.00, 0.95]');
    expect(column(html, 'p adjusted (Holm, all tasks: family of 2)')).toEqual(['0.088', '0.617']);
    // no post-hoc power (METHODS.md "How many seeds")
    expect(html).not.toContain('to detect the observed difference');
    expect(html.match(/<figure class="chart"/g)).toHaveLength(1);
  });

  it('adds the paired tests when Results has them', async () => {
    const r = sampleResults();
    const first = r.comparisons[0] as Comparison;
    const paired: Comparison = {
      ...first,
      tests: { ...first.tests, paired: { t: 3.1, df: 4, p: 0.036, wilcoxonP: 0.0625, pairs: 5 } },
      primary: 'paired-t',
    };
    const html = await renderCells('{{compare "val_acc"}}', { ...r, comparisons: [paired, ...r.comparisons.slice(1)] });
    // a paired verdict is labelled paired, never "Welch t-test (primary)"
    expect(html).not.toContain('Welch t-test (decides)');
    expect(column(html, 'Welch t-test (beside the paired test)')[0]).toBe('t = 2.40, df = 7.7, p = 0.044');
    expect(column(html, 'Paired t-test (decides) and Wilcoxon signed-rank')[0]).toBe(
      't = 3.10, df = 4.0, p = 0.036; Wilcoxon p = 0.063 (5 pairs)',
    );
  });
});
