/**
 * Entry `k` of `list`, failing the test loudly if it is missing: a checked index for tests, used
 * instead of a non-null assertion (`list[k]!`), which would let a missing entry pass on as
 * `undefined` and fail later with a less helpful message.
 */
export function at<T>(list: readonly T[], k: number): T {
  const v = list[k];
  if (v === undefined) throw new Error(`no entry ${k} in a list of ${list.length}`);
  return v;
}
