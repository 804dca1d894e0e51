/**
 * scanText at scale, on generated studies (tests/support/studyGenerator.ts). Expected from the
 * planted study (first principles): run and config counts, which key holds tasks, which files
 * are not logs.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { inventory } from '../../src/analysis/inventory.js';
import { ingest } from '../../src/ingest/ingest.js';
import { GRID_CONFIGS, GRID_SEEDS, scanText } from '../../src/report/scanText.js';
import { none } from '../fixtures/ingest/tree.js';
import { type StudySpec, TASKS_STUDY, writeStudy } from '../support/studyGenerator.js';

async function scan(spec: StudySpec, extra: (dir: string) => void = () => undefined): Promise<string> {
  const dir = mkdtempSync(join(tmpdir(), 'seedsift-scan-'));
  writeStudy(dir, spec);
  extra(dir);
  const set = await ingest([dir], none);
  return scanText(set, inventory(set));
}

describe('scanText at scale', () => {
  it('collapses the grid to one line per config beyond 20 seeds, counting runs by status', async () => {
    const text = await scan({ ...TASKS_STUDY, tasks: 2, seeds: GRID_SEEDS + 1, crashEvery: 0, shortEvery: 0 });
    expect(text).toContain(`Configs (${GRID_SEEDS + 1} seeds; one line per config):`);
    expect(text).toMatch(/task=lantern-001,method=base\s+21\s+21 ok/);
    expect(text).not.toContain('seed 20');
  });

  it('lists at most 40 configs in the grid and counts the rest', async () => {
    const text = await scan({ ...TASKS_STUDY, tasks: 10, seeds: 1, crashEvery: 0, shortEvery: 0 });
    expect(text).toContain(`... and ${50 - GRID_CONFIGS} more configs`);
  });

  it('groups files not used by reason and extension, with a few examples', async () => {
    const text = await scan({ ...TASKS_STUDY, tasks: 1, seeds: 1, crashEvery: 0, shortEvery: 0 }, (dir) => {
      for (let i = 0; i < 12; i++) writeFileSync(join(dir, `frame${i}.png`), '');
      writeFileSync(join(dir, 'notes.json'), '{}');
    });
    expect(text).toMatch(/Files not used \(13\):\n {2}skipped: not a log file .* x13 \(\.png 12, \.json 1\)/);
    expect(text).toContain('... and 10 more (see --json)');
  });

  it('points out a key that looks like tasks, for --task-key', async () => {
    const text = await scan({ ...TASKS_STUDY, tasks: 3, seeds: 1, crashEvery: 0, shortEvery: 0 });
    expect(text).toContain("Key 'task' (3 values) looks like tasks or evaluation sets: report with --task-key task");
    expect(text).not.toContain("Key 'method'");
  });
});
