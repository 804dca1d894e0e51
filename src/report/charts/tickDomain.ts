/**
 * The x domain of a chart against the internal tick: from the first to the last tick drawn, so
 * the axis ends where the model's clock ends (a "nice" domain would run past the last tick and
 * suggest ticks that do not exist). A single tick gets half a tick on either side.
 */

/**
 * `[first, last]` of the ticks, or `[t - 0.5, t + 0.5]` for a single tick value, `[0, 1]` for none.
 * Cost O(ticks). Never throws. Example: `tickDomain([0, 1, 2, 31])` → `[0, 31]`.
 */
export function tickDomain(ticks: readonly number[]): number[] {
  if (ticks.length === 0) return [0, 1];
  let low = Infinity;
  let high = -Infinity;
  for (const t of ticks) {
    if (t < low) low = t;
    if (t > high) high = t;
  }
  return low === high ? [low - 0.5, high + 0.5] : [low, high];
}

/**
 * The x encoding of a chart against the internal tick: whole ticks, the axis from the first to the
 * last tick (`tickDomain`, no "nice" rounding). Example: `tickAxis([0, 1, 7]).scale.domain` → `[0, 7]`.
 */
export function tickAxis(ticks: readonly number[]) {
  return {
    field: 'tick',
    type: 'quantitative',
    title: 'internal tick',
    axis: { tickMinStep: 1, format: 'd' },
    scale: { domain: tickDomain(ticks), nice: false },
  } as const;
}
