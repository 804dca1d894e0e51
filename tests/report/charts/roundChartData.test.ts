/**
 * roundChartData / roundNumber: chart data to 6 significant digits, integer part always kept.
 * Check values from the ECMAScript definition of Number.prototype.toPrecision (ECMA-262,
 * section 21.1.3.5), written out by hand here.
 */
import type { TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import { roundChartData, roundNumber } from '../../../src/report/charts/roundChartData.js';

function deepFreeze<T>(x: T): T {
  if (x !== null && typeof x === 'object') {
    Object.values(x).forEach(deepFreeze);
    Object.freeze(x);
  }
  return x;
}

describe('roundNumber', () => {
  it('keeps 6 significant digits of a fraction', () => {
    expect(roundNumber(0.45113333333333333)).toBe(0.451133);
    expect(roundNumber(24.924999999999997)).toBe(24.925);
    expect(roundNumber(-0.000123456789)).toBe(-0.000123457);
    expect(roundNumber(2.5099849999)).toBe(2.50998);
  });

  it('never rounds into the integer part, and leaves integers, zero and non-finite numbers alone', () => {
    expect(roundNumber(1234567.89)).toBe(1234568);
    expect(roundNumber(123456.789)).toBe(123457);
    expect(roundNumber(98765432)).toBe(98765432);
    expect(roundNumber(0)).toBe(0);
    expect(roundNumber(Infinity)).toBe(Infinity);
    expect(roundNumber(Number.NaN)).toBeNaN();
  });
});

describe('roundChartData', () => {
  it(
    'rounds numbers inside inline data (rows and arrays, at any depth) and datasets, nothing else, without ' +
      'changing the input',
    () => {
      const spec = deepFreeze({
        width: 520.123456789,
        datasets: { a: [{ v: 1 / 3 }] },
        layer: [
          {
            data: { values: [{ x: 2 / 3, s: 'kept 0.123456789', n: null, list: [1 / 7, null, 5] }] },
            mark: 'point',
            encoding: { x: { field: 'x', type: 'quantitative', scale: { domain: [-1.6666666666, 1.6666666666] } } },
          },
        ],
      }) as unknown as TopLevelSpec;
      const out = roundChartData(spec) as unknown as {
        width: number;
        datasets: { a: { v: number }[] };
        layer: { data: { values: Record<string, unknown>[] }; encoding: { x: { scale: { domain: number[] } } } }[];
      };
      expect(out.datasets.a[0]?.v).toBe(0.333333);
      expect(out.layer[0]?.data.values[0]).toEqual({
        x: 0.666667,
        s: 'kept 0.123456789',
        n: null,
        list: [0.142857, null, 5],
      });
      // Spec numbers are not data: the width and scale domain stay as given.
      expect(out.width).toBe(520.123456789);
      expect(out.layer[0]?.encoding.x.scale.domain).toEqual([-1.6666666666, 1.6666666666]);
    },
  );
});
