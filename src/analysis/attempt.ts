/**
 * Running a statistic that may refuse its input: a RangeError (too few values, zero variance, ...)
 * becomes a reason in plain words and a null result, so that a comparison never throws on data;
 * any other error is a bug and propagates.
 */

/** Run a statistic; on a RangeError (input it cannot use) record why and give null. */
export function attempt<T>(f: () => T, what: string, reasons: string[]): T | null {
  try {
    return f();
  } catch (error) {
    if (!(error instanceof RangeError)) throw error;
    reasons.push(`${what} could not run: ${error.message}`);
    return null;
  }
}

/** A finite number, else null (NaN, infinities, undefined). */
export function finiteOrNull(v: number | null | undefined): number | null {
  return v === null || v === undefined || !Number.isFinite(v) ? null : v;
}
