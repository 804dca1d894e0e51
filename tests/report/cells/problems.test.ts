/** The problems cell: errors first, each with where it happened and what to do (src/problems.ts PROBLEM_CODES). */
import { describe, expect, it } from 'vitest';
import { PROBLEM_CODES } from '../../../src/problems.js';
import { sampleResults } from '../sampleResults.js';
import { renderCells, textOf } from './renderCells.js';

describe('{{problems}}', () => {
  it('lists problems by severity with file:line, run and the action for their code', async () => {
    const html = await renderCells('{{problems}}', sampleResults());
    const rows = [...html.matchAll(/<tr class="severity-(\w+)">([\s\S]*?)<\/tr>/g)];
    expect(rows.map((m) => m[1])).toEqual(['error', 'warning', 'warning', 'note', 'note']);
    const malformed = textOf(rows[2]?.[2] ?? '');
    expect(malformed).toContain('runs/memory=8/seed=2/log.csv:42');
    expect(malformed).toContain(PROBLEM_CODES['row-malformed'].action);
    expect(textOf(rows[1]?.[2] ?? '')).toContain('run memory=12,seed=5');
  });

  it('folds the notes away under a count by code when there are many, keeping errors and warnings open', async () => {
    const base = sampleResults();
    const notes = Array.from({ length: 12 }, (_, i) => ({
      severity: 'note' as const,
      code: 'cells-missing' as const,
      message: `cells treated as missing: ${i}`,
    }));
    const html = await renderCells('{{problems}}', { ...base, problems: [...base.problems, ...notes] });
    const [open, folded] = html.split('<details class="fold">');
    expect([...(open ?? '').matchAll(/<tr class="severity-(\w+)">/g)].map((m) => m[1])).toEqual([
      'error',
      'warning',
      'warning',
    ]);
    expect(textOf(/<summary>([\s\S]*?)<\/summary>/.exec(folded ?? '')?.[1] ?? '')).toBe(
      '14 notes: steps-duplicated 1, goal-inferred 1, cells-missing 12',
    );
    expect([...(folded ?? '').matchAll(/<tr class="severity-note">/g)]).toHaveLength(14);
  });

  it('says when there are none', async () => {
    expect(textOf(await renderCells('{{problems}}', { ...sampleResults(), problems: [] }))).toBe(
      'No problems found in the input.',
    );
  });
});
