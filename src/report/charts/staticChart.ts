/**
 * The spec of a chart's server-drawn SVG: the interactive spec without its layers that exist only
 * for the pointer. A layer whose mark has opacity 0 (the hover points that carry a curve's
 * tooltips) draws nothing; in the SVG, where nothing can be hovered, it would only add an
 * invisible element per point (three quarters of a long learning curve's bytes). Leaving it out
 * changes no pixel: such a layer shares its scales' fields with a visible layer (seedsift builds
 * hover layers from the same rows as the line they sit on).
 */
import type { TopLevelSpec } from 'vega-lite';

function invisible(layer: unknown): boolean {
  const mark = (layer as { mark?: unknown }).mark;
  return mark !== null && typeof mark === 'object' && (mark as { opacity?: unknown }).opacity === 0;
}

/**
 * `spec` without its invisible layers (mark opacity 0), or `spec` itself when it has none or is
 * not layered (a layered spec keeps at least one layer).
 * Cost O(layers). Never throws.
 * Example: `staticChart(curvesChart(results, 'val_acc')!).layer.map((l) => l.name)`
 * → `['seeds', 'band', 'mean']` (no `hover`).
 */
export function staticChart(spec: TopLevelSpec): TopLevelSpec {
  if (!('layer' in spec)) return spec;
  const kept = spec.layer.filter((l) => !invisible(l));
  if (kept.length === spec.layer.length || kept.length === 0) return spec;
  return { ...spec, layer: kept };
}
