/** The methods cell says what ran, from Results.settings (METHODS.md "Defaults" names the methods). */
import { describe, expect, it } from 'vitest';
import { summaryWords } from '../../../src/report/cells/methods.js';
import { sampleResults } from '../sampleResults.js';
import { renderCells, textOf } from './renderCells.js';

describe('{{methods}}', () => {
  it('names the tests, the correction, the interval rule, seeds, alpha, summary and diverged policy', async () => {
    const text = textOf(await renderCells('{{methods}}', sampleResults()));
    for (const phrase of [
      "Welch's t-test, two-sided",
      'exact permutation test',
      'Mann-Whitney U test',
      'Holm (1979) correction',
      'Welch t-interval while either arm has fewer than 20 runs',
      'BCa bootstrap interval (Efron 1987; 10000 resamples) at 20 runs or more',
      'bootstrap with 2000 resamples',
      'alpha = 0.05',
      '(--summary final)',
      'by default it is left out of the value statistics',
      '(--seed 1)',
      'A statistical test is evidence, not proof',
      'a verdict from 3 seeds per arm is fragile',
    ]) {
      expect(text).toContain(phrase);
    }
  });

  it('follows the settings: BH, worst, paired, margin, task key', async () => {
    const r = sampleResults();
    const settings = {
      ...r.settings,
      correction: 'bh' as const,
      diverged: 'worst' as const,
      paired: true,
      margin: 0.5,
      taskKey: 'task',
      bootstrapFrom: 30,
    };
    const text = textOf(await renderCells('{{methods}}', { ...r, settings }));
    for (const phrase of [
      'Benjamini and Hochberg (1995) correction',
      'counts as the worst value observed',
      'paired t-test and the Wilcoxon signed-rank test',
      'not worse than the baseline by more than 0.5',
      'Comparisons run per value of task',
      'fewer than 30 runs',
    ]) {
      expect(text).toContain(phrase);
    }
  });

  it('describes each summary kind of DESIGN.md', () => {
    expect(summaryWords('last:10%')).toBe('the mean of the last 10% of logged steps up to the common horizon');
    expect(summaryWords('reach:0.9')).toContain('reaches 0.9');
    expect(summaryWords('step:5000')).toBe('the value at step 5000');
    expect(summaryWords('best')).toContain('optimistic');
  });
});
