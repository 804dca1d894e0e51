/**
 * Where samples exit: the histogram of exit ticks of one config at the reference threshold.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { Results } from '../../analysis/results.js';
import { configColour } from '../palette.js';
import { chartFrame } from './chartFrame.js';

/**
 * Vega-Lite spec of `HaltingCurve.exitHistogram` for one config: one bar per tick, its count of
 * exits (summed over runs, as analysis gives it) at the reference certainty threshold, in the
 * config's colour. Bars span tick − 0.5 to tick + 0.5 (layout only).
 * Returns null when the config has no halting curve or every count is 0.
 * Cost O(ticks). Never throws.
 * Example: `exitHistogramChart(results, 'memory=4')` → a bar chart with one bar per tick.
 */
export function exitHistogramChart(results: Results, config: string): TopLevelSpec | null {
  const halting = results.halting.find((h) => h.config === config);
  if (halting === undefined) return null;
  const { threshold, counts } = halting.exitHistogram;
  if (!counts.some((c) => c > 0)) return null;
  const bars = counts.map((count, tick) => ({ tick, from: tick - 0.5, to: tick + 0.5, count }));

  return {
    ...chartFrame({
      title: `Exit ticks at certainty ≥ ${threshold}: ${config}`,
      subtitle: [
        `Samples exiting at each tick, summed over ${halting.seeds} seed${halting.seeds === 1 ? '' : 's'}; the ` +
          `last tick also holds samples that never reached the threshold.`,
      ],
      description:
        `Histogram of exit ticks for config ${config} at certainty threshold ${threshold}, ` +
        `over ${counts.length} ticks and ${halting.seeds} seeds.`,
    }),
    name: 'bars',
    data: { values: bars },
    mark: { type: 'rect', color: configColour(results, config), stroke: '#fbf9f4', strokeWidth: 1 },
    encoding: {
      x: {
        field: 'from',
        type: 'quantitative',
        title: 'exit tick',
        axis: { tickMinStep: 1, format: 'd' },
        scale: { domain: [-0.5, counts.length - 0.5], nice: false },
      },
      x2: { field: 'to' },
      y: { field: 'count', type: 'quantitative', title: 'samples' },
      tooltip: [
        { field: 'tick', type: 'quantitative', title: 'tick' },
        { field: 'count', type: 'quantitative', title: 'samples', format: ',d' },
      ],
    },
  };
}
