/**
 * The curves cell's folded table: per config the last bin with a mean, that mean with its band and
 * the runs it rests on, read straight off `Results.curves` (the expected cells are taken from the
 * curve arrays by hand: the last non-null bin).
 */
import { describe, expect, it } from 'vitest';
import { CURVE_ROWS } from '../../../src/report/cells/curves.js';
import { sampleResults } from '../sampleResults.js';
import { renderCells, textOf } from './renderCells.js';

describe('{{curves}}', () => {
  it('folds a table of each curve at its last step with a mean', async () => {
    const r = sampleResults();
    const metric = r.curves[0]?.metric as string;
    const mine = r.curves.filter((c) => c.metric === metric);
    const html = await renderCells(`{{curves "${metric}"}}`, r);
    expect(html).toContain(`<details class="fold"><summary>The numbers of the curves of ${metric} as a table`);
    const rows = [...html.matchAll(/<table class="curves">[\s\S]*?<\/table>/g)].map((m) => m[0]);
    expect(rows).toHaveLength(1);
    const body = [...(rows[0] ?? '').matchAll(/<tr>([\s\S]*?)<\/tr>/g)].slice(1).map((m) => textOf(m[1] ?? ''));
    expect(body).toHaveLength(Math.min(mine.length, CURVE_ROWS));
    for (const [k, c] of mine.entries()) {
      let i = c.mean.length - 1;
      while (i >= 0 && c.mean[i] === null) i--;
      expect(body[k]?.startsWith(`${c.config} ${c.steps[i]} `), body[k]).toBe(true);
      expect(body[k]?.endsWith(` ${c.n[i]}`), body[k]).toBe(true);
    }
  });
});
