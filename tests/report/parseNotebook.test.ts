/**
 * Notebook front matter: DESIGN.md's example notebook is read as written there, and mistakes are
 * reported with the notebook's file and 1-based line.
 */
import { describe, expect, it } from 'vitest';
import { SeedsiftError } from '../../src/problems.js';
import { parseNotebook } from '../../src/report/parseNotebook.js';

/** DESIGN.md, section "Notebook", verbatim. */
const DESIGN_EXAMPLE = `---
title: Does a longer activation memory help?
runs: ./runs
baseline: memory=4
metrics: { val_acc: max, train_loss: min }
---
# Memory length study
{{curves "val_acc"}}
{{compare "val_acc" summary="last:10%"}}
{{ticks "val_acc"}}
`;

function errorOf(source: string): SeedsiftError {
  try {
    parseNotebook(source, 'study.md');
  } catch (error) {
    if (error instanceof SeedsiftError) return error;
    throw error;
  }
  throw new Error('expected a SeedsiftError');
}

describe('parseNotebook', () => {
  it("reads DESIGN.md's example notebook", () => {
    const nb = parseNotebook(DESIGN_EXAMPLE, 'study.md');
    expect(nb.options).toEqual({
      title: 'Does a longer activation memory help?',
      runs: ['./runs'],
      baseline: 'memory=4',
      metricGoals: ['val_acc:max', 'train_loss:min'],
    });
    expect(nb.body.startsWith('# Memory length study\n')).toBe(true);
    expect(nb.bodyLine).toBe(7);
    expect(DESIGN_EXAMPLE.split('\n')[nb.bodyLine - 1]).toBe('# Memory length study');
  });

  it('returns option names in camelCase with values as written, for the command line to merge and check', () => {
    const nb = parseNotebook(
      '---\nalpha: 0.01\nseed: 7\npaired: true\ncorrection: bh\ntask-key: task\nfail-on: worse\nsummary: ' +
        'last:10%\nby: [model, task]\nruns: [a, b]\nhalting-thresholds: [0.5, 0.9]\n---\nx',
      'n.md',
    );
    expect(nb.options).toEqual({
      alpha: 0.01,
      seed: 7,
      paired: true,
      correction: 'bh',
      taskKey: 'task',
      failOn: 'worse',
      summary: 'last:10%',
      by: 'model,task',
      runs: ['a', 'b'],
      haltingThresholds: '0.5,0.9',
    });
    expect(parseNotebook('---\ntaskKey: t\n---\n', 'n.md').options).toEqual({ taskKey: 't' });
  });

  it('treats a file without front matter as all body', () => {
    const nb = parseNotebook('# Only prose\n{{verdicts}}\n', 'n.md');
    expect(nb).toEqual({ file: 'n.md', options: {}, body: '# Only prose\n{{verdicts}}\n', bodyLine: 1 });
    expect(parseNotebook('---\n---\nbody', 'n.md')).toEqual({ file: 'n.md', options: {}, body: 'body', bodyLine: 3 });
  });

  it('reports an unknown key with its line', () => {
    const e = errorOf('---\ntitle: x\nbaseline: a=1\naplha: 0.01\n---\n');
    expect(e.code).toBe('notebook');
    expect(e.line).toBe(4);
    expect(e.file).toBe('study.md');
    expect(e.message).toMatch(/unknown key 'aplha'.*\(study\.md:4\)$/);
  });

  it('reports a goal other than max or min, and values of the wrong shape, with their lines', () => {
    const goal = errorOf('---\nmetrics:\n  val_acc: max\n  loss: up\n---\n');
    expect(goal.line).toBe(4);
    expect(goal.message).toContain('max or min for loss, got up');
    expect(errorOf('---\ntitle: x\nalpha: [1, 2]\n---\n').line).toBe(3);
    expect(errorOf('---\nbaseline: true\n---\n').message).toContain('front matter baseline: expected text');
  });

  it('reports YAML that does not parse, and an unclosed front matter', () => {
    const bad = errorOf('---\ntitle: x\nmetrics: { a: max\n---\n# x\n');
    expect(bad.code).toBe('notebook');
    expect(bad.line).toBeGreaterThanOrEqual(3);
    expect(errorOf('---\ntitle: x\n# no closing line\n').line).toBe(1);
    expect(errorOf('---\n- a\n- b\n---\n').message).toContain('expected key: value lines');
  });
});
