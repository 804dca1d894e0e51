/** The runs cell: every run with its status; long lists start folded. */
import { describe, expect, it } from 'vitest';
import type { Results } from '../../../src/analysis/results.js';
import { sampleResults } from '../sampleResults.js';
import { renderCells, textOf } from './renderCells.js';

describe('{{runs}}', () => {
  it('lists every run, counts statuses, and marks the diverged run with its step', async () => {
    const html = await renderCells('{{runs}}', sampleResults());
    expect(html.match(/<tr class="status-/g)).toHaveLength(17);
    expect(html).toContain('<details class="fold" open>');
    expect(textOf(html)).toContain('17 runs in 3 configs (16 ok, 1 diverged); 17 of 18 files read.');
    const diverged = /<tr class="status-diverged">([\s\S]*?)<\/tr>/.exec(html)?.[1] ?? '';
    expect(textOf(diverged)).toBe(
      'memory=12 5 diverged 5500 6000 runs/memory=12/seed=5/log.csv train_loss went non-finite at step 6000 ' +
        'and stayed so',
    );
  });

  it('folds a long list', async () => {
    const r = sampleResults();
    const many: Results = { ...r, runs: Array.from({ length: 3 }, () => r.runs).flat() };
    expect(await renderCells('{{runs}}', many)).toContain('<details class="fold">');
  });
});
