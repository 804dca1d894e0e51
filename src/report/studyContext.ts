/**
 * What the default notebook needs to lay a study out (`NotebookContext.study`): whether the study
 * is large (its details start folded), the scalar metrics in page order (the primary metric first,
 * open), and which tick-level sections have something to show (a section without data is left out).
 */
import type { Results } from '../analysis/results.js';
import { visibleText } from './escape.js';
import { HIGHLIGHT_FROM, primaryMetric } from './studyShape.js';

/** More comparisons than this make a study large. */
export const LARGE_FROM_COMPARISONS = 40;

export interface StudyContext {
  readonly large: boolean;
  readonly primary: string | null;
  /** Scalar metrics, the primary first; `open` for the primary one, and for every one when the study is small. */
  readonly metrics: readonly { readonly name: string; readonly label: string; readonly open: boolean }[];
  readonly ticks: boolean;
  readonly halting: boolean;
  readonly calibration: boolean;
}

/**
 * The study context of `Results`.
 * Cost O(metrics + configs). Never throws.
 * Example: demo results →
 * `{ large: false, primary: 'val_acc', metrics: [{ name: 'val_acc', open: true }, ...], ticks: true, ... }`.
 */
export function studyContext(results: Results): StudyContext {
  const primary = primaryMetric(results);
  const large =
    results.configs.length >= HIGHLIGHT_FROM ||
    results.comparisons.length > LARGE_FROM_COMPARISONS ||
    results.settings.taskKey !== null;
  const scalar = results.metrics.filter((m) => m.kind === 'scalar').map((m) => m.name);
  const ordered =
    primary !== null && scalar.includes(primary) ? [primary, ...scalar.filter((m) => m !== primary)] : scalar;
  return {
    large,
    primary,
    // `label`: the name with hidden characters made visible (Handlebars escapes it; it does not show them).
    metrics: ordered.map((name) => ({ name, label: visibleText(name, 120), open: !large || name === primary })),
    ticks: results.ticks.length > 0,
    halting: results.halting.length > 0,
    calibration: results.calibration.length > 0,
  };
}
