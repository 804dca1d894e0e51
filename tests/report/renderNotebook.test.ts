/**
 * Notebooks: prose, cells and charts render together; mistakes in a notebook (a misspelled cell,
 * a metric that does not exist, bad arguments, broken template syntax) are SeedsiftErrors that
 * name the notebook file and the line of the mistake, counted in the file (front matter included).
 */
import { describe, expect, it } from 'vitest';
import type { Results } from '../../src/analysis/results.js';
import { SeedsiftError } from '../../src/problems.js';
import { parseNotebook } from '../../src/report/parseNotebook.js';
import { renderNotebook } from '../../src/report/renderNotebook.js';
import { sampleResults, sampleResultsWithoutTicks } from './sampleResults.js';

async function render(source: string, results: Results = sampleResults()): Promise<string> {
  return (await renderNotebook(results, parseNotebook(source, 'studies/memory.md'), 'Memory study')).html;
}

async function failure(source: string): Promise<SeedsiftError> {
  try {
    await render(source);
  } catch (error) {
    if (error instanceof SeedsiftError) return error;
    throw error;
  }
  throw new Error('expected the notebook to fail');
}

/** 1-based line of the first line containing `needle`. */
function lineOf(source: string, needle: string): number {
  return source.split('\n').findIndex((l) => l.includes(needle)) + 1;
}

const STUDY = `---
title: Memory length study
baseline: memory=4
metrics: { val_acc: max, train_loss: min }
---
# Does a longer memory help?

We trained each memory length with *several seeds*; the table says whether any change beats seed noise.

{{verdicts}}

## Accuracy

{{curves "val_acc"}}

{{compare "val_acc"}}

## Loss

Loss is lower for memory=8:

{{values "train_loss"}}
`;

describe('renderNotebook: a notebook with prose, two metrics and a custom baseline', () => {
  it('renders prose, cells and charts in notebook order', async () => {
    const nb = parseNotebook(STUDY, 'studies/memory.md');
    expect(nb.options.baseline).toBe('memory=4');
    const { html, charts } = await renderNotebook(sampleResults(), nb, nb.options.title ?? '');
    expect(charts).toBe(3);
    expect(html).toContain('<h1 id="does-a-longer-memory-help">Does a longer memory help?</h1>');
    expect(html).toContain('<em>several seeds</em>');
    const order = [
      'class="verdicts-cell"',
      'id="accuracy"',
      'id="chart-1"',
      'id="chart-2"',
      'id="loss"',
      'Loss is lower',
      'id="chart-3"',
    ].map((s) => html.indexOf(s));
    expect(order.every((i) => i >= 0)).toBe(true);
    expect([...order].sort((a, b) => a - b)).toEqual(order);
    // Both metrics in the verdict table; the baseline of Results in every row.
    expect(html.match(/<tr class="row-/g)).toHaveLength(4);
    expect(html).toContain('<bdi class="name">train_loss</bdi>');
    // Each chart: an SVG with drawn marks and its compiled Vega spec beside it.
    expect(html.match(/<div class="chart-view" data-chart="\d+"><svg/g)).toHaveLength(3);
    expect(html.match(/<script type="application\/json" class="chart-spec">/g)).toHaveLength(3);
    expect(html).not.toMatch(/seedsift-(cell|chart)/);
  });

  it('renders #each over the metrics with a heading per metric', async () => {
    const html = await render('{{#each scalarMetrics}}\n{{metric name}}\n{{/each}}\n');
    expect(html).toContain('<h2 id="metric-val-acc" class="metric-heading"><bdi class="name">val_acc</bdi></h2>');
    expect(html).toContain('lower is better (guessed from the name; if wrong, say --metric train_loss:max)');
  });
});

describe('renderNotebook: mistakes name the notebook line', () => {
  it('a misspelled cell', async () => {
    const source = STUDY.replace('{{compare "val_acc"}}', '{{compair "val_acc"}}');
    const e = await failure(source);
    expect(e.code).toBe('notebook');
    expect(e.file).toBe('studies/memory.md');
    expect(e.line).toBe(lineOf(source, '{{compair'));
    const cells = "^unknown cell or field 'compair'; the cells are overview, aggregates, sweep, verdicts, ";
    expect(e.message).toMatch(new RegExp(`${cells}.*\\(studies/memory\\.md:16\\)$`));
  });

  it('a misspelled cell without arguments, and one inside #each', async () => {
    const bare = '---\ntitle: x\n---\nprose\n\n{{verdict}}\n';
    expect((await failure(bare)).line).toBe(6);
    const loop = 'intro\n{{#each scalarMetrics}}\n{{curves name}}\n{{valuse name}}\n{{/each}}\n';
    const e = await failure(loop);
    expect(e.line).toBe(4);
    expect(e.message).toContain("'valuse'");
  });

  it('a misspelled metric', async () => {
    const source = STUDY.replace('{{values "train_loss"}}', '{{values "train_los"}}');
    const e = await failure(source);
    expect(e.code).toBe('notebook');
    expect(e.line).toBe(lineOf(source, 'train_los"'));
    expect(e.message).toContain(
      "{{values}}: no metric 'train_los' in these runs; the metrics are 'val_acc', 'train_loss', 'tick_acc'",
    );
  });

  it('wrong arguments, an unknown option, a summary the results do not hold', async () => {
    expect((await failure('a\n{{curves}}\n')).message).toContain(
      '{{curves}}: expected 1 argument ({{curves "METRIC"}}), got 0',
    );
    expect((await failure('a\n\n{{curves "val_acc" colour="red"}}\n')).line).toBe(3);
    const summary = await failure('{{compare "val_acc" summary="last:10%"}}\n');
    expect(summary.message).toContain("no results for 'val_acc' under summary 'last:10%'; these results hold 'final'");
    expect((await failure('x\n{{#curves "val_acc"}}y{{/curves}}\n')).message).toContain(
      'curves is a cell, not a block',
    );
  });

  it('template syntax errors', async () => {
    const e = await failure('---\ntitle: t\n---\nline one\n{{curves "val_acc"\n');
    expect(e.code).toBe('notebook');
    expect(e.line).toBe(5);
    expect(e.message).toMatch(/^template syntax: expected /);
  });
});

describe('renderNotebook: tick-level cells without tick data', () => {
  it('say that the runs hold no tick data', async () => {
    const html = await render('{{ticks}}\n\n{{halting}}\n\n{{calibration}}\n', sampleResultsWithoutTicks());
    expect(html.match(/No tick data in these runs/g)).toHaveLength(3);
    expect(html).not.toContain('<figure');
  });
});
