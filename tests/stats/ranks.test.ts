import { describe, expect, it } from 'vitest';
import { midRanks } from '../../src/stats/ranks.js';

// Mid-ranks as R's rank(ties.method = "average") and scipy.stats.rankdata(method='average'):
// checked with scipy 1.10.1 (Debian python3-scipy): rankdata([72,70,74,70,72,69,70,68,71,70,67,72])
// = [10, 5.5, 12, 5.5, 10, 3, 5.5, 2, 8, 5.5, 1, 10].
const C_AND_D = Object.freeze([72, 70, 74, 70, 72, 69, 70, 68, 71, 70, 67, 72]);

describe('midRanks', () => {
  it('matches scipy rankdata(method="average") on the METHODS.md C and D values (ties)', () => {
    const { ranks, tieTerm, hasTies } = midRanks(C_AND_D);
    expect(Array.from(ranks)).toEqual([10, 5.5, 12, 5.5, 10, 3, 5.5, 2, 8, 5.5, 1, 10]);
    // tie groups: 70 x4, 72 x3 -> (64 - 4) + (27 - 3) = 84 (definition of the tie term, common practice)
    expect(tieTerm).toBe(84);
    expect(hasTies).toBe(true);
  });

  it('gives 1..n without ties, and handles infinities', () => {
    const r = midRanks([3, -Infinity, 1, Infinity, 2]);
    expect(Array.from(r.ranks)).toEqual([4, 1, 2, 5, 3]);
    expect(r.tieTerm).toBe(0);
    expect(r.hasTies).toBe(false);
  });

  it('rejects NaN', () => {
    expect(() => midRanks([1, Number.NaN])).toThrow(RangeError);
  });
});
