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
  MUTED_INK,
  OKABE_ITO,
  TOL_MUTED,
  VERDICT_COLOURS,
  VERDICT_SHAPES,
} from '../../../src/report/palette.js';
import { at } from '../../support/at.js';
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

  it('gives 12 configs 12 colours; from 13 on, only the baseline and decided candidates keep one', () => {
    const base = makeResults();
    const configs = (n: number) => Array.from({ length: n }, (_, i) => ({ ...at(base.configs, 0), id: `c${i}` }));
    const twelve = { ...base, configs: configs(12), comparisons: [] };
    expect(new Set(Array.from({ length: 12 }, (_, i) => configColour(twelve, `c${i}`))).size).toBe(12);
    expect(configColour(twelve, 'c8')).toBe(TOL_MUTED.indigo);
    const template = at(base.comparisons, 0);
    const comparisons = [
      { ...template, baseline: 'c0', candidate: 'c5', verdict: 'inconclusive' as const, pAdjusted: 0.5 },
      { ...template, baseline: 'c0', candidate: 'c7', verdict: 'worse' as const, pAdjusted: 0.01 },
      { ...template, baseline: 'c0', candidate: 'c3', verdict: 'better' as const, pAdjusted: 0.02 },
    ];
    const many = { ...base, configs: configs(19), comparisons };
    // Baseline first, then decided candidates (better before worse), the rest grey.
    expect(configColour(many, 'c0')).toBe(CONFIG_COLOURS[0]);
    expect(configColour(many, 'c3')).toBe(CONFIG_COLOURS[1]);
    expect(configColour(many, 'c7')).toBe(CONFIG_COLOURS[2]);
    expect(configColour(many, 'c5')).toBe(MUTED_INK);
    expect(configColour(many, 'c18')).toBe(MUTED_INK);
  });

  it('gives a method one colour on every task (task key)', () => {
    const base = makeResults();
    const cfg = (task: string, method: string) => ({
      ...at(base.configs, 0),
      id: `task=${task},method=${method}`,
      params: { task, method },
    });
    const results = {
      ...base,
      settings: { ...base.settings, taskKey: 'task' },
      configs: [cfg('a', 'x'), cfg('a', 'y'), cfg('b', 'x'), cfg('b', 'y')],
    };
    expect(configColour(results, 'task=b,method=x')).toBe(configColour(results, 'task=a,method=x'));
    expect(configColour(results, 'task=b,method=y')).toBe(CONFIG_COLOURS[1]);
  });

  it('never tells verdicts apart by colour alone', () => {
    expect(new Set(Object.values(VERDICT_COLOURS)).size).toBe(3);
    expect(new Set(Object.values(VERDICT_SHAPES)).size).toBe(3);
  });
});
