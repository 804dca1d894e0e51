/**
 * The halting cell: intervals named as across seeds, and beside them the between-example standard
 * error √(p(1−p)/m) of one run's accuracy on its m samples (binomial standard error, e.g.
 * Agresti, "Categorical Data Analysis", section 1.3; the value below worked by hand).
 */
import { describe, expect, it } from 'vitest';
import type { HaltingCurve, Results } from '../../../src/analysis/results.js';
import { sampleResults } from '../sampleResults.js';
import { renderCells, textOf } from './renderCells.js';

function table(html: string): { head: string[]; rows: string[][] } {
  const t = /<table class="halting">([\s\S]*?)<\/table>/.exec(html)?.[1] ?? '';
  const head = [...t.matchAll(/<th[^>]*>([\s\S]*?)<\/th>/g)].map((m) => textOf(m[1] ?? ''));
  const rows = [...t.matchAll(/<tr>([\s\S]*?)<\/tr>/g)]
    .slice(1)
    .map((m) => [...(m[1] ?? '').matchAll(/<td[^>]*>([\s\S]*?)<\/td>/g)].map((c) => textOf(c[1] ?? '')));
  return { head, rows };
}

describe('{{halting}}', () => {
  it(
    'gives the between-example standard error of one run beside the interval across seeds, and says which ' +
      'noise is which',
    async () => {
      const base = sampleResults();
      const first = base.halting[0] as HaltingCurve;
      const at = first.thresholds.indexOf(first.exitHistogram.threshold);
      // Accuracy 0.824 on m = 300 samples per run: √(0.824 × 0.176 / 300) = √0.000483413 = 0.021987.
      const results: Results = {
        ...base,
        halting: [
          {
            ...first,
            samples: 300,
            accuracy: first.accuracy.map((a, i) => (i === at ? { mean: 0.824, low: 0.803, high: 0.845 } : a)),
          },
          ...base.halting.slice(1),
        ],
      };
      const html = await renderCells('{{halting}}', results);
      const { head, rows } = table(html);
      expect(head).toEqual([
        'Config',
        'Seeds',
        'Samples per run',
        'Ticks',
        'Threshold',
        'Accuracy at exit [95% across seeds]',
        'Between-example SE (one run)',
        'Mean exit tick [95% across seeds]',
      ]);
      expect(rows[0]?.slice(5, 7)).toEqual(['0.824 [0.803, 0.845]', '0.022']);
      expect(textOf(html)).toContain(
        'Which noise: the bars are 95% intervals across seeds (the spread between training runs).',
      );
      expect(textOf(html)).toContain(
        "between-example standard error √(p(1−p)/m) of one run's accuracy on its m samples",
      );
    },
  );

  it('leaves the standard error out when the reference threshold has no accuracy', async () => {
    const base = sampleResults();
    const results: Results = {
      ...base,
      halting: base.halting.map((h) => ({
        ...h,
        accuracy: h.accuracy.map(() => ({ mean: null, low: null, high: null })),
      })),
    };
    const { rows } = table(await renderCells('{{halting}}', results));
    expect(rows[0]?.slice(5, 7)).toEqual(['—', '—']);
  });
});
