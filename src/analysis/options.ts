/**
 * Report options, resolved once at the edge: `ReportOptions` (every field optional, as typed on
 * the command line or written in notebook front matter, so strings or numbers) becomes
 * `ResolvedOptions` (every field set) in `resolveOptions`, with one defaults table. Bad values are
 * rejected with the option's name: "--alpha: expected a number in (0, 1), got 2".
 * Defaults are those of METHODS.md ("Defaults").
 */
import type { RunSet } from '../ingest/types.js';
import { SeedsiftError } from '../problems.js';
import { inventory } from './inventory.js';
import type { Correction, FailedPolicy, FailOn, FamilyScope, IntervalChoice, SummarySpec } from './results.js';
import { checkSelector, parseSelector, type Selector } from './selectors.js';
import { parseSummary } from './summarySpec.js';

type Raw = string | number | undefined;

/** Options as given: strings from the command line, numbers or strings from YAML front matter. */
export interface ReportOptions {
  readonly alpha?: Raw;
  readonly seed?: Raw;
  readonly correction?: string | undefined;
  readonly summary?: string | undefined;
  readonly baseline?: string | null | undefined;
  readonly taskKey?: string | null | undefined;
  readonly margin?: Raw | null;
  readonly paired?: boolean | string | undefined;
  readonly failed?: string | undefined;
  /** The old name of `failed` (`--diverged exclude|worst`), still accepted. */
  readonly diverged?: string | undefined;
  readonly family?: string | undefined;
  readonly interval?: string | undefined;
  readonly failOn?: string | null | undefined;
  readonly level?: Raw;
  readonly resamples?: Raw;
  readonly bandResamples?: Raw;
  readonly bins?: Raw;
  readonly bootstrapFrom?: Raw;
  readonly haltingThresholds?: string | readonly (number | string)[] | undefined;
  readonly haltingReference?: Raw;
  readonly calibrationBins?: Raw;
}

/** Every option set. */
export interface ResolvedOptions {
  readonly alpha: number;
  readonly seed: number;
  readonly correction: Correction;
  readonly summary: SummarySpec;
  /** The summary as typed (kept for the report), e.g. `last:10%`. */
  readonly summaryText: string;
  readonly baseline: Selector | null;
  readonly taskKey: string | null;
  readonly margin: number | null;
  readonly paired: boolean;
  /** Failed runs (diverged or short): left out, or scored worst. */
  readonly failed: FailedPolicy;
  readonly failOn: FailOn | null;
  /** The family of each correction: one metric and summary over all tasks, or each task. */
  readonly family: FamilyScope;
  /** The headline interval: Welch's t at every n, or BCa bootstrap. */
  readonly interval: IntervalChoice;
  /** Confidence level of every interval (1 - alpha unless given: the intervals are unadjusted). */
  readonly level: number;
  /** Bootstrap resamples for intervals that decide something. */
  readonly resamples: number;
  /** Bootstrap resamples for learning-curve bands. */
  readonly bandResamples: number;
  /** Most bins of the shared step grid of learning curves. */
  readonly bins: number;
  /** Runs per arm from which the BCa interval of a difference is shown beside Welch's. */
  readonly bootstrapFrom: number;
  /** Certainty thresholds of the halting trade-off curve. */
  readonly haltingThresholds: readonly number[];
  /** Threshold whose exit-tick histogram is shown. */
  readonly haltingReference: number;
  /** Equal-width confidence bins of the calibration error. */
  readonly calibrationBins: number;
}

/** The one defaults table (METHODS.md "Defaults"; the halting grid is ours: 0.05 to 0.95 by 0.05, and 0.99). */
export const DEFAULT_OPTIONS = {
  alpha: 0.05,
  seed: 1,
  correction: 'holm',
  summary: 'final',
  baseline: null,
  taskKey: null,
  margin: null,
  paired: false,
  failed: 'exclude',
  failOn: null,
  family: 'study',
  interval: 'welch',
  /** null: 1 - alpha. */
  level: null,
  resamples: 10000,
  bandResamples: 2000,
  bins: 400,
  bootstrapFrom: 10,
  haltingThresholds: [
    0.05, 0.1, 0.15, 0.2, 0.25, 0.3, 0.35, 0.4, 0.45, 0.5, 0.55, 0.6, 0.65, 0.7, 0.75, 0.8, 0.85, 0.9, 0.95, 0.99,
  ],
  haltingReference: 0.8,
  calibrationBins: 15,
} as const;

/**
 * Resolve report options: fill defaults, parse and check every value. With a `runSet`, the task
 * key must be a config key and the baseline selector must match a config (the message lists what
 * is available). Throws SeedsiftError('usage') naming the option on the first bad value.
 * Cost O(runs) with a run set, O(1) without.
 * Example: `resolveOptions({ alpha: '0.01' }).alpha` is 0.01.
 */
export function resolveOptions(input: ReportOptions, runSet?: RunSet): ResolvedOptions {
  const d = DEFAULT_OPTIONS;
  const summaryText = (input.summary ?? d.summary).trim();
  const summary = parseSummary(summaryText);
  const taskKey = blankToNull(input.taskKey) ?? d.taskKey;
  const baselineText = blankToNull(input.baseline) ?? d.baseline;
  const baseline = baselineText === null ? null : parseSelector(baselineText);
  const alpha = numberIn('--alpha', input.alpha ?? d.alpha, 0, 1, 'open');
  const resolved: ResolvedOptions = {
    alpha,
    seed: integerIn('--seed', input.seed ?? d.seed, -(2 ** 31), 2 ** 32 - 1),
    correction: oneOf('--correction', input.correction ?? d.correction, ['holm', 'bh', 'none'] as const),
    summary,
    summaryText,
    baseline,
    taskKey,
    margin:
      input.margin === undefined || input.margin === null || input.margin === ''
        ? d.margin
        : numberIn('--margin', input.margin, 0, Infinity, 'closed-low'),
    paired: booleanOf('--paired', input.paired ?? d.paired),
    failed:
      input.failed === undefined && input.diverged !== undefined
        ? oneOf('--diverged', input.diverged, ['exclude', 'worst'] as const)
        : oneOf('--failed', input.failed ?? d.failed, ['exclude', 'worst'] as const),
    family: oneOf('--family', input.family ?? d.family, ['study', 'task'] as const),
    interval: oneOf('--interval', input.interval ?? d.interval, ['welch', 'bca'] as const),
    failOn:
      blankToNull(input.failOn) === null
        ? d.failOn
        : oneOf('--fail-on', input.failOn as string, ['worse', 'not-better'] as const),
    level: input.level === undefined ? 1 - alpha : numberIn('--level', input.level, 0, 1, 'open'),
    resamples: integerIn('--resamples', input.resamples ?? d.resamples, 100, 10_000_000),
    bandResamples: integerIn('--band-resamples', input.bandResamples ?? d.bandResamples, 100, 10_000_000),
    bins: integerIn('--bins', input.bins ?? d.bins, 1, 100_000),
    bootstrapFrom: integerIn('--bootstrap-from', input.bootstrapFrom ?? d.bootstrapFrom, 2, 1_000_000),
    haltingThresholds: thresholds('--halting-thresholds', input.haltingThresholds ?? d.haltingThresholds),
    haltingReference: numberIn('--halting-reference', input.haltingReference ?? d.haltingReference, 0, 1, 'closed'),
    calibrationBins: integerIn('--calibration-bins', input.calibrationBins ?? d.calibrationBins, 1, 1000),
  };
  if (runSet !== undefined) checkAgainst(resolved, runSet);
  return resolved;
}

function checkAgainst(options: ResolvedOptions, runSet: RunSet): void {
  if (options.taskKey !== null && !runSet.keys.includes(options.taskKey)) {
    throw new SeedsiftError(
      'usage',
      `--task-key: expected one of the config keys (${runSet.keys.join(', ') || 'none'}), got '${options.taskKey}'`,
    );
  }
  if (options.baseline !== null)
    checkSelector(options.baseline, inventory(runSet).configs, runSet.keys, options.taskKey);
}

function blankToNull(v: string | null | undefined): string | null {
  return v === undefined || v === null || v.trim() === '' ? null : v.trim();
}

function toNumber(v: string | number): number {
  if (typeof v === 'number') return v;
  return v.trim() === '' ? NaN : Number(v);
}

function numberIn(
  option: string,
  raw: string | number,
  low: number,
  high: number,
  ends: 'open' | 'closed' | 'closed-low',
): number {
  const v = toNumber(raw);
  const ok =
    Number.isFinite(v) &&
    (ends === 'open' ? v > low && v < high : ends === 'closed' ? v >= low && v <= high : v >= low && v < high);
  if (!ok) {
    const range = ends === 'open' ? `in (${low}, ${high})` : ends === 'closed' ? `in [${low}, ${high}]` : `>= ${low}`;
    throw new SeedsiftError('usage', `${option}: expected a number ${range}, got ${String(raw)}`);
  }
  return v;
}

function integerIn(option: string, raw: string | number, low: number, high: number): number {
  const v = toNumber(raw);
  if (!Number.isInteger(v) || v < low || v > high) {
    throw new SeedsiftError('usage', `${option}: expected an integer from ${low} to ${high}, got ${String(raw)}`);
  }
  return v;
}

function oneOf<T extends string>(option: string, raw: string, allowed: readonly T[]): T {
  const v = raw.trim();
  const found = allowed.find((a) => a === v);
  if (found === undefined) throw new SeedsiftError('usage', `${option}: expected ${allowed.join(', ')}, got '${raw}'`);
  return found;
}

function booleanOf(option: string, raw: boolean | string): boolean {
  if (typeof raw === 'boolean') return raw;
  const v = raw.trim().toLowerCase();
  if (v === 'true' || v === 'yes' || v === '1' || v === '') return true;
  if (v === 'false' || v === 'no' || v === '0') return false;
  throw new SeedsiftError('usage', `${option}: expected true or false, got '${raw}'`);
}

function thresholds(option: string, raw: string | readonly (number | string)[]): number[] {
  const parts = typeof raw === 'string' ? raw.split(',') : raw;
  const values = parts.map((p) => toNumber(typeof p === 'string' ? p.trim() : p));
  const bad = values.length === 0 || values.some((v) => !Number.isFinite(v) || v < 0 || v > 1);
  if (bad)
    throw new SeedsiftError('usage', `${option}: expected comma-separated numbers in [0, 1], got '${String(raw)}'`);
  return [...new Set(values)].sort((a, b) => a - b);
}
