/**
 * The ticks cell: which noise each band shows (between seeds; between examples when known, else
 * said to be unknown), runs of ticks that differ from the baseline as ranges, and a summary step
 * that differs between runs said in words. Text checks on the rendered cell (sampleResults).
 */
import { describe, expect, it } from 'vitest';
import type { Results, TickCurve } from '../../../src/analysis/results.js';
import { sampleResults } from '../sampleResults.js';
import { renderCells, textOf } from './renderCells.js';

function rows(html: string): string[] {
  const table = /<table class="ticks">([\s\S]*?)<\/table>/.exec(html)?.[1] ?? '';
  return [...table.matchAll(/<tr>([\s\S]*?)<\/tr>/g)].slice(1).map((m) => textOf(m[1] ?? ''));
}

function withTicks(r: Results, map: (t: TickCurve, k: number) => TickCurve): Results {
  return { ...r, ticks: r.ticks.map(map) };
}

describe('{{ticks}}', () => {
  it('says the band is between seeds and the whiskers between examples when m is known', async () => {
    const text = textOf(await renderCells('{{ticks}}', sampleResults()));
    expect(text).toContain(
      'Which noise: the 95% t-interval band is the spread between seeds (training the same config again), the ' +
        'noise the tests weigh.',
    );
    expect(text).toContain(
      'The dotted whiskers are the between-example spread of one evaluation, ±1 standard error √(p(1−p)/m) for ' +
        'm examples',
    );
  });

  it(
    'says the between-example spread is not known when no config has it, and for how many configs when some ' +
      'have it',
    async () => {
      const none = textOf(
        await renderCells(
          '{{ticks}}',
          withTicks(sampleResults(), (t) => ({ ...t, exampleHalfWidth: null })),
        ),
      );
      expect(none).toContain(
        'The between-example spread of one evaluation (how much tick_acc would move on other examples) is not ' +
          'shown: the logs do not say on how many examples it was measured.',
      );
      expect(none).not.toContain('whiskers');
      const some = textOf(
        await renderCells(
          '{{ticks}}',
          withTicks(sampleResults(), (t, k) => (k === 0 ? t : { ...t, exampleHalfWidth: null })),
        ),
      );
      expect(some).toContain('(known for 1 of 3 configs)');
    },
  );

  it('gives consecutive ticks with one verdict as a range, with the largest adjusted p', async () => {
    const results = withTicks(sampleResults(), (t, k) =>
      k !== 1
        ? t
        : {
            ...t,
            versusBaseline: t.ticks.map((tick) => ({
              tick,
              difference: -0.1,
              pAdjusted: tick < 3 ? 0.0004 : tick === 3 ? 0.2 : tick < 6 ? ([0.004, 0.012][tick - 4] ?? null) : 0.03,
              verdict:
                tick < 3
                  ? ('worse' as const)
                  : tick === 3
                    ? ('inconclusive' as const)
                    : tick < 6
                      ? ('better' as const)
                      : ('worse' as const),
            })),
          },
    );
    const r = rows(await renderCells('{{ticks}}', results));
    expect(r[0]).toContain('baseline');
    expect(r[1]).toContain(
      'worse at ticks 0–2 (adjusted p < 0.001 at each); better at ticks 4–5 (adjusted p ≤ 0.012 at each); ' +
        'worse at ticks 6–7 (adjusted p ≤ 0.030 at each)',
    );
    expect(r[2]).toContain('no tick differs after Holm adjustment');
  });

  it('says "not compared" rather than "baseline" when no curve was compared (no single baseline config)', async () => {
    const base = sampleResults();
    const results = { ...base, ticks: base.ticks.map((t) => ({ ...t, versusBaseline: null })) };
    const r = rows(await renderCells('{{ticks}}', results));
    expect(r.length).toBeGreaterThan(0);
    for (const row of r) {
      expect(row).toContain('not compared (no single baseline config)');
      expect(row).not.toMatch(/ baseline$/);
    }
  });

  it('says when runs were read at different steps', async () => {
    const r = rows(
      await renderCells(
        '{{ticks}}',
        withTicks(sampleResults(), (t, k) => (k === 2 ? { ...t, step: null } : t)),
      ),
    );
    expect(r[2]).toContain('each run’s last (they differ)');
    expect(r[0]).toContain('10000');
  });
});
