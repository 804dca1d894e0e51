/**
 * The summary kinds of `--summary` as one exhaustive table keyed by kind (STYLE.md, "decide a
 * thing once"): for each kind, how its text parses, how it is written back, how the report
 * describes it in words, in which direction its value is better, whether it is a time-to-event
 * summary, and how one run's series becomes its value (`compute`). A new kind added to
 * `SummarySpec` without every aspect here fails to compile; the report reads the description from
 * `Results`, never by re-parsing the summary's text.
 *
 * ```
 * final          value at the comparison's step (the last step every non-failed run of both arms reached)
 * last:P%        mean of the values in the last P% of [first step, comparison step]   (0 < P <= 100)
 * best           best value up to the comparison's step, in the goal's direction (optimistic)
 * auc            area under the curve up to the comparison's step / the span it covers
 * reach:VALUE    steps until the metric first reaches VALUE (time to event; runs that never do are censored)
 * step:N         value at the last logged step <= N (a run that ends before N has none: it is short)
 * ```
 */
import type { Goal, Series } from '../ingest/types.js';
import type { SummarySpec } from './results.js';
import {
  averageHeight,
  bestUpTo,
  lastIndexAtOrBefore,
  lastPercent,
  type SummaryValue,
  type SummaryWindow,
} from './summaries.js';

export type SummaryKind = SummarySpec['kind'];
type SpecOf<K extends SummaryKind> = Extract<SummarySpec, { readonly kind: K }>;

/** Every aspect of one summary kind. */
export interface SummaryKindEntry<K extends SummaryKind> {
  /** Parse the text after `kind:` (null when there is no colon); a string is the reason it is bad. */
  readonly parse: (arg: string | null) => SpecOf<K> | string;
  readonly format: (spec: SpecOf<K>) => string;
  /** The summary in words for the report's Methods text and tables. */
  readonly describe: (spec: SpecOf<K>) => string;
  /** Direction in which the summary value is better, given the metric's goal. */
  readonly goal: (metricGoal: Goal) => Goal;
  /** Values are times to an event, compared with the log-rank test (censored runs kept). */
  readonly timeToEvent: boolean;
  /**
   * One run's value, from its sorted finite series, up to the comparison's step (`window.horizon`).
   * The series is not empty and `window.horizon` is not null (the caller handles both).
   */
  readonly compute: (series: Series, spec: SpecOf<K>, goal: Goal, window: SummaryWindowSet) => SummaryValue;
}

/** A window whose step is known. */
export interface SummaryWindowSet extends SummaryWindow {
  readonly horizon: number;
  readonly firstStep: number | null;
}

const noArg =
  <K extends 'final' | 'best' | 'auc'>(kind: K) =>
  (arg: string | null): SpecOf<K> | string =>
    arg === null ? ({ kind } as SpecOf<K>) : '';

function toNumber(s: string | null): number | null {
  if (s === null || s.trim() === '') return null;
  const v = Number(s);
  return Number.isFinite(v) ? v : null;
}

const ok = (value: number, loggedAt: number): SummaryValue => ({
  value,
  loggedAt,
  note: null,
  censored: false,
  short: false,
});

/** The table. */
export const SUMMARY_KINDS: { readonly [K in SummaryKind]: SummaryKindEntry<K> } = {
  final: {
    parse: noArg('final'),
    format: () => 'final',
    describe: () =>
      "the last logged value at or before the comparison's step (the last step every non-failed run of both " +
      'arms reached, per task)',
    goal: (g) => g,
    timeToEvent: false,
    compute: (s, _spec, _goal, w) => {
      const end = lastIndexAtOrBefore(s.steps, w.horizon);
      return ok(s.values[end] as number, s.steps[end] as number);
    },
  },
  last: {
    parse: (arg) => {
      const text = arg === null ? null : arg.trim().endsWith('%') ? arg.trim().slice(0, -1) : arg;
      const percent = toNumber(text);
      return percent === null || percent <= 0 || percent > 100 ? ' (P in (0, 100])' : { kind: 'last', percent };
    },
    format: (spec) => `last:${spec.percent}%`,
    describe: (spec) =>
      `the mean of the values logged in the last ${spec.percent}% of the steps up to the comparison's step`,
    goal: (g) => g,
    timeToEvent: false,
    compute: (s, spec, _goal, w) => {
      const end = lastIndexAtOrBefore(s.steps, w.horizon);
      return lastPercent(s.steps, s.values, end, w.horizon, w.firstStep ?? (s.steps[0] as number), spec.percent);
    },
  },
  best: {
    parse: noArg('best'),
    format: () => 'best',
    describe: () =>
      "the best value up to the comparison's step (optimistic: the checkpoint is chosen on the data it is scored on)",
    goal: (g) => g,
    timeToEvent: false,
    compute: (s, _spec, goal, w) => {
      const end = lastIndexAtOrBefore(s.steps, w.horizon);
      return ok(bestUpTo(s.values, end, goal), s.steps[end] as number);
    },
  },
  auc: {
    parse: noArg('auc'),
    format: () => 'auc',
    describe: () => "the area under the curve up to the comparison's step, divided by the steps covered",
    goal: (g) => g,
    timeToEvent: false,
    compute: (s, _spec, _goal, w) => {
      const end = lastIndexAtOrBefore(s.steps, w.horizon);
      return ok(averageHeight(s.steps, s.values, end, w.horizon), s.steps[end] as number);
    },
  },
  reach: {
    parse: (arg) => {
      const value = toNumber(arg);
      return value === null ? ' (VALUE a finite number)' : { kind: 'reach', value };
    },
    format: (spec) => `reach:${spec.value}`,
    describe: (spec) =>
      `the steps until the run first reaches ${spec.value}, a time to event: a run that has not reached it by ` +
      `the comparison's step is censored there (kept, never dropped) and the arms are compared with the log-rank test`,
    goal: () => 'min',
    timeToEvent: true,
    compute: (s, spec, goal, w) => {
      const end = lastIndexAtOrBefore(s.steps, w.horizon);
      for (let i = 0; i <= end; i++) {
        const v = s.values[i] as number;
        if (goal === 'max' ? v >= spec.value : v <= spec.value) return ok(s.steps[i] as number, s.steps[i] as number);
      }
      return {
        value: w.horizon,
        loggedAt: s.steps[end] as number,
        note: `had not reached ${spec.value} by step ${w.horizon} (censored there)`,
        censored: true,
        short: false,
      };
    },
  },
  step: {
    parse: (arg) => {
      const step = toNumber(arg);
      return step === null || step < 0 ? ' (N a step >= 0)' : { kind: 'step', step };
    },
    format: (spec) => `step:${spec.step}`,
    describe: (spec) =>
      `the last logged value at or before step ${spec.step}; a run that ends before step ${spec.step} has no ` +
      `value (it is short for this comparison)`,
    goal: (g) => g,
    timeToEvent: false,
    compute: (s, spec) => {
      const last = s.steps[s.steps.length - 1] as number;
      if (last < spec.step) {
        return {
          value: null,
          loggedAt: null,
          note: `run ends at step ${last}, before step ${spec.step}: short for this comparison`,
          censored: false,
          short: true,
        };
      }
      const i = lastIndexAtOrBefore(s.steps, spec.step);
      if (i < 0)
        return {
          value: null,
          loggedAt: null,
          note: `no value logged at or before step ${spec.step} (first step ${s.steps[0]})`,
          censored: false,
          short: false,
        };
      return ok(s.values[i] as number, s.steps[i] as number);
    },
  },
};

/** The entry of a spec's kind, typed for that spec. */
export function kindOf<K extends SummaryKind>(spec: SpecOf<K>): SummaryKindEntry<K> {
  return SUMMARY_KINDS[spec.kind as K] as SummaryKindEntry<K>;
}

/** The summary in words (for `Results.settings.summaryDescription`). */
export function describeSummary(spec: SummarySpec): string {
  return (kindOf(spec).describe as (s: SummarySpec) => string)(spec);
}
