/**
 * The layers shared by the charts against the internal tick (accuracy by tick, calibration by
 * tick): per config a band across seeds, a mean line, and points on the mean with a tooltip.
 */
import type { Layer } from './chartFrame.js';
import { layerOpacity } from './legendToggle.js';

/** A Vega-Lite encoding channel (field definitions built by the chart). */
type Channel = Record<string, unknown>;

export interface TickLayerParts {
  /** One row per config and tick with `mean`, `low`, `high` (null where there is none). */
  readonly rows: readonly Record<string, unknown>[];
  readonly x: Channel;
  /** The y encoding of a field (`mean`, `low`). */
  readonly y: (field: string) => Channel;
  readonly color: Channel;
  readonly configs: number;
  /** Tooltip of the points on the mean. */
  readonly tooltip: readonly Channel[];
}

/**
 * Layers `band` (only when some row has a band: Vega warns on an empty extent), `mean` and
 * `points` (the rows with a mean). Pure. Example: `tickLayers(parts).map((l) => l.name)` →
 * `['band', 'mean', 'points']`.
 */
export function tickLayers(p: TickLayerParts): Layer[] {
  const { rows, x, y, color } = p;
  const opacity = (o: number) => layerOpacity(o, p.configs);
  const layers: Layer[] = [];
  if (rows.some((r) => r.low !== null)) {
    layers.push({
      name: 'band',
      data: { values: rows },
      mark: { type: 'area' },
      encoding: { x, y: y('low'), y2: { field: 'high' }, color, opacity: opacity(0.2) },
    } as Layer);
  }
  layers.push(
    {
      name: 'mean',
      data: { values: rows },
      mark: { type: 'line' },
      encoding: { x, y: y('mean'), color, opacity: opacity(1) },
    } as Layer,
    {
      name: 'points',
      data: { values: rows.filter((r) => r.mean !== null) },
      mark: { type: 'point', filled: true, size: 30 },
      // 0.7: Vega-Lite's default opacity of point marks, kept so the charts look as before.
      encoding: { x, y: y('mean'), color, opacity: opacity(0.7), tooltip: p.tooltip },
    } as Layer,
  );
  return layers;
}
