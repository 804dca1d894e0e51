/**
 * `Results` of small generated studies (`studyGenerator`), analysed by the real pipeline, for the
 * report's overview tests. Written once per process into a temporary folder.
 */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { analyze } from '../../src/analysis/analyze.js';
import { resolveOptions, type ReportOptions } from '../../src/analysis/options.js';
import type { Results } from '../../src/analysis/results.js';
import { ingest } from '../../src/ingest/ingest.js';
import { none } from '../fixtures/ingest/tree.js';
import { type StudySpec, writeStudy } from './studyGenerator.js';

/**
 * Generate `spec`, read it and analyse it with `options` (resamples kept low: these tests read layout, not intervals).
 */
export async function studyResults(spec: StudySpec, options: ReportOptions): Promise<Results> {
  const dir = mkdtempSync(join(tmpdir(), 'seedsift-study-'));
  writeStudy(dir, spec);
  const set = await ingest([dir], none);
  return analyze(set, resolveOptions({ resamples: 400, bandResamples: 200, ...options }, set), {
    paths: [dir],
    generated: '2026-03-01T12:00:00.000Z',
    version: 'test',
  });
}
