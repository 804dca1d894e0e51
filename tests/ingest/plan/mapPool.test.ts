import { describe, expect, it } from 'vitest';
import { mapPool } from '../../../src/ingest/plan/mapPool.js';

const tick = (ms: number): Promise<void> => new Promise((resolve) => setTimeout(resolve, ms));

describe('mapPool', () => {
  it('returns results in item order whatever order the calls finish in', async () => {
    const out = await mapPool([30, 0, 20, 5, 10], 3, async (ms, i) => {
      await tick(ms);
      return `${i}:${ms}`;
    });
    expect(out).toEqual(['0:30', '1:0', '2:20', '3:5', '4:10']);
  });
  it('never has more than `limit` calls in flight, and uses that many', async () => {
    let inFlight = 0;
    let most = 0;
    await mapPool(
      Array.from({ length: 20 }, (_, i) => i),
      4,
      async (i) => {
        inFlight++;
        most = Math.max(most, inFlight);
        await tick(i % 3);
        inFlight--;
      },
    );
    expect(most).toBe(4);
  });
  it('passes on the first rejection, and handles no items', async () => {
    await expect(
      mapPool([1, 2, 3], 2, async (x) => {
        if (x === 2) throw new Error('boom');
        return x;
      }),
    ).rejects.toThrow('boom');
    expect(await mapPool([], 8, async (x: number) => x)).toEqual([]);
  });
  it('refuses a limit below 1', async () => {
    await expect(mapPool([1], 0, async (x) => x)).rejects.toThrow(RangeError);
  });
});
