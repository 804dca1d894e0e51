/**
 * Reliability diagram: accuracy against confidence in equal-width bins, at the last tick.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { Results } from '../../analysis/results.js';
import { configColour, REFERENCE_INK } from '../palette.js';
import { binomialHalfWidth } from '../../stats/binomialHalfWidth.js';
import { chartFrame, NUMBER_FORMAT, type Layer } from './chartFrame.js';

/**
 * Vega-Lite spec of `CalibrationCurve.reliability` for one config: per bin with samples, a bar
 * over the bin's confidence range up to its accuracy, a point at (mean confidence, accuracy), and
 * the diagonal of perfect calibration. Bins with no sample or a null accuracy are not drawn.
 * Counts are summed over seeds as analysis gives them (in the tooltip). Each point has a whisker
 * of ±1 between-example standard error √(a(1−a)/n) of the bin's accuracy a over its n pooled
 * samples (the binomial standard error, `binomialHalfWidth`), cut to [0, 1]: the only noise a
 * pooled diagram can show, and the subtitle says so (the spread between seeds is not in it).
 * Returns null when the config has no calibration curve or no bin to draw.
 * Cost O(bins). Never throws.
 * Example: `reliabilityChart(results, 'memory=4')` → layers diagonal, bins, points.
 */
export function reliabilityChart(results: Results, config: string): TopLevelSpec | null {
  const curve = results.calibration.find((c) => c.config === config);
  if (curve === undefined) return null;
  const bins = curve.reliability
    .filter((b) => b.count > 0 && b.accuracy !== null)
    .map((b) => {
      const a = b.accuracy as number;
      const se = a >= 0 && a <= 1 && Number.isInteger(b.count) ? binomialHalfWidth(a, b.count) : null;
      return {
        low: b.low,
        high: b.high,
        accuracy: a,
        confidence: b.confidence,
        count: b.count,
        exampleSe: se,
        from: se === null ? null : Math.max(0, a - se),
        to: se === null ? null : Math.min(1, a + se),
      };
    });
  if (bins.length === 0) return null;

  const colour = configColour(results, config);
  const unit = { domain: [0, 1], nice: false };
  const tooltip = [
    { field: 'low', type: 'quantitative', title: 'confidence from', format: NUMBER_FORMAT },
    { field: 'high', type: 'quantitative', title: 'confidence to', format: NUMBER_FORMAT },
    { field: 'confidence', type: 'quantitative', title: 'mean confidence', format: NUMBER_FORMAT },
    { field: 'accuracy', type: 'quantitative', title: 'accuracy', format: NUMBER_FORMAT },
    { field: 'count', type: 'quantitative', title: 'samples', format: ',d' },
    { field: 'exampleSe', type: 'quantitative', title: 'between-example SE', format: NUMBER_FORMAT },
  ] as const;

  const layers: Layer[] = [
    {
      name: 'diagonal',
      data: { values: [{ at: 0 }, { at: 1 }] },
      mark: { type: 'line', color: REFERENCE_INK, strokeDash: [4, 4], strokeWidth: 1 },
      encoding: {
        x: { field: 'at', type: 'quantitative', scale: unit, title: 'confidence (top-class probability)' },
        y: { field: 'at', type: 'quantitative', scale: unit, title: 'accuracy' },
      },
    },
    {
      name: 'bins',
      data: { values: bins },
      mark: { type: 'rect', color: colour, opacity: 0.3, stroke: colour, strokeWidth: 1 },
      encoding: {
        x: { field: 'low', type: 'quantitative', scale: unit },
        x2: { field: 'high' },
        y: { field: 'accuracy', type: 'quantitative', scale: unit },
        y2: { datum: 0 },
        tooltip: [...tooltip],
      },
    },
  ];
  const located = bins.filter((b) => b.confidence !== null);
  const whiskers = located.filter((b) => b.exampleSe !== null);
  if (whiskers.length > 0) {
    layers.push({
      name: 'exampleSpread',
      data: { values: whiskers },
      mark: { type: 'rule', color: colour, strokeWidth: 1.5 },
      encoding: {
        x: { field: 'confidence', type: 'quantitative', scale: unit },
        y: { field: 'from', type: 'quantitative', scale: unit },
        y2: { field: 'to' },
        tooltip: [...tooltip],
      },
    });
  }
  if (located.length > 0) {
    layers.push({
      name: 'points',
      data: { values: located },
      mark: { type: 'point', filled: true, size: 40, color: colour },
      encoding: {
        x: { field: 'confidence', type: 'quantitative', scale: unit },
        y: { field: 'accuracy', type: 'quantitative', scale: unit },
        tooltip: [...tooltip],
      },
    });
  }

  return {
    ...chartFrame({
      title: `Reliability at the last tick: ${config}`,
      subtitle: [
        `${curve.bins} equal-width confidence bins, samples summed ` +
          `over ${curve.seeds === undefined ? 'seeds' : `${curve.seeds} seed${curve.seeds === 1 ? '' : 's'}`}. ` +
          `Bars: accuracy per bin; points: at the bin's mean confidence.`,
        'Dashed diagonal: perfect calibration (points below it are over-confident).',
        ...(whiskers.length > 0
          ? [
              'Whiskers: ±1 between-example standard error √(a(1−a)/n) of each bin; seeds are pooled, so ' +
                'seed-to-seed spread is not shown.',
            ]
          : []),
      ],
      description:
        `Reliability diagram for config ${config} at the last tick: accuracy against confidence ` +
        `in ${bins.length} non-empty bins of ${curve.bins}, with the diagonal of perfect calibration.`,
      height: 320,
    }),
    width: 320,
    layer: layers,
  };
}
