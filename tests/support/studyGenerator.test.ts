/**
 * The study generator plants what its comment says. Expected values come from first principles
 * (the spec's counts and the planted rules), and `seedsift scan`'s reading of a small study checks
 * that the files are logs seedsift reads the way the generator meant (statuses, tasks, metrics).
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { ingest } from '../../src/ingest/ingest.js';
import { none } from '../fixtures/ingest/tree.js';
import {
  generateStudy,
  type StudySpec,
  studyRuns,
  studyTask,
  SWEEP_STUDY,
  TASKS_STUDY,
  writeStudy,
} from './studyGenerator.js';

const SMALL: StudySpec = { ...TASKS_STUDY, tasks: 4, seeds: 3, crashEvery: 7, shortEvery: 5 };
const dirs: string[] = [];
afterAll(() => {
  for (const d of dirs) rmSync(d, { recursive: true, force: true });
});

describe('studyGenerator', () => {
  it('has the sizes the acceptance asks for: 100 x 5 x 3 and 168 configs x 10 seeds', () => {
    expect(studyRuns(TASKS_STUDY)).toHaveLength(100 * 5 * 3);
    const sweep = studyRuns(SWEEP_STUDY);
    expect(sweep).toHaveLength(168 * 10);
    expect(new Set(sweep.map((r) => JSON.stringify(r.params))).size).toBe(168);
  });

  it('plants crashes and short runs at the stated rate, never both on one run', () => {
    const runs = studyRuns(TASKS_STUDY);
    expect(runs.filter((r) => r.diverges)).toHaveLength(Math.floor(1500 / 97));
    // A run that is both the 97th and the 89th (index 8633) does not exist below 1,500; short = every 89th.
    expect(runs.filter((r) => r.short)).toHaveLength(Math.floor(1500 / 89));
    expect(runs.some((r) => r.diverges && r.short)).toBe(false);
  });

  it('gives tasks different scales and lengths', () => {
    const tasks = Array.from({ length: 6 }, (_, i) => studyTask(i));
    expect(new Set(tasks.map((t) => t.lastStep)).size).toBeGreaterThan(2);
    expect(tasks.some((t) => t.level > 100)).toBe(true);
    expect(tasks.some((t) => t.level < 1)).toBe(true);
  });

  it('is deterministic and writes the bookkeeping columns', () => {
    const a = generateStudy(SMALL);
    const b = generateStudy(SMALL);
    expect(a).toEqual(b);
    expect(a[0]?.text.split('\n')[0]).toBe('step,train_loss,score,wall_seconds,lr');
    const crashed = a[6]?.text ?? '';
    expect(crashed).toContain('nan');
  });

  it('reads back as the runs it planted (tasks, statuses)', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'seedsift-study-'));
    dirs.push(dir);
    writeStudy(dir, SMALL);
    const set = await ingest([dir], none);
    const planned = studyRuns(SMALL);
    expect(set.runs).toHaveLength(planned.length);
    const status = (r: (typeof planned)[number]): string => (r.diverges ? 'diverged' : r.short ? 'short' : 'ok');
    const expected = planned.map((r) => `${r.task}|${r.params.method}|${r.seed}|${status(r)}`).sort();
    const got = set.runs.map((r) => `${r.params.task}|${r.params.method}|${r.seed}|${r.status}`).sort();
    expect(got).toEqual(expected);
  });
});
