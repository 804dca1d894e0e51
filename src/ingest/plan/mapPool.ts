/**
 * Run an async function over items with at most `limit` calls in flight, results in item order.
 * For I/O-bound work: reading the heads of many files, where each open and read waits on the disk
 * (or a network file system). Measured with the files in the page cache, 8 at a time against one at
 * a time: 40 files 29-48 ms against 40-80 ms, 400 files 265 ms against 291 ms; the wait it hides
 * is larger on a cold or remote disk.
 * Throws what `fn` throws (the first rejection; calls already started still run to their end).
 * Example: `await mapPool([1, 2, 3], 2, async (x) => x * 2)` is `[2, 4, 6]`.
 */
export async function mapPool<T, R>(
  items: readonly T[],
  limit: number,
  fn: (item: T, index: number) => Promise<R>,
): Promise<R[]> {
  if (!(limit >= 1)) throw new RangeError(`mapPool: limit must be at least 1, got ${limit}`);
  const out = new Array<R>(items.length);
  let next = 0;
  const worker = async (): Promise<void> => {
    while (next < items.length) {
      const i = next++;
      out[i] = await fn(items[i] as T, i);
    }
  };
  await Promise.all(Array.from({ length: Math.min(limit, items.length) }, worker));
  return out;
}
