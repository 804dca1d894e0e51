/** The methods cell says what ran, from Results.settings (METHODS.md "Defaults" names the methods). */
import { describe, expect, it } from 'vitest';
import { describeSummary } from '../../../src/analysis/summaryKinds.js';
import { parseSummary } from '../../../src/analysis/summarySpec.js';
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
      'The interval of a difference is the Welch t-interval at every number of seeds, at 95% (1 - alpha). ' +
        'It is unadjusted',
      'simultaneous (Bonferroni, 1 - alpha/m for a family of m) bounds',
      'From 10 runs per arm the BCa bootstrap interval (10000 resamples) is shown beside',
      'across the comparisons of one metric and one summary over all tasks',
      'Each comparison has its own step',
      'alpha = 0.05',
      '(--summary final)',
      'by default it is left out of the values',
      "Fisher's exact test",
      'candidate minus baseline in the metric',
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
      failed: 'worst' as const,
      family: 'task' as const,
      paired: true,
      margin: 0.5,
      taskKey: 'task',
      bootstrapFrom: 30,
    };
    const text = textOf(await renderCells('{{methods}}', { ...r, settings }));
    for (const phrase of [
      'Benjamini and Hochberg (1995) correction',
      'scored as the worst value observed',
      'the paired t-test on the seeds present in both arms decides instead',
      'not worse than the baseline by more than 0.5',
      'Comparisons run per value of task',
      'within each task alone (--family task',
      'From 30 runs per arm',
    ]) {
      expect(text).toContain(phrase);
    }
  });

  it('describes each summary kind of DESIGN.md (from the summary kinds table, through Results)', () => {
    const words = (t: string): string => describeSummary(parseSummary(t));
    expect(words('last:10%')).toBe(
      "the mean of the values logged in the last 10% of the steps up to the comparison's step",
    );
    expect(words('reach:0.9')).toContain('first reaches 0.9');
    expect(words('reach:0.9')).toContain('log-rank');
    expect(words('step:5000')).toContain('step 5000');
    expect(words('best')).toContain('optimistic');
  });
});
