/**
 * summary.md, read back the way a reviewer's tools read it: rendered with markdown-it (CommonMark
 * with GFM tables). Expected numbers: the val_acc memory=8 v memory=4 row carries METHODS.md's
 * Welch check values for samples A and B (scipy 1.10.1): difference 1.7142857 with 95% interval
 * (0.0575028, 3.3710686), two-sided p 0.0441811, which Holm over the metric's two comparisons
 * doubles to 0.0883621 (Holm 1979: the smaller of two p-values is multiplied by 2).
 */
import MarkdownIt from 'markdown-it';
import { describe, expect, it } from 'vitest';
import type { Results } from '../../src/analysis/results.js';
import { summaryMarkdown } from '../../src/report/summaryMarkdown.js';
import { SAMPLE_NAMES, sampleResults } from './sampleResults.js';

const md = new MarkdownIt();

function decode(html: string): string {
  return html
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&quot;/g, '"')
    .replace(/&#39;/g, "'")
    .replace(/&amp;/g, '&');
}

/**
 * Verdict tables of the rendered Markdown (those headed Baseline; the overview's come before them):
 * rows of cell texts (header row first).
 */
function tables(markdown: string): string[][][] {
  return allTables(markdown).filter((t) => t[0]?.[0] === 'Baseline');
}

/** Every table of the rendered Markdown. */
function allTables(markdown: string): string[][][] {
  const html = md.render(markdown);
  return [...html.matchAll(/<table>([\s\S]*?)<\/table>/g)].map((t) =>
    [...(t[1] ?? '').matchAll(/<tr>([\s\S]*?)<\/tr>/g)].map((r) =>
      [...(r[1] ?? '').matchAll(/<t[hd][^>]*>([\s\S]*?)<\/t[hd]>/g)].map((c) =>
        decode((c[1] ?? '').replace(/<[^>]*>/g, '')),
      ),
    ),
  );
}

describe('summaryMarkdown', () => {
  const text = summaryMarkdown(sampleResults());
  const rendered = tables(text);

  it('renders one GFM table per metric with the verdict columns', () => {
    expect(rendered).toHaveLength(2);
    expect(rendered[0]?.[0]).toEqual([
      'Baseline',
      'Candidate',
      'Step',
      'Difference [95% Welch t-interval, unadjusted]',
      'p (Holm-adjusted)',
      'Verdict',
      'Seeds',
    ]);
    expect(md.render(text)).toContain('<h3>val_acc (higher is better; summary final; family of 2 comparisons)</h3>');
  });

  it('shows the METHODS.md Welch values for A v B, Holm-adjusted (scipy 1.10.1)', () => {
    expect(rendered[0]?.[1]).toEqual([
      'memory=4',
      'memory=8',
      '1000',
      '+1.71 [0.06, 3.37]',
      '0.088',
      "● inconclusive (Welch's t)",
      '7 v 5',
    ]);
  });

  it('notes diverged runs in the seeds column and gives every verdict its word', () => {
    expect(rendered[0]?.[2]?.[6]).toBe('7 v 4 (1 diverged in the candidate, excluded)');
    // failure counts with Fisher's exact test beside the verdict (scipy fisher_exact([[0, 7], [1, 5]]) = 0.4615)
    expect(rendered[0]?.[2]?.[5]).toBe("● inconclusive (Welch's t) (failed 0/7 v 1/5, Fisher p 0.462)");
    expect(rendered[1]?.map((r) => r[5]?.split(' (')[0])).toEqual(['Verdict', '▲ better', '▼ worse']);
    expect(rendered[1]?.[1]?.[4]).toBe('< 0.001');
  });

  it('lists the caution lines and ends with the standard caution', () => {
    // One item per kind of caution, with the number of comparisons it concerns (sampleResults: kinds per comparison).
    expect(text).toContain('- **unequal seed counts: 1 comparison**. memory=8 v memory=4: Unequal seeds: 7 v 5.');
    expect(text).toContain(
      '- **failed runs: 1 comparison**. memory=12 v memory=4: 1 diverged run in the candidate was excluded.',
    );
    expect(text.trimEnd().split('\n').at(-1)).toMatch(/^> A statistical test is evidence, not proof/);
  });

  it('keeps pipes, newlines and markup in names as text in their cells', () => {
    const names = {
      ...SAMPLE_NAMES,
      configs: ['a|b\nc', '<script>alert(1)</script>', '*x* [y](javascript:z) @team #1'] as const,
    };
    const hostile = summaryMarkdown(sampleResults(names));
    const html = md.render(hostile);
    expect(html).not.toContain('<script>');
    expect(html).not.toMatch(/<a |<em>/);
    const [first] = tables(hostile);
    expect(first?.[1]?.slice(0, 2)).toEqual(['a|b c', '<script>alert(1)</script>']);
    expect(first?.[2]?.[1]).toBe('*x* [y](javascript:z) @team #1');
    for (const row of first ?? []) expect(row).toHaveLength(7);
  });

  it('says so when there is nothing to compare', () => {
    const empty: Results = { ...sampleResults(), comparisons: [] };
    expect(summaryMarkdown(empty)).toContain('No comparisons');
    expect(allTables(summaryMarkdown(empty))).toHaveLength(0);
  });
});

describe('summaryMarkdown cautions', () => {
  it('lists a caution shared by every comparison of a metric once, and others with the pairs they concern', () => {
    const base = sampleResults();
    const metric = base.comparisons[0]?.metric as string;
    const ofMetric = base.comparisons.filter((c) => c.metric === metric);
    const comparisons = base.comparisons.map((c) =>
      c.metric !== metric
        ? c
        : {
            ...c,
            cautions: ['shared line', ...(c === ofMetric[0] ? ['only the first'] : [])],
            cautionKinds: ['goal-guessed', ...(c === ofMetric[0] ? ['fragile'] : [])],
          },
    );
    const text = summaryMarkdown({ ...base, comparisons } as Results);
    expect(text.split('shared line').length - 1).toBe(1);
    expect(text).toContain(`- **goal guessed from the name: all ${ofMetric.length} comparisons**. shared line`);
    expect(text).toContain('- **fragile verdict: 1 comparison**.');
    expect(text.split('only the first').length - 1).toBe(1);
  });
});
