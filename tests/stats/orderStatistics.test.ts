/**
 * Order statistics by selection: src/stats/orderStatistics.ts. The reference is a sorted copy made
 * by `Float64Array.prototype.sort` (the ECMAScript specification's numeric order, -0 before +0):
 * the k-th smallest found by selection must be the value at k of the sorted copy, bit for bit
 * (compared with Object.is), whatever positions were asked for before.
 */
import { describe, expect, it } from 'vitest';
import { OrderStatistics, sortedOrder } from '../../src/stats/orderStatistics.js';
import { quantileAt, quantileSorted } from '../../src/stats/quantile.js';
import { createRandom } from '../../src/stats/random.js';

/** Arrays with the awkward cases: ties, -0 and +0, infinities, sorted and reversed runs. */
function cases(): Float64Array[] {
  const random = createRandom(20261202);
  const out: Float64Array[] = [
    Float64Array.of(5),
    Float64Array.of(2, 1),
    Float64Array.of(0, -0, 0, -0, 1, -1),
    Float64Array.of(Infinity, -Infinity, 0, 3, -Infinity, Infinity, 3),
    Float64Array.from({ length: 50 }, (_, i) => i),
    Float64Array.from({ length: 50 }, (_, i) => 50 - i),
    new Float64Array(40).fill(7),
  ];
  for (let t = 0; t < 200; t++) {
    const n = 1 + random.int(300);
    const distinct = 1 + random.int(t % 3 === 0 ? 4 : 1000);
    out.push(Float64Array.from({ length: n }, () => (random.int(distinct) - distinct / 2) * (t % 5 === 0 ? 0 : 0.37)));
  }
  return out;
}

describe('OrderStatistics', () => {
  it(
    'gives the value a sorted copy has at each position, positions asked in any order, ties, -0 and infinities ' +
      'included',
    () => {
      const random = createRandom(7);
      for (const values of cases()) {
        const sorted = Float64Array.from(values).sort();
        const order = new OrderStatistics(Float64Array.from(values));
        const n = values.length;
        const asks = [0, n - 1, ...Array.from({ length: 12 }, () => random.int(n)), Math.floor(n / 2)];
        for (const k of asks) expect(Object.is(order.at(k), sorted[k])).toBe(true);
        // Every position asked still holds its value afterwards, and the values are the same multiset.
        for (const k of asks) expect(Object.is(order.values[k], sorted[k])).toBe(true);
        expect(Float64Array.from(order.values).sort()).toEqual(sorted);
      }
    },
  );

  it('type-7 quantiles through quantileAt equal quantileSorted on the sorted copy', () => {
    for (const values of cases()) {
      const sorted = Float64Array.from(values).sort();
      if (sorted.some((v) => !Number.isFinite(v))) continue;
      const order = new OrderStatistics(Float64Array.from(values));
      for (const p of [0, 0.025, 0.05, 0.25, 0.5, 0.75, 0.95, 0.975, 1]) {
        expect(
          Object.is(
            quantileAt(values.length, p, (k) => order.at(k)),
            quantileSorted(sorted, p),
          ),
        ).toBe(true);
      }
    }
  });

  it('rejects a position outside the array; sortedOrder reads a sorted array as it is', () => {
    const order = new OrderStatistics(Float64Array.of(3, 1, 2));
    expect(() => order.at(3)).toThrow(RangeError);
    expect(() => order.at(-1)).toThrow(RangeError);
    expect(() => order.at(0.5)).toThrow(RangeError);
    expect(sortedOrder(Float64Array.of(1, 2, 3)).at(1)).toBe(2);
  });
});
