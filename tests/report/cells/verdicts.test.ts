/**
 * The verdict cell. The memory=8 v memory=4 row of val_acc carries METHODS.md's Welch values for
 * samples A and B (scipy 1.10.1), Holm-adjusted over two comparisons.
 */
import { describe, expect, it } from 'vitest';
import type { Comparison, Results } from '../../../src/analysis/results.js';
import { sampleResults } from '../sampleResults.js';
import { renderCells, textOf } from './renderCells.js';

function rows(html: string): string[] {
  return [...html.matchAll(/<tr class="row-[^"]*">([\s\S]*?)<\/tr>/g)].map((m) => textOf(m[1] ?? ''));
}

describe('{{verdicts}}', () => {
  it('has one row per comparison: the verdict beside the candidate, the baseline once per group', async () => {
    const html = await renderCells('{{verdicts}}', sampleResults());
    const r = rows(html);
    expect(r).toHaveLength(4);
    expect(r[0]).toBe(
      'val_acc higher is better; summary final; family: 2 comparisons against memory=4 ' +
        "memory=8 ● inconclusive Welch's t 1000 +1.71 [0.06, 3.37] 0.088 7 v 5",
    );
    // The second row of a group says no baseline: the group's first row said it.
    expect(r[1]?.startsWith('memory=12 ')).toBe(true);
    expect(r[3]).toBe(
      "memory=12 ▼ worse Welch's t failed 0/7 v 1/5, Fisher p 0.462 1000 +0.01514 [0.00588, 0.02441] 0.0052 " +
        '7 v 4 (1 diverged in the candidate, excluded)',
    );
    expect(html).toContain('<th scope="col">Candidate and verdict</th>');
    expect(html).not.toContain('<th scope="col">Verdict</th>');
    expect(html).toContain('<th scope="col" class="num">Difference [95% Welch t-interval]<br>unadjusted</th>');
    expect(html).toContain('<th scope="col" class="num">Step</th>');
    expect(textOf(html)).toContain('A statistical test is evidence, not proof');
    expect(textOf(html)).toContain(
      'unequal seed counts: 1 comparison. val_acc, memory=8 v memory=4: Unequal seeds: 7 v 5.',
    );
    // Grouped by kind: the diverged-run line of both metrics is one item naming both comparisons.
    expect(textOf(html)).toContain(
      'failed runs: 2 comparisons. val_acc, memory=12 v memory=4; train_loss, memory=12 v memory=4: 1 diverged run',
    );
  });

  it('filters to one metric, and shows tasks and non-inferiority when Results has them', async () => {
    const base = sampleResults();
    const [first, second] = base.comparisons as [Comparison, Comparison];
    const results: Results = {
      ...base,
      comparisons: [
        { ...first, task: 'glyphs', nonInferiority: { margin: 0.5, test: 'welch', p: 0.012, holds: true } },
        { ...second, task: 'glyphs', nonInferiority: { margin: 0.5, test: 'paired-t', p: 0.3, holds: false } },
      ],
    };
    const html = await renderCells('{{verdicts "val_acc"}}', results);
    expect(html).toContain('<th scope="col">Task</th>');
    expect(rows(html)[0]).toContain('against memory=4 glyphs memory=8 ● inconclusive');
    expect(rows(html)[0]).toContain("not worse by more than 0.5 (Welch's t, p 0.012)");
    expect(rows(html)[1]).toContain('not shown to be within 0.5 (paired t, p 0.3');
    expect(rows(await renderCells('{{verdicts "train_loss"}}', base))).toHaveLength(2);
  });

  it('says so when there are no comparisons', async () => {
    const html = await renderCells('{{verdicts}}', { ...sampleResults(), comparisons: [] });
    expect(textOf(html)).toContain('No comparisons');
  });
});
