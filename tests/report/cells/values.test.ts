/**
 * The values cell: every per-run value by seed, unused values marked, and each config's mean with
 * its interval as Results.configValues holds it. Expected numbers: memory=4's val_acc values are
 * METHODS.md's sample B, mean 69.5857; the fixture's 95% t-interval uses t(0.975, 6) = 2.446912
 * (40-digit mpmath root rounded, tests/reference/t_family_reference.py):
 * 69.5857 ± 2.446912 x 1.08847 / sqrt(7) = [68.58, 70.59].
 */
import { describe, expect, it } from 'vitest';
import { sampleResults } from '../sampleResults.js';
import { renderCells, textOf } from './renderCells.js';

describe('{{values}}', () => {
  it('lists values by seed with the config mean and interval', async () => {
    const html = await renderCells('{{values "val_acc"}}', sampleResults());
    const body = /<tbody>([\s\S]*?)<\/tbody>/.exec(html)?.[1] ?? '';
    const rows = [...body.matchAll(/<tr>([\s\S]*?)<\/tr>/g)].map((m) => textOf(m[1] ?? ''));
    expect(rows[0]).toBe(
      'memory=4 7 of 7 69.59 [68.58, 70.59] seed 1: 68.90 , seed 2: 70.10 , seed 3: 69.50 , seed 4: 71.00 , ' +
        'seed 5: 67.80 , seed 6: 70.60 , seed 7: 69.20',
    );
    expect(rows[2]).toContain('4 of 5');
    expect(html).toContain('<span class="value unused">seed 5: — (diverged at step 6000: excluded)</span>');
    expect(html).toContain('Mean [95% t-interval]');
    expect(html.match(/<figure class="chart"/g)).toHaveLength(1);
  });
});
