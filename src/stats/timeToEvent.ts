/**
 * Right-censored time-to-event data, the input of the Kaplan-Meier estimator and the log-rank test.
 *
 * In seedsift a "time" is the step at which a run first reached a value (`reach:VALUE`): event
 * true. A run that never reached it is censored at its last step: event false, time = that step.
 * Such a run is kept (it tells that the time to reach is later than its last step), never dropped.
 */
export interface TimeToEvent {
  /** Time of each unit (step reached, or last step when censored); finite, >= 0. */
  readonly times: readonly number[];
  /** Per unit: true when the event happened at its time, false when censored there. */
  readonly events: readonly boolean[];
}

/**
 * Check a `TimeToEvent` record: equal lengths, at least one unit, finite non-negative times and
 * boolean events. Throws a RangeError naming the caller and the first bad entry.
 * Example: `checkTimeToEvent({ times: [3, 5], events: [true, false] }, 'kaplanMeier')` returns nothing.
 */
export function checkTimeToEvent(data: TimeToEvent, who: string): void {
  const { times, events } = data;
  if (times.length !== events.length)
    throw new RangeError(`${who}: times and events must have equal lengths, got ${times.length} and ${events.length}`);
  if (times.length === 0) throw new RangeError(`${who} requires at least 1 unit, got 0`);
  for (let i = 0; i < times.length; i++) {
    const t = times[i] as number;
    if (!(Number.isFinite(t) && t >= 0))
      throw new RangeError(`${who}: times[${i}] must be a finite number >= 0, got ${t}`);
    if (typeof events[i] !== 'boolean') throw new RangeError(`${who}: events[${i}] must be true or false`);
  }
}
