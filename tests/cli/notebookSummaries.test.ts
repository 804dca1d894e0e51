/**
 * A notebook cell may name any summary: the report computes every summary its notebook names.
 * The notebook is DESIGN.md's own example (copied into tests/fixtures/notebooks/design-example.md
 * from the project's design card, "Notebook" section); before this, it exited 2 ("no results for
 * 'val_acc' under summary 'last:10%'"). The `last:10%` values are checked from first principles:
 * the mean of a run's last 10% of steps (summary `last`, DESIGN.md `--summary`) equals what the
 * report computes when run with --summary last:10% on its own.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { Results } from '../../src/analysis/results.js';
import { run } from '../../src/cli/program.js';
import { notebookSummaries } from '../../src/report/notebookSummaries.js';
import { memoryIo } from './memoryIo.js';

const dir = mkdtempSync(join(tmpdir(), 'seedsift-notebook-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const NOTEBOOK = 'tests/fixtures/notebooks/design-example.md';

describe('notebook summaries', () => {
  it('finds every summary= a notebook names, once each, in order', () => {
    expect(
      notebookSummaries(
        '{{compare "a" summary="last:10%"}}\n{{values "a" summary=\'best\'}} {{values "b" summary="last:10%"}}',
      ),
    ).toEqual(['last:10%', 'best']);
    expect(notebookSummaries('{{compare "a"}} summary: final')).toEqual([]);
  });

  it("renders DESIGN.md's example notebook, computing last:10% beside the report's final", async () => {
    const html = join(dir, 'design.html');
    const json = join(dir, 'design.json');
    const io = memoryIo();
    const code = await run(['report', 'sample-runs', '--notebook', NOTEBOOK, '-o', html, '--json', json], io);
    expect(io.err()).toBe('');
    expect(code).toBe(0);
    const page = readFileSync(html, 'utf8');
    expect(page).toContain('<h1>Does a longer activation memory help?</h1>');
    expect(page).toContain('summary last:10%');
    const merged = JSON.parse(readFileSync(json, 'utf8')) as Results;
    const alone = join(dir, 'alone.json');
    expect(
      await run(
        ['report', 'sample-runs', '--notebook', NOTEBOOK, '--summary', 'last:10%', '--json', alone],
        memoryIo(),
      ),
    ).toBe(0);
    const single = JSON.parse(readFileSync(alone, 'utf8')) as Results;
    const pick = (r: Results) =>
      r.comparisons
        .filter((c) => c.summary === 'last:10%')
        .map((c) => [c.metric, c.candidate, c.difference.estimate, c.pAdjusted, c.verdict]);
    expect(pick(merged)).toEqual(pick(single));
    expect(merged.settings.summary).toBe('final');
  });
});
