/**
 * Time-to-event data: per subject a time and whether the event happened then (`true`) or the
 * subject was right-censored then (`false`). Used by `kaplanMeier` and `logRank`.
 */
export interface TimeToEvent {
  readonly times: readonly number[];
  readonly events: readonly boolean[];
}
