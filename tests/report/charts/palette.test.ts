/**
 * palette (src/report/palette.ts; kept beside the chart tests, the folder this helper owns).
 * Okabe & Ito (2008) RGB values, from memory of the published CUD palette table
 * (https://jfly.uni-koeln.de/color/): black 0,0,0; orange 230,159,0; sky blue 86,180,233;
 * bluish green 0,158,115; yellow 240,228,66; blue 0,114,178; vermillion 213,94,0;
 * reddish purple 204,121,167.
 */
import { describe, expect, it } from 'vitest';
import {
  CONFIG_COLOURS,
  configColour,
  configColourScale,
  OKABE_ITO,
  TOL_MUTED,
  VERDICT_COLOURS,
  VERDICT_SHAPES,
} from '../../../src/report/palette.js';
import { DEFAULT_NAMES, makeResults } from '../fixtures.js';

const rgb = (hex: string): number[] => [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16));

describe('palette', () => {
  it('uses the Okabe & Ito (2008) colours', () => {
    expect(rgb(OKABE_ITO.black)).toEqual([0, 0, 0]);
    expect(rgb(OKABE_ITO.orange)).toEqual([230, 159, 0]);
    expect(rgb(OKABE_ITO.skyBlue)).toEqual([86, 180, 233]);
    expect(rgb(OKABE_ITO.bluishGreen)).toEqual([0, 158, 115]);
    expect(rgb(OKABE_ITO.yellow)).toEqual([240, 228, 66]);
    expect(rgb(OKABE_ITO.blue)).toEqual([0, 114, 178]);
    expect(rgb(OKABE_ITO.vermillion)).toEqual([213, 94, 0]);
    expect(rgb(OKABE_ITO.reddishPurple)).toEqual([204, 121, 167]);
    expect(new Set(CONFIG_COLOURS.slice(0, 8))).toEqual(new Set(Object.values(OKABE_ITO)));
  });

  it("then uses Paul Tol's muted scheme (Tol 2021, SRON technical note; from memory) for configs 9 to 17", () => {
    expect(rgb(TOL_MUTED.indigo)).toEqual([51, 34, 136]);
    expect(rgb(TOL_MUTED.rose)).toEqual([204, 102, 119]);
    expect(new Set(CONFIG_COLOURS.slice(8))).toEqual(new Set(Object.values(TOL_MUTED)));
    expect(new Set(CONFIG_COLOURS).size).toBe(17);
  });

  it('gives a config the same colour in every chart, by its place in Results.configs', () => {
    const results = makeResults();
    const [a, b, c] = DEFAULT_NAMES.configs;
    expect(configColourScale(results, [c, a])).toEqual({
      domain: [a, c],
      range: [CONFIG_COLOURS[0], CONFIG_COLOURS[2]],
    });
    expect(configColourScale(results, [b])).toEqual({ domain: [b], range: [CONFIG_COLOURS[1]] });
    expect(configColour(results, c)).toBe(CONFIG_COLOURS[2]);
    // Unknown configs follow the known ones, in the order given.
    expect(configColourScale(results, ['zz', a])).toEqual({
      domain: [a, 'zz'],
      range: [CONFIG_COLOURS[0], CONFIG_COLOURS[3]],
    });
  });

  it('gives 17 configs 17 colours, and cycles after that', () => {
    const base = makeResults();
    const many = { ...base, configs: Array.from({ length: 19 }, (_, i) => ({ ...base.configs[0]!, id: `c${i}` })) };
    expect(new Set(Array.from({ length: 17 }, (_, i) => configColour(many, `c${i}`))).size).toBe(17);
    expect(configColour(many, 'c8')).toBe(TOL_MUTED.indigo);
    expect(configColour(many, 'c17')).toBe(CONFIG_COLOURS[0]);
    expect(configColour(many, 'c18')).toBe(CONFIG_COLOURS[1]);
  });

  it('never tells verdicts apart by colour alone', () => {
    expect(new Set(Object.values(VERDICT_COLOURS)).size).toBe(3);
    expect(new Set(Object.values(VERDICT_SHAPES)).size).toBe(3);
  });
});
