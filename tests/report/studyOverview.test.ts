/**
 * The overview, aggregates and sweep outputs on small generated studies analysed by the real
 * pipeline (tests/support/studyGenerator.ts). Expected values come from first principles: counts of
 * verdicts are counts of `Results.comparisons`; the family of the adjustment is every comparison of
 * one metric and summary (METHODS.md, "Multiple comparisons"); the planted effects say which
 * method must come out better (deep-memory, +3 between-seed sds on every task) and worse
 * (halt-early, -2 sds); a sweep's points are `Results.configValues` means.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { Results } from '../../src/analysis/results.js';
import { fitGroups, SUMMARY_LIMIT } from '../../src/report/fitMarkdown.js';
import { overviewModel } from '../../src/report/overviewModel.js';
import { overviewMarkdown } from '../../src/report/overviewMarkdown.js';
import { overviewText, SCREEN_LINES } from '../../src/report/overviewText.js';
import { primaryMetric, sweepKeys } from '../../src/report/studyShape.js';
import { summaryMarkdown } from '../../src/report/summaryMarkdown.js';
import { SWEEP_TASKS, sweepModel } from '../../src/report/sweepModel.js';
import { comparisonGroups } from '../../src/report/verdictWords.js';
import { SWEEP_STUDY, TASKS_STUDY } from '../support/studyGenerator.js';
import { studyResults } from '../support/studyResults.js';
import { renderCells, textOf } from './cells/renderCells.js';

let tasks: Results;
let sweep: Results;

beforeAll(async () => {
  tasks = await studyResults(
    { ...TASKS_STUDY, tasks: 8, seeds: 4, crashEvery: 0, shortEvery: 0 },
    { baseline: 'method=base', taskKey: 'task' },
  );
  sweep = await studyResults(
    {
      ...SWEEP_STUDY,
      keys: { ticks: ['4', '8', '16', '32'], memory: ['4', '12'] },
      seeds: 5,
      crashEvery: 0,
      shortEvery: 0,
    },
    { baseline: 'ticks=8,memory=4' },
  );
}, 120_000);

describe('overview', () => {
  it('answers for the primary metric: score (a quality name) over train_loss, wall_seconds and lr', () => {
    expect(primaryMetric(tasks)).toBe('score');
  });

  it('counts every comparison of the metric and summary as one family, over all tasks', () => {
    const model = overviewModel(tasks);
    const score = tasks.comparisons.filter((c) => c.metric === 'score');
    expect(model?.comparisons).toHaveLength(4 * 8); // 4 candidates x 8 tasks
    expect(model?.counts).toEqual({
      better: score.filter((c) => c.verdict === 'better').length,
      worse: score.filter((c) => c.verdict === 'worse').length,
      inconclusive: score.filter((c) => c.verdict === 'inconclusive').length,
    });
    expect(model?.mode).toBe('tasks');
    expect(model?.columns).toHaveLength(8);
    // deep-memory is planted at +3 sds on every task: the row with the most decided comparisons.
    expect(model?.rows[0]?.candidate).toBe('method=deep-memory');
    expect(model?.rows[0]?.counts.better).toBeGreaterThan(0);
  });

  it('draws a mark matrix beyond six tasks, with every cell titled by its numbers', async () => {
    const html = await renderCells('{{overview}}', tasks);
    expect(html).toContain('<table class="mark-matrix">');
    const cells = [...html.matchAll(/<td class="mark-cell mark-(better|worse|inconclusive)" title="([^"]*)"/g)];
    expect(cells).toHaveLength(32);
    const decode = (t: string): string =>
      t.replace(/&#x([0-9a-f]+);/gi, (_m, h: string) => String.fromCodePoint(parseInt(h, 16)));
    expect(cells.every((m) => /^lantern-\d{3}: [+-]?\d.*, p [<\d]/.test(decode(m[2] ?? '')))).toBe(true);
    const text = textOf(html);
    expect(text).toMatch(/family of 32 comparisons of score \(summary final over 8 tasks\)/);
  });

  it('shows candidates by metrics without a task key, with each difference and interval', async () => {
    const model = overviewModel(sweep);
    expect(model?.mode).toBe('metrics');
    expect(model?.columns[0]).toBe('score');
    const html = await renderCells('{{overview "score"}}', sweep);
    const first = model?.rows[0];
    const c = first?.cells.get('score');
    expect(c).toBeDefined();
    expect(html).toContain('<table class="overview-matrix">');
    expect(textOf(html)).toContain(first?.candidate ?? '?');
  });
});

describe('aggregates', () => {
  it('draws the interquartile mean and probability of improvement across tasks, scores normalised', async () => {
    const html = await renderCells('{{aggregates}}', tasks);
    expect(html).toContain('<h2 id="across-tasks-score">Across tasks: score</h2>');
    expect(html.match(/<figure class="chart"/g)).toHaveLength(2);
    const text = textOf(html);
    expect(text).toContain('Scores normalised per task');
    expect(text).toContain('Every task was aggregated.');
    const deep = tasks.tasks.find((t) => t.metric === 'score' && t.config === 'method=deep-memory');
    const early = tasks.tasks.find((t) => t.metric === 'score' && t.config === 'method=halt-early');
    // Planted: deep-memory +3 sds, halt-early -2 sds on every task: P(better) far from 0.5 each way.
    expect(deep?.probabilityOfImprovement).toBeGreaterThan(0.8);
    expect(early?.probabilityOfImprovement).toBeLessThan(0.2);
  });

  it('renders nothing without a task key (a section without data is left out)', async () => {
    expect((await renderCells('{{aggregates}}', sweep)).trim()).toBe('');
  });
});

describe('sweeps', () => {
  it('finds the numeric keys and draws the summary against each, one line per value of the other key', async () => {
    expect(sweepKeys(sweep)).toEqual(['ticks', 'memory']);
    const s = sweepModel(sweep, 'score', 'final', 'ticks');
    expect(s?.xs).toEqual([4, 8, 16, 32]);
    expect(s?.series.map((x) => x.label)).toEqual(['memory=4', 'memory=12']);
    const point = s?.series[0]?.points[0];
    const cv = sweep.configValues.find((v) => v.metric === 'score' && v.config === point?.config);
    expect(point?.mean).toBe(cv?.mean);
    const html = await renderCells('{{sweep}}', sweep);
    expect(html.match(/<figure class="chart"/g)).toHaveLength(2);
    expect((await renderCells('{{sweep}}', tasks)).trim()).toBe('');
  });

  it('puts a table of the primary metric against each key in summary.md', () => {
    const md = overviewMarkdown(sweep).join('\n');
    expect(md).toContain('### score against ticks');
    expect(md).toContain('| memory | ticks=4 | ticks=8 | ticks=16 | ticks=32 |');
  });

  it('with a task key: one series per task (a panel each) up to SWEEP_TASKS tasks, none beyond', async () => {
    const spec = { ...SWEEP_STUDY, keys: { ticks: ['8', '16'] }, seeds: 2, rows: 6, crashEvery: 0, shortEvery: 0 };
    const few = await studyResults({ ...spec, tasks: SWEEP_TASKS }, { baseline: 'ticks=8', taskKey: 'task' });
    const s = sweepModel(few, 'score', 'final', 'ticks');
    expect(s?.taskKey).toBe('task');
    expect(s?.series).toHaveLength(SWEEP_TASKS);
    expect(new Set(s?.series.map((x) => x.params.task)).size).toBe(SWEEP_TASKS);
    expect(overviewMarkdown(few).join('\n')).toContain('| task | ticks=8 | ticks=16 |');
    const many = await studyResults({ ...spec, tasks: SWEEP_TASKS + 1 }, { baseline: 'ticks=8', taskKey: 'task' });
    expect(sweepModel(many, 'score', 'final', 'ticks')).toBeNull();
    expect((await renderCells('{{sweep}}', many)).trim()).toBe('');
  }, 60_000);

  it('rejects a key that is not numeric, naming the ones there are', async () => {
    await expect(renderCells('{{sweep "score" key="colour"}}', sweep)).rejects.toThrow(/'ticks', 'memory'/);
  });
});

describe('summary.md at scale', () => {
  it('writes everything when it fits, and otherwise the decided comparisons first, the rest folded or counted', () => {
    const groups = comparisonGroups(tasks);
    const render = (g: (typeof groups)[number]): string[] => [
      `### ${g.metric} ${g.task}`,
      ...g.comparisons.map((c) => `${c.candidate} ${c.verdict}`),
      '',
    ];
    const all = groups.flatMap(render);
    expect(fitGroups(groups, render, 1e9)).toEqual(all);
    const small = fitGroups(groups, render, 2_000, 'score');
    expect(small.join('\n').length).toBeLessThanOrEqual(2_000 + 200);
    const decided = tasks.comparisons.filter((c) => c.verdict !== 'inconclusive').length;
    const shown = small.filter((l) => / (better|worse)$/.test(l)).length;
    const counted = Number(/^(\d+) more comparisons in report\.html/m.exec(small.join('\n'))?.[1] ?? 0);
    const folded = small.filter((l) => / inconclusive$/.test(l)).length;
    // Nothing lost: shown + folded + counted = every comparison.
    expect(shown + folded + counted).toBe(tasks.comparisons.length);
    // Decided ones are never folded while an inconclusive one is shown.
    if (folded > 0) expect(shown).toBe(decided);
  });

  it('keeps the whole of summary.md within the limit', () => {
    expect(summaryMarkdown(tasks).length).toBeLessThanOrEqual(SUMMARY_LIMIT);
  });
});

describe('the overview in the terminal', () => {
  it('prints at most a screen, decided comparisons first, and counts the rest', () => {
    const text = overviewText(tasks);
    const lines = text.trimEnd().split('\n');
    expect(lines.length).toBeLessThanOrEqual(SCREEN_LINES);
    const score = tasks.comparisons.filter((c) => c.metric === 'score');
    const decided = score.filter((c) => c.verdict !== 'inconclusive').length;
    expect(lines[0]).toContain(
      `score (higher is better; summary final) against method=base: ${
        decided - score.filter((c) => c.verdict === 'worse').length
      } better`,
    );
    const rows = lines.filter((l) => /^ {2}[▲▼●] /.test(l));
    const firstInconclusive = rows.findIndex((l) => l.includes('●'));
    // Every decided comparison comes before the first inconclusive one.
    if (firstInconclusive >= 0) expect(firstInconclusive).toBe(Math.min(decided, rows.length));
    expect(rows.length + Number(/\.\.\. (\d+) more/.exec(text)?.[1] ?? 0)).toBe(score.length);
  });
});
