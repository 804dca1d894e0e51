/**
 * Legend toggling for charts with one colour per config: clicking a config in the legend keeps
 * its marks at full strength and fades the others; shift-click adds or removes a config; a
 * double-click on the plot, or a click on empty space in the legend, shows all again (Vega-Lite's
 * point selection with `toggle` on shift and `clear` on double-click). A point selection
 * projected on the `config` field and bound to the legend, with each layer's opacity conditioned
 * on it.
 *
 * With nothing selected every mark passes the test, so each layer keeps the opacity it had
 * without the selection: the server-drawn SVG (where no one can click) looks the same.
 */
import type { Layer } from './chartFrame.js';

/** A selection parameter of a unit layer, as the vega-lite types define it. */
type LayerParam = NonNullable<Extract<Layer, { mark: unknown }>['params']>[number];

/** The selection's name (a Vega signal and data set name; fixed, never from data). */
export const PICKED_CONFIGS = 'pickedConfigs';

/** How much of its opacity a faded layer keeps. */
export const FADED = 0.15;

/** The selection parameter: point selection on `config`, bound to the colour legend. */
export const PICK_CONFIGS_PARAM: LayerParam = {
  name: PICKED_CONFIGS,
  select: { type: 'point', fields: ['config'] },
  bind: 'legend',
};

/**
 * The opacity channel of a layer drawn at `opacity`: that opacity for picked configs (all of
 * them while nothing is picked), `opacity * FADED` for the others.
 * Cost O(1). Never throws.
 * Example: `pickedOpacity(0.2)` → `{ condition: { param: 'pickedConfigs', value: 0.2 }, value: 0.03 }`.
 */
export function pickedOpacity(opacity: number): {
  readonly condition: { readonly param: string; readonly value: number };
  readonly value: number;
} {
  return { condition: { param: PICKED_CONFIGS, value: opacity }, value: Number((opacity * FADED).toFixed(4)) };
}

/**
 * Add the selection to the first layer whose name is in `holders`, in that order of preference
 * (a Vega-Lite selection lives in one unit view and applies to every layer that tests it). The
 * legend takes its symbols from the layer that holds the selection, so the holder should be the
 * layer whose look the legend had before (a line layer for line charts). With fewer than two
 * configs there is nothing to toggle and the layers are returned unchanged; so they are when no
 * layer is named in `holders`.
 * Cost O(layers). Never throws.
 * Example: `withLegendToggle(layers, 3, ['mean'])` → the layer named mean gets
 * `params: [{ name: 'pickedConfigs', select: { type: 'point', fields: ['config'] }, bind: 'legend' }]`.
 */
export function withLegendToggle(layers: readonly Layer[], configs: number, holders: readonly string[]): Layer[] {
  if (configs < 2) return [...layers];
  const holder = holders.map((name) => layers.findIndex((l) => l.name === name)).find((i) => i >= 0);
  if (holder === undefined) return [...layers];
  // Only a unit layer (a mark) can hold a selection; seedsift's layers are all units.
  return layers.map((l, i) => (i === holder && 'mark' in l ? { ...l, params: [PICK_CONFIGS_PARAM] } : l));
}

/** What the reader can do, for the page to say beside a live chart (the SVG alone cannot do it). */
export const LEGEND_TOGGLE_HINT =
  'Click a config in the legend to show it alone; shift-click to add or remove one; double-click the plot to show all.';

/**
 * Whether a spec carries the legend selection (some layer has the `pickedConfigs` parameter).
 * Cost O(layers). Never throws. Example:
 * `hasLegendToggle(curvesChart(results, 'val_acc')!)` → `true` with two or more configs.
 */
export function hasLegendToggle(spec: unknown): boolean {
  const layers = (spec as { layer?: unknown }).layer;
  if (!Array.isArray(layers)) return false;
  return layers.some(
    (l) =>
      Array.isArray((l as { params?: unknown }).params) &&
      (l as { params: { name?: unknown }[] }).params.some((p) => p.name === PICKED_CONFIGS),
  );
}

/**
 * A layer's opacity encoding: conditioned on the selection when configs can be toggled, else the
 * plain value.
 * Cost O(1). Never throws. Example: `layerOpacity(0.35, 1)` → `{ value: 0.35 }`.
 */
export function layerOpacity(
  opacity: number,
  configs: number,
): ReturnType<typeof pickedOpacity> | { readonly value: number } {
  return configs < 2 ? { value: opacity } : pickedOpacity(opacity);
}
