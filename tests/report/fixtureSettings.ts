/**
 * The settings block shared by the report's test fixtures (`fixtures.ts`, `sampleResults.ts`): the
 * defaults of a plain `report` run; each fixture overrides what it needs (summary, baseline, margin).
 */
import type { Results } from '../../src/analysis/results.js';

export function fixtureSettings(overrides: Partial<Results['settings']> = {}): Results['settings'] {
  return {
    alpha: 0.05,
    seed: 1,
    correction: 'holm',
    summary: 'final',
    summaryDescription: "the last logged value at or before the comparison's step",
    baseline: null,
    taskKey: null,
    margin: null,
    paired: false,
    failed: 'exclude',
    failOn: null,
    family: 'study',
    interval: 'welch',
    metrics: null,
    primary: null,
    asMetric: [],
    includeConfigs: [],
    excludeConfigs: [],
    candidates: [],
    dropKeys: [],
    keepKeys: null,
    resamples: 10000,
    bandResamples: 2000,
    bootstrapFrom: 10,
    level: 0.95,
    ...overrides,
  };
}
