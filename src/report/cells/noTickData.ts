/** The notes that the tick-level cells show when `Results` holds no tick data. */
export const NO_TICK_DATA = {
  ticks:
    'No tick data in these runs: per-tick metrics come from columns named like val_acc@0, val_acc@1, ... (one ' +
    'per internal tick) or from long files with a tick column.',
  halting:
    'No tick data in these runs: certainty-threshold halting needs per-sample tick dumps (columns sample, tick, ' +
    'correct, certainty).',
  calibration:
    'No tick data in these runs: calibration needs per-sample tick dumps with a confidence column (sample, ' +
    'tick, correct, certainty, confidence).',
} as const;
