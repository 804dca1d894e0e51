/**
 * The analysis options of `report`: one table entry each (see `optionSpec.ts`). `ResolvedOptions`
 * (`options.ts`) is derived from this table, the command line and the notebook front matter are
 * built from it, and the entries with a `setting` make `results.json` settings, in this order.
 * Defaults are those of METHODS.md ("Defaults"); the halting grid is ours (0.05 to 0.95 by 0.05,
 * and 0.99).
 */
import type { Correction, FailedPolicy, FailOn, FamilyScope, IntervalChoice, SummarySpec } from './results.js';
import {
  alias,
  booleanOf,
  type CommandName,
  integerIn,
  numberIn,
  oneOf,
  option,
  splitList,
  text,
} from './optionSpec.js';
import { parseSelector } from './selectors.js';
import { parseSummary } from './summarySpec.js';
import { SeedsiftError } from '../problems.js';
import { SELECTION_OPTIONS } from './selectionOptions.js';

const REPORT: readonly CommandName[] = ['report'];
const FRONT_ONLY: readonly CommandName[] = [];

/** A summary as parsed, with the text as typed (kept for the report), e.g. `last:10%`. */
export type SummaryOption = SummarySpec & { readonly text: string };

const FINAL: SummaryOption = { kind: 'final', text: 'final' };

const DEFAULT_THRESHOLDS = [
  0.05, 0.1, 0.15, 0.2, 0.25, 0.3, 0.35, 0.4, 0.45, 0.5, 0.55, 0.6, 0.65, 0.7, 0.75, 0.8, 0.85, 0.9, 0.95, 0.99,
] as const;

export const ANALYSIS_OPTIONS = {
  alpha: option({
    flag: '--alpha <a>',
    help: 'significance level (default 0.05; e.g. --alpha 0.01)',
    commands: REPORT,
    front: 'alpha',
    shape: 'number',
    fallback: 0.05,
    parse: numberIn(0, 1, 'open'),
    setting: (v) => v,
  }),
  seed: option({
    flag: '--seed <n>',
    help: 'seed of every resampling (default 1; e.g. --seed 7)',
    commands: REPORT,
    front: 'seed',
    shape: 'number',
    fallback: 1,
    parse: integerIn(-(2 ** 31), 2 ** 32 - 1),
    setting: (v) => v,
  }),
  correction: option({
    flag: '--correction <c>',
    help: 'multiple comparisons: holm | bh | none (default holm)',
    commands: REPORT,
    front: 'correction',
    shape: 'text',
    fallback: 'holm' as Correction,
    parse: oneOf(['holm', 'bh', 'none'] as const),
    setting: (v) => v,
  }),
  summary: option({
    flag: '--summary <how>',
    help: 'per-run value: final | last:P% | best | auc | reach:VALUE | step:N (default final; e.g. last:10%)',
    commands: REPORT,
    front: 'summary',
    shape: 'text',
    fallback: FINAL,
    parse: (raw, name) => {
      const t = text()(raw, name);
      return { ...parseSummary(t, name), text: t };
    },
    setting: (v) => v.text,
  }),
  baseline: option({
    flag: '--baseline <selector>',
    help: 'key=value[,key=value]: the baseline config, or the baseline value of some keys (e.g. memory=4)',
    commands: REPORT,
    front: 'baseline',
    shape: 'text',
    fallback: null,
    parse: (raw, name) => parseSelector(text()(raw, name), name),
    setting: (v) => v?.text ?? null,
  }),
  taskKey: option({
    flag: '--task-key <key>',
    help: 'a config key whose values are tasks: compare per task and aggregate across tasks (e.g. task)',
    commands: REPORT,
    front: 'task-key',
    shape: 'text',
    fallback: null,
    parse: (raw, name) => text()(raw, name),
    setting: (v) => v,
  }),
  margin: option({
    flag: '--margin <m>',
    help: 'non-inferiority margin in metric units, one-sided Welch (paired t under --paired) at alpha/2 (e.g. 0.005)',
    commands: REPORT,
    front: 'margin',
    shape: 'number',
    fallback: null,
    parse: numberIn(0, Infinity, 'closed-low'),
    setting: (v) => v,
  }),
  paired: option({
    flag: '--paired',
    help: 'pair runs by seed across configs (paired t, Wilcoxon signed-rank)',
    commands: REPORT,
    front: 'paired',
    shape: 'boolean',
    fallback: false,
    parse: booleanOf(),
    setting: (v) => v,
  }),
  failed: option({
    flag: '--failed <policy>',
    help:
      'failed runs (diverged, or stopped short): exclude | worst (default exclude; counted either way, ' +
      'failure counts compared with Fisher)',
    commands: REPORT,
    front: 'failed',
    shape: 'text',
    fallback: 'exclude' as FailedPolicy,
    parse: oneOf(['exclude', 'worst'] as const),
    setting: (v) => v,
  }),
  diverged: alias({
    flag: '--diverged <policy>',
    help: 'the old name of --failed (e.g. --diverged worst)',
    commands: REPORT,
    front: 'diverged',
    shape: 'text',
    fallback: 'exclude' as FailedPolicy,
    parse: oneOf(['exclude', 'worst'] as const),
    aliasOf: 'failed',
  }),
  failOn: option({
    flag: '--fail-on <gate>',
    help: 'exit 1 when a comparison is worse | not-better (e.g. --fail-on worse in CI)',
    commands: REPORT,
    front: 'fail-on',
    shape: 'text',
    fallback: null as FailOn | null,
    parse: oneOf(['worse', 'not-better'] as const),
    setting: (v) => v,
  }),
  family: option({
    flag: '--family <scope>',
    help: 'the family of each correction: study (one metric and summary over all tasks) | task (default study)',
    commands: REPORT,
    front: 'family',
    shape: 'text',
    fallback: 'study' as FamilyScope,
    parse: oneOf(['study', 'task'] as const),
    setting: (v) => v,
  }),
  interval: option({
    flag: '--interval <kind>',
    help: "the headline interval of a difference: welch (Welch's t at every n) | bca (bootstrap) (default welch)",
    commands: REPORT,
    front: 'interval',
    shape: 'text',
    fallback: 'welch' as IntervalChoice,
    parse: oneOf(['welch', 'bca'] as const),
    setting: (v) => v,
  }),
  ...SELECTION_OPTIONS,
  resamples: option({
    flag: '--resamples <n>',
    help: 'bootstrap resamples for intervals that decide something (default 10000)',
    commands: FRONT_ONLY,
    front: 'resamples',
    shape: 'number',
    fallback: 10000,
    parse: integerIn(100, 10_000_000),
    setting: (v) => v,
  }),
  bandResamples: option({
    flag: '--band-resamples <n>',
    help: 'bootstrap resamples for learning-curve bands (default 2000)',
    commands: FRONT_ONLY,
    front: 'band-resamples',
    shape: 'number',
    fallback: 2000,
    parse: integerIn(100, 10_000_000),
    setting: (v) => v,
  }),
  bootstrapFrom: option({
    flag: '--bootstrap-from <n>',
    help: "runs per arm from which the BCa interval of a difference is shown beside Welch's (default 10)",
    commands: FRONT_ONLY,
    front: 'bootstrap-from',
    shape: 'number',
    fallback: 10,
    parse: integerIn(2, 1_000_000),
    setting: (v) => v,
  }),
  level: option({
    flag: '--level <l>',
    help: 'confidence level of every interval (default 1 - alpha: the intervals are unadjusted)',
    commands: FRONT_ONLY,
    front: 'level',
    shape: 'number',
    // null: 1 - alpha, filled in by resolveOptions.
    fallback: null as number | null,
    parse: numberIn(0, 1, 'open'),
    setting: (v) => v,
  }),
  bins: option({
    flag: '--bins <n>',
    help: 'most bins of the shared step grid of learning curves (default 400)',
    commands: FRONT_ONLY,
    front: 'bins',
    shape: 'number',
    fallback: 400,
    parse: integerIn(1, 100_000),
  }),
  haltingThresholds: option({
    flag: '--halting-thresholds <list>',
    help: 'certainty thresholds of the halting trade-off curve (e.g. 0.5,0.8,0.9)',
    commands: FRONT_ONLY,
    front: 'halting-thresholds',
    shape: 'csv',
    fallback: DEFAULT_THRESHOLDS as readonly number[],
    parse: (raw, name) => {
      const values = splitList(raw).map((p) => (p.trim() === '' ? NaN : Number(p)));
      if (values.length === 0 || values.some((v) => !Number.isFinite(v) || v < 0 || v > 1))
        throw new SeedsiftError('usage', `${name}: expected comma-separated numbers in [0, 1], got '${String(raw)}'`);
      return [...new Set(values)].sort((a, b) => a - b);
    },
  }),
  haltingReference: option({
    flag: '--halting-reference <t>',
    help: 'threshold whose exit-tick histogram is shown (default 0.8)',
    commands: FRONT_ONLY,
    front: 'halting-reference',
    shape: 'number',
    fallback: 0.8,
    parse: numberIn(0, 1, 'closed'),
  }),
  calibrationBins: option({
    flag: '--calibration-bins <n>',
    help: 'equal-width confidence bins of the calibration error (default 15)',
    commands: FRONT_ONLY,
    front: 'calibration-bins',
    shape: 'number',
    fallback: 15,
    parse: integerIn(1, 1000),
  }),
};
